import Link from 'next/link';
import type { CurrentUser } from '@/lib/auth/current-user';
import type { SessionPageData } from '@/lib/server/reading';
import { canOnProject } from '@/lib/auth/policy';
import { OPERATIONS } from '@/lib/validations/log';
import { formatDay, formatTimeSpent, plural } from '@/lib/format';
import { ButtonLink } from '@/components/ui/button';
import { VisibilityBadge } from '@/components/ui/badge';
import { OpenFlagCount } from '@/components/flags/flag-words';

/** One shop session of a build log. */
export function SessionView({ data, user }: { data: SessionPageData; user: CurrentUser | null }) {
  const { session: s, scope, flags } = data;
  const slug = scope.projectSlug;
  const canEdit = canOnProject(user, 'editLog', scope.facts);
  // The builder's circle prints the session as a shop sheet (a signed-out copy has no user: never shown there).
  const canPrint = canOnProject(user, 'printSheet', scope.facts);
  const seesAll = canOnProject(user, 'view', { ...scope.facts, sessionVisibility: 'private' });
  return (
    <article className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={`/logs/${slug}`}>{scope.projectTitle}</Link> <span aria-hidden="true">›</span> Session {s.position + 1}
      </nav>
      <header>
        <p className="text-sm font-semibold uppercase tracking-wide text-graphite-2">
          <time dateTime={s.heldOn}>{formatDay(s.heldOn)}</time> · {formatTimeSpent(s.minutesSpent)}
        </p>
        <h1 className="text-3xl font-bold">{s.title}</h1>
        {seesAll ? (
          <p className="mt-1">
            <VisibilityBadge visibility={s.visibility} />
          </p>
        ) : null}
        {flags.bySession[s.id] ? <OpenFlagCount count={flags.bySession[s.id]} className="mt-2" /> : null}
        {canEdit || canPrint ? (
          <div className="mt-3 flex flex-wrap gap-2 print:hidden">
            {canEdit ? (
              <ButtonLink href={`/projects/${slug}/log`} tone="quiet">
                Edit in the log
              </ButtonLink>
            ) : null}
            {canPrint ? (
              <ButtonLink href={`/projects/${slug}/sessions/${s.id}/sheet`} tone="quiet">
                Print sheet
              </ButtonLink>
            ) : null}
            {canPrint ? (
              // A full page load, not a client-side move: the bench page is then its own document, which its
              // service worker (scope /bench) can keep and take over.
              <a href={`/bench/${s.id}`} className="inline-flex min-h-11 items-center justify-center gap-2 rounded-md border border-rule bg-card px-4 py-2 text-sm font-semibold text-graphite no-underline hover:bg-paper-2">
                At the bench
              </a>
            ) : null}
          </div>
        ) : null}
      </header>
      <dl className="grid gap-4 sm:grid-cols-3">
        {(
          [
            ['Planned', s.planned],
            ['Done', s.done],
            ['Next time', s.nextSteps],
          ] as const
        ).map(([label, text]) => (
          <div key={label} className="rounded-lg border border-rule bg-card p-4">
            <dt className="text-sm font-bold">{label}</dt>
            <dd className="mt-1 whitespace-pre-line text-graphite-2">{text || '—'}</dd>
          </div>
        ))}
      </dl>
      <section aria-labelledby="entries-heading">
        <h2 id="entries-heading" className="mb-3 text-xl font-bold">
          Entries
        </h2>
        {s.entries.length ? (
          <ol className="space-y-3">
            {s.entries.map((e) => (
              <li key={e.id}>
                <Link href={`/logs/${slug}/entries/${e.id}`} className="flex flex-wrap items-center gap-3 rounded-lg border border-rule bg-card p-4 no-underline hover:border-dye">
                  <span className="rounded bg-dye-soft px-2 py-0.5 text-xs font-semibold text-dye">{OPERATIONS.find((o) => o.value === e.operation)?.label}</span>
                  <span className="flex-1 text-lg font-semibold text-graphite">{e.title}</span>
                  <span className="text-sm text-graphite-2">
                    {plural(e.photoCount, 'photo')} · {plural(e.clipCount, 'clip')} · {plural(e.noteCount, 'note')}
                  </span>
                </Link>
              </li>
            ))}
          </ol>
        ) : (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No entries in this session yet.</p>
        )}
      </section>
    </article>
  );
}
