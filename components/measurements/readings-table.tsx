'use client';

import { Fragment, useState } from 'react';
import { asEntered, otherUnit, sizeText, thouText, umText, type LengthUnit } from '@/lib/measurements/units';
import { instrumentLabel } from '@/lib/measurements/readings';
import type { MeasurementView, ReadingView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { deleteReadingAction } from '@/lib/actions/measurements';
import { IDLE } from '@/components/forms/action-state';
import { CheckMark, VerdictBadge } from './badges';
import { ReadingForm } from './lazy-editors';
import { PlusIcon } from '@/components/ui/plus-icon';
import { formatDateTime } from '@/lib/format';

type Props = { record: MeasurementView; unit: LengthUnit; canEdit: boolean; builderName: string };


function marginWords(r: ReadingView): string {
  const j = r.judgement;
  if (j.state !== 'inside') return '';
  return `${umText(j.marginUm)} µm to the ${j.nearest} limit`;
}

function ResolutionWords({ r, unit }: { r: ReadingView; unit: LengthUnit }) {
  return (
    <CheckMark
      ok={r.resolutionCheck.ok}
      good="fine enough"
      bad={`too coarse: a tenth of the band is ${sizeText(r.resolutionCheck.neededUm, unit)} ${unit}`}
    />
  );
}

function TemperatureWords({ r }: { r: ReadingView }) {
  if (r.temperatureC === null) return <span className="text-graphite-2">—</span>;
  const t = r.temperature;
  return (
    <span className="flex flex-col">
      <span className="dim">{asEntered(r.temperatureC)} °C</span>
      {t?.warn ? (
        <span className="font-semibold text-scribe">
          <span aria-hidden="true">⚠ </span>
          {Math.abs(t.offC)} °C {t.offC > 0 ? 'above' : 'below'} 20 °C: a steel part this size {t.growthUm > 0 ? 'grows' : 'shrinks'} about {umText(Math.abs(Math.round(t.growthUm)))} µm
        </span>
      ) : null}
    </span>
  );
}

/** Readings in order with what each one says: deviation, verdict, margin, and how it was taken. */
export function ReadingsTable({ record, unit, canEdit, builderName }: Props) {
  const [editing, setEditing] = useState<number | null>(null);
  const [adding, setAdding] = useState(false);
  const other = otherUnit(unit);
  const reading = (r: ReadingView) => (
    <>
      <span className="dim block whitespace-nowrap font-semibold">
        {r.valueText} {r.unit}
      </span>
      <span className="dim block text-xs text-graphite-2">
        {r.unit === unit ? `${sizeText(r.judgement.sizeUm, other)} ${other}` : `${sizeText(r.judgement.sizeUm, unit)} ${unit}`}
      </span>
    </>
  );
  const deviation = (r: ReadingView) => (
    <>
      <span className="dim block whitespace-nowrap">{umText(r.judgement.deviationUm, true)} µm</span>
      <span className="dim block whitespace-nowrap text-xs text-graphite-2">{thouText(r.judgement.deviationUm, true)} thou</span>
    </>
  );
  const actions = (r: ReadingView, i: number) =>
    canEdit ? (
      <ReadingActions record={record} reading={r} index={i} onEdit={() => setEditing(editing === r.id ? null : r.id)} canDelete={record.readings.length > 1} />
    ) : null;
  // The table and the phone cards each carry an editor; their field ids must differ for the labels to work.
  const editor = (r: ReadingView, where: 'table' | 'card') => (
    <ReadingForm record={record} reading={r} builderName={builderName} idSuffix={where} onDone={() => setEditing(null)} />
  );

  return (
    <section aria-labelledby="readings-title" className="space-y-3">
      <h2 id="readings-title" className="text-xl font-bold">
        Readings
      </h2>

      <div className="hidden overflow-x-auto rounded-lg border border-rule bg-card md:block">
        <table className="w-full text-sm" data-testid="readings-table">
          <caption className="sr-only">Each reading with its deviation from nominal, verdict, instrument, temperature and who measured it</caption>
          <thead>
            <tr className="border-b border-rule text-left text-xs text-graphite-2">
              <th scope="col" className="px-3 py-2 font-semibold">#</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Reading</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Deviation</th>
              <th scope="col" className="px-3 py-2 font-semibold">Verdict</th>
              <th scope="col" className="px-3 py-2 font-semibold">Instrument</th>
              <th scope="col" className="px-3 py-2 font-semibold">Temperature</th>
              <th scope="col" className="px-3 py-2 font-semibold">Measured</th>
              {canEdit ? (
                <th scope="col" className="px-3 py-2 font-semibold">
                  <span className="sr-only">Actions</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {record.readings.map((r, i) => (
              <Fragment key={r.id}>
                <tr className={`align-top ${r.note || editing === r.id ? '' : 'border-b border-rule/60'}`} data-reading={i + 1}>
                  <th scope="row" className="px-3 py-2 text-left font-semibold">
                    {i + 1}
                    {r.pass != null ? <span className="block whitespace-nowrap text-xs font-normal text-graphite-2">pass {r.pass}</span> : null}
                  </th>
                  <td className="px-3 py-2 text-right">{reading(r)}</td>
                  <td className="px-3 py-2 text-right">{deviation(r)}</td>
                  <td className="px-3 py-2">
                    <VerdictBadge state={r.judgement.state} outsideByUm={r.judgement.outsideByUm} unit={unit} />
                    {r.judgement.state === 'inside' ? <span className="mt-1 block text-xs text-graphite-2">{marginWords(r)}</span> : null}
                  </td>
                  <td className="px-3 py-2">
                    <span className="block">
                      {instrumentLabel(r.instrument)}, <span className="dim">{asEntered(r.resolution)} {r.unit}</span>
                    </span>
                    <span className="block text-xs">
                      <ResolutionWords r={r} unit={unit} />
                    </span>
                  </td>
                  <td className="max-w-48 px-3 py-2 text-xs">
                    <TemperatureWords r={r} />
                  </td>
                  <td className="px-3 py-2 text-xs">
                    <span className="block">{r.measuredBy || '—'}</span>
                    <time dateTime={r.measuredAt} className="block text-graphite-2" suppressHydrationWarning>
                      {formatDateTime(r.measuredAt)}
                    </time>
                  </td>
                  {canEdit ? <td className="px-3 py-2">{actions(r, i)}</td> : null}
                </tr>
                {r.note ? (
                  <tr className={editing === r.id ? '' : 'border-b border-rule/60'}>
                    <td />
                    <td colSpan={canEdit ? 7 : 6} className="px-3 pb-2 text-sm">
                      <span className="font-semibold">Note:</span> {r.note}
                    </td>
                  </tr>
                ) : null}
                {editing === r.id ? (
                  <tr className="border-b border-rule/60">
                    <td colSpan={canEdit ? 8 : 7} className="px-3 pb-3">
                      {editor(r, 'table')}
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            ))}
          </tbody>
        </table>
      </div>

      {/* On a phone the same readings as cards: a wide table does not fit 390 px. */}
      <ol className="space-y-3 md:hidden" data-testid="readings-cards">
        {record.readings.map((r, i) => (
          <li key={r.id} className="space-y-2 rounded-lg border border-rule bg-card p-3 text-sm">
            <div className="flex flex-wrap items-start justify-between gap-2">
              <p className="whitespace-nowrap font-semibold">
                Reading {i + 1}
                {r.pass != null ? <span className="font-normal text-graphite-2"> · pass {r.pass}</span> : null}
              </p>
              <VerdictBadge state={r.judgement.state} outsideByUm={r.judgement.outsideByUm} unit={unit} />
            </div>
            <div className="grid grid-cols-2 gap-2">
              <div>{reading(r)}</div>
              <div className="text-right">{deviation(r)}</div>
            </div>
            {r.judgement.state === 'inside' ? <p className="text-xs text-graphite-2">{marginWords(r)}</p> : null}
            <p>
              {instrumentLabel(r.instrument)}, <span className="dim">{asEntered(r.resolution)} {r.unit}</span> — <ResolutionWords r={r} unit={unit} />
            </p>
            {r.temperatureC !== null ? (
              <div className="text-xs">
                <TemperatureWords r={r} />
              </div>
            ) : null}
            <p className="text-xs text-graphite-2">
              {r.measuredBy || '—'},{' '}
              <time dateTime={r.measuredAt} suppressHydrationWarning>
                {formatDateTime(r.measuredAt)}
              </time>
            </p>
            {r.note ? (
              <p>
                <span className="font-semibold">Note:</span> {r.note}
              </p>
            ) : null}
            {actions(r, i)}
            {editing === r.id ? editor(r, 'card') : null}
          </li>
        ))}
      </ol>

      <p className="text-xs text-graphite-2">
        Resolution check: common practice asks for an instrument that resolves a tenth of the tolerance band or finer. Temperature warning: a rule of thumb
        for bands of 50 µm or less when the part is more than 5 °C from 20 °C (ISO 1), with steel and cast iron growing about 11 µm per metre per °C.
      </p>

      {canEdit ? (
        adding ? (
          <ReadingForm record={record} builderName={builderName} onDone={() => setAdding(false)} />
        ) : (
          <Button type="button" onClick={() => setAdding(true)}>
            <PlusIcon /> Add a reading
          </Button>
        )
      ) : null}
    </section>
  );
}

function ReadingActions({ record, reading, index, onEdit, canDelete }: { record: MeasurementView; reading: ReadingView; index: number; onEdit: () => void; canDelete: boolean }) {
  return (
    <div className="flex flex-wrap gap-2">
      <Button type="button" tone="quiet" className="!min-h-10 !px-3" onClick={onEdit} aria-label={`Edit reading ${index + 1}`}>
        Edit
      </Button>
      {canDelete ? (
        <ConfirmDialog
          small
          trigger="Delete"
          triggerLabel={`Delete reading ${index + 1}`}
          title={`Delete reading ${index + 1}?`}
          body={
            <p>
              {reading.valueText} {reading.unit} on “{record.feature}” goes for good.
            </p>
          }
          confirmLabel="Delete reading"
          onConfirm={async () => {
            const data = new FormData();
            data.set('readingId', String(reading.id));
            // The action renders the page again without the reading; a refusal comes back as its message.
            const state = await deleteReadingAction(IDLE, data);
            return state.ok ? null : (state.message ?? 'Not deleted.');
          }}
        />
      ) : null}
    </div>
  );
}
