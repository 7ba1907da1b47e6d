// The Redis side shared by both cache handlers (see DEVELOPERS.md, "Several servers"): one client per
// process, entries serialized so Buffers and Maps survive, and the tag expiry times every server reads.
// Loaded by Next at run time (next.config.mjs names these files only when REDIS_URL is set), never bundled.
import { createClient } from 'redis';

const PREFIX = process.env.REDIS_KEY_PREFIX || 'scribeline:';
const TAGS_KEY = `${PREFIX}tags`;
const TAGS_VERSION_KEY = `${PREFIX}tags:version`;
/** A Redis call that takes longer than this counts as a miss: a slow cache must never hold a page. */
const CALL_TIMEOUT_MS = Number(process.env.REDIS_TIMEOUT_MS) || 1_000;
/** Entries without an expiry of their own are dropped after a week; Redis's maxmemory LRU bounds the rest. */
export const LONGEST_TTL_S = 7 * 24 * 3600;

const g = globalThis;
g.scribelineRedis ??= { client: null, connecting: null, tags: new Map(), version: null, lastProblem: '' };
const state = g.scribelineRedis;

function say(problem) {
  if (problem === state.lastProblem) return;
  state.lastProblem = problem;
  console.warn(`[cache] ${problem}`);
}

async function client() {
  if (state.client?.isReady) return state.client;
  if (!state.connecting) {
    const c = createClient({
      url: process.env.REDIS_URL,
      // Commands fail at once while disconnected (a miss), instead of queueing behind a dead server.
      disableOfflineQueue: true,
      socket: { connectTimeout: 2_000, reconnectStrategy: (retries) => Math.min(100 * 2 ** retries, 2_000) },
    });
    c.on('error', (err) => say(`Redis: ${err?.message ?? err}`));
    c.on('ready', () => {
      state.lastProblem = '';
    });
    state.client = c;
    state.connecting = c.connect().finally(() => {
      state.connecting = null;
    });
  }
  await state.connecting;
  return state.client;
}

/** Runs one Redis call within CALL_TIMEOUT_MS; rejects otherwise (callers turn that into a miss). */
export async function redis(fn) {
  let timer;
  const timeout = new Promise((_, reject) => {
    timer = setTimeout(() => reject(new Error(`Redis did not answer within ${CALL_TIMEOUT_MS} ms`)), CALL_TIMEOUT_MS);
  });
  try {
    return await Promise.race([client().then(fn), timeout]);
  } finally {
    clearTimeout(timer);
  }
}

export const entryKey = (kind, key) => `${PREFIX}${kind}:${key}`;

export function warn(what, err) {
  say(`${what}: ${err instanceof Error ? err.message : String(err)}`);
}

// ── Serialization: JSON, with Buffers / byte arrays and Maps tagged so they come back as themselves ──

export function serialize(value) {
  return JSON.stringify(value, function replacer(key, v) {
    const raw = this[key];
    if (raw instanceof Uint8Array) return { $bytes: Buffer.from(raw.buffer, raw.byteOffset, raw.byteLength).toString('base64') };
    if (raw instanceof Map) return { $map: [...raw.entries()] };
    return v;
  });
}

export function deserialize(text) {
  return JSON.parse(text, (_key, v) => {
    if (v && typeof v === 'object' && !Array.isArray(v)) {
      if (typeof v.$bytes === 'string') return Buffer.from(v.$bytes, 'base64');
      if (Array.isArray(v.$map)) return new Map(v.$map);
    }
    return v;
  });
}

// ── Tags: { stale, expired } times in ms, one hash in Redis, mirrored here and re-read when its version moves ──

/** Reads the tag times again when another server changed them (one GET when nothing changed). */
export async function syncTags() {
  try {
    const version = await redis((c) => c.get(TAGS_VERSION_KEY));
    if (version === state.version) return;
    const all = await redis((c) => c.hGetAll(TAGS_KEY));
    const next = new Map();
    for (const [tag, json] of Object.entries(all)) {
      try {
        next.set(tag, JSON.parse(json));
      } catch {
        // A field someone else wrote: ignore it.
      }
    }
    state.tags = next;
    state.version = version;
  } catch (err) {
    // Serve with the tag times last known; the next request tries again.
    warn('reading tag expiry times failed', err);
  }
}

/**
 * Records that the tags expired now (or go stale now and expire after durations.expire seconds) for every
 * server: the hash and its version are written in one MULTI.
 */
export async function expireTagsEverywhere(tags, durations) {
  const now = Date.now();
  const fields = {};
  for (const tag of tags) {
    const times = { ...(state.tags.get(tag) ?? {}) };
    times.stale = now;
    // No durations: expired at once. With them: stale now, expired after durations.expire seconds (0 = now).
    if (!durations) times.expired = now;
    else if (durations.expire !== undefined) times.expired = now + Math.max(0, durations.expire) * 1000;
    state.tags.set(tag, times);
    fields[tag] = JSON.stringify(times);
  }
  if (!tags.length) return;
  await redis((c) => c.multi().hSet(TAGS_KEY, fields).incr(TAGS_VERSION_KEY).exec());
}

/** Whether an entry written at `timestamp` (ms) carrying any of `tags` has expired. */
export function tagsExpiredSince(tags, timestamp) {
  const now = Date.now();
  for (const tag of tags) {
    const expired = state.tags.get(tag)?.expired;
    if (typeof expired === 'number' && expired > timestamp && expired <= now) return true;
  }
  return false;
}

/** Whether any of `tags` went stale after `timestamp` (served while a fresh copy is made). */
export function tagsStaleSince(tags, timestamp) {
  for (const tag of tags) {
    const stale = state.tags.get(tag)?.stale;
    if (typeof stale === 'number' && stale > timestamp) return true;
  }
  return false;
}

/** The latest expiry among `tags` that has already come (0 when none). */
export function latestExpiry(tags) {
  const now = Date.now();
  let latest = 0;
  for (const tag of tags) {
    const expired = state.tags.get(tag)?.expired;
    if (typeof expired === 'number' && expired <= now && expired > latest) latest = expired;
  }
  return latest;
}

/** Seconds for Redis's EX from an expiry in seconds (Infinity or nonsense → the longest we keep). */
export function ttlSeconds(expireSeconds) {
  return Number.isFinite(expireSeconds) && expireSeconds > 0 ? Math.min(Math.ceil(expireSeconds), LONGEST_TTL_S) : LONGEST_TTL_S;
}
