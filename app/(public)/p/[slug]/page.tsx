import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { format } from 'date-fns';
import { ButtonLink } from '@/components/ui/button';
import { VisibilityBadge } from '@/components/ui/badge';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getProjectForViewer, type ProjectView } from '@/lib/server/projects';
import { AppError } from '@/lib/http/errors';

export const dynamic = 'force-dynamic';

type Props = { params: Promise<{ slug: string }> };

async function load(slug: string): Promise<ProjectView> {
  const user = await getCurrentUser();
  try {
    return await getProjectForViewer(user, { slug });
  } catch (err) {
    if (err instanceof AppError && (err.code === 'not_found' || err.code === 'unauthenticated')) notFound();
    throw err;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  try {
    const project = await getProjectForViewer(await getCurrentUser(), { slug });
    return { title: project.title, robots: project.visibility === 'published' ? undefined : { index: false } };
  } catch {
    return { title: 'Not found' };
  }
}

export default async function ProjectPage({ params }: Props) {
  const { slug } = await params;
  const project = await load(slug);
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-2">
          <VisibilityBadge visibility={project.visibility} />
          <span className="text-sm text-graphite-2">Sizes in {project.units === 'mm' ? 'millimetres' : 'inches'}</span>
        </div>
        <h1 className="text-3xl font-bold">{project.title}</h1>
        <p className="text-sm text-graphite-2">
          A build log by <strong className="text-graphite">{project.owner.name}</strong>
          {project.publishedAt ? <> · published {format(new Date(project.publishedAt), 'd MMM yyyy')}</> : null}
          {project.mentors.length ? <> · mentored by {project.mentors.map((m) => m.name).join(', ')}</> : null}
        </p>
        {project.can.update ? (
          <div className="pt-2">
            <ButtonLink href={`/projects/${project.slug}/edit`} tone="quiet">
              Edit project
            </ButtonLink>
          </div>
        ) : null}
      </header>
      {project.summary ? <p className="max-w-3xl whitespace-pre-line text-lg leading-relaxed">{project.summary}</p> : null}
      <section className="rounded-lg border border-dashed border-rule p-6 text-graphite-2">
        <h2 className="font-semibold text-graphite">Sessions</h2>
        <p className="mt-1 text-sm">No shop sessions have been logged on this project yet.</p>
      </section>
    </article>
  );
}
