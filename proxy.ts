import { NextResponse, type NextRequest } from 'next/server';
import { checkRequestOrigin } from './lib/http/origin';
import { legacyMomentMs } from './lib/chapters/moment';

const SIGNED_IN_AREAS = ['/projects', '/admin', '/settings', '/bench'];

// next-auth's session cookie (split into .0, .1… when large; __Secure- on https).
const SESSION_COOKIE = /^(__Secure-)?next-auth\.session-token(\.\d+)?$/;

// The published log's pages that have a signed-out copy cached for everyone under /open (app/(open)/open).
const OPEN_PAGES = [/^\/logs\/[^/]+$/, /^\/logs\/[^/]+\/sessions\/[^/]+$/, /^\/logs\/[^/]+\/entries\/[^/]+$/, /^\/builders\/[^/]+$/];
// Query keys those copies can answer without reading them on the server (the clip stage reads ?clip itself).
const OPEN_QUERY_KEYS = new Set(['clip']);

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

  // A signed-out reader of the published log gets the copy built once for everyone, where a missing or
  // private page is decided before anything is sent (a real 404). Everyone else gets their own copy.
  if (!signedIn && reading && OPEN_PAGES.some((p) => p.test(path)) && [...req.nextUrl.searchParams.keys()].every((k) => OPEN_QUERY_KEYS.has(k))) {
    return NextResponse.rewrite(sameServer(`/open${path}${req.nextUrl.search}`, req));
  }
  return NextResponse.next();
}

// Everything but the build's static files.
export const config = { matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'] };

/**
 * A rewrite this server answers itself. `req.nextUrl` spells a loopback host `localhost`, while Next compares a
 * rewrite with the address the server was started on (`-H 127.0.0.1`): told `localhost`, it would take the
 * rewrite for another site's and fetch the page from itself over HTTP, a second request for every signed-out
 * read. Next's own record of that address (`__NEXT_PRIVATE_ORIGIN`, set by `next start`) is used when the
 * port agrees; otherwise the request's own address, which is right on a host bound to a real name.
 */
function sameServer(pathAndQuery: string, req: NextRequest): URL {
  const own = process.env.__NEXT_PRIVATE_ORIGIN;
  if (own) {
    const origin = new URL(own);
    if (origin.port === req.nextUrl.port) return new URL(pathAndQuery, origin);
  }
  return new URL(pathAndQuery, req.nextUrl.origin);
}
