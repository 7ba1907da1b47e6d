import Link from 'next/link';
import { TimeAgo } from '@/components/ui/time-ago';
import { formatDay } from '@/lib/format';
import type { PublishedSessionCard } from '@/lib/types/following';

/** Sessions builders published lately, newest first: what a reader came to the home page for. */
export function RecentSessions({ sessions }: { sessions: PublishedSessionCard[] }) {
  if (!sessions.length) {
    return (
      <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2" data-testid="recent-sessions-empty">
        No sessions have been published yet. When a builder publishes a shop session, it shows up here.
      </p>
    );
  }
  return (
    <ol className="divide-y divide-rule overflow-hidden rounded-xl border border-rule bg-card" aria-label="Recently published sessions">
      {sessions.map((s) => (
        <li key={s.id} className="p-4" data-testid={`recent-session-${s.id}`}>
          <p className="text-xs font-semibold uppercase tracking-wide text-graphite-2">
            <time dateTime={s.heldOn}>{formatDay(s.heldOn)}</time> · published{' '}
            <TimeAgo iso={s.publishedAt} />
          </p>
          <h3 className="mt-0.5 text-lg font-bold leading-snug">
            <Link href={`/logs/${s.project.slug}/sessions/${s.id}`} className="text-graphite">
              {s.title}
            </Link>
          </h3>
          <p className="text-sm text-graphite-2">
            in <Link href={`/logs/${s.project.slug}`}>{s.project.title}</Link> · by <Link href={`/builders/${s.builder.handle}`}>{s.builder.name}</Link>
          </p>
          {s.summary ? <p className="mt-1 line-clamp-2 text-sm">{s.summary}</p> : null}
        </li>
      ))}
    </ol>
  );
}
