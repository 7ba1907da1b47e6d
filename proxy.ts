import { NextResponse, type NextRequest } from 'next/server';
import { checkRequestOrigin } from './lib/http/origin';
import { legacyMomentMs } from './lib/chapters/moment';

const SIGNED_IN_AREAS = ['/projects', '/admin', '/settings', '/bench'];

// next-auth's session cookie (split into .0, .1… when large; __Secure- on https).
const SESSION_COOKIE = /^(__Secure-)?next-auth\.session-token(\.\d+)?$/;

// A signed-out reader of the published log is sent to the copy cached for everyone (app/(open)/open) by
// next.config.mjs's rewrites, which test the same cookie: a rewrite from here served about half as many
// cached reads a second (DEVELOPERS.md, "Reading a page").

export function proxy(req: NextRequest) {
  // Cross-site refusal for every state-changing request: server actions (Next's own check answers 500),
  // next-auth's routes (on top of its CSRF token), the upload route and every JSON handler (route() checks again).
  const verdict = checkRequestOrigin(req);
  if (!verdict.ok) {
    const json = req.nextUrl.pathname.startsWith('/api/');
    return json
      ? NextResponse.json({ error: 'forbidden', message: verdict.message }, { status: 403 })
      : new NextResponse(verdict.message, { status: 403, headers: { 'content-type': 'text/plain; charset=utf-8' } });
  }
  const path = req.nextUrl.pathname;
  const signedIn = req.cookies.getAll().some((c) => SESSION_COOKIE.test(c.name));
  const reading = req.method === 'GET' || req.method === 'HEAD';

  // Old links carried a clip's moment as ?t=<seconds>: on to the W3C fragment form (#t=), the clip kept.
  if (reading && /^\/logs\/[^/]+\/entries\/[^/]+$/.test(path) && req.nextUrl.searchParams.has('t')) {
    const url = req.nextUrl.clone();
    const ms = legacyMomentMs(url.searchParams.get('t') ?? undefined);
    url.searchParams.delete('t');
    url.hash = ms === null ? '' : `t=${Math.floor(ms / 1000)}`;
    return NextResponse.redirect(url, 308);
  }

  // The signed-in area: a visitor with no session goes to sign-in first, and comes back to this page.
  if (SIGNED_IN_AREAS.some((area) => path === area || path.startsWith(`${area}/`))) {
    if (!signedIn && reading) {
      const url = new URL('/sign-in', req.url);
      url.searchParams.set('next', path + req.nextUrl.search);
      return NextResponse.redirect(url);
    }
    // Tells the signed-in area's layout which page was asked for, so sign-in can return there.
    const headers = new Headers(req.headers);
    headers.set('x-scribeline-path', path + req.nextUrl.search);
    return NextResponse.next({ request: { headers } });
  }

  return NextResponse.next();
}

// Everything but the build's static files; and on the home page, the published log's pages, builders'
// profiles and the tools (/fits, /calculators), which a reader only reads, only the requests there is something
// to do for: those with an Origin header (a browser sends one with every POST, so a cross-site form or server
// action is still refused here) and an entry asked for with an old ?t= moment. A plain read of those pages
// (most of the site's traffic, answered from the cache or the build) skips this function, which had cost it
// about half its rate (the demo entry, by hand: about 435 → 1,000–1,150 cached reads a second).
export const config = {
  matcher: [
    '/((?!_next/static|_next/image|favicon.ico|logs/|builders/|fits(?:/|$)|calculators(?:/|$)).+)',
    { source: '/', has: [{ type: 'header', key: 'origin' }] },
    { source: '/logs/:path*', has: [{ type: 'header', key: 'origin' }] },
    { source: '/builders/:path*', has: [{ type: 'header', key: 'origin' }] },
    { source: '/fits/:path*', has: [{ type: 'header', key: 'origin' }] },
    { source: '/calculators/:path*', has: [{ type: 'header', key: 'origin' }] },
    { source: '/logs/:slug/entries/:id', has: [{ type: 'query', key: 't' }] },
  ],
};
