'use client';

import { useMemo } from 'react';
import { Notice } from '@/components/ui/notice';
import { CLEARANCE_FITS, type ClearanceFit, type ClearanceHoleResult, type CounterboreResult } from '@/lib/calculators/holes';
import { SOURCES } from '@/lib/calculators/sources';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { formatIn, formatMm, readoutMm } from '@/lib/units/format';
import { CLEARANCE_FIELDS, clearanceFromSearch, clearanceQuery, clearanceRequests, type ClearanceState, clearanceHolesCalculator } from '@/lib/calculators/pages/clearance-holes';
import { HOLE_RUNNERS } from '@/lib/calculators/holes';
import { attempt, errorFor, looseError, type Outcome } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox, LENGTH_UNIT_OPTIONS } from '../boxes';
import { Len, ResultRow, SourcesLine, Waiting, WarningList } from '../readouts';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const EXAMPLES = ['M8', 'M5', 'M12', '1/4-20', '#10', '3/8'];
const FIT_WORDS: Record<ClearanceFit, string> = { close: 'Close', normal: 'Normal', loose: 'Loose' };

function ClearanceTable({ rows, chosen }: { rows: { fit: ClearanceFit; outcome: Outcome }[]; chosen: ClearanceFit }) {
  return (
    <ResultBlock title="Clearance holes" testId="clearance-table">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Clearance hole in each class, with the drill and its size in both units</caption>
          <thead>
            <tr className="border-b border-rule text-left text-xs text-graphite-2">
              <th scope="col" className="py-1 pr-3 font-semibold">Class</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Drill</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">mm</th>
              <th scope="col" className="py-1 pr-3 text-right font-semibold">in</th>
              <th scope="col" className="hidden py-1 font-semibold sm:table-cell">Nearest drill of the other system, not smaller</th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ fit, outcome }) => {
              const r = outcome.status === 'ok' && outcome.kind === 'clearance-hole' ? outcome.output : null;
              return (
                <tr key={fit} className={`border-b border-rule/60 last:border-0 ${fit === chosen ? 'bg-dye-soft/60' : ''}`} data-fit={fit}>
                  <th scope="row" className="py-1.5 pr-3 text-left font-semibold">
                    {FIT_WORDS[fit]}
                    {fit === chosen ? <span className="ml-1 text-xs font-normal text-dye">✓ chosen</span> : null}
                    {r?.isoSeries ? <span className="block text-xs font-normal text-graphite-2">ISO 273 {r.isoSeries}</span> : null}
                  </th>
                  <td className="dim py-1.5 pr-3 font-semibold">{r?.drill.name ?? '—'}</td>
                  <td className="dim py-1.5 pr-3 text-right">{r ? readoutMm(r.diameter.mm) : '—'}</td>
                  <td className="dim py-1.5 pr-3 text-right">{r ? formatIn(r.diameter.in) : '—'}</td>
                  <td className="dim hidden py-1.5 text-graphite-2 sm:table-cell">
                    {r?.drillOtherSystem
                      ? r.drillOtherSystem.kind === 'metric'
                        ? r.drillOtherSystem.name
                        : `${r.drillOtherSystem.name} (${formatIn(r.drillOtherSystem.diameter.in)} in)`
                      : '—'}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </ResultBlock>
  );
}

function CounterboreBlock({ r, fit }: { r: CounterboreResult; fit: ClearanceFit }) {
  const metric = r.screw.system === 'metric';
  const first = metric ? 'mm' : 'in';
  return (
    <ResultBlock title={`Counterbore for ${r.screw.size} socket head cap screws`} testId="counterbore">
      <dl>
        <ResultRow label="Counterbore diameter" strong testId="cb-diameter">
          <Len value={r.counterbore.diameter} first={first} />
        </ResultRow>
        <ResultRow label="Counterbore depth" strong testId="cb-depth">
          <Len value={r.counterbore.depth} first={first} />
        </ResultRow>
        <ResultRow label={`Through hole (${fit})`}>
          {r.throughHole.drill.kind !== 'metric' ? <span className="dim mr-2 font-semibold">{r.throughHole.drill.name}</span> : null}
          <Len value={r.throughHole.diameter} first={first} />
        </ResultRow>
        <ResultRow label="Head diameter · height">
          <Len value={r.head.diameter} first={first} /> <span className="text-graphite-2">·</span> <Len value={r.head.height} first={first} />
        </ResultRow>
        {r.wall.toEdge ? (
          <ResultRow label="Wall left to the edge" testId="wall-edge">
            <Len value={r.wall.toEdge} first={first} />
          </ResultRow>
        ) : null}
        {r.wall.betweenHoles ? (
          <ResultRow label="Wall left between holes" testId="wall-between">
            <Len value={r.wall.betweenHoles} first={first} />
          </ResultRow>
        ) : null}
        <ResultRow label="Thinnest wall advised">
          <Len value={r.wall.minimumAdvised} first={first} />
        </ResultRow>
      </dl>
      {!r.wall.toEdge && !r.wall.betweenHoles ? (
        <p className="text-xs text-graphite-2">Give the distance to the edge or to the next hole to see the wall left beside the counterbore.</p>
      ) : null}
      {r.warnings.length === 0 && (r.wall.toEdge || r.wall.betweenHoles) ? (
        <p className="text-sm font-semibold text-ok">
          <span aria-hidden="true">✓</span> Wall at least the {formatMm(r.wall.minimumAdvised.mm, { decimals: 2, maxDecimals: 2 })} mm advised.
        </p>
      ) : null}
      <p className="text-xs text-graphite-2">{r.counterbore.diameterRule}</p>
    </ResultBlock>
  );
}

export function ClearanceCalculator({ initial }: { initial: ClearanceState }) {
  const { state, update, hydrated, href } = useQueryState(initial, clearanceQuery, clearanceFromSearch);
  const { rows, chosen, cb } = useMemo(() => {
    const reqs = () => clearanceRequests(state);
    return {
      rows: CLEARANCE_FITS.map((fit) => ({ fit, outcome: attempt(() => (reqs() ? { kind: 'clearance-hole', input: { size: state.size, fit } } : null), CLEARANCE_FIELDS, HOLE_RUNNERS) })),
      chosen: attempt(() => reqs()?.clearance ?? null, CLEARANCE_FIELDS, HOLE_RUNNERS),
      cb: attempt(() => reqs()?.counterbore ?? null, CLEARANCE_FIELDS, HOLE_RUNNERS),
    };
  }, [state]);
  const sizeError = errorFor(chosen, 'size');
  const edgeError = errorFor(cb, 'edge');
  const spacingError = errorFor(cb, 'spacing');
  const cbSizeError = chosen.status === 'ok' ? errorFor(cb, 'size') : undefined;
  const other = looseError(chosen) ?? looseError(cb);
  const lengthUnit = state.unit === 'in' ? 'in' : 'mm';

  const candidates: SaveCandidate[] = [];
  const sources: string[] = [];
  let announce = '';
  let clearance: ClearanceHoleResult | null = null;
  let counterbore: CounterboreResult | null = null;
  if (cb.status === 'ok' && cb.kind === 'counterbore') {
    counterbore = cb.output;
    candidates.push({ title: 'The counterbore, with its through hole', request: cb, defaultLabel: resultLabel(clearanceHolesCalculator, 'counterbore', cb.input, cb.output) });
  }
  if (chosen.status === 'ok' && chosen.kind === 'clearance-hole') {
    clearance = chosen.output;
    candidates.push({ title: `The ${state.fit} clearance hole only`, request: chosen, defaultLabel: resultLabel(clearanceHolesCalculator, 'clearance-hole', chosen.input, chosen.output) });
    sources.push(clearance.source);
    announce = `${clearance.screw.size}: ${state.fit} clearance hole ${clearance.drill.name}${counterbore ? `, counterbore ${counterbore.counterbore.diameter.mm} mm` : ''}.`;
  }
  if (counterbore) sources.push(counterbore.head.source, counterbore.counterbore.source, SOURCES.counterboreDepth, SOURCES.wall);

  const distanceField = (id: 'edge' | 'spacing', label: string, hint: string, error?: string) => (
    <DimBox
      id={id}
      label={label}
      hint={hint}
      error={error}
      value={state[id]}
      onChange={(value) => update({ [id]: value } as Partial<ClearanceState>)}
      placeholder={`optional, ${lengthUnit}`}
      maxLength={20}
      kind="decimal"
    />
  );

  const form = (
    <>
      <DimBox
        id="size"
        label="Screw size"
        hint="e.g. M8, M5, 1/4-20, 3/8 or #10."
        error={sizeError}
        value={state.size}
        onChange={(value) => update({ size: value })}
        placeholder="M8"
        maxLength={60}
        kind="name"
        big
      />
      <Choice
        legend="Clearance class"
        name="fit"
        value={state.fit}
        options={CLEARANCE_FITS.map((f) => ({ value: f, label: FIT_WORDS[f] }))}
        onChange={(fit) => update({ fit })}
        hint="For metric screws: ISO 273 fine, medium and coarse series."
      />
      <fieldset className="space-y-3 rounded-md border border-rule p-3">
        <legend className="px-1 text-sm font-semibold">Wall beside the counterbore (optional)</legend>
        {distanceField('edge', 'Hole centre to the part’s edge', 'To see the metal left between the counterbore and the edge.', edgeError)}
        {distanceField('spacing', 'Hole centre to the next hole', 'To see the metal left between two counterbores.', spacingError)}
        <Choice
          legend="These distances are in"
          name="unit"
          value={state.unit}
          options={LENGTH_UNIT_OPTIONS}
          onChange={(unit) => update({ unit })}
        />
      </fieldset>
      <Examples items={EXAMPLES.map((label) => ({ label }))} onPick={(i) => update({ size: EXAMPLES[i] })} label="Sizes to try" />
    </>
  );

  const result = (
    <>
      {chosen.status === 'empty' ? (
        <Notice kind="info" title="Type a screw size">
          For example M8 or 1/4-20. The clearance holes in three classes and the counterbore for a socket head cap screw appear as you type.
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {chosen.status === 'error' && !other ? <Waiting>Nothing to show until the screw size can be read: see the reason beside the box.</Waiting> : null}
      {clearance ? <ClearanceTable rows={rows} chosen={state.fit} /> : null}
      {counterbore ? <WarningList warnings={counterbore.warnings} title="Wall beside the counterbore" /> : null}
      {counterbore ? <CounterboreBlock r={counterbore} fit={state.fit} /> : null}
      {clearance && cbSizeError ? (
        <Notice kind="info" title="No counterbore for this size">
          {cbSizeError}
        </Notice>
      ) : null}
      {clearance && (edgeError || spacingError) ? <Waiting>The counterbore appears once the distances can be read: see beside the boxes.</Waiting> : null}
      {sources.length ? <SourcesLine sources={sources} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Screw and clearance" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
