'use client';

import { useMemo } from 'react';
import { Field, inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { CUTTING_SPEEDS, spindleSpeed, TOOL_MATERIAL_NAMES, type ToolMaterial, type WorkMaterial } from '@/lib/calculators/speeds';
import { formatRpm } from '@/lib/calculators/units';
import { SOURCES } from '@/lib/calculators/sources';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { readLengthMm } from '@/lib/calculators/pages/numbers';
import { SPEEDS_FIELDS, speedsFromSearch, speedsQuery, speedsRequests, type SpeedsState, speedsCalculator } from '@/lib/calculators/pages/speeds';
import { SPEED_RUNNERS } from '@/lib/calculators/speeds';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox, LENGTH_UNIT_OPTIONS } from '../boxes';
import { Len, SourcesLine, Waiting } from '../readouts';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const EXAMPLES: { label: string; state: Partial<SpeedsState> }[] = [
  { label: '8 mm · 30 m/min', state: { d: '8', unit: 'mm', v: '30', vunit: 'm/min' } },
  { label: '130 mm · cast iron · HSS', state: { d: '130', unit: 'mm', material: 'cast-iron', tool: 'hss', v: '' } },
  { label: '1 in · 100 ft/min', state: { d: '1', unit: 'in', v: '100', vunit: 'sfm' } },
];

const rpmRange = (lo: number, hi: number) => `${Math.round(lo)}–${Math.round(hi)} rev/min`;

function rpmAt(sfm: number, diameterMm: number | undefined): number | null {
  if (diameterMm === undefined || !Number.isFinite(diameterMm) || diameterMm <= 0) return null;
  try {
    return spindleSpeed({ cuttingSpeed: sfm, unit: 'sfm', diameterMm }).rpm;
  } catch {
    return null;
  }
}

function StartingSpeeds({ diameterMm, material, tool, onPick }: { diameterMm: number | undefined; material: WorkMaterial | ''; tool: ToolMaterial; onPick: (m: WorkMaterial) => void }) {
  const showRpm = rpmAt(100, diameterMm) !== null;
  return (
    <ResultBlock title="Starting cutting speeds" testId="starting-speeds">
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Starting cutting speeds for turning by material and tool, with the spindle speeds at this diameter</caption>
          <thead>
            <tr className="border-b border-rule text-left text-xs text-graphite-2">
              <th scope="col" className="py-1 pr-3 font-semibold">Material</th>
              {(['hss', 'carbide'] as const).map((t) => (
                <th key={t} scope="col" className={`py-1 pr-3 font-semibold ${t === tool ? 'text-graphite' : 'hidden sm:table-cell'}`}>
                  {TOOL_MATERIAL_NAMES[t]}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {CUTTING_SPEEDS.map((row) => (
              <tr key={row.material} className={`border-b border-rule/60 align-top last:border-0 ${row.material === material ? 'bg-dye-soft/60' : ''}`}>
                <th scope="row" className="py-1.5 pr-3 text-left">
                  <button type="button" className="min-h-10 text-left font-semibold text-dye underline-offset-2 hover:underline" onClick={() => onPick(row.material)}>
                    {row.name}
                  </button>
                  {row.material === material ? <span className="ml-1 text-xs text-dye">✓ chosen</span> : null}
                  <span className="hidden text-xs font-normal text-graphite-2 sm:block">{row.note}</span>
                </th>
                {(['hss', 'carbide'] as const).map((t) => {
                  const lo = rpmAt(row[t].sfm[0], diameterMm);
                  const hi = rpmAt(row[t].sfm[1], diameterMm);
                  return (
                    <td key={t} className={`dim py-1.5 pr-3 whitespace-nowrap ${t === tool ? '' : 'hidden sm:table-cell'}`}>
                      {row[t].mPerMin[0]}–{row[t].mPerMin[1]} m/min
                      <span className="block text-xs text-graphite-2">
                        {row[t].sfm[0]}–{row[t].sfm[1]} ft/min
                      </span>
                      {showRpm && lo !== null && hi !== null ? <span className="block text-xs font-semibold">{rpmRange(lo, hi)}</span> : null}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-graphite-2">
        For turning. On a phone only the chosen tool is shown. Start low on a light machine, with a long overhang, in interrupted cuts or without coolant; drills and reamers usually run slower.
        {showRpm ? ' Spindle speeds are for the diameter given.' : ' Give a diameter to see spindle speeds.'}
      </p>
    </ResultBlock>
  );
}

export function SpeedsCalculator({ initial }: { initial: SpeedsState }) {
  const { state, update, hydrated, href } = useQueryState(initial, speedsQuery, speedsFromSearch);
  const { speed, range } = useMemo(() => {
    const reqs = () => speedsRequests(state);
    return { speed: attempt(() => reqs().speed, SPEEDS_FIELDS, SPEED_RUNNERS), range: attempt(() => reqs().range, SPEEDS_FIELDS, SPEED_RUNNERS) };
  }, [state]);
  const dError = errorFor(speed, 'd') ?? errorFor(range, 'd');
  const vError = errorFor(speed, 'v');
  const other = looseError(speed) ?? looseError(range);
  const diameterMm = readLengthMm(state.d, state.unit);

  const candidates: SaveCandidate[] = [];
  const sources: string[] = [];
  let announce = '';
  if (speed.status === 'ok' && speed.kind === 'spindle-speed') {
    candidates.push({ title: 'The spindle speed', request: speed, defaultLabel: resultLabel(speedsCalculator, 'spindle-speed', speed.input, speed.output) });
    sources.push(speed.output.source);
    announce = formatRpm(speed.output.rpm);
  }
  if (range.status === 'ok' && range.kind === 'speed-range') {
    candidates.push({ title: 'The starting speeds for this material', request: range, defaultLabel: resultLabel(speedsCalculator, 'speed-range', range.input, range.output) });
    announce = announce || rpmRange(range.output.rpm[0], range.output.rpm[1]);
  }
  sources.push(SOURCES.cuttingSpeeds);

  const form = (
    <>
      <DimBox
        id="d"
        label="Diameter"
        hint="Of the work when turning, of the drill or cutter when drilling or milling."
        error={dError}
        value={state.d}
        onChange={(value) => update({ d: value })}
        placeholder={state.unit === 'in' ? '1' : '25'}
        maxLength={20}
        kind="decimal"
        big
      />
      <Choice
        legend="Diameter in"
        name="unit"
        value={state.unit}
        options={LENGTH_UNIT_OPTIONS}
        onChange={(unit) => update({ unit })}
      />
      <DimBox
        id="v"
        label="Cutting speed"
        hint="Leave empty and pick a material to start from the table."
        error={vError}
        value={state.v}
        onChange={(value) => update({ v: value })}
        placeholder={state.vunit === 'sfm' ? '100' : '30'}
        maxLength={20}
        kind="decimal"
      />
      <Choice
        legend="Cutting speed in"
        name="vunit"
        value={state.vunit}
        options={[
          { value: 'm/min', label: 'm/min' },
          { value: 'sfm', label: 'ft/min' },
        ]}
        onChange={(vunit) => update({ vunit })}
      />
      <Field id="material" label="Material (optional)">
        <select id="material" value={state.material} onChange={(e) => update({ material: e.target.value as WorkMaterial | '' })} className={inputClass}>
          <option value="">—</option>
          {CUTTING_SPEEDS.map((r) => (
            <option key={r.material} value={r.material}>
              {r.name}
            </option>
          ))}
        </select>
      </Field>
      <Choice
        legend="Tool"
        name="tool"
        value={state.tool}
        options={[
          { value: 'hss', label: TOOL_MATERIAL_NAMES.hss },
          { value: 'carbide', label: TOOL_MATERIAL_NAMES.carbide },
        ]}
        onChange={(tool) => update({ tool })}
      />
      <Examples items={EXAMPLES} onPick={(i) => update(EXAMPLES[i].state)} label="Try" />
    </>
  );

  const result = (
    <>
      {speed.status === 'empty' && range.status === 'empty' ? (
        <Notice kind="info" title="Type a diameter">
          Then a cutting speed for the spindle speed, or a material for a starting range. The table below gives starting speeds.
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {(speed.status === 'error' || range.status === 'error') && !other ? <Waiting>Nothing to show until the boxes can be read: see the reason beside the box.</Waiting> : null}
      {speed.status === 'ok' && speed.kind === 'spindle-speed' ? (
        <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="spindle-speed">
          <p className="text-sm text-graphite-2">
            <span className="dim">
              {Number(speed.output.cuttingSpeed.mPerMin.toFixed(1))} m/min ({Number(speed.output.cuttingSpeed.sfm.toFixed(0))} ft/min)
            </span>{' '}
            on <Len value={speed.output.diameter} first={state.unit} prefix="Ø" />
          </p>
          <p className="dim text-3xl font-bold">{formatRpm(speed.output.rpm)}</p>
          <p className="text-xs text-graphite-2">{speed.output.formula}. Use the nearest speed your machine has, below rather than above.</p>
        </div>
      ) : null}
      {range.status === 'ok' && range.kind === 'speed-range' ? (
        <div className="space-y-1 rounded-lg border border-rule bg-card p-4" data-testid="speed-range">
          <p className="text-sm text-graphite-2">
            {range.output.row.name}, {TOOL_MATERIAL_NAMES[range.output.tool].toLowerCase()} tool, on <Len value={range.output.diameter} first={state.unit} prefix="Ø" />
          </p>
          <p className="dim text-2xl font-bold">Start at {rpmRange(range.output.rpm[0], range.output.rpm[1])}</p>
          <p className="dim text-sm">
            {range.output.cuttingSpeed.mPerMin[0]}–{range.output.cuttingSpeed.mPerMin[1]} m/min ({range.output.cuttingSpeed.sfm[0]}–{range.output.cuttingSpeed.sfm[1]} ft/min)
          </p>
          <button
            type="button"
            className="min-h-11 rounded-md border border-rule px-3 text-sm font-semibold hover:bg-paper-2"
            onClick={() => update({ v: String(range.output.cuttingSpeed.mPerMin[0]), vunit: 'm/min' })}
          >
            Use the low end ({range.output.cuttingSpeed.mPerMin[0]} m/min)
          </button>
        </div>
      ) : null}
      <StartingSpeeds diameterMm={diameterMm} material={state.material} tool={state.tool} onPick={(material) => update({ material })} />
      <SourcesLine sources={sources} />
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Diameter and cutting speed" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
