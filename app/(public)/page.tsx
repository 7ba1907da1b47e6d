import { Suspense } from 'react';
import { connection } from 'next/server';
import { ButtonLink } from '@/components/ui/button';
import { getCurrentUser } from '@/lib/auth/current-user';
import { publicHomeLists } from '@/lib/server/public-reads';
import { HomeHero, HomeLists } from './_reading/home-view';

// The home page of a builder, mentor or admin (signed-out readers and members outside every circle get the
// copy cached for everyone, app/(open)/open/home: next.config.mjs rewrites).

/** The first step for this viewer, streamed in its own boundary. */
async function FirstStep() {
  const user = await getCurrentUser();
  return user ? <ButtonLink href="/projects/new">Start a project</ButtonLink> : <ButtonLink href="/sign-up">Create an account</ButtonLink>;
}

/**
 * The lists are the same for every reader (cached for everyone, tagged 'home', lib/server/public-reads.ts),
 * read at request time so the build never needs the database.
 */
async function Lists() {
  await connection();
  return <HomeLists lists={await publicHomeLists()} />;
}

// Only the first button depends on the viewer, and the lists are read at request time: the rest is prerendered at build.
export default function HomePage() {
  return (
    <div className="space-y-10">
      <HomeHero
        firstStep={
          <Suspense fallback={<ButtonLink href="/sign-up">Create an account</ButtonLink>}>
            <FirstStep />
          </Suspense>
        }
      />
      <Suspense fallback={<p className="text-graphite-2">Loading the latest logs…</p>}>
        <Lists />
      </Suspense>
    </div>
  );
}
