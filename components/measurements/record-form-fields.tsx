'use client';

import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import {
  INSTRUMENTS, judgeReading, recordLimits, MeasurementError, checkNearNominal, sizeText, umText,
  type GeneralClass, type LengthUnit, type Limits, type ReadingJudgement, type Spec,
} from '@/lib/measurements';
import type { MeasurementFormValues, ReadingFormValues } from '@/lib/validations/measurements';
import { inputClass } from '@/components/ui/field';
import { parseNum } from './units';
import { VerdictBadge } from './badges';

export function defaultResolution(instrument: string, unit: LengthUnit): string {
  const i = INSTRUMENTS.find((x) => x.value === instrument) ?? INSTRUMENTS[0];
  return String(i[unit]);
}

export function emptyReading(unit: LengthUnit, instrument = 'micrometer'): ReadingFormValues {
  return { value: '', unit, instrument, resolution: defaultResolution(instrument, unit), measuredBy: '', measuredAt: '', temperatureC: '', pass: '', note: '' };
}

type SpecValues = MeasurementFormValues['spec'];

function specOf(s: SpecValues | undefined): Spec | null {
  if (!s) return null;
  if (s.type === 'zone') return s.zone?.trim() ? { type: 'zone', zone: s.zone.trim() } : null;
  if (s.type === 'inchClass') return s.fitClass?.trim() ? { type: 'inchClass', fitClass: s.fitClass.trim() } : null;
  if (s.type === 'limits') {
    const upper = parseNum(s.upper);
    const lower = parseNum(s.lower);
    return upper === null || lower === null ? null : { type: 'limits', upper, lower };
  }
  if (s.type === 'plusMinus') {
    const tolerance = parseNum(s.tolerance);
    return tolerance === null ? null : { type: 'plusMinus', tolerance };
  }
  if (s.type === 'general') return s.generalClass ? { type: 'general', generalClass: s.generalClass as GeneralClass } : null;
  return null;
}

export type LimitsPreview = { state: 'empty' } | { state: 'error'; message: string } | { state: 'ok'; limits: Limits; unit: LengthUnit };

/** The limits as the builder types, computed in the browser with the same code the server uses. */
export function previewLimits(v: Partial<Pick<MeasurementFormValues, 'kind' | 'nominal' | 'unit' | 'spec'>>): LimitsPreview {
  const nominal = parseNum(v.nominal);
  const spec = specOf(v.spec);
  if (nominal === null || !spec || !v.kind || !v.unit) return { state: 'empty' };
  try {
    return { state: 'ok', limits: recordLimits({ kind: v.kind, nominal, unit: v.unit, spec }), unit: v.unit };
  } catch (err) {
    if (err instanceof MeasurementError) return { state: 'error', message: err.message };
    throw err;
  }
}

export function LimitsPreviewBox({ preview }: { preview: LimitsPreview }) {
  if (preview.state === 'empty') {
    return (
      <p className="rounded-md border border-dashed border-rule px-3 py-2 text-sm text-graphite-2" data-testid="limits-preview" aria-live="polite">
        The limits appear here as you type the size and its specification.
      </p>
    );
  }
  if (preview.state === 'error') {
    return (
      <p className="flex gap-2 rounded-md border border-bad/50 bg-bad-soft px-3 py-2 text-sm text-bad" data-testid="limits-preview" aria-live="polite">
        <span aria-hidden="true">✕</span>
        <span>{preview.message}</span>
      </p>
    );
  }
  const { limits: l, unit } = preview;
  const other: LengthUnit = unit === 'mm' ? 'in' : 'mm';
  const between = (u: LengthUnit) => `${sizeText(l.nominalUm + l.lowerUm, u)} and ${sizeText(l.nominalUm + l.upperUm, u)} ${u}`;
  return (
    <div className="rounded-md border border-dye/40 bg-dye-soft px-3 py-2 text-sm" data-testid="limits-preview" aria-live="polite">
      <p className="font-semibold">
        Make it between <span className="dim">{between(unit)}</span>
      </p>
      <p className="dim text-graphite-2">{between(other)}</p>
      <p className="text-xs text-graphite-2">
        <span className="dim">
          {umText(l.upperUm, true)} / {umText(l.lowerUm, true)} µm, band {umText(l.bandUm)} µm
        </span>{' '}
        · {l.source}
      </p>
    </div>
  );
}

/** The verdict a reading row would get, live, or why it cannot be judged yet. */
export function readingPreview(preview: LimitsPreview, nominal: string | undefined, nominalUnit: LengthUnit | undefined, r: ReadingFormValues | undefined): { judgement: ReadingJudgement; unit: LengthUnit } | { message: string } | null {
  if (preview.state !== 'ok' || !r) return null;
  const value = parseNum(r.value);
  const n = parseNum(nominal);
  if (value === null || n === null || !nominalUnit) return null;
  try {
    checkNearNominal(n, nominalUnit, value, r.unit, 'value');
  } catch (err) {
    if (err instanceof MeasurementError) return { message: err.message };
    throw err;
  }
  return { judgement: judgeReading(preview.limits, value, r.unit), unit: preview.unit };
}

export function ReadingVerdictPreview({ result }: { result: ReturnType<typeof readingPreview> }) {
  if (!result) return null;
  if ('message' in result) {
    return (
      <p className="flex gap-1 text-sm text-bad">
        <span aria-hidden="true">✕</span> {result.message}
      </p>
    );
  }
  return (
    <p className="flex flex-wrap items-center gap-2 text-sm" aria-live="polite">
      <span className="text-graphite-2">This reading would be:</span>
      <VerdictBadge state={result.judgement.state} outsideByUm={result.judgement.outsideByUm} unit={result.unit} />
    </p>
  );
}

type ChipOption = { value: string; label: string; hint?: string };

/** Big radio chips: pressed with a greasy finger at the machine, and read at a glance. */
export function Chips({ legend, options, register, current, error, columns = 'grid-cols-2' }: {
  legend: string;
  options: readonly ChipOption[];
  register: UseFormRegisterReturn;
  current: string | undefined;
  error?: string;
  columns?: string;
}) {
  return (
    <fieldset>
      <legend className="mb-1 text-sm font-semibold">{legend}</legend>
      <div className={`grid gap-2 ${columns}`}>
        {options.map((o) => (
          <label
            key={o.value}
            className="flex min-h-12 cursor-pointer items-center gap-2 rounded-lg border-2 border-rule bg-paper px-3 py-1.5 text-sm font-semibold has-[:checked]:border-dye has-[:checked]:bg-dye-soft has-[:focus-visible]:outline has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-dye-2"
          >
            <input type="radio" value={o.value} className="sr-only" {...register} />
            <span className="flex flex-col">
              <span>{o.label}</span>
              {o.hint ? <span className="text-xs font-normal text-graphite-2">{o.hint}</span> : null}
            </span>
            {current === o.value ? (
              <span aria-hidden="true" className="ml-auto text-dye">
                ✓
              </span>
            ) : null}
          </label>
        ))}
      </div>
      {error ? <FieldErrorLine text={error} /> : null}
    </fieldset>
  );
}

export function FieldErrorLine({ text, id }: { text: string; id?: string }) {
  return (
    <p id={id} className="mt-1 flex items-center gap-1 text-sm font-medium text-bad" data-field-error={id}>
      <span aria-hidden="true">✕</span> {text}
    </p>
  );
}

/** A labelled input with its error, for the many small fields of a reading. */
export function SmallField({ id, label, hint, error, children, className = '' }: { id: string; label: string; hint?: string; error?: string; children: ReactNode; className?: string }) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-graphite-2">
          {hint}
        </p>
      ) : null}
      {error ? <FieldErrorLine text={error} id={`${id}-error`} /> : null}
    </div>
  );
}

export const smallInput = `${inputClass} dim`;

type ReadingKey = keyof ReadingFormValues;

/** The fields of one reading; the parent form decides where they live (readings.N.*). */
export function ReadingFields({ idPrefix, field, error, builderName, onInstrumentOrUnit }: {
  idPrefix: string;
  field: (name: ReadingKey) => UseFormRegisterReturn;
  error: (name: ReadingKey) => string | undefined;
  builderName: string;
  onInstrumentOrUnit: () => void;
}) {
  const id = (k: ReadingKey) => `${idPrefix}-${k}`;
  const aria = (k: ReadingKey, hint?: boolean) => ({
    'aria-invalid': error(k) ? true : undefined,
    'aria-describedby': error(k) ? `${id(k)}-error` : hint ? `${id(k)}-hint` : undefined,
  });
  const instrument = field('instrument');
  const unit = field('unit');
  return (
    <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
      <SmallField id={id('value')} label="Value" error={error('value')} className="col-span-2 sm:col-span-1">
        <input id={id('value')} inputMode="decimal" autoComplete="off" className={smallInput} {...aria('value')} {...field('value')} />
      </SmallField>
      <SmallField id={id('unit')} label="Unit" error={error('unit')}>
        <select
          id={id('unit')}
          className={inputClass}
          {...aria('unit')}
          {...unit}
          onChange={(e) => {
            void unit.onChange(e);
            onInstrumentOrUnit();
          }}
        >
          <option value="mm">mm</option>
          <option value="in">in</option>
        </select>
      </SmallField>
      <SmallField id={id('instrument')} label="Instrument" error={error('instrument')}>
        <select
          id={id('instrument')}
          className={inputClass}
          {...aria('instrument')}
          {...instrument}
          onChange={(e) => {
            void instrument.onChange(e);
            onInstrumentOrUnit();
          }}
        >
          {INSTRUMENTS.map((i) => (
            <option key={i.value} value={i.value}>
              {i.label}
            </option>
          ))}
        </select>
      </SmallField>
      <SmallField id={id('resolution')} label="Resolution" hint="Smallest step it reads" error={error('resolution')}>
        <input id={id('resolution')} inputMode="decimal" autoComplete="off" className={smallInput} {...aria('resolution', true)} {...field('resolution')} />
      </SmallField>
      <SmallField id={id('pass')} label="Pass (optional)" hint="When turning or boring toward size" error={error('pass')}>
        <input id={id('pass')} inputMode="numeric" autoComplete="off" className={smallInput} {...aria('pass', true)} {...field('pass')} />
      </SmallField>
      <SmallField id={id('temperatureC')} label="Part temperature °C (optional)" error={error('temperatureC')}>
        <input id={id('temperatureC')} inputMode="decimal" autoComplete="off" className={smallInput} {...aria('temperatureC')} {...field('temperatureC')} />
      </SmallField>
      <SmallField id={id('measuredBy')} label="Measured by" hint={builderName ? `Empty: ${builderName}` : undefined} error={error('measuredBy')}>
        <input id={id('measuredBy')} autoComplete="off" className={inputClass} placeholder={builderName} {...aria('measuredBy', !!builderName)} {...field('measuredBy')} />
      </SmallField>
      <SmallField id={id('measuredAt')} label="Measured at" hint="Empty: the session’s day" error={error('measuredAt')} className="col-span-2 sm:col-span-1">
        <input id={id('measuredAt')} type="datetime-local" className={inputClass} {...aria('measuredAt', true)} {...field('measuredAt')} />
      </SmallField>
      <SmallField id={id('note')} label="Note (optional)" hint="E.g. what you did about a reading outside its limits" error={error('note')} className="col-span-2 sm:col-span-4">
        <input id={id('note')} autoComplete="off" className={inputClass} {...aria('note', true)} {...field('note')} />
      </SmallField>
    </div>
  );
}
