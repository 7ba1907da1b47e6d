import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { describeViewer } from '@/lib/server/viewer';
import { VIEWER_COPY_COOKIE } from '@/lib/types/viewer';

const MONTH_S = 30 * 24 * 60 * 60;

/**
 * { viewer: { name, handle, manageUsers, copy } | null } for the islands of a shared copy (policy:
 * describeViewer, everyone). It also sets or clears the scribeline-copy cookie, so the next page read
 * gets the copy that suits this member (a new builder or mentor, or someone signed out, is put right here).
 */
export const GET = route(async ({ req, user }) => {
  const viewer = await describeViewer(user);
  const res = NextResponse.json({ viewer }, { headers: { 'cache-control': 'private, no-store' } });
  if (viewer) {
    res.cookies.set(VIEWER_COPY_COOKIE, viewer.copy, { path: '/', sameSite: 'lax', maxAge: MONTH_S, secure: req.nextUrl.protocol === 'https:', httpOnly: false });
  } else if (req.cookies.has(VIEWER_COPY_COOKIE)) {
    res.cookies.delete(VIEWER_COPY_COOKIE);
  }
  return res;
});
