import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { MyProjects } from '@/components/projects/my-projects';
import { MentoredProjects } from '@/components/projects/mentored-projects';
import { Notice } from '@/components/ui/notice';
import { PlusIcon } from '@/components/ui/plus-icon';
import { ImportArchiveForm } from '@/components/archive/import-archive-form';
import { getCurrentUser } from '@/lib/auth/current-user';
import { listMentoredProjects, listMyProjects } from '@/lib/server/projects';
import { withOpenFlagCounts } from '@/lib/server/flags';
import { AppError } from '@/lib/errors';
import { notFound } from 'next/navigation';

function ListPager({ first, next, what }: { first: string | null; next: string | null; what: string }) {
  if (!first && !next) return null;
  return (
    <nav aria-label={`Pages of ${what}`} className="flex flex-wrap justify-end gap-2">
      {first ? (
        <ButtonLink href={first} tone="quiet">
          First page of {what}
        </ButtonLink>
      ) : null}
      {next ? (
        <ButtonLink href={next} tone="quiet">
          More of {what}
        </ButtonLink>
      ) : null}
    </nav>
  );
}

export const metadata: Metadata = { title: 'My projects' };

type Query = { saved?: string; mine?: string; mentored?: string };

/** This page with a list moved to another page (the other list stays where it was). */
function hrefWith(query: Query, change: Pick<Query, 'mine' | 'mentored'>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries({ mine: query.mine, mentored: query.mentored, ...change })) if (v) q.set(k, v);
  const s = q.toString();
  return s ? `/projects?${s}` : '/projects';
}

export default async function MyProjectsPage({ searchParams }: { searchParams: Promise<Query> }) {
  const query = await searchParams;
  const { saved } = query;
  // Both lists come with the page, a page of each at a time (keyset): the forms that change them are server
  // actions that revalidate it. A page address that cannot be read is the 404 page.
  const user = await getCurrentUser();
  const [mine, mentored] = await Promise.all([listMyProjects(user, query.mine), listMentoredProjects(user, query.mentored)]).catch((err: unknown) => {
    if (err instanceof AppError && err.code === 'validation') notFound();
    throw err;
  });
  const [mineShown, mentoredShown] = await Promise.all([withOpenFlagCounts(mine.projects), withOpenFlagCounts(mentored.projects)]);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">My projects</h1>
        <ButtonLink href="/projects/new" className="gap-2">
          <PlusIcon /> New project
        </ButtonLink>
      </div>
      {saved ? (
        <Notice kind="success" role="status" title="Saved">
          Your project was saved.
        </Notice>
      ) : null}
      <MyProjects projects={mineShown} />
      <ListPager first={query.mine ? hrefWith(query, { mine: undefined }) : null} next={mine.nextCursor ? hrefWith(query, { mine: mine.nextCursor }) : null} what="your projects" />
      <MentoredProjects projects={mentoredShown} />
      <ListPager first={query.mentored ? hrefWith(query, { mentored: undefined }) : null} next={mentored.nextCursor ? hrefWith(query, { mentored: mentored.nextCursor }) : null} what="the projects you mentor" />
      <section className="rounded-xl border border-rule bg-card p-5 sm:p-6" aria-labelledby="bring-in">
        <h2 id="bring-in" className="mb-2 text-lg font-bold">
          Bring in an archive
        </h2>
        <p className="mb-3 text-sm text-graphite-2">A project archive from this or another Scribeline comes back as a new project of yours, on the bench (private) until you publish it.</p>
        <ImportArchiveForm />
      </section>
    </div>
  );
}
