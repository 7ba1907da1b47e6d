import 'server-only';
import { revalidateTag } from 'next/cache';

/**
 * Names of the cache tags on published content (see DEVELOPERS.md, "Reading a page"). Everything an
 * anonymous reader sees of a project (its timeline, sessions, entries, records, measurements, comments,
 * flags) carries `projectTag` and its builder's `builderTag`; the home page's lists `HOME_TAG`; a cached
 * 404 `NOT_SHOWN_TAG`; and all of it `PUBLIC_TAG`, for the rare change that touches everything (a member
 * renamed or deleted).
 */
export const PUBLIC_TAG = 'public';
export const HOME_TAG = 'home';
/** The cached "not shown to anonymous readers" answers (the 404s), expired by every log write (a publish may show them). */
export const NOT_SHOWN_TAG = 'not-shown';
export const projectTag = (projectId: number) => `project:${projectId}`;
export const builderTag = (userId: number) => `builder:${userId}`;

/**
 * Expires the tags at once: the next request renders afresh (never stale content after unpublishing or
 * hiding). Outside Next (scripts, Vitest) there is no cache to expire and nothing is done.
 */
export function expireTags(...tags: string[]): void {
  for (const tag of new Set(tags)) {
    try {
      revalidateTag(tag, { expire: 0 });
    } catch (err) {
      if (err instanceof Error && err.message.startsWith('Invariant: static generation store missing')) return;
      throw err;
    }
  }
}
