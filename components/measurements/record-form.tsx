'use client';

import { useActionState, useEffect, useRef, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { GENERAL_CLASS_NAMES, GENERAL_CLASSES, SPEC_TYPE_WORDS, asEntered, type LengthUnit, type Spec } from '@/lib/measurements';
import {
  measurementInputSchema, recordFieldsSchema, type MeasurementFormValues, type MeasurementInput, type ReadingFormValues,
} from '@/lib/validations/measurements';
import type { MeasurementView } from '@/lib/types/measurements';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { inputClass } from '@/components/ui/field';
import { applyActionErrors, dispatchForm, IDLE } from '@/components/forms/action-state';
import { createMeasurementAction, updateMeasurementAction } from '@/lib/actions/measurements';
import type { ActionState } from '@/lib/actions/authed';
import { Chips, FieldErrorLine, LimitsPreviewBox, ReadingFields, ReadingVerdictPreview, SmallField, defaultResolution, emptyReading, previewLimits, readingPreview, smallInput } from './record-form-fields';
import { PlusIcon } from '@/components/ui/plus-icon';

export type MomentOption = { id: number; label: string };

type Common = {
  /** Moments of the entry's clips the record can open at. */
  moments: MomentOption[];
  builderName: string;
  onSaved: (record: MeasurementView) => void;
  onCancel?: () => void;
};
type Props = Common & ({ mode: 'create'; entryId: number; projectUnits: LengthUnit } | { mode: 'edit'; record: MeasurementView });

const KIND_OPTIONS = [
  { value: 'outside', label: 'Outside (shaft-like)', hint: 'Spigot, shaft, thickness' },
  { value: 'inside', label: 'Inside (hole-like)', hint: 'Bore, recess, slot, hole depth' },
] as const;
const UNIT_OPTIONS = [
  { value: 'mm', label: 'mm' },
  { value: 'in', label: 'in' },
] as const;
const SPEC_OPTIONS = [
  { value: 'zone', label: SPEC_TYPE_WORDS.zone, hint: 'e.g. k6, H7' },
  { value: 'inchClass', label: SPEC_TYPE_WORDS.inchClass, hint: 'e.g. RC4, LN2 (inches)' },
  { value: 'limits', label: SPEC_TYPE_WORDS.limits, hint: 'e.g. +0.1 / 0' },
  { value: 'plusMinus', label: SPEC_TYPE_WORDS.plusMinus, hint: 'e.g. ±0.05' },
  { value: 'general', label: SPEC_TYPE_WORDS.general, hint: 'f, m, c or v' },
] as const;
const CLASS_OPTIONS = GENERAL_CLASSES.map((c) => ({ value: c, label: `${c} — ${GENERAL_CLASS_NAMES[c]}` }));

function specValues(spec: Spec): MeasurementFormValues['spec'] {
  const blank = { zone: '', fitClass: '', upper: '', lower: '', tolerance: '', generalClass: 'm' };
  switch (spec.type) {
    case 'zone':
      return { ...blank, type: 'zone', zone: spec.zone };
    case 'inchClass':
      return { ...blank, type: 'inchClass', fitClass: spec.fitClass };
    case 'limits':
      return { ...blank, type: 'limits', upper: String(spec.upper), lower: String(spec.lower) };
    case 'plusMinus':
      return { ...blank, type: 'plusMinus', tolerance: String(spec.tolerance) };
    default:
      return { ...blank, type: 'general', generalClass: spec.generalClass };
  }
}

/**
 * A measurement record: the feature, its size and specification, and (for a new record) its readings.
 * The limits and each reading's verdict preview live as the builder types, from lib/measurements.
 */
export function RecordForm(props: Props) {
  const { moments, builderName, onSaved, onCancel } = props;
  const creating = props.mode === 'create';
  const formRef = useRef<HTMLFormElement>(null);
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);

  const defaults: MeasurementFormValues = creating
    ? {
        feature: '',
        kind: 'outside',
        nominal: '',
        unit: props.projectUnits,
        spec: { type: 'zone', zone: '', upper: '', lower: '', tolerance: '', generalClass: 'm' },
        timeNoteId: '',
        readings: [emptyReading(props.projectUnits)],
      }
    : {
        feature: props.record.feature,
        kind: props.record.kind,
        nominal: asEntered(props.record.nominal),
        unit: props.record.unit,
        spec: specValues(props.record.spec),
        timeNoteId: props.record.timeNoteId ? String(props.record.timeNoteId) : '',
        readings: [],
      };

  const schema = creating ? measurementInputSchema : recordFieldsSchema;
  const { register, handleSubmit, formState, setError, control, setValue, getValues } = useForm<MeasurementFormValues, unknown, MeasurementInput>({
    // Form fields hold text; the schema reads numbers out of it (the same schema the server parses with).
    resolver: zodResolver(schema) as unknown as Resolver<MeasurementFormValues, unknown, MeasurementInput>,
    defaultValues: defaults,
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'readings' });
  const { errors } = formState;
  const watched = useWatch({ control });
  const preview = previewLimits({ kind: watched.kind, nominal: watched.nominal, unit: watched.unit, spec: watched.spec as MeasurementFormValues['spec'] });
  const specType = watched.spec?.type;
  const prefix = creating ? 'new-m' : `m-${props.record.id}`;

  // Checked here with the same schema first; the server's refusals land beside the same fields.
  const [state, dispatch, pending] = useActionState<ActionState<MeasurementView>, FormData>(async (prev, data) => {
    const result = creating ? await createMeasurementAction(prev, data) : await updateMeasurementAction(prev, data);
    applyActionErrors(result, setError);
    if (result.ok && result.data) onSaved(result.data);
    return result;
  }, IDLE);
  const failure = state.ok ? null : state;

  const onSubmit = handleSubmit((values) =>
    // A time typed without a zone is the builder's own clock: send it as the instant the browser read it as.
    dispatchForm(
      formRef.current!,
      dispatch,
      Object.fromEntries((values.readings ?? []).flatMap((r, i) => (r.measuredAt ? [[`readings.${i}.measuredAt`, r.measuredAt.toISOString()]] : []))),
    ),
  );

  const readingError = (i: number) => (k: keyof ReadingFormValues) => errors.readings?.[i]?.[k]?.message;
  const refreshResolution = (i: number) => () => {
    const r = getValues(`readings.${i}`);
    setValue(`readings.${i}.resolution`, defaultResolution(r.instrument, r.unit));
  };
  const specErrors = errors.spec as Partial<Record<'type' | 'zone' | 'fitClass' | 'upper' | 'lower' | 'tolerance' | 'generalClass', { message?: string }>> | undefined;
  const aria = (id: string, message?: string, hint?: boolean) => ({
    'aria-invalid': message ? true : undefined,
    'aria-describedby': message ? `${id}-error` : hint ? `${id}-hint` : undefined,
  });

  return (
    <form
      ref={formRef}
      onSubmit={onSubmit}
      noValidate
      aria-label={creating ? 'New measurement' : 'Edit measurement'}
      data-hydrated={hydrated ? 'true' : 'false'}
      className="space-y-5 rounded-lg border-2 border-dye/50 bg-card p-4 sm:p-5"
    >
      {creating ? <input type="hidden" name="entryId" value={props.entryId} /> : (
        <>
          <input type="hidden" name="recordId" value={props.record.id} />
          <input type="hidden" name="version" value={props.record.version} />
        </>
      )}
      {failure ? (
        <Notice kind="error" role="alert" title={failure.status === 409 ? 'Changed elsewhere' : 'Not saved'}>
          <p>{failure.message}</p>
          {failure.status === 409 ? (
            <button type="button" className="mt-2 min-h-11 font-semibold underline" onClick={() => window.location.reload()}>
              Reload the latest version
            </button>
          ) : (
            <p className="mt-1">Nothing was saved: fix the fields marked below and save again.</p>
          )}
        </Notice>
      ) : null}

      <div className="grid gap-4 md:grid-cols-2">
        <SmallField id={`${prefix}-feature`} label="Feature" hint="What you measured, e.g. “spigot diameter”, “bore of the plate”" error={errors.feature?.message}>
          <input id={`${prefix}-feature`} autoComplete="off" className={inputClass} {...aria(`${prefix}-feature`, errors.feature?.message, true)} {...register('feature')} />
        </SmallField>
        <Chips legend="Kind of feature" options={KIND_OPTIONS} register={register('kind')} current={watched.kind} error={errors.kind?.message} />
      </div>

      <div className="grid gap-4 md:grid-cols-[minmax(0,14rem)_minmax(0,10rem)_1fr]">
        <SmallField id={`${prefix}-nominal`} label="Nominal size" error={errors.nominal?.message}>
          <input id={`${prefix}-nominal`} inputMode="decimal" autoComplete="off" className={smallInput} {...aria(`${prefix}-nominal`, errors.nominal?.message)} {...register('nominal')} />
        </SmallField>
        <Chips legend="Unit" options={UNIT_OPTIONS} register={register('unit')} current={watched.unit} error={errors.unit?.message} />
        {moments.length ? (
          <SmallField id={`${prefix}-moment`} label="Clip moment (optional)" hint="The record opens the clip here" error={errors.timeNoteId?.message}>
            <select id={`${prefix}-moment`} className={inputClass} {...aria(`${prefix}-moment`, errors.timeNoteId?.message, true)} {...register('timeNoteId')}>
              <option value="">None</option>
              {moments.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.label}
                </option>
              ))}
            </select>
          </SmallField>
        ) : null}
      </div>

      <Chips legend="Specification" options={SPEC_OPTIONS} register={register('spec.type')} current={specType} error={specErrors?.type?.message} columns="grid-cols-1 sm:grid-cols-2 xl:grid-cols-3" />

      <div className="grid gap-4 sm:grid-cols-2 md:grid-cols-3">
        {specType === 'zone' ? (
          <SmallField id={`${prefix}-zone`} label="ISO 286 zone" hint="Small letter for an outside feature (k6, h6), capital for an inside one (H7)" error={specErrors?.zone?.message}>
            <input id={`${prefix}-zone`} autoComplete="off" autoCapitalize="off" spellCheck={false} className={smallInput} {...aria(`${prefix}-zone`, specErrors?.zone?.message, true)} {...register('spec.zone')} />
          </SmallField>
        ) : null}
        {specType === 'inchClass' ? (
          <SmallField id={`${prefix}-fit-class`} label="Inch class (ANSI B4.1)" hint="e.g. RC4: the hole side for an inside feature, the shaft side for an outside one; nominal in inches" error={specErrors?.fitClass?.message}>
            <input id={`${prefix}-fit-class`} autoComplete="off" autoCapitalize="characters" spellCheck={false} className={smallInput} {...aria(`${prefix}-fit-class`, specErrors?.fitClass?.message, true)} {...register('spec.fitClass')} />
          </SmallField>
        ) : null}
        {specType === 'limits' ? (
          <>
            <SmallField id={`${prefix}-upper`} label={`Upper deviation (${watched.unit ?? 'mm'})`} hint="e.g. +0.1" error={specErrors?.upper?.message}>
              <input id={`${prefix}-upper`} inputMode="decimal" autoComplete="off" className={smallInput} {...aria(`${prefix}-upper`, specErrors?.upper?.message, true)} {...register('spec.upper')} />
            </SmallField>
            <SmallField id={`${prefix}-lower`} label={`Lower deviation (${watched.unit ?? 'mm'})`} hint="e.g. 0 or -0.05" error={specErrors?.lower?.message}>
              <input id={`${prefix}-lower`} inputMode="decimal" autoComplete="off" className={smallInput} {...aria(`${prefix}-lower`, specErrors?.lower?.message, true)} {...register('spec.lower')} />
            </SmallField>
          </>
        ) : null}
        {specType === 'plusMinus' ? (
          <SmallField id={`${prefix}-tolerance`} label={`± tolerance (${watched.unit ?? 'mm'})`} hint="e.g. 0.05" error={specErrors?.tolerance?.message}>
            <input id={`${prefix}-tolerance`} inputMode="decimal" autoComplete="off" className={smallInput} {...aria(`${prefix}-tolerance`, specErrors?.tolerance?.message, true)} {...register('spec.tolerance')} />
          </SmallField>
        ) : null}
        {specType === 'general' ? (
          <div className="sm:col-span-2 md:col-span-3">
            <Chips legend="Tolerance class (ISO 2768-1)" options={CLASS_OPTIONS} register={register('spec.generalClass')} current={watched.spec?.generalClass} error={specErrors?.generalClass?.message} columns="grid-cols-2 md:grid-cols-4" />
          </div>
        ) : null}
      </div>

      <LimitsPreviewBox preview={preview} />

      {creating ? (
        <fieldset className="space-y-3">
          <legend className="text-base font-bold">Readings</legend>
          {typeof errors.readings?.message === 'string' ? <FieldErrorLine text={errors.readings.message} /> : null}
          {fields.map((f, i) => (
            <fieldset key={f.id} className="space-y-2 rounded-lg border border-rule bg-paper p-3" aria-label={`Reading ${i + 1}`}>
              <div className="flex items-center justify-between gap-2">
                <p className="text-sm font-bold" aria-hidden="true">
                  Reading {i + 1}
                </p>
                {fields.length > 1 ? (
                  <Button type="button" tone="quiet" className="!min-h-10 !px-3" onClick={() => remove(i)} aria-label={`Remove reading ${i + 1}`}>
                    Remove
                  </Button>
                ) : null}
              </div>
              <ReadingFields
                idPrefix={`${prefix}-r${i}`}
                field={(k) => register(`readings.${i}.${k}`)}
                error={readingError(i)}
                builderName={builderName}
                onInstrumentOrUnit={refreshResolution(i)}
              />
              <ReadingVerdictPreview result={readingPreview(preview, watched.nominal, watched.unit, watched.readings?.[i] as ReadingFormValues | undefined)} />
            </fieldset>
          ))}
          <Button
            type="button"
            tone="quiet"
            onClick={() => {
              const last = getValues(`readings.${fields.length - 1}`);
              append(emptyReading(last?.unit ?? getValues('unit'), last?.instrument ?? 'micrometer'));
            }}
          >
            <PlusIcon /> Add another reading
          </Button>
        </fieldset>
      ) : (
        <p className="text-sm text-graphite-2">Readings are added and changed one at a time, below the record.</p>
      )}

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : creating ? 'Save measurement' : 'Save changes'}
        </Button>
        {onCancel ? (
          <Button type="button" tone="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
