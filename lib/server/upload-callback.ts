import 'server-only';
import { createHmac, timingSafeEqual } from 'node:crypto';
import { env } from '../env';

/**
 * What the app trusts about the upload service, read from the same UPLOADTHING_* settings the SDK reads:
 * the key that signs callbacks, the origins callbacks may name, and the hosts stored files live on.
 */
type UploadServiceConfig = { apiKey: string; appId: string; ingestOrigins: string[]; fileOrigins: string[] };

function parseTokenEnv(): { apiKey: string; appId: string; regions: string[]; ingestHost: string } | null {
  const token = env().UPLOADTHING_TOKEN;
  if (!token) return null;
  try {
    const t = JSON.parse(Buffer.from(token, 'base64').toString('utf8')) as Record<string, unknown>;
    if (typeof t.apiKey !== 'string' || typeof t.appId !== 'string' || !Array.isArray(t.regions)) return null;
    const regions = t.regions.filter((r): r is string => typeof r === 'string' && /^[a-z0-9-]+$/i.test(r));
    return { apiKey: t.apiKey, appId: t.appId, regions, ingestHost: typeof t.ingestHost === 'string' ? t.ingestHost : 'ingest.uploadthing.com' };
  } catch {
    return null;
  }
}

const originOf = (url: string): string | null => {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
};

export function uploadServiceConfig(): UploadServiceConfig | null {
  const token = parseTokenEnv();
  if (!token) return null;
  // As the SDK computes its ingest URL: the configured one, else one per region of the token.
  const { UPLOADTHING_INGEST_URL: ingestUrl, UPLOADTHING_UFS_HOST: ufsHost } = env();
  const configured = ingestUrl ? originOf(ingestUrl) : null;
  const ingestOrigins = configured ? [configured] : token.regions.map((r) => `https://${r}.${token.ingestHost}`);
  const proto = ufsHost.includes('local') ? 'http' : 'https';
  const fileOrigins = [...new Set([...ingestOrigins, `${proto}://${ufsHost}`, `${proto}://${token.appId}.${ufsHost}`].map((o) => originOf(o)).filter((o): o is string => !!o))];
  return { apiKey: token.apiKey, appId: token.appId, ingestOrigins, fileOrigins };
}

/** File keys as the SDK makes them (letters and digits), with room for the service's own punctuation. */
export const FILE_KEY_PATTERN = /^[A-Za-z0-9][A-Za-z0-9._-]{0,199}$/;

function signatureMatches(body: string, signature: string | null, apiKey: string): boolean {
  if (!signature) return false;
  const expected = Buffer.from('hmac-sha256=' + createHmac('sha256', apiKey).update(body, 'utf8').digest('hex'));
  const given = Buffer.from(signature);
  return expected.length === given.length && timingSafeEqual(expected, given);
}

/** A stored file's address must be on the upload service and name exactly this key. */
function isServiceFileUrl(value: unknown, key: string, config: UploadServiceConfig): boolean {
  if (typeof value !== 'string') return false;
  let url: URL;
  try {
    url = new URL(value);
  } catch {
    return false;
  }
  if (url.username || url.password || url.search || url.hash) return false;
  if (!config.fileOrigins.includes(url.origin)) return false;
  return url.pathname === `/f/${key}` || url.pathname === `/a/${encodeURIComponent(config.appId)}/${key}`;
}

/**
 * Checks an upload-service callback before the SDK handles it. Returns why it is refused, or null.
 * The SDK checks the signature too, but it would then post its result (with the API key) to the body's
 * `origin` and hand the body's file URL to onUploadComplete: both must be the configured service's.
 */
export function checkUploadCallback(body: string, signature: string | null, hook: string | null): string | null {
  const config = uploadServiceConfig();
  if (!config) return 'Uploads are not configured on this server.';
  if (!signatureMatches(body, signature, config.apiKey)) return 'The callback signature is not valid.';
  let data: Record<string, unknown>;
  try {
    const parsed = JSON.parse(body) as unknown;
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) return 'The callback body must be a JSON object.';
    data = parsed as Record<string, unknown>;
  } catch {
    return 'The callback body is not valid JSON.';
  }
  if (hook === 'error') return typeof data.fileKey === 'string' && FILE_KEY_PATTERN.test(data.fileKey) ? null : 'The callback names no valid file key.';
  if (hook !== 'callback') return 'Unknown callback kind.';
  if (typeof data.origin !== 'string' || !config.ingestOrigins.includes(data.origin)) return 'The callback names an origin that is not the upload service.';
  const file = data.file as Record<string, unknown> | undefined;
  if (typeof file !== 'object' || file === null) return 'The callback names no file.';
  const key = file.key;
  if (typeof key !== 'string' || !FILE_KEY_PATTERN.test(key)) return 'The callback names no valid file key.';
  for (const field of ['ufsUrl', 'url', 'appUrl'] as const) {
    if (file[field] !== undefined && !isServiceFileUrl(file[field], key, config)) return `The callback's file.${field} is not on the upload service.`;
  }
  if (file.ufsUrl === undefined) return 'The callback names no file address.';
  return null;
}
