import type { ReactNode } from 'react';
import { Field, describedBy, inputClass } from '@/components/ui/field';
import { CAUTION_DEFER, CAUTIONS, TABLES_VERSION, type CalculatorWarning, type CautionTopic, type Length } from '@/lib/calculators';

/** Millimetres to 0.001 and inches to 0.0001, the way a machinist reads them off a drawing or a DRO. */
export function mmText(mm: number): string {
  const r = Math.round(mm * 1000) / 1000;
  return (r === 0 ? 0 : r).toFixed(3);
}
export function inText(inches: number): string {
  const r = Math.round(inches * 10000) / 10000;
  return (r === 0 ? 0 : r).toFixed(4);
}
export const lengthWords = (l: Length) => `${mmText(l.mm)} mm (${inText(l.in)} in)`;

/** One length in both units: millimetres first, inches beside it in a quieter tone. */
export function Len({ value, first = 'mm', prefix = '' }: { value: Length; first?: 'mm' | 'in'; prefix?: string }) {
  const mm = `${mmText(value.mm)} mm`;
  const inch = `${inText(value.in)} in`;
  return (
    <span className="inline-flex flex-wrap items-baseline gap-x-2">
      {/* In the sans face: a monospaced Ø reads as a zero. */}
      {prefix ? <span className="-mr-1">{prefix}</span> : null}
      <span className="dim whitespace-nowrap">{first === 'mm' ? mm : inch}</span>
      <span className="dim whitespace-nowrap text-sm text-graphite-2">{first === 'mm' ? inch : mm}</span>
    </span>
  );
}

/** A labelled result: the name on the left, the value (usually both units) on the right, wrapping on a phone. */
export function ResultRow({ label, children, testId, strong }: { label: ReactNode; children: ReactNode; testId?: string; strong?: boolean }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5 border-b border-rule/60 py-2 last:border-0" data-testid={testId}>
      <dt className="text-sm text-graphite-2">{label}</dt>
      <dd className={`text-right ${strong ? 'text-lg font-bold' : ''}`}>{children}</dd>
    </div>
  );
}

/** Where the numbers come from, and the tables version a saved result records. */
export function SourcesLine({ sources, version = TABLES_VERSION }: { sources: readonly string[]; version?: string }) {
  const unique = [...new Set(sources)];
  return (
    <p className="text-xs text-graphite-2" data-testid="sources">
      <span className="font-semibold">Tables: version {version}</span>
      {unique.map((s) => (
        <span key={s}> · {s}</span>
      ))}
    </p>
  );
}

/** Warnings of a result, said in words with an icon. */
export function WarningList({ warnings, title = 'Check before cutting' }: { warnings: readonly CalculatorWarning[]; title?: string }) {
  if (!warnings.length) return null;
  return (
    <div className="flex gap-3 rounded-md border border-scribe/60 bg-scribe-soft px-4 py-3 text-sm" data-testid="warnings" role="note">
      <span aria-hidden="true" className="text-base leading-5 text-scribe">
        ⚠
      </span>
      <div>
        <p className="font-semibold">{title}</p>
        <ul className="mt-0.5 space-y-1">
          {warnings.map((w) => (
            <li key={w.code} data-warning={w.code}>
              {w.message}
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}

/** The usual cautions for what the calculator is used for: one quiet line that opens into the list. */
export function CalculatorCautions({ topics }: { topics: readonly CautionTopic[] }) {
  const cautions = topics.map((t) => CAUTIONS[t]);
  const count = cautions.reduce((n, c) => n + c.points.length, 0);
  return (
    <details className="group rounded-md border border-scribe/40 bg-scribe-soft/40 text-sm" data-testid="calculator-cautions">
      <summary className="flex min-h-11 cursor-pointer list-none items-center gap-2 px-3 py-2 font-semibold [&::-webkit-details-marker]:hidden">
        <span aria-hidden="true" className="text-scribe">
          ⚠
        </span>
        <span>
          Usual cautions: {cautions.map((c) => c.title.split(':')[0].toLowerCase()).join(', ')} <span className="font-normal text-graphite-2">({count})</span>
        </span>
        <span aria-hidden="true" className="ml-auto text-graphite-2 transition-transform group-open:rotate-90">
          ›
        </span>
      </summary>
      <div className="space-y-3 border-t border-scribe/30 px-3 py-3">
        {cautions.map((c) => (
          <div key={c.title}>
            <p className="font-semibold">{c.title}</p>
            <ul className="mt-1 space-y-1">
              {c.points.map((p) => (
                <li key={p} className="pl-4 -indent-4">
                  <span aria-hidden="true" className="text-scribe">
                    ▸{' '}
                  </span>
                  {p}
                </li>
              ))}
            </ul>
          </div>
        ))}
        <p className="text-graphite-2">{CAUTION_DEFER}</p>
      </div>
    </details>
  );
}

/** A two- or three-way choice as big radio buttons (a segmented row). */
export function Choice<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
  hint,
}: {
  legend: string;
  name: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  hint?: string;
}) {
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-semibold">{legend}</legend>
      <div className={`grid gap-2 ${options.length === 3 ? 'grid-cols-3' : 'grid-cols-2'}`}>
        {options.map((o) => (
          <label
            key={o.value}
            className="flex min-h-11 cursor-pointer items-center justify-center gap-2 rounded-md border border-rule bg-card px-2 text-center text-sm font-semibold has-[:checked]:border-dye has-[:checked]:bg-dye-soft has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-dye-2"
          >
            <input type="radio" name={name} value={o.value} checked={value === o.value} onChange={() => onChange(o.value)} className="h-4 w-4 shrink-0 accent-[var(--color-dye)]" />
            {o.label}
          </label>
        ))}
      </div>
      {hint ? <p className="text-xs text-graphite-2">{hint}</p> : null}
    </fieldset>
  );
}

/** Example buttons that fill the boxes. */
export function Examples({ items, onPick, label = 'Examples' }: { items: readonly { label: string; key?: string }[]; onPick: (i: number) => void; label?: string }) {
  return (
    <div className="space-y-1">
      <p className="text-xs font-semibold text-graphite-2">{label}</p>
      <div className="flex flex-wrap gap-2" role="group" aria-label={label}>
        {items.map((ex, i) => (
          <button key={ex.key ?? ex.label} type="button" className="dim min-h-11 rounded-md border border-rule px-3 text-sm hover:bg-paper-2" onClick={() => onPick(i)}>
            {ex.label}
          </button>
        ))}
      </div>
    </div>
  );
}

/** Result column's placeholder while the boxes are empty or wrong. */
export function Waiting({ children }: { children: ReactNode }) {
  return <p className="rounded-lg border border-dashed border-rule p-4 text-sm text-graphite-2">{children}</p>;
}

/**
 * One text box of a calculator, with its label, hint and error beside it and the value in the
 * dimension face. kind: the phone keyboard for numbers, or a name (a thread, a drill) that must
 * not be auto-corrected.
 */
export function DimBox({
  id, label, hint, error, value, onChange, placeholder, maxLength, kind = 'text', big = false,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  value: string;
  onChange: (value: string) => void;
  placeholder?: string;
  maxLength: number;
  kind?: 'text' | 'name' | 'decimal' | 'numeric';
  big?: boolean;
}) {
  const name = kind === 'name' ? ({ autoComplete: 'off', autoCapitalize: 'off', autoCorrect: 'off', spellCheck: false } as const) : {};
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        type="text"
        inputMode={kind === 'decimal' || kind === 'numeric' ? kind : undefined}
        {...name}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        placeholder={placeholder}
        maxLength={maxLength}
        className={`${inputClass} dim${big ? ' min-h-14 text-2xl' : ''}`}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, error, hint ? 'hint' : undefined)}
      />
    </Field>
  );
}
