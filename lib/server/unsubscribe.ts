import 'server-only';
import { appUrl } from './app-url';
import { createHmac, timingSafeEqual } from 'node:crypto';
import { signingSecret } from '../env';

// The link in a follow e-mail that switches that follow's mail off. It names the follow and its member
// and carries an HMAC-SHA256 of both under the app's secret, so it cannot be forged or pointed at
// someone else's follow; it does not expire, as such links are expected to keep working.

const PURPOSE = 'scribeline/unsubscribe/v1';

const secret = (): string => signingSecret('unsubscribe links');

function mac(followId: number, userId: number): Buffer {
  return createHmac('sha256', secret()).update(`${PURPOSE}:${followId}:${userId}`).digest();
}

/** `<followId>.<userId>.<signature, base64url>` */
export function unsubscribeToken(followId: number, userId: number): string {
  return `${followId}.${userId}.${mac(followId, userId).toString('base64url')}`;
}

/** The follow and member a token names, or null when it is malformed or its signature does not match. */
export function readUnsubscribeToken(token: unknown): { followId: number; userId: number } | null {
  if (typeof token !== 'string' || token.length > 200) return null;
  const m = /^([1-9][0-9]{0,9})\.([1-9][0-9]{0,9})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!m) return null;
  const followId = Number(m[1]);
  const userId = Number(m[2]);
  // Compared as text, so no second spelling of the same bytes passes.
  const given = Buffer.from(m[3], 'ascii');
  const expected = Buffer.from(mac(followId, userId).toString('base64url'), 'ascii');
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return { followId, userId };
}

export function unsubscribeUrl(followId: number, userId: number): string {
  return appUrl(`/unsubscribe?token=${encodeURIComponent(unsubscribeToken(followId, userId))}`);
}
