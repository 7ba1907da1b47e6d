import 'server-only';
import type { Actor, ProjectFacts } from '../auth/policy';
import { renderEntryBody } from '../rich-text/render';
import { withReadMemo } from './log-scope';
import { getEntry } from './entries';
import { initModels } from '../../db/models';
import { getSession, readSessionPage } from './sessions';
import type { OpenFlagCounts } from '../types/flags';
import { getProjectForViewer } from './projects';
import { listEntryMeasurements } from './measurements';
import { listEntryComments } from './comments';
import { listEntryFlags, openFlagCounts } from './flags';
import { listEntryCalculations } from './calculations';
import { projectFollowStateOf } from './follows';

/**
 * The loaders behind the published log's pages: one access walk per page (remembered across the page's
 * sections, lib/server/log-scope.ts), the sections read in parallel, and the result plain data, so the
 * anonymous reader's copy can be cached as it is (lib/server/public-reads.ts).
 */

export async function loadEntryPage(actor: Actor, entryId: number) {
  return withReadMemo(async () => {
    // A published page can be the first thing this bundle's copy of the models is asked for.
    initModels();
    // The entry's read carries the access walk; the sections then find it remembered.
    const found = await getEntry(actor, entryId);
    const [measurements, comments, flags, calculations] = await Promise.all([
      listEntryMeasurements(actor, entryId),
      // A failure here leaves the page readable; the comments section then loads (and reports) on its own.
      listEntryComments(actor, entryId).catch(() => null),
      listEntryFlags(actor, entryId),
      listEntryCalculations(actor, entryId),
    ]);
    const photos = found.entry.media.filter((m) => m.kind === 'photo');
    // Rendered here, once, so a cached page never renders the body again.
    const html = renderEntryBody(found.entry.body, { allowedImageUrls: photos.map((p) => p.url) });
    return { ...found, html, measurements, comments, flags, calculations };
  });
}
export type EntryPageData = Awaited<ReturnType<typeof loadEntryPage>>;

export async function loadSessionPage(actor: Actor, sessionId: number) {
  return withReadMemo(async () => {
    initModels();
    const found = await getSession(actor, sessionId);
    // The same count the project's timeline shows beside this session.
    const flags = await openFlagCounts(found.scope.projectId, [found.session.id]);
    return { ...found, flags };
  });
}
export type SessionPageData = Awaited<ReturnType<typeof loadSessionPage>>;

export async function loadProjectPage(actor: Actor, slug: string) {
  return withReadMemo(async () => {
    // Authorizes 'view' and gives the facts the lists below need: no separate access walk.
    initModels();
    const project = await getProjectForViewer(actor, { slug });
    const facts: ProjectFacts = { ownerId: project.owner.id, visibility: project.visibility, mentorIds: project.mentors.map((m) => m.id) };
    // The first page of the sessions this viewer is shown (the next ones through GET /api/projects/[id]/sessions?after=),
    // each with its open flags counted, and the totals over every listed session in the same read, so a count
    // never hints at a hidden session.
    const [page, follow] = await Promise.all([readSessionPage(actor, project.id, facts, null, { totals: true }), projectFollowStateOf(actor, project.id)]);
    const totals = page.totals!;
    const flagCounts: OpenFlagCounts = { total: totals.openFlags, bySession: page.openFlags };
    return { project, sessions: page.sessions, nextCursor: page.nextCursor, totals, measurementCount: totals.records, follow, flagCounts };
  });
}
export type ProjectPageData = Awaited<ReturnType<typeof loadProjectPage>>;

/** A row missing or not shown to this reader: the page's 404. */
export function isHidden(err: unknown): boolean {
  const code = err instanceof Error ? (err as { code?: unknown }).code : undefined;
  return code === 'not_found' || code === 'unauthenticated';
}
