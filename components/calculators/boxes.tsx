import { Field, describedBy, inputClass } from '@/components/ui/field';

// The boxes and choices of a calculator's form, big enough for a greasy hand at the machine.

/** The options of every calculator's length-unit choice. */
export const LENGTH_UNIT_OPTIONS = [
  { value: 'mm', label: 'Millimetres' },
  { value: 'in', label: 'Inches' },
] as const;

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
