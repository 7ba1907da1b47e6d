import type { Metadata } from 'next';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/current-user';
import { listBenchSessions } from '@/lib/server/bench';
import { formatDay } from '@/lib/format';

// The signed-in member's own sessions: rendered per request.
export const instant = false;

export const metadata: Metadata = { title: 'At the bench', robots: { index: false } };

/** Where the home-screen app opens: the member's latest sessions, each a link to its bench view. */
export default async function BenchStartPage() {
  const user = await getCurrentUser();
  const sessions = await listBenchSessions(user);
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-2xl font-bold">At the bench</h1>
      <p className="text-graphite-2">Pick the session you are working on. Each opens with its records, a number pad, the camera and the timer, and keeps working without a connection once opened.</p>
      {sessions.length ? (
        <ul className="space-y-2">
          {sessions.map((s) => (
            <li key={s.id}>
              <Link href={`/bench/${s.id}`} className="block min-h-14 rounded-lg border border-rule bg-card p-3 no-underline">
                <span className="block text-lg font-bold">{s.title}</span>
                <span className="block text-sm text-graphite-2">
                  {s.projectTitle} · {formatDay(s.heldOn)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      ) : (
        <p className="rounded-md border border-rule bg-card p-3">
          No sessions yet. <Link href="/projects">Start a project</Link> and add a session to it.
        </p>
      )}
    </div>
  );
}
