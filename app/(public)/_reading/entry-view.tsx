import Link from 'next/link';
import type { CurrentUser } from '@/lib/auth/current-user';
import { canOnProject } from '@/lib/auth/policy';
import { OPERATIONS } from '@/lib/validations/log';
import { formatDay } from '@/lib/format';
import type { EntryPageData } from '@/lib/server/reading';
import { EntryBody } from '@/components/editor/entry-body';
import { PhotoGallery } from '@/components/media/photo-gallery';
import { EntryClipStage } from '@/components/clips/entry-clip-stage';
import { ClipsOnPaper } from '@/components/clips/clips-on-paper';
import { ButtonLink } from '@/components/ui/button';
import { EntryMeasurementsTable } from '@/components/measurements/entry-measurements';
import { EntryDiscussion } from '@/components/comments/entry-discussion';
import { CommentsSection } from '@/components/comments/comments-section';
import { EntryFlags } from '@/components/flags/entry-flags';
import { flagMarkers, flagTargetsOf } from '@/components/flags/flag-markers';
import { OperationCautions } from '@/components/safety/operation-cautions';
import { EntryCalculations } from '@/components/calculators/entry-calculations';

/**
 * One entry of a build log: its clip and notes, body, measurements, calculations, photos and discussion.
 * `clipId` picks the clip shown first (the signed-out copy has none: the page reads `?clip` in the browser).
 */
export function EntryView({ data, user, clipId }: { data: EntryPageData; user: CurrentUser | null; clipId?: string }) {
  const { entry, scope, session, html, measurements, comments, flags, calculations } = data;
  const slug = scope.projectSlug;
  const canEdit = canOnProject(user, 'editLog', scope.facts);
  const photos = entry.media.filter((m) => m.kind === 'photo');
  const clips = entry.media.filter((m) => m.kind === 'clip');
  const clip = clips.find((c) => String(c.id) === clipId) ?? clips[0];
  const operation = OPERATIONS.find((o) => o.value === entry.operation)?.label ?? entry.operation;
  const canFlag = canOnProject(user, 'flagRisk', scope.facts);

  return (
    <EntryDiscussion entryId={entry.id} initial={comments} shared={!user}>
    <article className="space-y-6">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link href={`/logs/${slug}`}>{scope.projectTitle}</Link> <span aria-hidden="true">›</span>{' '}
        <Link href={`/logs/${slug}/sessions/${session.id}`}>
          Session {session.position + 1}: {session.title}
        </Link>
      </nav>
      <header className="space-y-2">
        <p className="text-sm font-semibold uppercase tracking-wide text-graphite-2">
          <span className="rounded bg-dye-soft px-2 py-0.5 text-dye">{operation}</span> · <time dateTime={session.heldOn}>{formatDay(session.heldOn)}</time>
        </p>
        <h1 className="text-3xl font-bold">{entry.title}</h1>
        <OperationCautions operation={entry.operation} />
        {canEdit ? (
          <ButtonLink href={`/projects/${slug}/entries/${entry.id}/edit`} tone="quiet">
            Edit entry
          </ButtonLink>
        ) : null}
      </header>

      <EntryFlags entryId={entry.id} initialFlags={flags} mode="reader" canFlag={canFlag} targets={flagTargetsOf(entry, measurements)} />

      {clip ? (
        <section aria-label="Clip and its notes" className="space-y-3 print:hidden">
          <EntryClipStage clips={clips} notes={entry.notes} initialClipId={clip.id} entryPath={`/logs/${slug}/entries/${entry.id}`} canEdit={canEdit} noteMarkers={flagMarkers(flags, 'note')} />
        </section>
      ) : null}
      <ClipsOnPaper clips={clips} notes={entry.notes} />

      <EntryBody html={html} />

      {measurements.length ? (
        <section aria-labelledby="measurements-heading" className="space-y-3">
          <h2 id="measurements-heading" className="text-xl font-bold">
            Measurements
          </h2>
          <EntryMeasurementsTable records={measurements} unit={scope.units} slug={slug} markers={flagMarkers(flags, 'measurement')} />
        </section>
      ) : null}

      {calculations.calculations.length ? (
        <section aria-labelledby="calculations-heading" className="space-y-3">
          <h2 id="calculations-heading" className="text-xl font-bold">
            Calculations
          </h2>
          <EntryCalculations initial={calculations.calculations} tablesVersion={calculations.tablesVersion} />
        </section>
      ) : null}

      {photos.length ? (
        <section aria-labelledby="photos-heading">
          <h2 id="photos-heading" className="mb-3 text-xl font-bold">
            Photos
          </h2>
          <PhotoGallery photos={photos} />
        </section>
      ) : null}

      <CommentsSection entryPath={`/logs/${slug}/entries/${entry.id}`} hasClip={!!clip} isBuilder={canEdit} />
    </article>
    </EntryDiscussion>
  );
}
