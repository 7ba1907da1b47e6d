import Link from 'next/link';
import { ProjectCard } from './project-card';
import { ButtonLink } from '@/components/ui/button';
import type { ProjectView } from '@/lib/types/project';

/** The builder's own projects, loaded with the page on the server (no second fetch in the browser). */
export function MyProjects({ projects }: { projects: (ProjectView & { openFlags?: number })[] }) {
  if (!projects.length) {
    return (
      <div className="rounded-lg border border-dashed border-rule p-8 text-center">
        <p className="text-lg font-semibold">No projects yet</p>
        <p className="mt-1 text-graphite-2">Start one for the part on your bench: you can log its sessions, clips and measurements as you go.</p>
        <div className="mt-4 flex justify-center">
          <ButtonLink href="/projects/new">Start a project</ButtonLink>
        </div>
      </div>
    );
  }
  return (
    <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-label="My projects">
      {projects.map((p) => (
        <li key={p.id} className="flex flex-col">
          <ProjectCard project={p} href={`/logs/${p.slug}`} showVisibility />
          <div className="mt-1 flex gap-4 px-1 text-sm">
            <Link href={`/projects/${p.slug}/log`} className="inline-flex min-h-9 items-center font-semibold">
              Work on the log
            </Link>
            <Link href={`/projects/${p.slug}/edit`} className="inline-flex min-h-9 items-center">
              Settings
            </Link>
          </div>
        </li>
      ))}
    </ul>
  );
}
