import 'server-only';
import { unstable_cache } from 'next/cache';
import { isHidden, loadEntryPage, loadProjectPage, loadSessionPage, type EntryPageData, type ProjectPageData, type SessionPageData } from './reading';
import { HOME_TAG, PUBLIC_TAG } from './cache-tags';
import { listRecentlyPublishedSessions } from './publishing';
import { listPublishedProjects } from './projects';

/**
 * What an anonymous reader sees of the published log, cached once for everyone (Next's data cache,
 * `unstable_cache`), tagged `public` (and `home` for the home lists); every log write expires them after
 * its commit (lib/server/cache-tags.ts, log-scope.ts `expireAfterCommit`). Only the signed-out view is
 * ever cached: nothing here takes a viewer, so nothing private can enter the cache, and a by-link session
 * is cached only under its own address, never in a list. `null` is "not shown to anonymous readers" (the
 * 404 page), cached like the rest (publishing is a write, and expires it).
 */

const DAY = 24 * 60 * 60;

async function orHidden<T>(load: Promise<T>): Promise<T | null> {
  try {
    return await load;
  } catch (err) {
    if (isHidden(err)) return null;
    throw err;
  }
}

export const publicEntryPage = (entryId: number): Promise<EntryPageData | null> =>
  unstable_cache(() => orHidden(loadEntryPage(null, entryId)), ['public-entry-page', String(entryId)], { tags: [PUBLIC_TAG], revalidate: DAY })();

export const publicSessionPage = (sessionId: number): Promise<SessionPageData | null> =>
  unstable_cache(() => orHidden(loadSessionPage(null, sessionId)), ['public-session-page', String(sessionId)], { tags: [PUBLIC_TAG], revalidate: DAY })();

export const publicProjectPage = (slug: string): Promise<ProjectPageData | null> =>
  unstable_cache(() => orHidden(loadProjectPage(null, slug)), ['public-project-page', slug], { tags: [PUBLIC_TAG], revalidate: DAY })();

/** The home page's lists: published projects and the latest published sessions. */
export const publicHomeLists = unstable_cache(
  async () => {
    const [projects, sessions] = await Promise.all([listPublishedProjects(null), listRecentlyPublishedSessions(null, 10)]);
    return { projects, sessions };
  },
  ['public-home-lists'],
  { tags: [PUBLIC_TAG, HOME_TAG], revalidate: DAY },
);
