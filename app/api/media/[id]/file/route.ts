import { NextResponse } from 'next/server';
import { route, idParam } from '@/lib/http/route';
import { signedMediaUrl } from '@/lib/server/media';


type Params = { id: string };

/**
 * An uploaded photo or clip, for whoever may see its entry: a redirect to a short-lived signed URL on the
 * upload service (which then serves Range requests, so clips seek). Pages embed this address, never the signature.
 */
export const GET = route<Params>(async ({ user, params }) => {
  const target = await signedMediaUrl(user, idParam(params));
  return NextResponse.redirect(target, {
    status: 302,
    headers: { 'cache-control': 'private, no-store', 'x-content-type-options': 'nosniff', 'referrer-policy': 'no-referrer' },
  });
});
