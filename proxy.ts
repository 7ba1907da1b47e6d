import { NextResponse, type NextRequest } from 'next/server';
import { checkRequestOrigin } from './lib/http/origin';

const SIGNED_IN_AREAS = ['/projects', '/admin', '/settings'];

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
  // Tells the signed-in area's layout which page was asked for, so sign-in can return there.
  const path = req.nextUrl.pathname;
  if (SIGNED_IN_AREAS.some((area) => path === area || path.startsWith(`${area}/`))) {
    const headers = new Headers(req.headers);
    headers.set('x-scribeline-path', req.nextUrl.pathname + req.nextUrl.search);
    return NextResponse.next({ request: { headers } });
  }
  return NextResponse.next();
}

// Everything but the build's static files.
export const config = { matcher: ['/((?!_next/static|_next/image|favicon.ico).*)'] };
