// The 'use cache' handler (next.config.mjs `cacheHandlers.default` when REDIS_URL is set), written against
// Next's documented CacheHandler interface: entries live in Redis for every server, and a tag expired on
// one server is seen by every other on its next request (refreshTags reads the shared tag times first).
import { deserialize, entryKey, expireTagsEverywhere, latestExpiry, redis, serialize, syncTags, tagsExpiredSince, tagsStaleSince, ttlSeconds, warn } from './redis-store.mjs';

const streamOf = (bytes) =>
  new ReadableStream({
    start(controller) {
      controller.enqueue(bytes);
      controller.close();
    },
  });

const useCacheRedis = {
  async get(cacheKey) {
    try {
      const text = await redis((c) => c.get(entryKey('uc', cacheKey)));
      if (!text) return undefined;
      const entry = deserialize(text);
      if (tagsExpiredSince(entry.tags, entry.timestamp)) return undefined;
      const revalidate = tagsStaleSince(entry.tags, entry.timestamp) ? -1 : entry.revalidate;
      return { ...entry, revalidate, value: streamOf(new Uint8Array(entry.value)) };
    } catch (err) {
      // A cache that cannot answer is a miss, never a failed page.
      warn('reading a cached entry failed', err);
      return undefined;
    }
  },

  async set(cacheKey, pendingEntry) {
    try {
      const entry = await pendingEntry;
      // Read the single-use stream once; an interrupted value is not kept.
      const value = Buffer.from(await new Response(entry.value).arrayBuffer());
      const stored = { tags: entry.tags, stale: entry.stale, timestamp: entry.timestamp, expire: entry.expire, revalidate: entry.revalidate, value };
      await redis((c) => c.set(entryKey('uc', cacheKey), serialize(stored), { EX: ttlSeconds(entry.expire) }));
    } catch (err) {
      warn('storing a cached entry failed', err);
    }
  },

  async refreshTags() {
    await syncTags();
  },

  async getExpiration(tags) {
    return latestExpiry(tags);
  },

  async updateTags(tags, durations) {
    try {
      await expireTagsEverywhere(tags, durations);
    } catch (err) {
      warn(`expiring ${tags.join(', ')} failed`, err);
    }
  },
};

export default useCacheRedis;
