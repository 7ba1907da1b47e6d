'use client';

import { useMemo } from 'react';
import { Field, describedBy, inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { DEFAULT_CHANGE_GEARS_SOURCE, DEFAULT_INDEX_PLATES, DEFAULT_INDEX_PLATES_SOURCE, type DifferentialSetup, type DirectIndexingResult, type GearTrain, type IndexMove, type SimpleIndexingResult } from '@/lib/calculators/indexing';
import { formatAngle } from '@/lib/calculators/units';
import { resultLabel } from '@/lib/calculators/pages/definition';
import { INDEXING_FIELDS, indexingFromSearch, indexingQuery, indexingRequests, type IndexingState, indexingCalculator } from '@/lib/calculators/pages/indexing';
import { INDEXING_RUNNERS } from '@/lib/calculators/indexing';
import { attempt, errorFor, looseError } from '@/lib/calculators/pages/compute';
import { useQueryState } from '@/components/hooks/use-query-state';
import { CalcShell, ResultBlock } from './calc-shell';
import { Examples, DimBox } from './boxes';
import { ResultRow, SourcesLine, Waiting } from './readouts';
import { IndexPlateDrawing } from './index-plate-drawing';
import { pluralWord } from '@/lib/format';
import { SaveToEntry, type SaveCandidate } from './save-to-entry';

const EXAMPLES = ['36', '7', '24', '127', '60', '13'];

function SectorWords({ move }: { move: IndexMove }) {
  if (!move.sector || move.circle === null) {
    return <p className="text-sm">Whole turns only: any hole circle, and the sector arms are not needed.</p>;
  }
  return (
    <p className="text-sm" data-testid="sector-setting">
      <strong>Sector arms:</strong> set them to take in <strong className="dim">{move.sector.holesBetweenArms} holes</strong> of the {move.circle}-hole circle, the
      one the pin sits in and {move.sector.spaces} more ({move.sector.spaces} {move.sector.spaces === 1 ? 'space' : 'spaces'}). After each move, swing the arms on
      so the first arm meets the pin again.
    </p>
  );
}

function trainText(t: GearTrain) {
  return t.kind === 'simple'
    ? `Driver ${t.driver} (spindle) → driven ${t.driven} (plate shaft)`
    : `Driver ${t.driver1} → driven ${t.driven1}, then driver ${t.driver2} → driven ${t.driven2}`;
}

/** "56/24", or "48/32 × 40/24" for a compound train: driver over driven. */
function trainShort(t: GearTrain) {
  return t.kind === 'simple' ? `${t.driver}/${t.driven}` : `${t.driver1}/${t.driven1} × ${t.driver2}/${t.driven2}`;
}

function Differential({ d, divisions }: { d: DifferentialSetup; divisions: number }) {
  return (
    <ResultBlock title="Differential indexing set-up" testId="differential">
      <p className="text-sm">{d.description}</p>
      <dl>
        <ResultRow label="Index as for">
          <span className="dim">{d.approximateDivisions} divisions</span>
        </ResultRow>
        <ResultRow label="Crank move">
          <span className="dim">{d.index.description}</span>
        </ResultRow>
        <ResultRow label="Gear ratio, spindle to plate">
          <span className="dim">
            {d.gearRatio.numerator}/{d.gearRatio.denominator}
          </span>
        </ResultRow>
        <ResultRow label="Change gears">
          <span className="dim">{trainText(d.train)}</span>
        </ResultRow>
        <ResultRow label="Plate turns">
          <span>{d.plateDirection === 'same' ? '↻ the same way as the crank' : '↺ against the crank'}</span>
        </ResultRow>
      </dl>
      {d.index.circle ? (
        <figure>
          <IndexPlateDrawing holes={d.index.circle} count={d.index.holes} wholeTurns={d.index.wholeTurns} name={`${d.index.circle}-hole circle`} />
          <figcaption className="mt-1 text-xs text-graphite-2">The crank move for {d.approximateDivisions} divisions; the gears make up the difference to {divisions}.</figcaption>
        </figure>
      ) : null}
      <SectorWords move={d.index} />
      <ul className="list-disc space-y-1 pl-5 text-sm text-graphite-2">
        {d.notes.map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
    </ResultBlock>
  );
}

function SimpleResult({ r }: { r: SimpleIndexingResult }) {
  const t = r.turnsPerDivision;
  const fraction = t.numerator ? `${t.whole ? `${t.whole} ` : ''}${t.numerator}/${t.denominator}` : String(t.whole);
  const asWritten = `${r.ratio}/${r.divisions}`;
  const d = r.differential;
  return (
    <>
      <div className="space-y-1 rounded-lg border-2 border-dye/50 bg-card p-4" data-testid="indexing-move">
        {/* The answer first: the crank move, or the differential set-up when simple indexing cannot do it. */}
        {r.move ? (
          <p className="text-2xl font-bold">{r.move.description}</p>
        ) : d ? (
          <>
            <p className="text-sm font-semibold uppercase tracking-wide text-dye">By differential indexing</p>
            <p className="text-2xl font-bold">
              Index as for {d.approximateDivisions}: {d.index.description}; change gears {trainShort(d.train)}
            </p>
            <p className="text-sm">{r.message}</p>
          </>
        ) : (
          <p className="text-xl font-bold">
            <span aria-hidden="true">✕</span> No hole circle given serves
          </p>
        )}
        <p className="text-sm text-graphite-2">
          {r.divisions} divisions on a {r.ratio}:1 head: <span className="dim">{asWritten === fraction ? fraction : `${asWritten} = ${fraction}`}</span>{' '}
          {pluralWord(t.value, 'crank turn')} a division
        </p>
        <p className="dim text-sm text-graphite-2">{formatAngle(r.degreesPerDivision)} of the work a division</p>
      </div>
      {r.move ? (
        <>
          {r.move.circle ? (
            <figure className="rounded-lg border border-rule bg-card p-2 sm:p-4">
              <IndexPlateDrawing holes={r.move.circle} count={r.move.holes} wholeTurns={r.move.wholeTurns} name={`${r.move.circle}-hole circle`} />
              <figcaption className="mt-2 text-xs text-graphite-2">
                Black: the hole the pin is in. Filled and numbered: the holes to count, clockwise. The shaded wedge between the two arms is the sector setting.
              </figcaption>
            </figure>
          ) : null}
          <SectorWords move={r.move} />
          {r.options.length > 1 ? (
            <ResultBlock title="Other circles that work">
              <ul className="space-y-1 text-sm">
                {r.options.slice(1).map((o) => (
                  <li key={o.circle} className="dim">
                    {o.description}
                  </li>
                ))}
              </ul>
            </ResultBlock>
          ) : null}
        </>
      ) : (
        d ? null : (
          <Notice kind="caution" title="Simple indexing cannot do it">
            {r.message}
          </Notice>
        )
      )}
      {r.differential ? <Differential d={r.differential} divisions={r.divisions} /> : null}
    </>
  );
}

function DirectResult({ r }: { r: DirectIndexingResult }) {
  return (
    <ResultBlock title={`Direct indexing on a ${r.plateHoles}-hole spindle plate`} testId="direct-indexing">
      <p className="text-lg font-bold">
        Move <span className="dim">{r.holesToMove}</span> {r.holesToMove === 1 ? 'hole' : 'holes'} a division
      </p>
      <figure>
        <IndexPlateDrawing holes={r.plateHoles} count={r.holesToMove} arms={false} name={`${r.plateHoles}-hole spindle plate`} />
        <figcaption className="mt-1 text-xs text-graphite-2">Black: the hole the plunger is in. Filled and numbered: the holes to move, clockwise.</figcaption>
      </figure>
      <p className="text-xs text-graphite-2">This plate gives {r.workableDivisions.join(', ')} divisions directly.</p>
    </ResultBlock>
  );
}

export function IndexingCalculator({ initial }: { initial: IndexingState }) {
  const { state, update, hydrated, href } = useQueryState(initial, indexingQuery, indexingFromSearch);
  const { simple, direct } = useMemo(() => {
    const reqs = () => indexingRequests(state);
    return { simple: attempt(() => reqs()?.simple ?? null, INDEXING_FIELDS, INDEXING_RUNNERS), direct: attempt(() => reqs()?.direct ?? null, INDEXING_FIELDS, INDEXING_RUNNERS) };
  }, [state]);
  const nError = errorFor(simple, 'n');
  const ratioError = errorFor(simple, 'ratio');
  const circlesError = errorFor(simple, 'circles');
  // A plate that cannot give the divisions is said in its own block, not as an error on the divisions box.
  const plateError = simple.status === 'ok' ? errorFor(direct, 'plate') : undefined;
  const directRefusal = simple.status === 'ok' && direct.status === 'error' && direct.field !== 'plate' ? direct.message : undefined;
  const other = looseError(simple);
  const own = state.circles.trim() !== '';

  const candidates: SaveCandidate[] = [];
  const sources: string[] = [];
  let announce = '';
  if (simple.status === 'ok' && simple.kind === 'simple-indexing') {
    const r = simple.output;
    candidates.push({ title: 'The dividing-head move', request: simple, defaultLabel: resultLabel(indexingCalculator, 'simple-indexing', simple.input, r) });
    announce = r.message;
    sources.push(r.circlesSource, r.source);
    if (r.differential) sources.push(r.differential.source, DEFAULT_CHANGE_GEARS_SOURCE);
  }
  if (direct.status === 'ok' && direct.kind === 'direct-indexing') {
    candidates.push({ title: 'The direct-indexing move', request: direct, defaultLabel: resultLabel(indexingCalculator, 'direct-indexing', direct.input, direct.output) });
    sources.push(direct.output.source);
  }

  const form = (
    <>
      <DimBox
        id="n"
        label="Divisions"
        hint="Teeth, flutes or flats around the work."
        error={nError}
        value={state.n}
        onChange={(value) => update({ n: value })}
        placeholder="36"
        maxLength={10}
        kind="numeric"
        big
      />
      <DimBox
        id="ratio"
        label="Head ratio (crank turns per spindle turn)"
        hint="40 on most dividing heads."
        error={ratioError}
        value={state.ratio}
        onChange={(value) => update({ ratio: value })}
        placeholder="40"
        maxLength={6}
        kind="numeric"
      />
      <Field
        id="circles"
        label="Your hole circles"
        hint="Hole counts of your own index plates, separated by commas. Empty: the commonly supplied set below."
        error={circlesError}
      >
        <textarea
          id="circles"
          rows={2}
          value={state.circles}
          onChange={(e) => update({ circles: e.target.value })}
          placeholder="15, 16, 17, 18, 19, 20, 21, 23, 27…"
          maxLength={400}
          className={`${inputClass} dim`}
          aria-invalid={circlesError ? true : undefined}
          aria-describedby={describedBy('circles', circlesError, 'hint')}
        />
      </Field>
      <div className="rounded-md border border-rule bg-paper-2/60 p-3 text-xs" data-testid="default-plates">
        <p className="font-semibold">{own ? 'Not in use — ' : 'In use: '}commonly supplied plates</p>
        <ul className="dim mt-1 space-y-0.5">
          {DEFAULT_INDEX_PLATES.map((p) => (
            <li key={p.name}>
              {p.name}: {p.circles.join(' ')}
            </li>
          ))}
        </ul>
        <p className="mt-1 text-graphite-2">{DEFAULT_INDEX_PLATES_SOURCE}. Check the plates that came with your head.</p>
        {!own ? (
          <button
            type="button"
            className="mt-2 min-h-11 rounded-md border border-rule bg-card px-3 text-sm font-semibold hover:bg-paper-2"
            onClick={() => update({ circles: DEFAULT_INDEX_PLATES.flatMap((p) => p.circles).join(', ') })}
          >
            Copy into my circles to edit
          </button>
        ) : null}
      </div>
      <DimBox
        id="plate"
        label="Spindle plate holes (direct indexing)"
        hint="The plate on the head's spindle nose, often 24."
        error={plateError}
        value={state.plate}
        onChange={(value) => update({ plate: value })}
        placeholder="24"
        maxLength={6}
        kind="numeric"
      />
      <Examples items={EXAMPLES.map((label) => ({ label }))} onPick={(i) => update({ n: EXAMPLES[i] })} label="Divisions to try" />
    </>
  );

  const result = (
    <>
      {simple.status === 'empty' ? (
        <Notice kind="info" title="Type the number of divisions">
          For example 36 for a 36-tooth gear. The crank turns and holes, the sector-arm setting and a drawing of the plate appear as you type.
        </Notice>
      ) : null}
      {other ? <Notice kind="error" title="Cannot work this out">{other}</Notice> : null}
      {simple.status === 'error' && !other ? <Waiting>Nothing to show until the boxes can be read: see the reason beside the box.</Waiting> : null}
      {simple.status === 'ok' && simple.kind === 'simple-indexing' ? <SimpleResult r={simple.output} /> : null}
      {direct.status === 'ok' && direct.kind === 'direct-indexing' ? <DirectResult r={direct.output} /> : null}
      {directRefusal ? (
        <ResultBlock title="Direct indexing" testId="direct-indexing">
          <p className="text-sm">
            <span aria-hidden="true">✕ </span>
            Not on a {state.plate || '24'}-hole spindle plate. {directRefusal}
          </p>
        </ResultBlock>
      ) : null}
      {sources.length ? <SourcesLine sources={sources} /> : null}
      <SaveToEntry candidates={candidates} returnTo={href} />
    </>
  );

  return <CalcShell formLabel="Divisions and plates" hydrated={hydrated} form={form} result={result} announce={announce} />;
}
