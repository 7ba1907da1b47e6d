'use client';

import { useMemo } from 'react';
import { useQueryState } from '@/components/hooks/use-query-state';
import { Field, describedBy, inputClass } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { SIZE_UNIT_OPTIONS, type SizeUnit } from '@/lib/validations/fits-words';
import { entryFromSearch, entryQuery, inchClassesAt, preferredFitsAt, readEntry, type EntryState } from './read-entry';
import { FitResult } from './fit-result';
import { InchFitResult } from './inch-fit-result';
import { InchClassesTable } from './inch-classes-table';
import { PreferredFitsTable } from './preferred-fits-table';
import { formatUm } from '@/lib/units/format';
import { clearanceWords, KIND_WORDS, nominalText } from './format';
import { inchClearanceWords } from './inch-format';

const EXAMPLES = ['25 H7/g6', '40 H7/p6', '1 in H7/k6', '12 js7', '1.5 RC4', '0.75 FN2'];

/**
 * One box for "size zone-or-fit", worked out in the browser on every keystroke.
 * The URL follows the entry (history.replaceState, no request), so a copied link shows the same result.
 */
export function FitsWorkbench({ initial }: { initial: EntryState }) {
  const { state: entry, update: set, hydrated } = useQueryState<EntryState>(initial, entryQuery, entryFromSearch);

  const result = useMemo(() => readEntry(entry), [entry]);
  const nominal = result.status === 'empty' ? undefined : result.nominal;
  const preferred = useMemo(() => (nominal ? preferredFitsAt(nominal.mm, entry.round) : []), [nominal, entry.round]);
  const inchClasses = useMemo(() => (nominal && nominal.unit === 'in' ? inchClassesAt(nominal.input) : []), [nominal]);

  const error = result.status === 'error' ? result.message : undefined;
  const textNamesUnit = nominal !== undefined && nominal.unit !== entry.unit;
  // One short line for screen readers instead of the whole result on every keystroke.
  const announce =
    result.status === 'inch'
      ? `${nominalText(result.nominal).typed} ${result.inch.fitClass}: ${KIND_WORDS[result.inch.kind].title.toLowerCase()}, ${inchClearanceWords(result.inch)}.`
      : result.status === 'fit'
      ? `${nominalText(result.nominal).typed} ${result.fit.fit}: ${KIND_WORDS[result.fit.kind].title.toLowerCase()}, ${clearanceWords(result.fit, result.nominal.unit)}.`
      : result.status === 'zone'
        ? `${nominalText(result.nominal).typed} ${result.zone.zone}: ${formatUm(result.zone.lowerUm, { signed: true })} to ${formatUm(result.zone.upperUm, { signed: true })} µm.`
        : '';

  return (
    <div className="space-y-10">
      {/* Phone: entry, result, then the options. Wide screens: entry and options on the left, result on the right. */}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,20rem)_minmax(0,1fr)] lg:grid-rows-[auto_1fr] lg:items-start">
        <form
          role="search"
          aria-label="Size and tolerance"
          className="space-y-4 rounded-xl border border-rule bg-card p-4 sm:p-5 lg:col-start-1 lg:row-start-1"
          onSubmit={(e) => e.preventDefault()}
          data-hydrated={hydrated ? 'true' : undefined}
        >
          <Field
            id="entry"
            label="Size and zone or fit"
            hint={'e.g. 25 H7/g6, Ø40 h6 or 1 in H7/p6 (ISO 286: capitals for the hole, small letters for the shaft), or 1.5 RC4 for an inch class (ANSI B4.1, sizes in inches).'}
            error={error}
          >
            <input
              id="entry"
              name="q"
              type="text"
              value={entry.text}
              onChange={(e) => set({ text: e.target.value })}
              placeholder="25 H7/g6"
              maxLength={60}
              autoComplete="off"
              autoCapitalize="off"
              autoCorrect="off"
              spellCheck={false}
              enterKeyHint="done"
              className={`${inputClass} dim min-h-14 text-2xl`}
              aria-invalid={error ? true : undefined}
              aria-describedby={describedBy('entry', error, 'hint')}
            />
          </Field>

          <fieldset className="space-y-2">
            <legend className="text-sm font-semibold">Size typed in</legend>
            <div className="grid grid-cols-2 gap-2">
              {SIZE_UNIT_OPTIONS.map((o) => (
                <label
                  key={o.value}
                  className="flex min-h-12 cursor-pointer items-center justify-center gap-2 rounded-md border border-rule bg-card px-3 text-base font-semibold has-[:checked]:border-dye has-[:checked]:bg-dye-soft"
                >
                  <input
                    type="radio"
                    name="unit"
                    value={o.value}
                    checked={entry.unit === o.value}
                    onChange={() => set({ unit: o.value as SizeUnit })}
                    className="h-4 w-4 accent-[var(--color-dye)]"
                  />
                  {o.value === 'mm' ? 'Millimetres' : 'Inches'}
                </label>
              ))}
            </div>
            <p className="text-xs text-graphite-2">
              {textNamesUnit
                ? `Your entry says ${nominal?.unit}, so that is used.`
                : 'Used when the entry does not say mm or in. 1 in = 25.4 mm exactly.'}
            </p>
          </fieldset>
        </form>

        <section aria-label="Result" className="min-w-0 lg:col-start-2 lg:row-span-2 lg:row-start-1">
          <p className="sr-only" role="status">
            {announce}
          </p>
          {result.status === 'fit' ? <FitResult nominal={result.nominal} fit={result.fit} /> : null}
          {result.status === 'zone' ? <FitResult nominal={result.nominal} zone={result.zone} /> : null}
          {result.status === 'inch' ? <InchFitResult nominal={result.nominal} inch={result.inch} /> : null}
          {result.status === 'size' ? (
            <Notice kind="info" title={`Size ${nominalText(result.nominal).typed}`}>
              Add a tolerance zone such as <span className="dim">H7</span> or a fit such as <span className="dim">H7/g6</span> after the size. The common
              fits at this size are listed below.
            </Notice>
          ) : null}
          {result.status === 'empty' ? (
            <Notice kind="info" title="Type a size and a zone or fit">
              For example <span className="dim">25 H7/g6</span> for a hole and shaft, or <span className="dim">25 h6</span> for one zone. The limits
              appear as you type.
            </Notice>
          ) : null}
          {result.status === 'error' ? (
            <p className="rounded-lg border border-dashed border-rule p-4 text-sm text-graphite-2">
              Nothing to show until the entry can be read: see the reason under the box.
            </p>
          ) : null}
        </section>

        <div className="space-y-4 rounded-xl border border-rule bg-card p-4 sm:p-5 lg:col-start-1 lg:row-start-2">
          <div className="space-y-1">
            <label className="flex min-h-11 cursor-pointer items-center gap-3 text-sm font-semibold">
              <input
                type="checkbox"
                checked={entry.round}
                onChange={(e) => set({ round: e.target.checked })}
                className="h-5 w-5 accent-[var(--color-dye)]"
                aria-describedby="round-hint"
              />
              Round JS/js to the even micrometre
            </label>
            <p id="round-hint" className="text-xs text-graphite-2">
              ISO 286-1 allows rounding odd IT values of grades 7–11 down to the even number for JS/js: 25 js7 becomes ±10 µm instead of ±10.5 µm. Off
              unless your drawing or shop works that way.
            </p>
          </div>

          <div className="space-y-1">
            <p id="examples" className="text-xs font-semibold text-graphite-2">
              Examples
            </p>
            <div className="flex flex-wrap gap-2" role="group" aria-labelledby="examples">
              {EXAMPLES.map((ex) => (
                <button
                  key={ex}
                  type="button"
                  className="dim min-h-11 rounded-md border border-rule px-3 text-sm hover:bg-paper-2"
                  onClick={() => set({ text: ex })}
                >
                  {ex}
                </button>
              ))}
            </div>
          </div>
        </div>
      </div>

      {nominal && inchClasses.length > 0 ? (
        <InchClassesTable nominal={nominal} rows={inchClasses} currentClass={result.status === 'inch' ? result.inch.fitClass : undefined} />
      ) : null}

      {nominal ? (
        <PreferredFitsTable nominal={nominal} rows={preferred} round={entry.round} currentFit={result.status === 'fit' ? result.fit.fit : undefined} />
      ) : null}
    </div>
  );
}
