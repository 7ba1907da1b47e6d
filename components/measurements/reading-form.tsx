'use client';

import { useActionState, useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { asEntered, checkNearNominal, MeasurementError } from '@/lib/measurements';
import { readingInputSchema, type ReadingData, type ReadingFormValues } from '@/lib/validations/measurements';
import type { MeasurementView, ReadingView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { addReadingAction, updateReadingAction } from '@/lib/actions/measurements';
import { dispatchForm, IDLE } from '@/components/forms/action-state';
import type { ActionState } from '@/lib/actions/authed';
import { ReadingFields, ReadingVerdictPreview, defaultResolution, emptyReading, previewLimits, readingPreview } from './record-form-fields';

// The builder's form for one reading, with react-hook-form and the readings' zod schema: loaded through
// lazy-editors.tsx when it is opened, so a reader of a record page never loads it.

type OneReading = { readings: ReadingFormValues[] };

function toLocalInput(iso: string): string {
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

// The server names a single reading's fields without the readings.0 prefix the form uses.
const SERVER_KEYS = ['value', 'unit', 'instrument', 'resolution', 'measuredBy', 'measuredAt', 'temperatureC', 'pass', 'note'] as const;

/** Adds a reading to a record, or changes one (sending the version it was opened at). */
export function ReadingForm({ record, reading, builderName, idSuffix = 'form', onDone }: { record: MeasurementView; reading?: ReadingView; builderName: string; idSuffix?: string; onDone: () => void }) {
  const formRef = useRef<HTMLFormElement>(null);
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => {
    setHydrated(true);
    // The button that opened the form is gone: the keyboard goes on in the form's first box.
    formRef.current?.querySelector<HTMLElement>('input:not([type="hidden"]), select')?.focus();
  }, []);
  const schema = useMemo(
    () =>
      z.object({ readings: z.array(readingInputSchema).length(1) }).superRefine((v, ctx) => {
        const r = v.readings[0];
        if (!r) return;
        try {
          checkNearNominal(record.nominal, record.unit, r.value, r.unit, 'value');
        } catch (err) {
          if (err instanceof MeasurementError) ctx.addIssue({ code: 'custom', path: ['readings', 0, 'value'], message: err.message });
          else throw err;
        }
      }),
    [record.nominal, record.unit],
  );
  const last = record.readings[record.readings.length - 1];
  const initial: ReadingFormValues = reading
    ? {
        value: reading.valueText,
        unit: reading.unit,
        instrument: reading.instrument,
        resolution: asEntered(reading.resolution),
        measuredBy: reading.measuredBy,
        measuredAt: toLocalInput(reading.measuredAt),
        temperatureC: reading.temperatureC === null ? '' : String(reading.temperatureC),
        pass: reading.pass === null ? '' : String(reading.pass),
        note: reading.note,
      }
    : {
        ...emptyReading(last?.unit ?? record.unit, last?.instrument ?? 'micrometer'),
        pass: last?.pass != null ? String(last.pass + 1) : '',
      };
  const { register, handleSubmit, formState, setError, control, setValue, getValues } = useForm<OneReading, unknown, { readings: ReadingData[] }>({
    resolver: zodResolver(schema) as unknown as Resolver<OneReading, unknown, { readings: ReadingData[] }>,
    defaultValues: { readings: [initial] },
  });
  const watched = useWatch({ control, name: 'readings.0' });
  const limits = previewLimits({ kind: record.kind, nominal: String(record.nominal), unit: record.unit, spec: specForm(record) });
  const { errors } = formState;
  const idPrefix = reading ? `reading-${reading.id}-${idSuffix}` : `new-reading-${record.id}`;

  // Checked here with the same schema first; the server's refusals land beside the same fields.
  const [state, dispatch, pending] = useActionState<ActionState<never>, FormData>(async (prev, data) => {
    const result = reading ? await updateReadingAction(prev, data) : await addReadingAction(prev, data);
    if (!result.ok) {
      for (const k of SERVER_KEYS) {
        const m = result.fieldErrors?.[k]?.[0];
        if (m) setError(`readings.0.${k}`, { type: 'server', message: m });
      }
    } else onDone();
    return result;
  }, IDLE);
  const failure = state.ok ? null : state;

  const onSubmit = handleSubmit((values) => {
    // A time typed without a zone is the builder's own clock: send it as the instant the browser read it as.
    const at = values.readings[0]?.measuredAt;
    dispatchForm(formRef.current!, dispatch, at ? { 'readings.0.measuredAt': at.toISOString() } : {});
  });

  return (
    <form
      ref={formRef}
      onSubmit={onSubmit}
      noValidate
      aria-label={reading ? 'Edit reading' : 'New reading'}
      data-hydrated={hydrated ? 'true' : 'false'}
      className="space-y-3 rounded-lg border-2 border-dye/50 bg-card p-3 sm:p-4"
    >
      {reading ? (
        <>
          <input type="hidden" name="readingId" value={reading.id} />
          <input type="hidden" name="version" value={reading.version} />
        </>
      ) : (
        <input type="hidden" name="recordId" value={record.id} />
      )}
      {failure ? (
        <Notice kind="error" role="alert" title={failure.status === 409 ? 'Changed elsewhere' : 'Not saved'}>
          <p>{failure.message}</p>
        </Notice>
      ) : null}
      <ReadingFields
        idPrefix={idPrefix}
        field={(k) => register(`readings.0.${k}`)}
        error={(k) => errors.readings?.[0]?.[k]?.message}
        builderName={builderName}
        onInstrumentOrUnit={() => {
          const r = getValues('readings.0');
          setValue('readings.0.resolution', defaultResolution(r.instrument, r.unit));
        }}
      />
      <ReadingVerdictPreview result={readingPreview(limits, String(record.nominal), record.unit, watched as ReadingFormValues)} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : reading ? 'Save reading' : 'Add reading'}
        </Button>
        <Button type="button" tone="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function specForm(record: MeasurementView) {
  const s = record.spec;
  if (s.type === 'zone') return { type: 'zone' as const, zone: s.zone };
  if (s.type === 'inchClass') return { type: 'inchClass' as const, fitClass: s.fitClass };
  if (s.type === 'limits') return { type: 'limits' as const, upper: String(s.upper), lower: String(s.lower) };
  if (s.type === 'plusMinus') return { type: 'plusMinus' as const, tolerance: String(s.tolerance) };
  return { type: 'general' as const, generalClass: s.generalClass };
}
