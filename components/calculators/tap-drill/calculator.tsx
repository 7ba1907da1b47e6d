'use client';

import { useMemo } from 'react';
import { Field, describedBy, inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { formatPercent, lengthFromMm } from '@/lib/calculators/units';
import { SOURCES } from '@/lib/calculators/sources';
import { tapDrill, type TapDrillChoice, type TapDrillResult, type ThreadPercentResult } from '@/lib/calculators/threads';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { formatIn, formatMm, readoutMm } from '@/lib/units/format';
import { TAP_DRILL_FIELDS, tapDrillFromSearch, tapDrillQuery, tapDrillRequest, type DrillSet, type TapDrillState, tapDrillCalculator } from '@/lib/calculators/pages/tap-drill';
import { THREAD_RUNNERS } from '@/lib/calculators/threads';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from '../calc-shell';
import { Choice, Examples, DimBox } from '../boxes';
import { Len, ResultRow, SourcesLine, Waiting, WarningList } from '../readouts';
import { TappedHoleDrawing } from './tapped-hole-drawing';
import { SaveToEntry, type SaveCandidate } from '../save-to-entry';

const EXAMPLES = ['M8x1.25', '1/4-20', 'M10x1', '5/16-18 UNC', '#10-32', 'M6'];
const KIND_WORDS = { fractional: 'fractional', number: 'number', letter: 'letter', metric: 'metric' } as const;

function DrillChoiceCard({ title, choice, testId }: { title: string; choice: TapDrillChoice | null; testId: string }) {
  return (
    <div className="rounded-lg border border-rule bg-card p-3" data-testid={testId}>
      <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">{title}</p>
      {choice ? (
        <>
          <p className="mt-1 text-lg font-bold">
            <span className="dim">{choice.drill.name}</span>{' '}
            <span className="text-sm font-normal text-graphite-2">{KIND_WORDS[choice.drill.kind]} drill</span>
          </p>
          <Len value={choice.drill.diameter} first={choice.drill.kind === 'metric' ? 'mm' : 'in'} />
          <p className="dim mt-1 text-sm">{formatPercent(choice.percent)} of thread</p>
        </>
      ) : (
        <p className="mt-1 text-sm text-graphite-2">None in the chart for this thread.</p>
      )}
    </div>
  );
}

function BlindHoleNote({ guide, drillMm }: { guide: TapDrillResult['blindHole']; drillMm: number }) {
  return (
    <ResultBlock title="Blind holes: how much deeper to drill" testId="blind-hole">
      <p className="text-sm text-graphite-2">{guide.note}</p>
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Extra drilling depth beyond the last full thread, by kind of tap</caption>
          <thead>
            <tr className="border-b border-rule text-left text-xs text-graphite-2">
              <th scope="col" className="py-1 pr-3 font-semibold">Tap</th>
              <th scope="col" className="py-1 pr-3 font-semibold">Chamfer</th>
              <th scope="col" className="py-1 font-semibold">Extra depth</th>
            </tr>
          </thead>
          <tbody>
            {guide.allowances.map((a) => (
              <tr key={a.tap} className="border-b border-rule/60 align-top last:border-0">
                <th scope="row" className="py-1.5 pr-3 text-left font-semibold capitalize">
                  {a.tap}
                </th>
                <td className="dim py-1.5 pr-3 whitespace-nowrap">
                  {a.chamferPitches[0]}–{a.chamferPitches[1]} threads
                </td>
                <td className="py-1.5">
                  <span className="dim whitespace-nowrap">
                    {formatMm(a.extraDepth.min.mm, { decimals: 2, maxDecimals: 2 })}–{formatMm(a.extraDepth.max.mm, { decimals: 2, maxDecimals: 2 })} mm
                  </span>{' '}
                  <span className="dim whitespace-nowrap text-xs text-graphite-2">
                    {formatIn(a.extraDepth.min.in, { decimals: 3 })}–{formatIn(a.extraDepth.max.in, { decimals: 3 })} in
                  </span>
                  <span className="block text-xs text-graphite-2">{a.note}</span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-sm">
        Add the drill point too, about <Len value={lengthFromMm(0.3 * drillMm)} /> on this drill (118°).
      </p>
    </ResultBlock>
  );
}

function ThreadFacts({ thread }: { thread: TapDrillResult['thread'] }) {
  return (
    <ResultBlock title={`Thread ${thread.designationWithPitch}`} testId="thread-facts">
      <dl>
        <ResultRow label="Major diameter">
          <Len value={thread.major} first={thread.system === 'unified' ? 'in' : 'mm'} />
        </ResultRow>
        <ResultRow label={thread.tpi ? `Pitch (${thread.tpi} threads per inch)` : 'Pitch'}>
          <Len value={thread.pitch} first={thread.system === 'unified' ? 'in' : 'mm'} />
        </ResultRow>
        <ResultRow label="Basic minor diameter of the nut">
          <Len value={thread.minorDiameterInternal} first={thread.system === 'unified' ? 'in' : 'mm'} />
        </ResultRow>
      </dl>
    </ResultBlock>
  );
}

function PickResult({ r }: { r: TapDrillResult }) {
  const c = r.choice;
  return (
    <>
      <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="tap-drill-choice">
        <p className="text-sm text-graphite-2">
          Tap drill for <span className="dim font-semibold text-graphite">{r.thread.designationWithPitch}</span> at {Number(r.targetPercent.toFixed(1))} %
        </p>
        <p className="text-3xl font-bold">
          <span className="dim">{c.drill.name}</span>
          {c.drill.alsoNamed.length ? <span className="ml-2 text-base font-normal text-graphite-2">also {c.drill.alsoNamed.join(', ')}</span> : null}
        </p>
        <Len value={c.drill.diameter} first={c.drill.kind === 'metric' ? 'mm' : 'in'} />
        <p className="dim text-lg font-semibold" data-testid="tap-drill-percent">
          {formatPercent(c.percent)} of thread
        </p>
        <p className="text-xs text-graphite-2">
          Exact drill for {Number(r.targetPercent.toFixed(1))} %: <Len value={r.idealDrill} />
        </p>
      </div>

      <div className="grid gap-3 sm:grid-cols-2">
        <DrillChoiceCard title="Best inch drill" choice={r.bestInch} testId="best-inch" />
        <DrillChoiceCard title="Best metric drill" choice={r.bestMetric} testId="best-metric" />
      </div>

      <WarningList warnings={r.warnings} />

      <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
        <TappedHoleDrawing designation={r.thread.designationWithPitch} major={r.thread.major} pitchMm={r.thread.pitchMm} drill={c.drill.diameter} drillName={c.drill.name} percent={c.percent} />
        <figcaption className="mt-2 text-xs text-graphite-2">
          Section through the hole, to scale. Shaded: the thread the tap cuts, from the drilled hole out to the major diameter. Dashed: where a full
          thread (100 %, 1.299 × pitch across) would end. Hatched: the part.
        </figcaption>
      </figure>

      {r.alternatives.length ? (
        <ResultBlock title="Other drills close to the target" testId="alternatives">
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <caption className="sr-only">Other drills, closest to the target first, with the percentage of thread each gives</caption>
              <thead>
                <tr className="border-b border-rule text-left text-xs text-graphite-2">
                  <th scope="col" className="py-1 pr-3 font-semibold">Drill</th>
                  <th scope="col" className="py-1 pr-3 text-right font-semibold">mm</th>
                  <th scope="col" className="py-1 pr-3 text-right font-semibold">in</th>
                  <th scope="col" className="py-1 text-right font-semibold">Thread</th>
                </tr>
              </thead>
              <tbody>
                {r.alternatives.map((a) => (
                  <tr key={a.drill.name} className="border-b border-rule/60 last:border-0">
                    <th scope="row" className="dim py-1.5 pr-3 text-left font-semibold">
                      {a.drill.name}
                    </th>
                    <td className="dim py-1.5 pr-3 text-right">{readoutMm(a.drill.diameter.mm)}</td>
                    <td className="dim py-1.5 pr-3 text-right">{formatIn(a.drill.diameter.in)}</td>
                    <td className="dim py-1.5 text-right">{formatPercent(a.percent)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="text-xs text-graphite-2">{r.tieRule}</p>
        </ResultBlock>
      ) : null}

      <ThreadFacts thread={r.thread} />
      <BlindHoleNote guide={r.blindHole} drillMm={c.drill.diameterMm} />
    </>
  );
}

function CheckResult({ r }: { r: ThreadPercentResult }) {
  // The blind-hole allowances depend only on the pitch: take them from the tap-drill tables for this thread.
  const guide = useMemo(() => tapDrill(r.thread.designation).blindHole, [r.thread.designation]);
  return (
    <>
      <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="thread-percent-result">
        <p className="text-sm text-graphite-2">
          <span className="dim font-semibold text-graphite">{r.thread.designationWithPitch}</span> drilled{' '}
          <span className="dim font-semibold text-graphite">{r.drillSize?.name ?? `${readoutMm(r.drill.mm)} mm`}</span>
        </p>
        <p className="dim text-3xl font-bold" data-testid="tap-drill-percent">
          {formatPercent(r.percent)} of thread
        </p>
        <p className="text-sm">
          Drill <Len value={r.drill} /> · thread depth each side <Len value={r.threadDepth} />
        </p>
      </div>
      <WarningList warnings={r.warnings} />
      <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
        <TappedHoleDrawing designation={r.thread.designationWithPitch} major={r.thread.major} pitchMm={r.thread.pitchMm} drill={r.drill} drillName={r.drillSize?.name} percent={r.percent} />
        <figcaption className="mt-2 text-xs text-graphite-2">
          Section through the hole, to scale. Shaded: the thread the tap cuts. Dashed: where a full thread (100 %) would end. Hatched: the part.
        </figcaption>
      </figure>
      <p className="text-xs text-graphite-2">{r.relation}</p>
      <ThreadFacts thread={r.thread} />
      <BlindHoleNote guide={guide} drillMm={r.drill.mm} />
    </>
  );
}

export function TapDrillCalculator({ initial }: { initial: TapDrillState }) {
  const { state, update, hydrated, href } = useQueryState(initial, tapDrillQuery, tapDrillFromSearch);
  const outcome = useMemo(() => attempt(() => tapDrillRequest(state), TAP_DRILL_FIELDS, THREAD_RUNNERS), [state]);
  const threadError = errorFor(outcome, 'thread');
  const targetError = errorFor(outcome, 'target');
  const drillError = errorFor(outcome, 'drill');
  const drillsError = errorFor(outcome, 'drills');
  const other = looseError(outcome);

  const candidates: SaveCandidate[] = [];
  let announce = '';
  let sources: string[] = [];
  if (outcome.status === 'ok' && outcome.kind === 'tap-drill') {
    const r = outcome.output;
    candidates.push({ title: 'The tap drill', request: outcome, defaultLabel: resultLabel(tapDrillCalculator, 'tap-drill', outcome.input, r) });
    announce = `${r.thread.designationWithPitch}: drill ${r.choice.drill.name}, ${formatPercent(r.choice.percent)} of thread.`;
    sources = r.sources;
  } else if (outcome.status === 'ok' && outcome.kind === 'thread-percent') {
    const r = outcome.output;
    candidates.push({ title: 'The thread engagement', request: outcome, defaultLabel: resultLabel(tapDrillCalculator, 'thread-percent', outcome.input, r) });
    announce = `${r.thread.designationWithPitch} with this drill: ${formatPercent(r.percent)} of thread.`;
    sources = [r.thread.source, r.source, SOURCES.drills, SOURCES.tapDepth];
  }

  const form = (
    <>
      <DimBox
        id="thread"
        label="Thread"
        hint="e.g. M8x1.25, M10x1, 1/4-20, 5/16-18 UNC or #10-32. Metric coarse pitch if none is given."
        error={threadError}
        value={state.thread}
        onChange={(value) => update({ thread: value })}
        placeholder="M8x1.25"
        maxLength={60}
        kind="name"
        big
      />
      <Choice
        legend="What do you want to know?"
        name="mode"
        value={state.mode}
        options={[
          { value: 'pick', label: 'The drill to use' },
          { value: 'check', label: 'A drill I have' },
        ]}
        onChange={(mode) => update({ mode })}
      />
      {state.mode === 'pick' ? (
        <>
          <DimBox
            id="target"
            label="Target percentage of thread"
            hint="75 % is the usual shop target; 60–85 % makes a good thread."
            error={targetError}
            value={state.target}
            onChange={(value) => update({ target: value })}
            placeholder="75"
            maxLength={8}
            kind="decimal"
          />
          <Field id="drills" label="Drills to choose from" error={drillsError}>
            <select
              id="drills"
              value={state.drills}
              onChange={(e) => update({ drills: e.target.value as DrillSet })}
              className={inputClass}
              aria-invalid={drillsError ? true : undefined}
              aria-describedby={describedBy('drills', drillsError)}
            >
              <option value="all">All drills (inch and metric)</option>
              <option value="inch">Inch drills: fractional, number, letter</option>
              <option value="metric">Metric drills</option>
            </select>
          </Field>
        </>
      ) : (
        <DimBox
          id="drill"
          label="Drill you have"
          hint="A drill by name (#7, F, 27/64, 6.8 mm) or a size with its unit (6.75 mm, 0.2 in)."
          error={drillError}
          value={state.drill}
          onChange={(value) => update({ drill: value })}
          placeholder="6.8 mm"
          maxLength={30}
          kind="name"
        />
      )}
      <Examples items={EXAMPLES.map((label) => ({ label }))} onPick={(i) => update({ thread: EXAMPLES[i] })} label="Threads to try" />
    </>
  );

  const result = (
    <>
      {outcome.status === 'empty' ? (
        <Notice kind="info" title={state.mode === 'check' && state.thread.trim() ? 'Type the drill you have' : 'Type a thread'}>
          {state.mode === 'check' && state.thread.trim()
            ? 'Give the drill by its name or size, and the percentage of thread it leaves appears as you type.'
            : 'For example M8x1.25 or 1/4-20. The tap drill, the thread it leaves and a drawing of the hole appear as you type.'}
        </Notice>
      ) : null}
      {outcome.status === 'error' ? (
        other ? (
          <Notice kind="error" title="Cannot work this out">
            {other}
          </Notice>
        ) : (
          <Waiting>Nothing to show until the boxes can be read: see the reason beside the box.</Waiting>
        )
      ) : null}
      {outcome.status === 'ok' && outcome.kind === 'tap-drill' ? <PickResult r={outcome.output} /> : null}
      {outcome.status === 'ok' && outcome.kind === 'thread-percent' ? <CheckResult r={outcome.output} /> : null}
      {sources.length ? <SourcesLine sources={sources} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Thread and drill" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
