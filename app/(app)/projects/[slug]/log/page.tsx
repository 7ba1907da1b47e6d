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
import { listOpenProjectFlags } from '@/lib/server/flags';
import { OpenFlagsSummary } from '@/components/flags/open-flags-summary';

export const metadata: Metadata = { title: 'Build log' };

export default async function LogPage({ params, searchParams }: { params: Promise<{ slug: string }>; searchParams: Promise<{ created?: string; after?: string }> }) {
  const { slug } = await params;
  const { created, after } = await searchParams;
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
      <h1 className="text-2xl font-bold">Build log</h1>
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
