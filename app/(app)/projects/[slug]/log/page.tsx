import type { Metadata } from 'next';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getProjectForViewer } from '@/lib/server/projects';
import { listSessions } from '@/lib/server/sessions';
import { countPublishAudience } from '@/lib/server/publishing';
import { orNotFound } from '@/lib/http/page';
import { notFound } from 'next/navigation';
import { AppError } from '@/lib/errors';
import { LogWorkspace } from '@/components/log/log-workspace';
import { Notice } from '@/components/ui/notice';
import { plural } from '@/lib/format';
import { listOpenProjectFlags } from '@/lib/server/flags';
import { OpenFlagsSummary } from '@/components/flags/open-flags-summary';

export const metadata: Metadata = { title: 'Build log' };

export default async function LogPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ created?: string; imported?: string; after?: string }> }) {
  const { slug } = await params;
  const { created, imported, after } = await searchParams;
  const user = await getCurrentUser();
  const project = await orNotFound(getProjectForViewer(user, { slug }));
  if (!project.can.editLog) {
    return (
      <Notice kind="error" title="Not yours to change">
        Only the builder can work on this log. <Link href={`/logs/${slug}`}>Read it instead</Link>.
      </Notice>
    );
  }
  // One page of the log at a time (keyset on position): a page address that cannot be read is the 404 page.
  const page = await listSessions(user, project.id, after ?? null).catch((err: unknown) => {
    if (err instanceof AppError && err.code === 'validation') notFound();
    throw err;
  });
  const sessions = page.sessions;
  const openFlags = await listOpenProjectFlags(user, project.id, sessions.map((x) => x.id));
  const mailAudience = await countPublishAudience(user, project.id);
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href="/projects">My projects</Link> <span aria-hidden="true">›</span> <Link href={`/logs/${slug}`}>{project.title}</Link>
      </nav>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h1 className="text-2xl font-bold">Build log</h1>
        {project.can.update ? (
          <p className="text-sm print:hidden">
            <Link href={`/projects/${slug}/edit`}>Settings</Link> <span aria-hidden="true">·</span> <Link href={`/projects/${slug}/edit#archive`}>Download an archive</Link>
          </p>
        ) : null}
      </div>
      {imported ? (
        <Notice kind="success" role="status" title="Archive brought in">
          “{project.title}” is back with {plural(page.total, 'session')}, on the bench: only you and its mentors see it until you publish
          its sessions. Comments, flags, follows and mentors stay with the original.
        </Notice>
      ) : null}
      {created && !page.total ? (
        <Notice kind="success" role="status" title="Project created">
          “{project.title}” is ready. Add its first shop session below; its settings, mentors and who can see it are on{' '}
          <Link href={`/projects/${slug}/edit`}>the project’s settings</Link>.
        </Notice>
      ) : null}
      <OpenFlagsSummary flags={openFlags} hrefFor={(f) => `/projects/${slug}/entries/${f.entryId}/edit#flag-${f.id}`} />
      <LogWorkspace project={{ id: project.id, slug: project.slug, title: project.title, visibility: project.visibility, mailAudience }} initialSessions={sessions}
        paging={{
          total: page.total,
          nextHref: page.nextCursor ? `/projects/${slug}/log?after=${encodeURIComponent(page.nextCursor)}` : null,
          firstHref: after ? `/projects/${slug}/log` : null,
        }}
      />
    </div>
  );
}
