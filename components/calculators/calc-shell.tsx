import type { ReactNode } from 'react';

/**
 * One calculator: the boxes on the left (on top on a phone), the result on the right, and a line
 * read out to screen readers when the result changes.
 */
export function CalcShell({
  formLabel,
  hydrated,
  form,
  result,
  announce,
}: {
  formLabel: string;
  hydrated: boolean;
  form: ReactNode;
  result: ReactNode;
  announce: string;
}) {
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)] lg:items-start">
      <form
        aria-label={formLabel}
        className="space-y-4 rounded-xl border border-rule bg-card p-4 sm:p-5"
        onSubmit={(e) => e.preventDefault()}
        data-hydrated={hydrated ? 'true' : undefined}
        noValidate
      >
        {form}
      </form>
      <section aria-label="Result" className="min-w-0 space-y-5" data-testid="calculator-result">
        <p className="sr-only" role="status">
          {announce}
        </p>
        {result}
      </section>
    </div>
  );
}

/** A framed block of the result with its heading. */
export function ResultBlock({ title, children, testId }: { title?: string; children: ReactNode; testId?: string }) {
  return (
    <div className="space-y-2 rounded-lg border border-rule bg-card p-4" data-testid={testId}>
      {title ? <h3 className="text-base font-bold">{title}</h3> : null}
      {children}
    </div>
  );
}
