'use client';

import { useMemo } from 'react';
import { Notice } from '@/components/ui/notice';
import { nearestDrills, type DrillMatch, type DrillSize } from '@/lib/calculators/drills';
import { SOURCES } from '@/lib/calculators/sources';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { formatIn, formatMmAs, formatNumber, readoutMm } from '@/lib/units/format';
import { DRILLS_FIELDS, drillsFromSearch, drillsQuery, drillsRequest, type DrillSide, type DrillsState, drillsCalculator } from '@/lib/calculators/pages/drills';
import { DRILL_RUNNERS } from '@/lib/calculators/drills';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox, LENGTH_UNIT_OPTIONS } from '../boxes';
import { Len, SourcesLine, Waiting } from '../readouts';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const NAME_EXAMPLES = ['#7', 'F', '27/64', '6.8 mm', '#29', '1/4'];
const KIND_WORDS = { fractional: 'Fractional drill', number: 'Number drill', letter: 'Letter drill', metric: 'Metric drill' } as const;

/** A difference with its sign set as a drill chart does: "+0.020", "−0.015", "±0.000". */
function signed(n: number, digits: number) {
  const text = formatNumber(n, { decimals: digits, signed: true });
  return text.startsWith('-') ? `−${text.slice(1)}` : text.startsWith('+') ? text : `±${text}`;
}

function MatchTable({ matches, caption, highlight }: { matches: DrillMatch[]; caption: string; highlight?: string }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid="drill-matches">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-rule text-left text-xs text-graphite-2">
            <th scope="col" className="py-1 pr-3 font-semibold">Drill</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">mm</th>
            <th scope="col" className="py-1 pr-3 text-right font-semibold">in</th>
            <th scope="col" className="py-1 text-right font-semibold">Difference</th>
          </tr>
        </thead>
        <tbody>
          {matches.map((m) => (
            <tr key={m.drill.name} className={`border-b border-rule/60 last:border-0 ${m.drill.name === highlight ? 'bg-dye-soft/60' : ''}`}>
              <th scope="row" className="py-1.5 pr-3 text-left">
                <span className="dim font-semibold">{m.drill.name}</span>
                {m.drill.alsoNamed.length ? <span className="dim ml-1 text-xs font-normal text-graphite-2">= {m.drill.alsoNamed.join(', ')}</span> : null}
                <span className="block text-xs font-normal text-graphite-2">{KIND_WORDS[m.drill.kind]}</span>
              </th>
              <td className="dim py-1.5 pr-3 text-right">{readoutMm(m.drill.diameter.mm)}</td>
              <td className="dim py-1.5 pr-3 text-right">{formatIn(m.drill.diameter.in)}</td>
              <td className="dim py-1.5 text-right">
                <span className="whitespace-nowrap">{signed(m.difference.mm, 3)} mm</span>
                <span className="block whitespace-nowrap text-xs text-graphite-2">{signed(m.difference.in, 4)} in</span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function DrillCard({ drill }: { drill: DrillSize }) {
  const neighbours = nearestDrills(drill.diameterMm, { count: 7 });
  return (
    <>
      <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="drill-size">
        <p className="text-sm text-graphite-2">{KIND_WORDS[drill.kind]}</p>
        <p className="dim text-3xl font-bold">{drill.name}</p>
        <p className="text-lg">
          <Len value={drill.diameter} first={drill.kind === 'metric' ? 'mm' : 'in'} />
        </p>
        {drill.alsoNamed.length ? <p className="text-sm">The same size as {drill.alsoNamed.join(', ')}.</p> : null}
      </div>
      <ResultBlock title="Sizes either side">
        <MatchTable matches={neighbours} caption={`Drills nearest to ${drill.name}, closest first`} highlight={drill.name} />
      </ResultBlock>
    </>
  );
}

export function DrillsCalculator({ initial }: { initial: DrillsState }) {
  const { state, update, hydrated, href } = useQueryState(initial, drillsQuery, drillsFromSearch);
  const outcome = useMemo(() => attempt(() => drillsRequest(state), DRILLS_FIELDS, DRILL_RUNNERS), [state]);
  const nameError = errorFor(outcome, 'name');
  const dError = errorFor(outcome, 'd');
  const other = looseError(outcome);

  const candidates: SaveCandidate[] = [];
  let announce = '';
  if (outcome.status === 'ok' && outcome.kind === 'drill-size') {
    candidates.push({ title: 'This drill', request: outcome, defaultLabel: resultLabel(drillsCalculator, 'drill-size', outcome.input, outcome.output) });
    announce = `${outcome.output.name}: ${readoutMm(outcome.output.diameter.mm)} mm, ${formatIn(outcome.output.diameter.in)} inch.`;
  } else if (outcome.status === 'ok' && outcome.kind === 'nearest-drills') {
    candidates.push({ title: 'The nearest drills', request: outcome, defaultLabel: resultLabel(drillsCalculator, 'nearest-drills', outcome.input, outcome.output) });
    announce = outcome.output[0] ? `Nearest drill: ${outcome.output[0].drill.name}.` : '';
  }

  const form = (
    <>
      <Choice
        legend="Look up"
        name="mode"
        value={state.mode}
        options={[
          { value: 'name', label: 'A drill by name' },
          { value: 'size', label: 'Drills near a size' },
        ]}
        onChange={(mode) => update({ mode })}
      />
      {state.mode === 'name' ? (
        <>
          <DimBox
            id="name"
            label="Drill"
            hint="Fractional (27/64), number (#7 or No. 7), letter (F) or metric with its unit (6.8 mm)."
            error={nameError}
            value={state.name}
            onChange={(value) => update({ name: value })}
            placeholder="#7"
            maxLength={30}
            kind="name"
            big
          />
          <Examples items={NAME_EXAMPLES.map((label) => ({ label }))} onPick={(i) => update({ name: NAME_EXAMPLES[i] })} label="Drills to try" />
        </>
      ) : (
        <>
          <DimBox
            id="d"
            label="Diameter"
            hint={state.unit === 'in' ? 'In inches: 0.257 or 17/64.' : 'In millimetres: 6.78.'}
            error={dError}
            value={state.d}
            onChange={(value) => update({ d: value })}
            placeholder={state.unit === 'in' ? '0.257' : '6.78'}
            maxLength={20}
            kind="decimal"
            big
          />
          <Choice
            legend="Unit"
            name="unit"
            value={state.unit}
            options={LENGTH_UNIT_OPTIONS}
            onChange={(unit) => update({ unit })}
          />
          <Choice<DrillSide>
            legend="Drills"
            name="side"
            value={state.side}
            options={[
              { value: 'any', label: 'Either side' },
              { value: 'above', label: 'At least' },
              { value: 'below', label: 'At most' },
            ]}
            onChange={(side) => update({ side })}
            hint="“At least” for a hole a part must pass through; “at most” to leave stock for a reamer."
          />
        </>
      )}
    </>
  );

  const result = (
    <>
      {outcome.status === 'empty' ? (
        <Notice kind="info" title={state.mode === 'name' ? 'Type a drill' : 'Type a diameter'}>
          {state.mode === 'name' ? 'For example #7, F, 27/64 or 6.8 mm: its size appears in both units.' : 'The nearest fractional, number, letter and metric drills appear as you type.'}
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {outcome.status === 'error' && !other ? <Waiting>Nothing to show until the box can be read: see the reason beside it.</Waiting> : null}
      {outcome.status === 'ok' && outcome.kind === 'drill-size' ? <DrillCard drill={outcome.output} /> : null}
      {outcome.status === 'ok' && outcome.kind === 'nearest-drills' ? (
        <ResultBlock title={`Drills nearest ${readoutMm(outcome.input.diameterMm)} mm (${formatMmAs(outcome.input.diameterMm, 'in')} in)`} testId="nearest-drills">
          <MatchTable matches={outcome.output} caption="Nearest drills, closest first, with the difference from the size asked for" />
        </ResultBlock>
      ) : null}
      {outcome.status === 'ok' ? <SourcesLine sources={[SOURCES.drills]} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Drill lookup" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
