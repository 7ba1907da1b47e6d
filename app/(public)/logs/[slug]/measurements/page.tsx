import type { Metadata } from 'next';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getProjectForViewer } from '@/lib/server/projects';
import { listProjectMeasurements } from '@/lib/server/measurements';
import { ProjectRecordsTable } from '@/components/measurements/project-records-table';
import { UnitToggle } from '@/components/measurements/unit-toggle';
import { displayUnit, otherUnitHref } from '@/components/measurements/units';
import { orNotFound } from '@/lib/http/page';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;


type Query = Record<string, string | string[] | undefined>;
type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Query> };

async function load(slug: string) {
  const user = await getCurrentUser();
  return orNotFound(getProjectForViewer(user, { slug }).then((project) => listProjectMeasurements(user, project.id)));
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const data = await load(slug);
  return { title: `Measurements · ${data.project.title}` };
}

export default async function ProjectMeasurementsPage({ params, searchParams }: Props) {
  const [{ slug }, query] = await Promise.all([params, searchParams]);
  const data = await load(slug);
  const unit = displayUnit(query.unit, data.project.units);
  return (
    <article className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={`/logs/${slug}`}>{data.project.title}</Link> <span aria-hidden="true">›</span> Measurements
      </nav>
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div className="space-y-1">
          <h1 className="text-3xl font-bold">Measurements</h1>
          <p className="max-w-3xl text-graphite-2">
            Every critical dimension of the build, judged against its specification: ISO 286 zones, drawing limits and ISO 2768-1 general tolerances.
          </p>
        </div>
        <UnitToggle unit={unit} href={otherUnitHref(`/logs/${slug}/measurements`, query, unit)} />
      </header>
      <ProjectRecordsTable initial={data} unit={unit} />
    </article>
  );
}
