import { NextResponse, type NextRequest } from 'next/server';
import { checkRequestOrigin } from './lib/http/origin';
import { legacyMomentMs } from './lib/chapters/moment';
import { TOOL_BOXES_HEADER, holdsBoxes } from './lib/http/tool-addresses.mjs';

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

  // A tool's address that holds boxes (/fits?q=25+H7/g6): marked, so next.config.mjs's rewrites send it to the
  // page's from-address twin, which renders them on the server (lib/http/tool-addresses.mjs). The plain page is the
  // one built ahead.
  if (holdsBoxes(path, req.nextUrl.searchParams)) {
    const headers = new Headers(req.headers);
    headers.set(TOOL_BOXES_HEADER, '1');
    return NextResponse.next({ request: { headers } });
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
// action is still refused here), an entry asked for with an old ?t= moment and a tool's address holding boxes. A plain read of those pages
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
    // A tool's address with boxes in it: one entry per page and query key of lib/http/tool-addresses.mjs (Next
    // reads a matcher as written, so it is spelled out; tests/unit/tool-addresses.test.ts checks it against the table).
    { source: '/fits', has: [{ type: 'query', key: 'q' }] },
    { source: '/fits', has: [{ type: 'query', key: 'size' }] },
    { source: '/fits', has: [{ type: 'query', key: 'fit' }] },
    { source: '/fits', has: [{ type: 'query', key: 'zone' }] },
    { source: '/fits', has: [{ type: 'query', key: 'unit' }] },
    { source: '/fits', has: [{ type: 'query', key: 'round' }] },
    { source: '/calculators/tap-drill', has: [{ type: 'query', key: 'thread' }] },
    { source: '/calculators/tap-drill', has: [{ type: 'query', key: 'mode' }] },
    { source: '/calculators/tap-drill', has: [{ type: 'query', key: 'target' }] },
    { source: '/calculators/tap-drill', has: [{ type: 'query', key: 'drill' }] },
    { source: '/calculators/tap-drill', has: [{ type: 'query', key: 'drills' }] },
    { source: '/calculators/clearance-holes', has: [{ type: 'query', key: 'size' }] },
    { source: '/calculators/clearance-holes', has: [{ type: 'query', key: 'fit' }] },
    { source: '/calculators/clearance-holes', has: [{ type: 'query', key: 'edge' }] },
    { source: '/calculators/clearance-holes', has: [{ type: 'query', key: 'spacing' }] },
    { source: '/calculators/clearance-holes', has: [{ type: 'query', key: 'unit' }] },
    { source: '/calculators/drills', has: [{ type: 'query', key: 'mode' }] },
    { source: '/calculators/drills', has: [{ type: 'query', key: 'name' }] },
    { source: '/calculators/drills', has: [{ type: 'query', key: 'd' }] },
    { source: '/calculators/drills', has: [{ type: 'query', key: 'unit' }] },
    { source: '/calculators/drills', has: [{ type: 'query', key: 'side' }] },
    { source: '/calculators/bolt-circle', has: [{ type: 'query', key: 'd' }] },
    { source: '/calculators/bolt-circle', has: [{ type: 'query', key: 'unit' }] },
    { source: '/calculators/bolt-circle', has: [{ type: 'query', key: 'holes' }] },
    { source: '/calculators/bolt-circle', has: [{ type: 'query', key: 'start' }] },
    { source: '/calculators/bolt-circle', has: [{ type: 'query', key: 'midway' }] },
    { source: '/calculators/indexing', has: [{ type: 'query', key: 'n' }] },
    { source: '/calculators/indexing', has: [{ type: 'query', key: 'ratio' }] },
    { source: '/calculators/indexing', has: [{ type: 'query', key: 'circles' }] },
    { source: '/calculators/indexing', has: [{ type: 'query', key: 'plate' }] },
    { source: '/calculators/spur-gear', has: [{ type: 'query', key: 'teeth' }] },
    { source: '/calculators/spur-gear', has: [{ type: 'query', key: 'by' }] },
    { source: '/calculators/spur-gear', has: [{ type: 'query', key: 'm' }] },
    { source: '/calculators/spur-gear', has: [{ type: 'query', key: 'dp' }] },
    { source: '/calculators/spur-gear', has: [{ type: 'query', key: 'pa' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'd' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'unit' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'v' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'vunit' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'material' }] },
    { source: '/calculators/speeds', has: [{ type: 'query', key: 'tool' }] },
  ],
};
