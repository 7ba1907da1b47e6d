import { createHmac, timingSafeEqual } from 'node:crypto';

/** Prefix the SDK puts in front of every hex HMAC it sends or expects. */
export const SIGNATURE_PREFIX = 'hmac-sha256=';

export interface Credentials {
  apiKey: string;
  appId: string;
}

/**
 * Reads the same token the app is given (base64 JSON), so the app and the
 * service cannot drift apart on which key signs what.
 */
export function parseToken(token: string): Credentials {
  let decoded: unknown;
  try {
    decoded = JSON.parse(Buffer.from(token, 'base64').toString('utf8'));
  } catch {
    throw new Error('UPLOADTHING_TOKEN is not base64-encoded JSON');
  }
  if (typeof decoded !== 'object' || decoded === null) throw new Error('UPLOADTHING_TOKEN must encode an object');
  const { apiKey, appId } = decoded as Record<string, unknown>;
  if (typeof apiKey !== 'string' || !apiKey.startsWith('sk_')) throw new Error('token apiKey must be a string starting with sk_');
  if (typeof appId !== 'string' || appId === '') throw new Error('token appId must be a non-empty string');
  return { apiKey, appId };
}

export function sign(payload: string, apiKey: string): string {
  return SIGNATURE_PREFIX + createHmac('sha256', apiKey).update(payload, 'utf8').digest('hex');
}

/** Constant-time so a caller cannot learn a valid signature byte by byte. */
export function safeEqual(a: string, b: string): boolean {
  const ab = Buffer.from(a, 'utf8');
  const bb = Buffer.from(b, 'utf8');
  return ab.length === bb.length && timingSafeEqual(ab, bb);
}

export interface PresignedParams {
  fileKey: string;
  expires: number;
  appId: string;
  fileName: string;
  fileSize: number;
  fileType: string;
  slug: string | null;
  customId: string | null;
  contentDisposition: string;
  acl: string | null;
}

export type PresignedCheck =
  | { ok: true; params: PresignedParams }
  | { ok: false; status: number; error: string };

// The SDK runs every value through encodeURIComponent before URLSearchParams
// encodes it again, so one more decode is needed after URLSearchParams.
function decodeTwice(value: string | null): string | null {
  if (value === null) return null;
  try {
    return decodeURIComponent(value);
  } catch {
    return null;
  }
}

/**
 * Checks a presigned ingest URL. `rawPathAndQuery` is the request target
 * exactly as received; the signature covers `origin + target` up to
 * `&signature=`, so the target must not be re-serialised before checking.
 * `origins` lists what the SDK may have used as its ingest base.
 */
export function verifyPresignedUrl(
  rawPathAndQuery: string,
  origins: string[],
  creds: Credentials,
  now: number = Date.now(),
): PresignedCheck {
  const cut = rawPathAndQuery.lastIndexOf('&signature=');
  if (cut < 0) return { ok: false, status: 403, error: 'missing signature' };
  const signed = rawPathAndQuery.slice(0, cut);
  const signature = decodeTwice(new URLSearchParams(rawPathAndQuery.slice(cut + 1)).get('signature'));
  if (!signature) return { ok: false, status: 403, error: 'missing signature' };
  const matches = origins.some((origin) => safeEqual(sign(origin + signed, creds.apiKey), signature));
  if (!matches) return { ok: false, status: 403, error: 'invalid signature' };

  const qIndex = signed.indexOf('?');
  const path = qIndex < 0 ? signed : signed.slice(0, qIndex);
  const query = new URLSearchParams(qIndex < 0 ? '' : signed.slice(qIndex + 1));
  const fileKey = decodeTwice(path.slice(path.lastIndexOf('/') + 1) || null);
  const expires = Number(query.get('expires'));
  if (!fileKey) return { ok: false, status: 400, error: 'missing file key' };
  if (!Number.isFinite(expires)) return { ok: false, status: 403, error: 'missing expiry' };
  if (expires <= now) return { ok: false, status: 403, error: 'presigned URL has expired' };

  const get = (name: string): string | null => decodeTwice(query.get(name));
  const appId = get('x-ut-identifier');
  if (appId !== creds.appId) return { ok: false, status: 403, error: 'URL was signed for another app' };
  const fileName = get('x-ut-file-name');
  const fileSize = Number(get('x-ut-file-size'));
  if (!fileName) return { ok: false, status: 400, error: 'missing x-ut-file-name' };
  if (!Number.isSafeInteger(fileSize) || fileSize < 0) return { ok: false, status: 400, error: 'invalid x-ut-file-size' };
  return {
    ok: true,
    params: {
      fileKey,
      expires,
      appId,
      fileName,
      fileSize,
      fileType: get('x-ut-file-type') || 'application/octet-stream',
      slug: get('x-ut-slug'),
      customId: get('x-ut-custom-id'),
      contentDisposition: get('x-ut-content-disposition') ?? 'inline',
      acl: get('x-ut-acl'),
    },
  };
}

/**
 * Checks a signed read URL (the SDK's `generateSignedURL`: `<base>/a/<appId>/<key>?expires=…&signature=…`
 * or `<base>/f/<key>?…`). Like an ingest URL, the signature covers `origin + target` up to `&signature=`.
 */
export function verifySignedRead(
  rawPathAndQuery: string,
  origins: string[],
  apiKey: string,
  now: number = Date.now(),
): { ok: true } | { ok: false; error: string } {
  const cut = rawPathAndQuery.lastIndexOf('&signature=');
  if (cut < 0) return { ok: false, error: 'this file is private: a signed URL is required' };
  const signed = rawPathAndQuery.slice(0, cut);
  const signature = decodeTwice(new URLSearchParams(rawPathAndQuery.slice(cut + 1)).get('signature'));
  if (!signature) return { ok: false, error: 'this file is private: a signed URL is required' };
  if (!origins.some((origin) => safeEqual(sign(origin + signed, apiKey), signature))) return { ok: false, error: 'invalid signature' };
  const qIndex = signed.indexOf('?');
  const expires = Number(new URLSearchParams(qIndex < 0 ? '' : signed.slice(qIndex + 1)).get('expires'));
  if (!Number.isFinite(expires)) return { ok: false, error: 'missing expiry' };
  if (expires <= now) return { ok: false, error: 'signed URL has expired' };
  return { ok: true };
}
