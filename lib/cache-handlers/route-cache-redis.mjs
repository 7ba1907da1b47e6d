// The page and route cache handler (next.config.mjs `cacheHandler` when REDIS_URL is set): whole pages and
// data-cache entries in Redis for every server instead of each server's memory and disk. Next keeps tag
// expiry for this cache in the process, so get() checks the entry's tags against the shared tag times and
// answers a miss when one expired after the entry was written. A page's HTML is stored as bytes, so a read hands
// Next a Buffer and the page is not encoded again for every answer (page-bytes.mjs).
import { pageValueAsBytes } from './page-bytes.mjs';
import { deserialize, entryKey, expireTagsEverywhere, redis, serialize, syncTags, tagsExpiredSince, tagsStaleSince, ttlSeconds, warn } from './redis-store.mjs';

const TAGS_HEADER = 'x-next-cache-tags';

/** The tags an entry carries: pages and route answers in their tags header, data entries in the context. */
function tagsOf(value, ctx, storedTags) {
  const tags = new Set(storedTags ?? []);
  const header = value?.headers?.[TAGS_HEADER];
  if (typeof header === 'string') for (const t of header.split(',')) if (t) tags.add(t);
  for (const t of ctx?.tags ?? []) tags.add(t);
  for (const t of ctx?.softTags ?? []) tags.add(t);
  return [...tags];
}

export default class RouteCacheRedis {
  constructor(_options) {}

  async get(cacheKey, ctx) {
    try {
      const text = await redis((c) => c.get(entryKey('rc', cacheKey)));
      if (!text) return null;
      const stored = deserialize(text);
      await syncTags();
      const tags = tagsOf(stored.value, ctx, stored.tags);
      // Expired or stale on any server: read afresh (the writes here expire at once, never "stale for a while").
      if (tagsExpiredSince(tags, stored.lastModified) || tagsStaleSince(tags, stored.lastModified)) return null;
      return { value: stored.value, lastModified: stored.lastModified, ...(stored.cacheControl ? { cacheControl: stored.cacheControl } : {}) };
    } catch (err) {
      warn('reading a cached page failed', err);
      return null;
    }
  }

  async set(cacheKey, data, ctx) {
    try {
      const key = entryKey('rc', cacheKey);
      if (!data) {
        await redis((c) => c.del(key));
        return;
      }
      const cacheControl = ctx?.cacheControl;
      const stored = { value: pageValueAsBytes(data), lastModified: Date.now(), tags: tagsOf(data, ctx), cacheControl };
      const seconds = cacheControl?.expire ?? (typeof data.revalidate === 'number' ? data.revalidate : undefined);
      await redis((c) => c.set(key, serialize(stored), { EX: ttlSeconds(seconds) }));
    } catch (err) {
      warn('storing a cached page failed', err);
    }
  }

  async revalidateTag(tags, durations) {
    try {
      await expireTagsEverywhere(Array.isArray(tags) ? tags : [tags], durations);
    } catch (err) {
      warn('expiring tags failed', err);
    }
  }

  resetRequestCache() {}
}
