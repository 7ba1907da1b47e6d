import type { ReactNode } from 'react';
import { ButtonLink } from '@/components/ui/button';
import { ProjectCard } from '@/components/projects/project-card';
import { RecentSessions } from '@/components/following/recent-sessions';
import type { publicHomeLists } from '@/lib/server/public-reads';

type Lists = Awaited<ReturnType<typeof publicHomeLists>>;

/** The home page's first words and its first button (the viewer's own step, given by the page). */
export function HomeHero({ firstStep }: { firstStep: ReactNode }) {
  return (
    <section className="rounded-xl border border-rule bg-card p-6 sm:p-8">
      <h1 className="max-w-2xl text-3xl font-bold leading-tight sm:text-4xl">
        Keep the whole build: every session, every clip, every dimension <span className="text-scribe">checked</span>.
      </h1>
      <p className="mt-3 max-w-2xl text-graphite-2">
        Scribeline is a shop journal for home machinists. Record each session at the lathe or mill, pin notes to moments of your clips, and
        judge each critical size against its ISO 286 fit. Followers learn from published logs; mentors flag what could hurt you.
      </p>
      <div className="mt-5 flex flex-wrap gap-2">
        {firstStep}
        <ButtonLink href="/fits" tone="quiet">
          Look up a fit
        </ButtonLink>
      </div>
    </section>
  );
}

/** The recently published sessions and logs: the same for every reader. */
export function HomeLists({ lists: { projects, sessions } }: { lists: Lists }) {
  return (
    <>
      <section aria-labelledby="recent-sessions">
        <h2 id="recent-sessions" className="mb-4 text-xl font-bold">
          Recently published sessions
        </h2>
        <RecentSessions sessions={sessions} />
      </section>

      <section aria-labelledby="recent-logs">
        <h2 id="recent-logs" className="mb-4 text-xl font-bold">
          Recently published logs
        </h2>
        {projects.length === 0 ? (
          <p className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">No published logs yet. Be the first to publish one.</p>
        ) : (
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            {projects.map((p) => (
              <ProjectCard key={p.id} project={p} href={`/logs/${p.slug}`} />
            ))}
          </div>
        )}
      </section>
    </>
  );
}
