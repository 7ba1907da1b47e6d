import Link from 'next/link';
import { OPERATIONS } from '@/lib/validations/log-words';
import { formatDay, formatTimeSpent, plural } from '@/lib/format';
import type { SessionView } from '@/lib/types/log';
import { VisibilityBadge } from '@/components/ui/badge';
import { OpenFlagCount } from '@/components/flags/flag-words';

/** The project's sessions in order, each with a picture, its day, time spent and counts. */
export function SessionTimeline({
  projectSlug,
  sessions,
  showVisibility = false,
  openFlags = {},
  firstNumber = 1,
}: {
  projectSlug: string;
  sessions: SessionView[];
  /** The number shown on the first session: a later page of the log goes on counting. */
  firstNumber?: number;
  showVisibility?: boolean;
  /** Open risk flags per session id. */
  openFlags?: Record<number, number>;
}) {
  return (
    <ol start={firstNumber} className="relative space-y-6 border-l-2 border-dye/30 pl-5 sm:pl-8" aria-label="Shop sessions">
      {sessions.map((s, i) => (
        <li key={s.id} className="relative" data-testid={`timeline-session-${s.id}`}>
          <span aria-hidden="true" className="absolute -left-[29px] top-3 flex h-5 w-5 items-center justify-center rounded-full border-2 border-dye bg-card text-[10px] font-bold text-dye sm:-left-[41px]">
            {firstNumber + i}
          </span>
          <article className="flex flex-col gap-4 rounded-xl border border-rule bg-card p-4 shadow-sm sm:flex-row">
            {s.thumbnail ? (
              <img
                src={s.thumbnail.url}
                alt={s.thumbnail.name}
                width={s.thumbnail.width ?? undefined}
                height={s.thumbnail.height ?? undefined}
                loading="lazy"
                className="h-32 w-full rounded-lg border border-rule object-cover sm:w-48"
              />
            ) : (
              <div aria-hidden="true" className="flex h-32 w-full items-center justify-center rounded-lg border border-dashed border-rule text-xs text-graphite-2 sm:w-48">
                no photo
              </div>
            )}
            <div className="min-w-0 flex-1">
              <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">
                Session {firstNumber + i} · <time dateTime={s.heldOn}>{formatDay(s.heldOn)}</time> · {formatTimeSpent(s.minutesSpent)}
              </p>
              <h3 className="flex flex-wrap items-center gap-2 text-lg font-bold">
                <Link href={`/logs/${projectSlug}/sessions/${s.id}`} className="text-graphite">
                  {s.title}
                </Link>
                {/* The builder's circle sees every session; the badge says which ones outsiders do. */}
                {showVisibility ? <VisibilityBadge visibility={s.visibility} /> : null}
              </h3>
              {openFlags[s.id] ? <OpenFlagCount count={openFlags[s.id]} className="mt-1" /> : null}
              {s.done ? <p className="mt-1 line-clamp-2 text-sm text-graphite-2">{s.done}</p> : null}
              <p className="mt-2 text-xs text-graphite-2">
                {plural(s.counts.entries, 'entry', 'entries')} · {plural(s.counts.photos, 'photo')} · {plural(s.counts.clips, 'clip')} · {plural(s.counts.notes, 'timestamped note')}
              </p>
              {s.entries.length ? (
                <ul className="mt-2 flex flex-wrap gap-2">
                  {s.entries.map((e) => (
                    <li key={e.id}>
                      <Link href={`/logs/${projectSlug}/entries/${e.id}`} className="inline-flex min-h-9 items-center gap-1 rounded-full border border-rule bg-paper px-3 text-sm no-underline hover:border-dye">
                        <span className="text-xs text-graphite-2">{OPERATIONS.find((o) => o.value === e.operation)?.label}</span>
                        <span className="font-medium text-graphite">{e.title}</span>
                      </Link>
                    </li>
                  ))}
                </ul>
              ) : null}
            </div>
          </article>
        </li>
      ))}
    </ol>
  );
}
