import Link from 'next/link';
import type { ExcerptPart, SearchHit, SearchResult } from '@/lib/types/search';
import { SEARCH_PAGE_SIZE } from '@/lib/validations/search';

const KIND_LABEL: Record<SearchHit['kind'], string> = { entry: 'Entry', session: 'Session', note: 'Clip note', comment: 'Comment', record: 'Measurement' };

/** The excerpt as React nodes (never HTML): the matching words in <mark>. */
function Excerpt({ parts }: { parts: ExcerptPart[] }) {
  if (!parts.length) return null;
  return (
    <p className="mt-1 text-sm text-graphite-2" data-excerpt>
      {parts.map((p, i) =>
        p.mark ? (
          <mark key={i} className="rounded-sm bg-scribe-soft px-0.5 text-graphite">
            {p.text}
          </mark>
        ) : (
          <span key={i}>{p.text}</span>
        ),
      )}
    </p>
  );
}

function Outcome({ record }: { record: NonNullable<SearchHit['record']> }) {
  const verdict =
    record.state === 'inside'
      ? { icon: '✓', tone: 'text-ok' }
      : record.state === 'none'
        ? { icon: '○', tone: 'text-graphite-2' }
        : { icon: '✕', tone: 'text-bad' };
  return (
    <dl className="mt-2 grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1 text-sm" data-outcome={record.state}>
      <dt className="text-graphite-2">Size</dt>
      <dd className="font-mono tabular-nums">{record.spec} · {record.kind === 'inside' ? 'inside (bore)' : 'outside (shaft)'}</dd>
      <dt className="text-graphite-2">Limits</dt>
      <dd className="font-mono tabular-nums">{record.limitsText}</dd>
      <dt className="text-graphite-2">Outcome</dt>
      <dd className={`font-semibold ${verdict.tone}`}>
        <span aria-hidden="true">{verdict.icon}</span> {record.verdict}
        {record.deviationText ? (
          <span className="ml-2 font-mono font-normal tabular-nums text-graphite">last reading {record.deviationText} from nominal</span>
        ) : null}
        {record.readings > 1 ? <span className="ml-2 font-normal text-graphite-2">({record.readings} readings)</span> : null}
      </dd>
    </dl>
  );
}

export function SearchResults({ result, pageHref }: { result: SearchResult; pageHref: (page: number) => string }) {
  const first = (result.page - 1) * SEARCH_PAGE_SIZE + 1;
  return (
    <section aria-labelledby="search-results-title" className="space-y-4">
      <h2 id="search-results-title" className="text-lg font-bold">
        {result.hits.length ? `Results ${first}–${first + result.hits.length - 1}${result.hasMore ? ', more follow' : ''}` : 'No results'}
      </h2>
      <ol className="space-y-3" data-search-results>
        {result.hits.map((hit) => (
          <li key={`${hit.kind}:${hit.id}`} className="rounded-md border border-rule bg-card p-4" data-hit={`${hit.kind}:${hit.id}`}>
            <p className="flex flex-wrap items-center gap-2 text-xs font-semibold uppercase tracking-wide text-graphite-2">
              <span>{KIND_LABEL[hit.kind]}</span>
              {hit.operation ? <span>· {hit.operation}</span> : null}
              {hit.privateToYou ? <span className="normal-case text-dye">· only you and your circle find this</span> : null}
            </p>
            <h3 className="mt-1 text-base font-semibold">
              <Link href={hit.href} className="break-words">
                {hit.title}
              </Link>
            </h3>
            <p className="text-sm text-graphite-2">{hit.context}</p>
            <Excerpt parts={hit.excerpt} />
            {hit.record ? <Outcome record={hit.record} /> : null}
          </li>
        ))}
      </ol>
      {result.page > 1 || result.hasMore ? (
        <nav aria-label="Result pages" className="flex flex-wrap gap-2">
          {result.page > 1 ? (
            <Link href={pageHref(result.page - 1)} rel="prev" className="inline-flex min-h-11 items-center rounded-md border border-rule bg-card px-4 text-sm font-semibold no-underline hover:bg-paper-2">
              Previous results
            </Link>
          ) : null}
          {result.hasMore ? (
            <Link href={pageHref(result.page + 1)} rel="next" className="inline-flex min-h-11 items-center rounded-md border border-rule bg-card px-4 text-sm font-semibold no-underline hover:bg-paper-2">
              More results
            </Link>
          ) : null}
        </nav>
      ) : null}
    </section>
  );
}
