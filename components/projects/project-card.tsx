import Link from 'next/link';
import { TimeAgo } from '@/components/ui/time-ago';
import { VisibilityBadge } from '@/components/ui/badge';
import { OpenFlagCount } from '@/components/flags/flag-words';
import type { ProjectView } from '@/lib/types/project';

export function ProjectCard({ project, href, showVisibility = false }: { project: ProjectView; href: string; showVisibility?: boolean }) {
  return (
    <article className="flex flex-col gap-2 rounded-lg border border-rule bg-card p-4 shadow-sm" data-testid="project-card">
      <div className="flex items-start justify-between gap-2">
        <h3 className="text-lg font-bold leading-snug">
          <Link href={href} className="text-graphite no-underline hover:underline">
            {project.title}
          </Link>
        </h3>
        {showVisibility ? <VisibilityBadge visibility={project.visibility} /> : null}
      </div>
      {project.summary ? <p className="line-clamp-3 text-sm text-graphite-2">{project.summary}</p> : null}
      {project.openFlags ? <OpenFlagCount count={project.openFlags} className="self-start" /> : null}
      <p className="mt-auto text-xs text-graphite-2">
        by <Link href={`/builders/${project.owner.handle}`}>{project.owner.name}</Link> · units {project.units === 'mm' ? 'mm' : 'inch'} · updated{' '}
        <TimeAgo iso={project.updatedAt} />
      </p>
    </article>
  );
}
