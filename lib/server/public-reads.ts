import 'server-only';
import { cacheLife, cacheTag } from 'next/cache';
import { isHidden, loadEntryPage, loadProjectPage, loadSessionPage, type EntryPageData, type ProjectPageData, type SessionPageData } from './reading';
import { builderTag, HOME_TAG, NOT_SHOWN_TAG, projectTag, PUBLIC_TAG } from './cache-tags';
import { listRecentlyPublishedSessions } from './publishing';
import { listPublishedProjects } from './projects';
import { getBuilderProfile } from './profiles';
import type { BuilderProfile } from '../types/following';
import type { LogScope } from './log-scope';

/**
 * What an anonymous reader sees of the published log, cached once for everyone (`'use cache'`, Next's
 * Cache Components), so a signed-out hit asks the database nothing. Each copy is tagged with its project
 * and builder (and `public`); every log write expires its project's and builder's tags after its commit
 * (lib/server/log-scope.ts `expireAfterCommit`), and the home lists' and the not-shown copies' tags.
 * Only the signed-out view is ever cached: nothing here takes a viewer, so nothing private can enter
 * the cache; a by-link session is cached only under its own address, never in a list. `null` is "not
 * shown to anonymous readers" (the 404 page), cached under `not-shown`, which every log write expires.
 */

async function orHidden<T>(load: Promise<T>): Promise<T | null> {
  try {
    return await load;
  } catch (err) {
    if (isHidden(err)) return null;
    throw err;
  }
}

/** Tags a cached copy with whose it is (its project, if any, and its builder), or as a cached 404. */
function tagCopy(of: { projectId?: number; ownerId: number } | null): void {
  if (!of) cacheTag(PUBLIC_TAG, NOT_SHOWN_TAG);
  else cacheTag(PUBLIC_TAG, builderTag(of.ownerId), ...(of.projectId === undefined ? [] : [projectTag(of.projectId)]));
}

const scopeOf = (found: { scope: LogScope } | null) => found && { projectId: found.scope.projectId, ownerId: found.scope.facts.ownerId };

export async function publicEntryPage(entryId: number): Promise<EntryPageData | null> {
  'use cache';
  cacheLife('days');
  const found = await orHidden(loadEntryPage(null, entryId));
  tagCopy(scopeOf(found));
  return found;
}

export async function publicSessionPage(sessionId: number): Promise<SessionPageData | null> {
  'use cache';
  cacheLife('days');
  const found = await orHidden(loadSessionPage(null, sessionId));
  tagCopy(scopeOf(found));
  return found;
}

export async function publicProjectPage(slug: string): Promise<ProjectPageData | null> {
  'use cache';
  cacheLife('days');
  const found = await orHidden(loadProjectPage(null, slug));
  tagCopy(found && { projectId: found.project.id, ownerId: found.project.owner.id });
  return found;
}

/** The home page's lists: published projects and the latest published sessions. */
export async function publicHomeLists() {
  'use cache';
  cacheLife('days');
  cacheTag(PUBLIC_TAG, HOME_TAG);
  const [projects, sessions] = await Promise.all([listPublishedProjects(null), listRecentlyPublishedSessions(null, 10)]);
  return { projects, sessions };
}

/** A builder's profile, first page, as an anonymous reader sees it. */
export async function publicBuilderProfile(handle: string): Promise<BuilderProfile | null> {
  'use cache';
  cacheLife('days');
  const found = await orHidden(getBuilderProfile(null, handle));
  tagCopy(found && { ownerId: found.id });
  return found;
}
