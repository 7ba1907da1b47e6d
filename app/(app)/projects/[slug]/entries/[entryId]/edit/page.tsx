import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getCurrentUser } from '@/lib/auth/current-user';
import { getEntry } from '@/lib/server/entries';
import { idOrNotFound, orNotFound } from '@/lib/http/page';
import { canOnProject } from '@/lib/auth/policy';
import { EntryEditor } from '@/components/editor/entry-editor';
import { EntryMediaManager } from '@/components/media/entry-media-manager';
import { EntryClipSections } from '@/components/clips/entry-clip-sections';
import { Notice } from '@/components/ui/notice';
import { ButtonLink } from '@/components/ui/button';
import { listEntryMeasurements } from '@/lib/server/measurements';
import { EntryMeasurementsTable } from '@/components/measurements/entry-measurements';
import { AddMeasurement } from '@/components/measurements/add-measurement';
import { momentOptions } from '@/components/measurements/moments';
import { listEntryFlags } from '@/lib/server/flags';
import { EntryFlags } from '@/components/flags/entry-flags';
import { flagMarkers, flagTargetsOf } from '@/components/flags/flag-markers';
import { OperationCautions } from '@/components/safety/operation-cautions';
import { listEntryComments } from '@/lib/server/comments';
import { pinnedQuestions } from '@/lib/comments/pinned';
import { listEntryCalculations } from '@/lib/server/calculations';
import { EntryCalculations } from '@/components/calculators/entry-calculations';

export const metadata: Metadata = { title: 'Edit entry' };

type Props = { params: Promise<{ slug: string; entryId: string }> };

export default async function EditEntryPage({ params }: Props) {
  const { slug, entryId } = await params;
  const user = await getCurrentUser();
  const found = await orNotFound(getEntry(user, idOrNotFound(entryId)));
  const { entry, scope, session } = found;
  if (scope.projectSlug !== slug) notFound();
  if (!canOnProject(user, 'editLog', scope.facts)) {
    return (
      <Notice kind="error" title="Not yours to change">
        Only the builder can edit this entry. <Link href={`/logs/${slug}/entries/${entry.id}`}>Read it instead</Link>.
      </Notice>
    );
  }
  const photos = entry.media.filter((m) => m.kind === 'photo');
  const measurements = await listEntryMeasurements(user, entry.id);
  const flags = await listEntryFlags(user, entry.id);
  // Readers' questions pinned to moments show among the builder's notes, answered on the reader's page.
  const questions = pinnedQuestions((await listEntryComments(user, entry.id)).comments);
  const calculations = await listEntryCalculations(user, entry.id);
  return (
    <div className="space-y-8">
      <nav aria-label="Breadcrumb" className="flex flex-wrap items-center justify-between gap-2 text-sm">
        <span>
          <Link href={`/projects/${slug}/log`}>{scope.projectTitle} — log</Link> <span aria-hidden="true">›</span> Session {session.position + 1}: {session.title}
        </span>
        <ButtonLink href={`/logs/${slug}/entries/${entry.id}`} tone="quiet">
          View as a reader
        </ButtonLink>
      </nav>
      {flags.length ? <EntryFlags entryId={entry.id} initialFlags={flags} mode="builder" canFlag={false} targets={flagTargetsOf(entry, measurements)} /> : null}
      <OperationCautions operation={entry.operation} />
      <EntryEditor entry={{ id: entry.id, title: entry.title, operation: entry.operation, body: entry.body, version: entry.version }} photos={photos} />
      <section aria-labelledby="media-heading" className="space-y-3">
        <h2 id="media-heading" className="text-xl font-bold">
          Photos and clips
        </h2>
        <EntryMediaManager entryId={entry.id} initialMedia={entry.media} />
      </section>
      {/* Clips and their notes right under the uploads: a new clip shows here, playable, as soon as it is accepted. */}
      <EntryClipSections
        entryId={entry.id}
        initialMedia={entry.media}
        notes={entry.notes}
        noteMarkers={flagMarkers(flags, 'note')}
        readerQuestions={questions}
        questionThreadBase={`/logs/${slug}/entries/${entry.id}`}
      />
      <section aria-labelledby="measurements-heading" className="space-y-3">
        <h2 id="measurements-heading" className="text-xl font-bold">
          Measurements
        </h2>
        {measurements.length ? (
          <EntryMeasurementsTable records={measurements} unit={scope.units} slug={slug} markers={flagMarkers(flags, 'measurement')} />
        ) : (
          <p className="text-sm text-graphite-2">No measurements on this entry yet: add each critical dimension with its readings, and Scribeline judges it.</p>
        )}
        <AddMeasurement entryId={entry.id} projectUnits={scope.units} builderName={user?.name ?? ''} moments={momentOptions(entry.notes, entry.media)} />
      </section>
      <section aria-labelledby="calculations-heading" className="space-y-3">
        <h2 id="calculations-heading" className="text-xl font-bold">
          Calculations
        </h2>
        {calculations.calculations.length ? (
          <EntryCalculations initial={calculations.calculations} tablesVersion={calculations.tablesVersion} canRemove />
        ) : (
          <p className="text-sm text-graphite-2">
            No saved calculations yet: work one out in the <Link href="/calculators">calculators</Link> and save it into this entry.
          </p>
        )}
      </section>
    </div>
  );
}
