'use client';

import { useMemo } from 'react';
import { Notice } from '@/components/ui/notice';
import { formatAngle } from '@/lib/calculators/units';
import type { BoltCircleResult, BoltHole } from '@/lib/calculators/bolt-circle';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { BOLT_CIRCLE_FIELDS, boltCircleFromSearch, boltCircleQuery, boltCircleRequest, type BoltCircleState, boltCircleCalculator } from '@/lib/calculators/pages/bolt-circle';
import { BOLT_CIRCLE_RUNNERS } from '@/lib/calculators/bolt-circle';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox, LENGTH_UNIT_OPTIONS } from '../boxes';
import { Len, ResultRow, SourcesLine, Waiting } from '../readouts';
import { formatIn, readoutMm } from '@/lib/units/format';
import type { LengthUnit } from '@/lib/types/units';
import { BoltCircleDrawing } from './bolt-circle-drawing';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const EXAMPLES: { label: string; state: Partial<BoltCircleState> }[] = [
  { label: '124 mm · 3 holes · 90°', state: { d: '124', unit: 'mm', holes: '3', start: '90', midway: false } },
  { label: '100 mm · 6 holes', state: { d: '100', unit: 'mm', holes: '6', start: '', midway: false } },
  { label: '4 in · 5 holes · 90°', state: { d: '4', unit: 'in', holes: '5', start: '90', midway: false } },
  { label: '80 mm · 4 + 4 midway', state: { d: '80', unit: 'mm', holes: '4', start: '45', midway: true } },
];

function HoleTable({ holes, mark, caption }: { holes: BoltHole[]; mark: string; caption: string }) {
  return (
    <div className="max-h-[32rem] overflow-auto">
      <table className="w-full text-xs sm:text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 bg-card">
          <tr className="border-b border-rule text-left text-xs text-graphite-2">
            <th scope="col" className="py-1 pr-2 font-semibold">Hole</th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold">Angle</th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold">
              Table <span className="sr-only">setting from hole 1</span>
            </th>
            <th scope="col" className="py-1 pr-2 text-right font-semibold">
              X <span className="font-normal">mm · in</span>
            </th>
            <th scope="col" className="py-1 text-right font-semibold">
              Y <span className="font-normal">mm · in</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {holes.map((h) => (
            <tr key={h.index} className="border-b border-rule/60 align-top last:border-0" data-row={`${h.index}${mark}`}>
              <th scope="row" className="dim py-1.5 pr-2 text-left font-semibold">
                {h.index}
                {mark}
              </th>
              <td className="dim py-1.5 pr-2 text-right">{formatAngle(h.angleDeg)}</td>
              <td className="dim py-1.5 pr-2 text-right">{formatAngle(h.turnFromFirstDeg)}</td>
              <td className="dim py-1.5 pr-2 text-right">
                <span className="block whitespace-nowrap">{readoutMm(h.x.mm)}</span>
                <span className="block whitespace-nowrap text-xs text-graphite-2">{formatIn(h.x.in)}</span>
              </td>
              <td className="dim py-1.5 text-right">
                <span className="block whitespace-nowrap">{readoutMm(h.y.mm)}</span>
                <span className="block whitespace-nowrap text-xs text-graphite-2">{formatIn(h.y.in)}</span>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function BoltCircleResultView({ r, first }: { r: BoltCircleResult; first: LengthUnit }) {
  return (
    <>
      <ResultBlock testId="bolt-circle-summary">
        <dl>
          <ResultRow label="Bolt circle diameter" strong>
            <Len value={r.diameter} first={first} />
          </ResultRow>
          <ResultRow label={`Between holes (${r.holeCount} holes)`}>
            <span className="dim">{formatAngle(r.stepDeg)}</span>
          </ResultRow>
          <ResultRow label="Chord, hole to neighbouring hole" testId="chord">
            <Len value={r.chord} first={first} />
          </ResultRow>
          {r.midwayChord ? (
            <ResultRow label="Hole to the nearest midway hole">
              <Len value={r.midwayChord} first={first} />
            </ResultRow>
          ) : null}
        </dl>
      </ResultBlock>
      <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
        <BoltCircleDrawing result={r} />
        <figcaption className="mt-2 text-xs text-graphite-2">
          Circles: the holes, numbered counter-clockwise from hole 1 (outlined heavier).{' '}
          {r.midwayHoles ? 'Squares: the midway holes, numbered 1′, 2′… from the one after hole 1. ' : ''}
          The arc is the start angle from +X. {r.convention}
        </figcaption>
      </figure>
      <ResultBlock title="Hole positions from the centre" testId="hole-table">
        <HoleTable holes={r.holes} mark="" caption="Each hole's angle from +X, the rotary-table setting from hole 1, and its X and Y from the centre" />
        <p className="text-xs text-graphite-2">
          Angle: from +X, counter-clockwise. Table: what a rotary table set to 0 at hole 1 reads at each hole.
        </p>
      </ResultBlock>
      {r.midwayHoles ? (
        <ResultBlock title="Midway holes" testId="midway-table">
          <HoleTable holes={r.midwayHoles} mark="′" caption="Midway holes: angle, rotary-table setting from hole 1, X and Y from the centre" />
        </ResultBlock>
      ) : null}
    </>
  );
}

export function BoltCircleCalculator({ initial }: { initial: BoltCircleState }) {
  const { state, update, hydrated, href } = useQueryState(initial, boltCircleQuery, boltCircleFromSearch);
  const outcome = useMemo(() => attempt(() => boltCircleRequest(state), BOLT_CIRCLE_FIELDS, BOLT_CIRCLE_RUNNERS), [state]);
  const dError = errorFor(outcome, 'd');
  const holesError = errorFor(outcome, 'holes');
  const startError = errorFor(outcome, 'start');
  const other = looseError(outcome);

  const candidates: SaveCandidate[] = [];
  let announce = '';
  if (outcome.status === 'ok' && outcome.kind === 'bolt-circle') {
    const r = outcome.output;
    candidates.push({ title: 'The bolt circle', request: outcome, defaultLabel: resultLabel(boltCircleCalculator, 'bolt-circle', outcome.input, r) });
    announce = `${r.holeCount} holes on ${readoutMm(r.diameter.mm)} millimetres, ${formatAngle(r.stepDeg)} apart.`;
  }

  const numberField = (id: 'd' | 'holes' | 'start', label: string, hint: string, placeholder: string, error?: string) => (
    <DimBox
      id={id}
      label={label}
      hint={hint}
      error={error}
      value={state[id]}
      onChange={(value) => update({ [id]: value } as Partial<BoltCircleState>)}
      placeholder={placeholder}
      maxLength={20}
      kind={id === 'start' ? 'text' : 'decimal'}
      big={id === 'd'}
    />
  );

  const form = (
    <>
      {numberField('d', 'Bolt circle diameter', state.unit === 'in' ? 'In inches: 4.5 or 4-1/2.' : 'In millimetres.', state.unit === 'in' ? '4.5' : '124', dError)}
      <Choice
        legend="Diameter in"
        name="unit"
        value={state.unit}
        options={LENGTH_UNIT_OPTIONS}
        onChange={(unit) => update({ unit })}
      />
      {numberField('holes', 'Number of holes', 'Equally spaced, 2 to 360.', '6', holesError)}
      {numberField('start', 'Start angle of hole 1 (degrees)', 'From +X (3 o’clock), counter-clockwise: 90 puts hole 1 at 12 o’clock.', '0', startError)}
      <label className="flex min-h-11 cursor-pointer items-center gap-3 text-sm font-semibold">
        <input type="checkbox" checked={state.midway} onChange={(e) => update({ midway: e.target.checked })} className="h-5 w-5 accent-[var(--color-dye)]" aria-describedby="midway-hint" />
        Add a second pattern midway between the holes
      </label>
      <p id="midway-hint" className="-mt-3 text-xs text-graphite-2">
        For example tapped holes between the clearance holes of the same circle.
      </p>
      <Examples items={EXAMPLES} onPick={(i) => update(EXAMPLES[i].state)} label="Patterns to try" />
    </>
  );

  const result = (
    <>
      {outcome.status === 'empty' ? (
        <Notice kind="info" title="Type a diameter and a number of holes">
          The coordinates of each hole from the centre, the rotary-table angles and a drawing of the pattern appear as you type.
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {outcome.status === 'error' && !other ? <Waiting>Nothing to show until the boxes can be read: see the reason beside the box.</Waiting> : null}
      {outcome.status === 'ok' && outcome.kind === 'bolt-circle' ? <BoltCircleResultView r={outcome.output} first={state.unit} /> : null}
      {outcome.status === 'ok' && outcome.kind === 'bolt-circle' ? <SourcesLine sources={[outcome.output.source]} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Bolt circle" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
