'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { formatDay } from '@/lib/format';
import type { Length } from '@/lib/calculators/units';
import type { SavedCalculationView } from '@/lib/types/calculations';
import { sendJson } from '@/lib/client/api-client';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { formatIn, readoutMm } from '@/lib/units/format';
import type { SummaryValue } from '@/lib/calculators/pages/summary';

function Value({ value }: { value: SummaryValue }) {
  const l = value.len;
  const mm = l ? `${readoutMm(l.mm)} mm` : null;
  const inch = l ? `${formatIn(l.in)} in` : null;
  // A metric drill's name is its size: "6.8 mm" beside "6.800 mm" says nothing new.
  const text = l && value.text && /^\d+(?:\.\d+)? mm$/.test(value.text) ? undefined : value.text;
  return (
    <span className="inline-flex flex-wrap items-baseline justify-end gap-x-2">
      {/* Sizes and names in the tabular face; a sentence ("1 turn and 2 holes…") reads better in the text face. */}
      {text ? <span className={`${text.length > 20 ? 'text-left' : 'dim'} font-semibold`}>{text}</span> : null}
      {l ? <span className="dim whitespace-nowrap">{value.first === 'in' ? inch : mm}</span> : null}
      {l ? <span className="dim whitespace-nowrap text-xs text-graphite-2">{value.first === 'in' ? mm : inch}</span> : null}
      {value.note ? <span className="dim whitespace-nowrap text-xs">{value.note}</span> : null}
    </span>
  );
}

const cell = (c: string | Length) =>
  typeof c === 'string' ? (
    c
  ) : (
    <>
      <span className="block whitespace-nowrap">{readoutMm(c.mm)} mm</span>
      <span className="block whitespace-nowrap text-graphite-2">{formatIn(c.in)} in</span>
    </>
  );

/** One saved result: what went in, what came out in both units, and the way back to the calculator. */
export function SavedCalculationCard({ calc, currentVersion, onRemove }: { calc: SavedCalculationView; currentVersion: string; onRemove?: () => Promise<string | null> }) {
  const summary = calc.summary;
  const headingId = `calc-${calc.id}-title`;
  const older = calc.tablesVersion !== currentVersion;
  return (
    <article aria-labelledby={headingId} className="space-y-3 rounded-lg border border-rule bg-card p-4" data-testid="saved-calculation" data-kind={calc.kind}>
      <header className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 id={headingId} className="text-base font-bold">
            {calc.label}
          </h3>
          <p className="text-xs font-semibold uppercase tracking-wide text-dye">{calc.calculatorName}</p>
        </div>
        {onRemove ? (
          <ConfirmDialog
            trigger="Remove"
            triggerLabel={`Remove “${calc.label}”`}
            title="Remove this saved result?"
            body={<>“{calc.label}” leaves the entry. The calculator itself stays, and the result can be worked out and saved again.</>}
            confirmLabel="Remove it"
            onConfirm={onRemove}
            small
          />
        ) : null}
      </header>

      {summary ? (
        <>
          <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-graphite-2" data-testid="saved-inputs">
            {summary.inputs.map((i) => (
              <span key={i.label}>
                {i.label}: <Value value={i.value} />
              </span>
            ))}
          </p>
          <dl className="grid gap-x-6 sm:grid-cols-2" data-testid="saved-results">
            {summary.results.map((r) => (
              <div key={r.label} className="flex flex-wrap items-baseline justify-between gap-x-3 border-b border-rule/60 py-1.5">
                <dt className="text-sm text-graphite-2">{r.label}</dt>
                <dd className={`text-right ${r.strong ? 'text-base font-bold' : 'text-sm'}`}>
                  <Value value={r.value} />
                </dd>
              </div>
            ))}
          </dl>
          {summary.table ? (
            <div className="overflow-x-auto">
              <table className="w-full text-xs">
                <caption className="sr-only">{summary.table.caption}</caption>
                <thead>
                  <tr className="border-b border-rule text-left text-graphite-2">
                    {summary.table.head.map((h, i) => (
                      <th key={h} scope="col" className={`py-1 pr-2 font-semibold ${i ? 'text-right' : ''}`}>
                        {h}
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {summary.table.rows.map((row) => (
                    <tr key={row.key} className="border-b border-rule/60 align-top last:border-0">
                      {row.cells.map((c, i) =>
                        i === 0 ? (
                          <th key={i} scope="row" className="dim py-1 pr-2 text-left font-semibold">
                            {cell(c)}
                          </th>
                        ) : (
                          <td key={i} className="dim py-1 pr-2 text-right">
                            {cell(c)}
                          </td>
                        ),
                      )}
                    </tr>
                  ))}
                </tbody>
              </table>
              {summary.table.more ? <p className="mt-1 text-xs text-graphite-2">…and {summary.table.more} more in the calculator.</p> : null}
            </div>
          ) : null}
          {summary.warnings.length ? (
            <ul className="space-y-1 rounded-md border border-scribe/50 bg-scribe-soft px-3 py-2 text-sm" data-testid="saved-warnings">
              {summary.warnings.map((w) => (
                <li key={w}>
                  <span aria-hidden="true" className="text-scribe">
                    ⚠{' '}
                  </span>
                  {w}
                </li>
              ))}
            </ul>
          ) : null}
        </>
      ) : (
        <p className="text-sm text-graphite-2">This saved result cannot be shown in detail here; reopen it in the calculator.</p>
      )}

      <footer className="flex flex-wrap items-center justify-between gap-2 text-xs text-graphite-2">
        <span>
          {older ? (
            <strong className="text-graphite" data-testid="older-tables">
              Computed with tables {calc.tablesVersion} (now {currentVersion})
            </strong>
          ) : (
            <>Tables {calc.tablesVersion}</>
          )}{' '}
          · saved <time dateTime={calc.createdAt}>{formatDay(calc.createdAt.slice(0, 10))}</time>
          {calc.createdBy ? ` by ${calc.createdBy.name}` : ''}
        </span>
        {calc.reopenHref ? (
          <Link href={calc.reopenHref} className="inline-flex min-h-11 items-center gap-1 text-sm font-semibold print:hidden" data-testid="reopen-calculation">
            Reopen in the calculator <span aria-hidden="true">→</span>
          </Link>
        ) : null}
      </footer>
    </article>
  );
}

/** The entry's saved results; the builder may remove them on the edit page. */
export function EntryCalculations({ initial, tablesVersion, canRemove = false }: { initial: SavedCalculationView[]; tablesVersion: string; canRemove?: boolean }) {
  const [items, setItems] = useState(initial);
  const router = useRouter();
  return (
    <div className="grid gap-3 lg:grid-cols-2" data-testid="entry-calculations">
      {items.map((c) => (
        <SavedCalculationCard
          key={c.id}
          calc={c}
          currentVersion={tablesVersion}
          onRemove={
            canRemove
              ? async () => {
                  const res = await sendJson(`/api/calculations/${c.id}`, 'DELETE');
                  if (!res.ok) return res.error.message;
                  setItems((list) => list.filter((x) => x.id !== c.id));
                  router.refresh();
                  return null;
                }
              : undefined
          }
        />
      ))}
    </div>
  );
}
