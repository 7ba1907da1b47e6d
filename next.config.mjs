import { fileURLToPath } from 'node:url';
import { securityHeaders } from './lib/http/security-headers.mjs';
import { toolAddressRewrites } from './lib/http/tool-addresses.mjs';

// Several servers (DEVELOPERS.md, "Several servers"): with REDIS_URL, the 'use cache' entries and the page cache live
// in Redis for every server (tags expired on one are seen by all), and nothing is cached in one server's memory or disk.
// One server: Next's own file-system cache, handing cached pages back as bytes (lib/cache-handlers/page-bytes.mjs).
const handler = (file) => fileURLToPath(new URL(`./lib/cache-handlers/${file}`, import.meta.url));
const sharedCache = process.env.REDIS_URL
  ? {
      cacheHandler: handler('route-cache-redis.mjs'),
      cacheHandlers: { default: handler('use-cache-redis.mjs'), remote: handler('use-cache-redis.mjs') },
      cacheMaxMemorySize: 0,
    }
  : { cacheHandler: handler('route-cache-local.mjs') };

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads optional drivers with dynamic requires, and the archive's zip packages read their own files:
  // keep them out of the bundle.
  serverExternalPackages: ['sequelize', 'mariadb', 'archiver', 'yauzl'],
  ...sharedCache,
  poweredByHeader: false,
  // No ETag on pages: Next computes it by hashing the whole body on every answer, which was about a quarter
  // of what a cached read of the heavy entry (350 KB) cost the server (a CPU profile under load). A page's
  // answer carries no max-age, so a browser reads it afresh anyway; the build's files keep their own caching.
  generateEtags: false,
  cacheComponents: true,
  typedRoutes: false,
  // The browser tests build into their own folder so they never clobber a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Published logs and profiles moved to self-explaining paths; old links keep working (the query, such as
  // an old ?t= moment, goes along and the entry page turns it into #t=).
  async redirects() {
    return [
      { source: '/p/:slug/s/:id', destination: '/logs/:slug/sessions/:id', permanent: true },
      { source: '/p/:slug/e/:id', destination: '/logs/:slug/entries/:id', permanent: true },
      { source: '/p/:slug/m/:id', destination: '/logs/:slug/records/:id', permanent: true },
      { source: '/p/:slug/measurements', destination: '/logs/:slug/measurements', permanent: true },
      { source: '/p/:slug', destination: '/logs/:slug', permanent: true },
      { source: '/b/:handle', destination: '/builders/:handle', permanent: true },
    ];
  },
  // A signed-out reader (no next-auth session cookie, in any of its names) of the home page, a published log's
  // page, project or builder, and a signed-in member whose scribeline-copy cookie says the shared copy suits them (outside
  // every project's circle: lib/server/viewer.ts), get the copy built once for everyone under app/(open)/open,
  // where a missing or private page is decided before anything is sent (a real 404) and a repeated read is
  // the stored page; a member's own corner and controls are filled in by their browser. Everyone else (the
  // builder, mentors, admins), and a profile asked for a later page of projects (?after=), gets the copy
  // rendered for them. The cookie picks a copy, never a permission: the shared copy holds only what everyone
  // may see. An old ?t= moment link is sent on to #t= by proxy.ts first. The tools (/fits, each calculator) are
  // prerendered whole with empty boxes; an address holding boxes, marked by proxy.ts, goes to the page's
  // from-address twin (lib/http/tool-addresses.mjs: two rules, not one per query key, since Next reads every
  // rewrite again for each page it serves). DEVELOPERS.md, "Reading a page".
  async rewrites() {
    // The names proxy.ts's SESSION_COOKIE matches (chunked cookies always have a .0).
    const signedOut = ['next-auth.session-token', 'next-auth.session-token.0', '__Secure-next-auth.session-token', '__Secure-next-auth.session-token.0'].map((key) => ({ type: 'cookie', key }));
    const sharedCopy = [{ type: 'cookie', key: 'scribeline-copy', value: 'shared' }];
    const pages = [
      { source: '/', destination: '/open/home/all' },
      { source: '/logs/:slug', destination: '/open/logs/:slug' },
      { source: '/logs/:slug/sessions/:id', destination: '/open/logs/:slug/sessions/:id' },
      { source: '/logs/:slug/entries/:id', destination: '/open/logs/:slug/entries/:id' },
      { source: '/builders/:handle', destination: '/open/builders/:handle', missing: [{ type: 'query', key: 'after' }] },
    ];
    return {
      beforeFiles: [
        ...pages.flatMap(({ missing = [], ...page }) => [
          { ...page, missing: [...signedOut, ...missing] },
          { ...page, has: sharedCopy, ...(missing.length ? { missing } : {}) },
        ]),
        ...toolAddressRewrites(),
      ],
    };
  },
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders() }];
  },
};

export default nextConfig;
