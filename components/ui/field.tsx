import type { ReactNode } from 'react';

/** A labelled control with its hint and its error right beside it, tied together for screen readers. */
export function Field({ id, label, hint, error, children }: { id: string; label: string; hint?: string; error?: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-graphite-2">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="flex items-center gap-1 text-sm font-medium text-bad" data-field-error={id}>
          <span aria-hidden="true">✕</span> {error}
        </p>
      ) : null}
    </div>
  );
}

export const inputClass =
  'min-h-11 w-full rounded-md border border-rule bg-card px-3 py-2 text-base text-graphite placeholder:text-graphite-2/70 aria-[invalid=true]:border-bad';

/** The id of whichever line currently describes the control: its error, else its hint if it has one. */
export function describedBy(id: string, error?: string, hasHint?: 'hint'): string | undefined {
  if (error) return `${id}-error`;
  return hasHint ? `${id}-hint` : undefined;
}
