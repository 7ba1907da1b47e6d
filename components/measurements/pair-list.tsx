'use client';

import { startTransition, useActionState, useId, useState } from 'react';
import Link from 'next/link';
import { actualPairWords, clearanceRangeText, clearanceText, FIT_KIND_WORDS } from '@/lib/measurements/words';
import { otherUnit, type LengthUnit } from '@/lib/measurements/units';
import type { PairCandidate, PairSideView, PairView } from '@/lib/types/measurements';
import { FitKindIcon, KIND_TONE } from '@/components/fits/fit-kind';
import { PressFitCaution } from '@/components/fits/press-fit-caution';
import { ZoneDrawing } from '@/components/fits/zone-drawing';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { inputClass } from '@/components/ui/field';
import { createPairAction, deletePairAction } from '@/lib/actions/measurements';
import { dispatchForm, IDLE } from '@/components/forms/action-state';
import { zoneOf } from './zone-picture';

type Props = {
  recordId: number;
  recordKind: 'outside' | 'inside';
  nominalLabel: string;
  pairs: PairView[];
  candidates: PairCandidate[];
  canEdit: boolean;
  slug: string;
  unit: LengthUnit;
};

function Side({ side, role, slug }: { side: PairSideView; role: 'Hole' | 'Shaft'; slug: string }) {
  return (
    <div className="text-sm">
      <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">{role}</p>
      <Link href={`/logs/${slug}/records/${side.id}`} className="font-semibold">
        {side.feature}
      </Link>
      <p className="dim">
        {side.nominalText} {side.unit} {side.limits.label}
        {side.latest ? (
          <span className="text-graphite-2">
            {' '}
            · latest {side.latest.valueText} {side.latest.unit}
          </span>
        ) : (
          <span className="text-graphite-2"> · no reading yet</span>
        )}
      </p>
    </div>
  );
}

/** One fit: its kind and clearance range from the specifications, and the clearance actually made. */
function PairCard({ pair, slug, unit, canEdit }: { pair: PairView; slug: string; unit: LengthUnit; canEdit: boolean }) {
  // Unpairing renders the page again without this fit; a refusal stays here as its message.
  const [state, unpair, pending] = useActionState(deletePairAction, IDLE);
  const error = state.ok ? null : (state.message ?? 'Not unpaired.');
  const a = pair.analysis;
  const other = otherUnit(unit);
  const made = a.actualState === 'within' ? 'ok' : a.actualState === 'unknown' ? 'unknown' : 'bad';
  const madeBox = made === 'ok' ? 'border-ok/60 bg-ok-soft' : made === 'bad' ? 'border-bad/60 bg-bad-soft' : 'border-rule bg-paper-2';
  const madeIcon = made === 'ok' ? '✓' : made === 'bad' ? '✕' : '–';
  const title = a.fit ?? `${pair.hole.limits.label} with ${pair.shaft.limits.label}`;
  return (
    <article className="space-y-3 rounded-lg border border-rule bg-card p-4" data-testid="pair" aria-label={`Fit ${title}`}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h3 className="dim text-lg font-bold">
            {pair.hole.nominalText} {pair.hole.unit} {title}
          </h3>
          <p className={`inline-flex items-center gap-1.5 font-semibold ${KIND_TONE[a.kind]}`}>
            <FitKindIcon kind={a.kind} className="h-5 w-5" />
            {FIT_KIND_WORDS[a.kind]}
          </p>
        </div>
        {canEdit ? (
          <Button
            type="button"
            tone="quiet"
            className="!min-h-10 !px-3"
            disabled={pending}
            onClick={() => {
              const data = new FormData();
              data.set('pairId', String(pair.id));
              startTransition(() => unpair(data));
            }}
          >
            Unpair
          </Button>
        ) : null}
      </div>
      {error ? <Notice kind="error">{error}</Notice> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <Side side={pair.hole} role="Hole" slug={slug} />
        <Side side={pair.shaft} role="Shaft" slug={slug} />
      </div>
      <p className="text-sm">
        The specifications give <span className="dim font-semibold">{clearanceRangeText(a, unit)}</span>
        <span className="dim text-graphite-2"> ({clearanceRangeText(a, other)})</span>.
      </p>
      <p className={`flex gap-2 rounded-md border-2 px-3 py-2 text-sm font-semibold ${madeBox}`} data-testid="pair-actual" data-state={a.actualState}>
        <span aria-hidden="true">{madeIcon}</span>
        <span>
          {actualPairWords(a, unit)}
          {a.actualClearanceUm !== null ? <span className="dim font-normal text-graphite-2"> ({clearanceText(a.actualClearanceUm, other)})</span> : null}
        </span>
      </p>
      <figure>
        <ZoneDrawing
          sizeLabel={`${pair.hole.nominalText} ${pair.hole.unit}`}
          hole={zoneOf(pair.hole.limits, 'inside')}
          shaft={zoneOf(pair.shaft.limits, 'outside')}
          kind={a.kind}
          unit={unit}
          titles={{ hole: `Hole ${pair.hole.limits.label}`, shaft: `Shaft ${pair.shaft.limits.label}` }}
        />
        <figcaption className="mt-1 text-xs text-graphite-2">Both zones to scale against the nominal size; the strip between them is the smallest gap or the largest overlap.</figcaption>
      </figure>
      {a.kind === 'interference' ? <PressFitCaution kind="interference" /> : null}
    </article>
  );
}

function PairForm({ recordId, recordKind, candidates }: { recordId: number; recordKind: 'outside' | 'inside'; candidates: PairCandidate[] }) {
  const id = useId();
  const [choice, setChoice] = useState(String(candidates[0]?.id ?? ''));
  // Pairing renders the page again with the fit; a refusal stays here as its message.
  const [state, pair, busy] = useActionState(createPairAction, IDLE);
  const error = state.ok ? null : (state.message ?? 'Not paired.');
  // This record is the hole when it is an inside feature, and its mate the shaft; the other way round otherwise.
  const [own, mate] = recordKind === 'inside' ? (['holeRecordId', 'shaftRecordId'] as const) : (['shaftRecordId', 'holeRecordId'] as const);
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      aria-label="Pair as a fit"
      onSubmit={(e) => {
        e.preventDefault();
        dispatchForm(e.currentTarget, pair);
      }}
    >
      <input type="hidden" name={own} value={recordId} />
      <div className="flex min-w-64 flex-1 flex-col gap-1">
        <label htmlFor={`${id}-mate`} className="text-sm font-semibold">
          Mating record
        </label>
        <select id={`${id}-mate`} name={mate} className={inputClass} value={choice} onChange={(e) => setChoice(e.target.value)}>
          {candidates.map((c) => (
            <option key={c.id} value={c.id}>
              {c.feature} — {c.nominalText} {c.unit} {c.specLabel} ({c.entryTitle})
            </option>
          ))}
        </select>
      </div>
      <Button type="submit" disabled={busy || !choice}>
        {busy ? 'Pairing…' : 'Pair as a fit'}
      </Button>
      {error ? (
        <p role="alert" className="w-full text-sm font-semibold text-bad">
          ✕ {error}
        </p>
      ) : null}
    </form>
  );
}

/** The fits this record is part of, and (for the builder) pairing it with its mating record. */
export function PairList({ recordId, recordKind, nominalLabel, pairs, candidates, canEdit, slug, unit }: Props) {
  const mateKind = recordKind === 'outside' ? 'inside (hole-like)' : 'outside (shaft-like)';
  return (
    <section aria-labelledby="fits-title" className="space-y-3">
      <h2 id="fits-title" className="text-xl font-bold">
        Fit with its mating part
      </h2>
      {pairs.length ? (
        <div className="grid gap-4 xl:grid-cols-2">
          {pairs.map((p) => (
            <PairCard key={p.id} pair={p} slug={slug} unit={unit} canEdit={canEdit} />
          ))}
        </div>
      ) : (
        <p className="text-sm text-graphite-2">Not paired with a mating record.</p>
      )}
      {canEdit ? (
        candidates.length ? (
          <PairForm recordId={recordId} recordKind={recordKind} candidates={candidates} />
        ) : (
          <p className="text-sm text-graphite-2">
            To pair it, add an {mateKind} record of the same nominal size ({nominalLabel}) to this project.
          </p>
        )
      ) : null}
    </section>
  );
}
