import type { Metadata } from 'next';
import Link from 'next/link';
import { format } from 'date-fns';
import { ButtonLink } from '@/components/ui/button';
import { VisibilityBadge } from '@/components/ui/badge';
import { SessionTimeline } from '@/components/log/session-timeline';
import { getCurrentUser } from '@/lib/auth/current-user';
import { formatDuration, plural } from '@/lib/format';
import { orNotFound } from '@/lib/http/page';
import { cache } from 'react';
import { notFound } from 'next/navigation';
import { loadProjectPage } from '@/lib/server/reading';
import { publicProjectPage } from '@/lib/server/public-reads';
import { OpenFlagCount } from '@/components/flags/flag-words';
import { canOnProject } from '@/lib/auth/policy';
import { FollowButton } from '@/components/following/follow-button';

export const dynamic = 'force-dynamic';


type Props = { params: Promise<{ slug: string }> };

// Once per request: a signed-out reader gets the copy cached for everyone, a signed-in one their own.
const load = cache(async (slug: string) => {
  const user = await getCurrentUser();
  const found = user ? await orNotFound(loadProjectPage(user, slug)) : await publicProjectPage(slug);
  if (!found) notFound();
  return { ...found, user };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const { project } = await load(slug);
  return { title: project.title, robots: project.visibility === 'published' ? undefined : { index: false } };
}

export default async function ProjectPage({ params }: Props) {
  const { slug } = await params;
  const { project, sessions, measurementCount, follow, flagCounts, user } = await load(slug);
  const minutes = sessions.reduce((n, s) => n + s.minutesSpent, 0);
  // Whoever may see private sessions sees them all here, each with a badge saying who else can.
  const seesAll = canOnProject(user, 'view', { ownerId: project.owner.id, visibility: project.visibility, mentorIds: project.mentors.map((m) => m.id), sessionVisibility: 'private' });
  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-2">
          <VisibilityBadge visibility={project.visibility} />
          <span className="text-sm text-graphite-2">Sizes in {project.units === 'mm' ? 'millimetres' : 'inches'}</span>
        </div>
        <h1 className="text-3xl font-bold">{project.title}</h1>
        <p className="text-sm text-graphite-2">
          A build log by{' '}
          <Link href={`/builders/${project.owner.handle}`} className="font-semibold">
            {project.owner.name}
          </Link>
          {project.publishedAt ? <> · published {format(new Date(project.publishedAt), 'd MMM yyyy')}</> : null}
          {project.mentors.length ? <> · mentored by {project.mentors.map((m) => m.name).join(', ')}</> : null}
          {sessions.length ? <> · {plural(sessions.length, 'session')}, {formatDuration(minutes)} at the machines</> : null}
        </p>
        {flagCounts.total ? (
          <p className="flex flex-wrap items-center gap-2 text-sm">
            <OpenFlagCount count={flagCounts.total} />
            <span className="text-graphite-2">raised by a mentor and not yet answered: see the cautions on the entries below.</span>
          </p>
        ) : null}
        <div className="pt-2">
          <FollowButton
            endpoint={`/api/projects/${project.id}/follow`}
            what="this project"
            initial={follow}
            signedIn={!!user}
            canFollow={project.can.follow}
            returnTo={`/logs/${project.slug}`}
          />
        </div>
        {project.can.update || project.can.editLog ? (
          <div className="flex flex-wrap gap-2 pt-2">
            {project.can.editLog ? <ButtonLink href={`/projects/${project.slug}/log`}>Work on the log</ButtonLink> : null}
            {project.can.update ? (
              <ButtonLink href={`/projects/${project.slug}/edit`} tone="quiet">
                Project settings
              </ButtonLink>
            ) : null}
          </div>
        ) : null}
      </header>
      {project.summary ? <p className="max-w-3xl whitespace-pre-line text-lg leading-relaxed">{project.summary}</p> : null}
      {measurementCount ? (
        <p>
          <Link href={`/logs/${project.slug}/measurements`} className="inline-flex min-h-11 items-center gap-2 font-semibold">
            <span aria-hidden="true">⌀</span> All measurements ({measurementCount})
          </Link>
          <span className="ml-2 text-sm text-graphite-2">every critical dimension, judged against its tolerance</span>
        </p>
      ) : null}
      <section aria-labelledby="sessions-heading">
        <h2 id="sessions-heading" className="mb-4 text-xl font-bold">
          Shop sessions
        </h2>
        {sessions.length ? (
          <SessionTimeline projectSlug={project.slug} sessions={sessions} showVisibility={seesAll} openFlags={flagCounts.bySession} />
        ) : (
          <div className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">
            <p>{seesAll ? 'No shop sessions have been logged on this project yet.' : 'No shop sessions have been published on this project yet.'}</p>
            {project.can.editLog ? (
              <p className="mt-2">
                <Link href={`/projects/${project.slug}/log`}>Log your first session</Link> — a day at the machines, with entries for each operation.
              </p>
            ) : null}
          </div>
        )}
      </section>
    </article>
  );
}
