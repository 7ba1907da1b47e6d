import type { Metadata } from 'next';
import { cache } from 'react';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getMeasurement } from '@/lib/server/measurements';
import { getEntry } from '@/lib/server/entries';
import { KindBadge } from '@/components/measurements/badges';
import { VerdictPanel, LimitsCard } from '@/components/measurements/record-summary';
import { RecordZonePicture } from '@/components/measurements/zone-picture';
import { ReadingsTable } from '@/components/measurements/readings-table';
import { ApproachPanel } from '@/components/measurements/approach-panel';
import { PairList } from '@/components/measurements/pair-list';
import { RecordActions } from '@/components/measurements/record-actions';
import { UnitToggle } from '@/components/measurements/unit-toggle';
import { displayUnit, otherUnitHref } from '@/components/measurements/units';
import { momentOptions } from '@/components/measurements/moments';
import { idOrNotFound, orNotFound } from '@/lib/http/page';

// Rendered for each request (it reads the viewer's session); see DEVELOPERS.md "Reading a page".
export const instant = false;


type Query = Record<string, string | string[] | undefined>;
type Props = { params: Promise<{ slug: string; recordId: string }>; searchParams: Promise<Query> };

// Through React cache(): generateMetadata and the page share one load.
const load = cache(async (slug: string, recordId: string) => {
  const found = await orNotFound(getMeasurement(await getCurrentUser(), idOrNotFound(recordId)));
  if (found.record.project.slug !== slug) notFound();
  return found;
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, recordId } = await params;
  const { record } = await load(slug, recordId);
  return { title: `${record.feature} · ${record.project.title}` };
}

export default async function MeasurementPage({ params, searchParams }: Props) {
  const [{ slug, recordId }, query] = await Promise.all([params, searchParams]);
  const { record, pairs, candidates, canEdit } = await load(slug, recordId);
  const user = await getCurrentUser();
  const unit = displayUnit(query.unit, record.project.units);
  const moments = canEdit ? await getEntry(user, record.entry.id).then(({ entry }) => momentOptions(entry.notes, entry.media)) : [];
  const showApproach = record.readings.length > 0 && (record.byPasses || record.approach?.state === 'stock-left');

  return (
    <article className="space-y-8">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={`/logs/${slug}`}>{record.project.title}</Link> <span aria-hidden="true">›</span>{' '}
        <Link href={`/logs/${slug}/entries/${record.entry.id}`}>
          Session {record.entry.sessionPosition + 1}: {record.entry.title}
        </Link>{' '}
        <span aria-hidden="true">›</span> <Link href={`/logs/${slug}/measurements`}>All measurements</Link>
      </nav>

      <header className="flex flex-wrap items-end justify-between gap-4">
        <div className="space-y-1">
          <p className="text-sm font-semibold uppercase tracking-wide text-graphite-2">Measurement</p>
          <h1 className="text-3xl font-bold">{record.feature}</h1>
          <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <span className="dim text-lg">
              {record.nominalText} {record.unit} {record.limits.label}
            </span>
            <KindBadge kind={record.kind} long />
          </p>
        </div>
        <UnitToggle unit={unit} href={otherUnitHref(`/logs/${slug}/records/${record.id}`, query, unit)} />
      </header>

      {canEdit ? <RecordActions record={record} moments={moments} builderName={user?.name ?? ''} /> : null}

      <VerdictPanel record={record} unit={unit} />

      <div className="grid gap-6 lg:grid-cols-2">
        <LimitsCard record={record} unit={unit} />
        <RecordZonePicture record={record} unit={unit} />
      </div>

      <ReadingsTable record={record} unit={unit} canEdit={canEdit} builderName={user?.name ?? ''} />

      {showApproach ? <ApproachPanel record={record} unit={unit} /> : null}

      <PairList
        recordId={record.id}
        recordKind={record.kind}
        nominalLabel={`${record.nominalText} ${record.unit}`}
        pairs={pairs}
        candidates={candidates}
        canEdit={canEdit}
        slug={slug}
        unit={unit}
      />
    </article>
  );
}
