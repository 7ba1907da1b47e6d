import { NextResponse } from 'next/server';
import { route, readJson } from '@/lib/http/route';
import { readTextCapped } from '@/lib/http/body';
import { applyUnsubscribe } from '@/lib/server/follows';


const MAX_BYTES = 4096;

/**
 * Switches off the e-mail of the follow a signed unsubscribe token names. Only POST changes anything,
 * so a mail scanner fetching the link does not unsubscribe anyone. Takes JSON { token } or the
 * confirmation page's plain urlencoded form (then answers with a redirect back to that page).
 */
export const POST = route({ maxBytes: MAX_BYTES }, async ({ req }) => {
  const type = req.headers.get('content-type') ?? '';
  if (type.startsWith('application/x-www-form-urlencoded')) {
    const token = new URLSearchParams(await readTextCapped(req, MAX_BYTES)).get('token') ?? '';
    const back = new URL('/unsubscribe', req.nextUrl.origin);
    back.searchParams.set('token', token);
    try {
      await applyUnsubscribe({ token });
      back.searchParams.set('done', '1');
    } catch {
      // The page checks the token again and explains what is wrong with it.
    }
    return NextResponse.redirect(back, 303);
  }
  return { unsubscribed: await applyUnsubscribe(await readJson(req)) };
});
