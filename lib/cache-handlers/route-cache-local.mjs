// The page and route cache handler of a single server (next.config.mjs `cacheHandler` when REDIS_URL is not set):
// Next's own file-system cache (pages in memory, and on disk under the build folder), which hands each cached page
// back with its HTML as bytes (page-bytes.mjs). Everything else — where entries live, tag expiry, the memory limit
// (cacheMaxMemorySize) — is Next's own.
import fileSystemCache from 'next/dist/server/lib/incremental-cache/file-system-cache.js';
import { withPageBytes } from './page-bytes.mjs';

const FileSystemCache = fileSystemCache.default ?? fileSystemCache;

export default class RouteCacheLocal extends FileSystemCache {
  async get(...args) {
    return withPageBytes(await super.get(...args));
  }
}
