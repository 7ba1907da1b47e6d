import Link from 'next/link';
import type { CurrentUser } from '@/lib/auth/current-user';
import type { ProjectPageData } from '@/lib/server/reading';
import { ButtonLink } from '@/components/ui/button';
import { VisibilityBadge } from '@/components/ui/badge';
import { SessionTimeline } from '@/components/log/session-timeline';
import { MoreSessions } from '@/components/log/more-sessions';
import { formatDate, formatDuration, plural } from '@/lib/format';
import { OpenFlagCount } from '@/components/flags/flag-words';
import { canOnProject } from '@/lib/auth/policy';
import { FollowButton } from '@/components/following/follow-button';

/** A build log's front page: the same for every reader but for the viewer's own controls. */
export function ProjectView({ data, user }: { data: ProjectPageData; user: CurrentUser | null }) {
  const { project, sessions, nextCursor, totals, measurementCount, follow, flagCounts } = data;
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
          {project.publishedAt ? <> · published {formatDate(project.publishedAt)}</> : null}
          {project.mentors.length ? <> · mentored by {project.mentors.map((m) => m.name).join(', ')}</> : null}
          {totals.sessions ? <> · {plural(totals.sessions, 'session')}, {formatDuration(totals.minutes)} at the machines</> : null}
        </p>
        {flagCounts.total ? (
          <p className="flex flex-wrap items-center gap-2 text-sm">
            <OpenFlagCount count={flagCounts.total} />
            <span className="text-graphite-2">raised by a mentor and not yet answered: see the cautions on the entries below.</span>
          </p>
        ) : null}
        <div className="pt-2">
          <FollowButton
            target={{ projectId: project.id }}
            what="this project"
            initial={follow}
            signedIn={!!user}
            shared={!user}
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
          <>
            <SessionTimeline projectSlug={project.slug} sessions={sessions} showVisibility={seesAll} openFlags={flagCounts.bySession} />
            <MoreSessions projectId={project.id} projectSlug={project.slug} nextCursor={nextCursor} shown={sessions.length} showVisibility={seesAll} />
          </>
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
