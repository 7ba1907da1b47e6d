import type { Metadata } from 'next';
import { getCurrentUser } from '@/lib/auth/current-user';
import { search, type SearchResult } from '@/lib/server/search';
import { AppError, type FieldErrors } from '@/lib/errors';
import { OPERATIONS } from '@/lib/validations/log';
import { SEARCH_KINDS, SEARCH_MAX_PAGE } from '@/lib/validations/search';
import { Field, inputClass, describedBy } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SearchResults } from '@/components/search/search-results';

// Per request: what a search finds depends on the query and on who asks.
export const instant = false;

export const metadata: Metadata = { title: 'Search the logs' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };
const FIELDS = ['q', 'kind', 'operation', 'zone', 'min', 'max', 'unit', 'page'] as const;

export default async function SearchPage({ searchParams }: Props) {
  const raw = await searchParams;
  const input: Record<string, string> = {};
  for (const f of FIELDS) {
    const v = raw[f];
    const s = Array.isArray(v) ? v[0] : v;
    if (s !== undefined && s !== '') input[f] = s;
  }
  const asked = Object.keys(input).some((k) => k !== 'page' && k !== 'unit' && k !== 'kind' && k !== 'operation');
  const user = await getCurrentUser();
  let result: SearchResult | null = null;
  let errors: FieldErrors = {};
  if (asked) {
    try {
      result = await search(user, input);
    } catch (err) {
      if (!(err instanceof AppError) || err.code !== 'validation') throw err;
      errors = err.fieldErrors ?? { q: [err.message] };
    }
  }
  const error = (f: string) => errors[f]?.[0];
  const pageHref = (page: number) => `/search?${new URLSearchParams({ ...input, page: String(page) }).toString()}`;

  return (
    <div className="mx-auto max-w-4xl space-y-6 px-4 py-6">
      <header className="space-y-1">
        <h1 className="text-2xl font-bold">Search the logs</h1>
        <p className="text-sm text-graphite-2">
          Published sessions, entries, clip notes, comments and measurements of every open log{user ? ', and your own work and the projects you mentor' : ''}.
          A zone and a size find measured fits, e.g. <span className="font-mono">k6 spigot 130 mm</span> or <span className="font-mono">H7 bores between 100 and 150 mm</span>.
        </p>
      </header>

      <form action="/search" method="get" role="search" aria-label="Search the logs" className="space-y-4 rounded-md border border-rule bg-card p-4" noValidate>
        <Field id="search-q" label="Words" error={error('q')} hint="Every word must match; a word also finds longer words that begin with it.">
          <div className="flex flex-col gap-2 sm:flex-row">
            <input
              id="search-q" name="q" type="search" defaultValue={input.q ?? ''} maxLength={200} autoFocus={!asked}
              aria-invalid={error('q') ? true : undefined} aria-describedby={describedBy('search-q', error('q'), 'hint')}
              className={inputClass} placeholder="spigot recess, chatter, 130 mm k6…" enterKeyHint="search"
            />
            <Button type="submit" className="sm:w-32">Search</Button>
          </div>
        </Field>
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="sr-only">Filters</legend>
          <Field id="search-kind" label="Look in" error={error('kind')}>
            <select id="search-kind" name="kind" defaultValue={input.kind ?? 'all'} className={inputClass} aria-invalid={error('kind') ? true : undefined} aria-describedby={describedBy('search-kind', error('kind'))}>
              <option value="all">Everything</option>
              {SEARCH_KINDS.map((k) => <option key={k.value} value={k.value}>{k.label}</option>)}
            </select>
          </Field>
          <Field id="search-operation" label="Operation" error={error('operation')}>
            <select id="search-operation" name="operation" defaultValue={input.operation ?? 'all'} className={inputClass} aria-invalid={error('operation') ? true : undefined} aria-describedby={describedBy('search-operation', error('operation'))}>
              <option value="all">Any operation</option>
              {OPERATIONS.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
            </select>
          </Field>
        </fieldset>
        <fieldset className="space-y-2">
          <legend className="text-sm font-semibold">Fit: measured records by zone and size</legend>
          <div className="grid grid-cols-2 gap-4 sm:grid-cols-4">
            <Field id="search-zone" label="Zone or fit" error={error('zone')} hint="k6, H7, H7/g6, RC4">
              <input id="search-zone" name="zone" defaultValue={input.zone ?? ''} maxLength={20} autoCapitalize="off" autoCorrect="off" spellCheck={false}
                className={`${inputClass} font-mono`} aria-invalid={error('zone') ? true : undefined} aria-describedby={describedBy('search-zone', error('zone'), 'hint')} />
            </Field>
            <Field id="search-min" label="From size" error={error('min')}>
              <input id="search-min" name="min" inputMode="decimal" defaultValue={input.min ?? ''} maxLength={20}
                className={`${inputClass} font-mono tabular-nums`} aria-invalid={error('min') ? true : undefined} aria-describedby={describedBy('search-min', error('min'))} />
            </Field>
            <Field id="search-max" label="To size" error={error('max')}>
              <input id="search-max" name="max" inputMode="decimal" defaultValue={input.max ?? ''} maxLength={20}
                className={`${inputClass} font-mono tabular-nums`} aria-invalid={error('max') ? true : undefined} aria-describedby={describedBy('search-max', error('max'))} />
            </Field>
            <Field id="search-unit" label="Unit" error={error('unit')}>
              <select id="search-unit" name="unit" defaultValue={input.unit ?? 'mm'} className={inputClass} aria-invalid={error('unit') ? true : undefined} aria-describedby={describedBy('search-unit', error('unit'))}>
                <option value="mm">mm</option>
                <option value="in">in</option>
              </select>
            </Field>
          </div>
          <p className="text-xs text-graphite-2">
            Material is not a field of the logs yet: type it among the words (“cast iron”, “EN8”), and it is found where the builder wrote it.
          </p>
        </fieldset>
      </form>

      {errors.page ? <Notice kind="error" role="alert">{errors.page[0]}</Notice> : null}
      {result?.notice ? <Notice kind="info" role="status">{result.notice}</Notice> : null}
      {result && (result.filters.length || result.ignored.length) ? (
        <p className="text-sm text-graphite-2" data-search-read>
          {result.filters.length ? <>Read as: <span className="font-mono">{result.filters.join(' · ')}</span>{result.words.length ? <> with the words <span className="font-mono">{result.words.join(' ')}</span></> : null}. </> : null}
          {result.ignored.length ? <>Not searched (too short or too common): {result.ignored.join(', ')}.</> : null}
        </p>
      ) : null}
      {result && !result.notice ? (
        result.hits.length ? (
          <SearchResults result={result} pageHref={pageHref} />
        ) : (
          <Notice kind="info" role="status" title="Nothing found">
            {result.mode === 'fit'
              ? 'No measurement you may read matches that zone and size. Widen the size range, or drop the zone.'
              : 'No published log you may read has all of those words. Try fewer words, or the start of a word.'}
          </Notice>
        )
      ) : null}
      {result && result.page >= SEARCH_MAX_PAGE && result.hasMore ? (
        <p className="text-sm text-graphite-2">That is as far as a search pages: add a word or a filter to narrow it.</p>
      ) : null}
    </div>
  );
}
