'use client';

import { useMemo } from 'react';
import { Notice } from '@/components/ui/notice';
import { INVOLUTE_CUTTERS, type SpurGearResult } from '@/lib/calculators/gears';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { formatNumber, readoutMm } from '@/lib/units/format';
import { SPUR_GEAR_FIELDS, spurGearFromSearch, spurGearQuery, spurGearRequest, type SpurGearState, spurGearCalculator } from '@/lib/calculators/pages/spur-gear';
import { GEAR_RUNNERS } from '@/lib/calculators/gears';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox } from '../boxes';
import { Len, ResultRow, SourcesLine, Waiting, WarningList } from '../readouts';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const EXAMPLES: { label: string; state: Partial<SpurGearState> }[] = [
  { label: '36 teeth · m 1.5', state: { teeth: '36', by: 'module', m: '1.5' } },
  { label: '20 teeth · m 1', state: { teeth: '20', by: 'module', m: '1' } },
  { label: '40 teeth · 16 DP', state: { teeth: '40', by: 'dp', dp: '16' } },
  { label: '60 teeth · 20 DP · 14.5°', state: { teeth: '60', by: 'dp', dp: '20', pa: '14.5' } },
];

function GearResult({ r }: { r: SpurGearResult }) {
  const first = r.system === 'module' ? 'mm' : 'in';
  return (
    <>
      <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="gear-blank">
        <p className="text-sm text-graphite-2">
          {r.teeth} teeth, {r.system === 'module' ? `module ${formatNumber(r.module, { maxDecimals: 4 })}` : `${formatNumber(r.diametralPitch, { maxDecimals: 4 })} diametral pitch`}, {r.pressureAngleDeg}°
        </p>
        <p className="text-sm font-semibold">Turn the blank to</p>
        <p className="text-3xl font-bold">
          <Len value={r.outsideDiameter} first={first} prefix="Ø" />
        </p>
        {r.cutter ? (
          <p className="text-lg font-semibold" data-testid="gear-cutter">
            Involute cutter {r.cutter.label}
          </p>
        ) : null}
      </div>
      <WarningList warnings={r.warnings} />
      <ResultBlock title="Sizes" testId="gear-sizes">
        <dl>
          <ResultRow label="Pitch diameter">
            <Len value={r.pitchDiameter} first={first} />
          </ResultRow>
          <ResultRow label="Outside diameter (the blank)" strong>
            <Len value={r.outsideDiameter} first={first} />
          </ResultRow>
          <ResultRow label="Root diameter">
            <Len value={r.rootDiameter} first={first} />
          </ResultRow>
          <ResultRow label="Whole depth (depth of cut)" strong>
            <Len value={r.wholeDepth} first={first} />
          </ResultRow>
          <ResultRow label="Addendum · dedendum">
            <Len value={r.addendum} first={first} /> <span className="text-graphite-2">·</span> <Len value={r.dedendum} first={first} />
          </ResultRow>
          <ResultRow label="Circular pitch">
            <Len value={r.circularPitch} first={first} />
          </ResultRow>
          <ResultRow label="Tooth thickness on the pitch circle">
            <Len value={r.toothThickness} first={first} />
          </ResultRow>
          <ResultRow label="Base circle diameter">
            <Len value={r.baseDiameter} first={first} />
          </ResultRow>
          <ResultRow label={r.system === 'module' ? 'Diametral pitch equivalent' : 'Module equivalent'}>
            <span className="dim">{r.system === 'module' ? `${r.diametralPitch.toFixed(3)} DP` : `m ${r.module.toFixed(4)}`}</span>
          </ResultRow>
        </dl>
      </ResultBlock>
      <ResultBlock title="Involute cutters" testId="cutter-ranges">
        {r.cutter ? <p className="text-sm">{r.cutter.note}</p> : null}
        <ul className="grid grid-cols-2 gap-1 text-sm sm:grid-cols-4">
          {INVOLUTE_CUTTERS.map((c) => {
            const chosen = r.cutter?.number === c.number;
            return (
              <li key={c.number} className={`dim rounded px-2 py-1 ${chosen ? 'bg-dye-soft font-bold' : 'text-graphite-2'}`}>
                {chosen ? <span aria-hidden="true">▸ </span> : null}No. {c.number}: {c.minTeeth}–{c.maxTeeth ?? 'rack'}
                {chosen ? <span className="sr-only"> (this gear)</span> : null}
              </li>
            );
          })}
        </ul>
        <p className="text-xs text-graphite-2">Cutters are made for one pressure angle: use a {r.pressureAngleDeg}° set.</p>
      </ResultBlock>
    </>
  );
}

export function SpurGearCalculator({ initial }: { initial: SpurGearState }) {
  const { state, update, hydrated, href } = useQueryState(initial, spurGearQuery, spurGearFromSearch);
  const outcome = useMemo(() => attempt(() => spurGearRequest(state), SPUR_GEAR_FIELDS, GEAR_RUNNERS), [state]);
  const teethError = errorFor(outcome, 'teeth');
  const mError = errorFor(outcome, 'm');
  const dpError = errorFor(outcome, 'dp');
  const other = looseError(outcome) ?? errorFor(outcome, 'pa');

  const candidates: SaveCandidate[] = [];
  let announce = '';
  if (outcome.status === 'ok' && outcome.kind === 'spur-gear') {
    const r = outcome.output;
    candidates.push({ title: 'The gear blank', request: outcome, defaultLabel: resultLabel(spurGearCalculator, 'spur-gear', outcome.input, r) });
    announce = `Blank ${readoutMm(r.outsideDiameter.mm)} millimetres, cutter number ${r.cutter?.number ?? 'none'}.`;
  }

  const form = (
    <>
      <DimBox
        id="teeth"
        label="Number of teeth"
        error={teethError}
        value={state.teeth}
        onChange={(value) => update({ teeth: value })}
        placeholder="36"
        maxLength={10}
        kind="numeric"
        big
      />
      <Choice
        legend="Tooth size by"
        name="by"
        value={state.by}
        options={[
          { value: 'module', label: 'Module (mm)' },
          { value: 'dp', label: 'Diametral pitch' },
        ]}
        onChange={(by) => update({ by })}
      />
      {state.by === 'module' ? (
        <DimBox
          id="m"
          label="Module"
          hint="Pitch diameter in mm per tooth: 1, 1.25, 1.5, 2…"
          error={mError}
          value={state.m}
          onChange={(value) => update({ m: value })}
          placeholder="1.5"
          maxLength={20}
          kind="decimal"
        />
      ) : (
        <DimBox
          id="dp"
          label="Diametral pitch"
          hint="Teeth per inch of pitch diameter: 12, 16, 20, 24…"
          error={dpError}
          value={state.dp}
          onChange={(value) => update({ dp: value })}
          placeholder="16"
          maxLength={20}
          kind="decimal"
        />
      )}
      <Choice
        legend="Pressure angle"
        name="pa"
        value={state.pa}
        options={[
          { value: '20', label: '20°' },
          { value: '14.5', label: '14.5°' },
        ]}
        onChange={(pa) => update({ pa })}
        hint="20° for most gears made today; 14.5° for many older gears and cutters."
      />
      <Examples items={EXAMPLES} onPick={(i) => update(EXAMPLES[i].state)} label="Gears to try" />
    </>
  );

  const result = (
    <>
      {outcome.status === 'empty' ? (
        <Notice kind="info" title="Type the teeth and the module or diametral pitch">
          The blank to turn, the depth of cut and the involute cutter number appear as you type.
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {outcome.status === 'error' && !other ? <Waiting>Nothing to show until the boxes can be read: see the reason beside the box.</Waiting> : null}
      {outcome.status === 'ok' && outcome.kind === 'spur-gear' ? <GearResult r={outcome.output} /> : null}
      {outcome.status === 'ok' && outcome.kind === 'spur-gear' ? <SourcesLine sources={outcome.output.sources} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Gear" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
