import { NextResponse, type NextRequest } from 'next/server';

// Tells the signed-in area's layout which page was asked for, so sign-in can return there.
export function proxy(req: NextRequest) {
  const headers = new Headers(req.headers);
  headers.set('x-scribeline-path', req.nextUrl.pathname + req.nextUrl.search);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ['/projects/:path*', '/admin/:path*', '/settings/:path*'] };
