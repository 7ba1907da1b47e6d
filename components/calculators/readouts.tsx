import type { ReactNode } from 'react';
import { TABLES_VERSION } from '@/lib/calculators/version';
import type { CalculatorWarning } from '@/lib/calculators/errors';
import type { Length } from '@/lib/calculators/units';
import { formatIn, readoutMm } from '@/lib/units/format';
import type { LengthUnit } from '@/lib/types/units';

// What a calculator's result is made of: lengths in both units, labelled rows, warnings, sources.

/** One length in both units: millimetres first, inches beside it in a quieter tone. */
export function Len({ value, first = 'mm', prefix = '' }: { value: Length; first?: LengthUnit; prefix?: string }) {
  const mm = `${readoutMm(value.mm)} mm`;
  const inch = `${formatIn(value.in)} in`;
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

/** Result column's placeholder while the boxes are empty or wrong. */
export function Waiting({ children }: { children: ReactNode }) {
  return <p className="rounded-lg border border-dashed border-rule p-4 text-sm text-graphite-2">{children}</p>;
}

