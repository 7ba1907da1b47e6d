import { ButtonLink } from '@/components/ui/button';
import { ProjectCard } from '@/components/projects/project-card';
import { getCurrentUser } from '@/lib/auth/current-user';
import { Suspense } from 'react';
import { connection } from 'next/server';
import { publicHomeLists } from '@/lib/server/public-reads';
import { RecentSessions } from '@/components/following/recent-sessions';


/** The first step for this viewer, streamed in its own boundary. */
async function FirstStep() {
  const user = await getCurrentUser();
  return user ? <ButtonLink href="/projects/new">Start a project</ButtonLink> : <ButtonLink href="/sign-up">Create an account</ButtonLink>;
}

/**
 * The lists are the same for every reader (cached for everyone, tagged 'home', lib/server/public-reads.ts),
 * read at request time so the build never needs the database.
 */
async function HomeLists() {
  await connection();
  const { projects, sessions } = await publicHomeLists();
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

// Only the first button depends on the viewer, and the lists are read at request time: the rest is prerendered at build.
export default function HomePage() {
  return (
    <div className="space-y-10">
      <section className="rounded-xl border border-rule bg-card p-6 sm:p-8">
        <h1 className="max-w-2xl text-3xl font-bold leading-tight sm:text-4xl">
          Keep the whole build: every session, every clip, every dimension <span className="text-scribe">checked</span>.
        </h1>
        <p className="mt-3 max-w-2xl text-graphite-2">
          Scribeline is a shop journal for home machinists. Record each session at the lathe or mill, pin notes to moments of your clips, and
          judge each critical size against its ISO 286 fit. Followers learn from published logs; mentors flag what could hurt you.
        </p>
        <div className="mt-5 flex flex-wrap gap-2">
          <Suspense fallback={<ButtonLink href="/sign-up">Create an account</ButtonLink>}>
            <FirstStep />
          </Suspense>
          <ButtonLink href="/fits" tone="quiet">
            Look up a fit
          </ButtonLink>
        </div>
      </section>

      <Suspense fallback={<p className="text-graphite-2">Loading the latest logs…</p>}>
        <HomeLists />
      </Suspense>
    </div>
  );
}
