import { connection } from 'next/server';

// The bench view's service worker, served from here because the app has no public/ folder. Its scope is
// /bench only (the bench pages); what it keeps is listed in its source below: those pages, the build's
// static files they load, and the icon. It never keeps an /api/ answer.
const CACHE = 'scribeline-bench-v1';

const SOURCE = `
const CACHE = ${JSON.stringify(CACHE)};
const PAGE = /^\\/bench(\\/\\d+)?$/;
const KEPT = (url) => url.origin === self.location.origin && (url.pathname.startsWith('/_next/static/') || url.pathname === '/bench-icon.svg' || url.pathname === '/icon.svg' || url.pathname === '/manifest.webmanifest');

self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil((async () => {
    for (const name of await caches.keys()) if (name.startsWith('scribeline-bench-') && name !== CACHE) await caches.delete(name);
    await self.clients.claim();
  })());
});

// The page asks for what it loaded before this worker took it over (its own address and its static files).
self.addEventListener('message', (event) => {
  const data = event.data || {};
  if (data.type !== 'keep' || !Array.isArray(data.urls)) return;
  event.waitUntil((async () => {
    // Another member on this phone: what was kept for the last one goes first.
    if (data.forget) await caches.delete(CACHE);
    const cache = await caches.open(CACHE);
    for (const href of data.urls.slice(0, 200)) {
      let url;
      try { url = new URL(href, self.location.origin); } catch { continue; }
      if (!(KEPT(url) || (url.origin === self.location.origin && PAGE.test(url.pathname)))) continue;
      url.search = '';
      if (await cache.match(url.href, { ignoreVary: true })) continue;
      try {
        const res = await fetch(url.href, { credentials: 'same-origin', redirect: 'manual' });
        if (res.ok && res.type === 'basic') await cache.put(url.href, res);
      } catch {}
    }
    if (event.source) event.source.postMessage({ type: 'kept' });
  })());
});

self.addEventListener('fetch', (event) => {
  const req = event.request;
  if (req.method !== 'GET') return;
  const url = new URL(req.url);
  if (url.origin !== self.location.origin || url.pathname.startsWith('/api/')) return;
  // The bench page itself: the network first (fresh records), the kept copy when there is none.
  if (req.mode === 'navigate' && PAGE.test(url.pathname)) {
    const key = url.origin + url.pathname;
    event.respondWith((async () => {
      try {
        const res = await fetch(req);
        if (res.ok && res.type === 'basic' && !res.redirected) {
          const copy = res.clone();
          caches.open(CACHE).then((c) => c.put(key, copy));
        }
        return res;
      } catch (err) {
        const kept = await caches.match(key, { ignoreVary: true });
        if (kept) return kept;
        return new Response('<!doctype html><meta name="viewport" content="width=device-width"><title>Offline</title><p style="font:20px system-ui;padding:1rem">No connection, and this bench page was not opened on this phone before. Open it once with a connection.</p>', { status: 503, headers: { 'content-type': 'text/html; charset=utf-8' } });
      }
    })());
    return;
  }
  // The build's static files never change under one name: kept once, served from the cache.
  if (KEPT(url) && !req.headers.get('rsc')) {
    event.respondWith((async () => {
      const cache = await caches.open(CACHE);
      const hit = await cache.match(req, { ignoreVary: true });
      if (hit) return hit;
      const res = await fetch(req);
      if (res.ok && res.type === 'basic') cache.put(req, res.clone());
      return res;
    })());
  }
});
`;

export async function GET(): Promise<Response> {
  // Answered per request, never a copy prerendered at build.
  await connection();
  return new Response(SOURCE, {
    headers: {
      'content-type': 'application/javascript; charset=utf-8',
      'cache-control': 'no-cache, no-store, must-revalidate',
      'content-security-policy': "default-src 'self'; script-src 'self'",
      // Served from the root, used with the scope /bench.
      'service-worker-allowed': '/bench',
    },
  });
}
