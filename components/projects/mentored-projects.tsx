import Link from 'next/link';
import { ProjectCard } from './project-card';
import type { ProjectView } from '@/lib/types/project';

/** Projects the signed-in member mentors, private ones included: where they read the log and raise flags. */
export function MentoredProjects({ projects }: { projects: (ProjectView & { openFlags?: number })[] }) {
  if (!projects.length) return null;
  return (
    <section aria-labelledby="mentored-heading" className="space-y-3">
      <h2 id="mentored-heading" className="text-xl font-bold">
        Projects you mentor
      </h2>
      <p className="text-sm text-graphite-2">Read each log as its builder writes it, and flag whatever could hurt someone or spoil the part.</p>
      <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" aria-label="Projects you mentor">
        {projects.map((p) => (
          <li key={p.id} className="flex flex-col">
            <ProjectCard project={p} href={`/logs/${p.slug}`} showVisibility />
            <div className="mt-1 flex gap-4 px-1 text-sm">
              <Link href={`/logs/${p.slug}`} className="inline-flex min-h-9 items-center font-semibold">
                Read the log
              </Link>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}
