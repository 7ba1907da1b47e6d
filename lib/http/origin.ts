// Cross-site request refusal: one pure check shared by route() and proxy.ts (server actions). No Next, no db.
import { env } from '../env';

export type OriginVerdict = { ok: true } | { ok: false; message: string };

export type OriginInput = {
  method: string;
  /** The request's own origin as the server received it (scheme://host[:port]). */
  selfOrigin: string;
  origin: string | null;
  secFetchSite: string | null;
  /** Further allowed origins, e.g. NEXTAUTH_URL's. */
  allowed?: readonly string[];
};

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** scheme://host:port in lower case, or null when the text is not an http(s) URL. */
export function normalizeOrigin(value: string | null | undefined): string | null {
  if (!value) return null;
  try {
    const url = new URL(value);
    if (url.protocol !== 'http:' && url.protocol !== 'https:') return null;
    return url.origin.toLowerCase();
  } catch {
    return null;
  }
}

/** The origins a state-changing request may come from: the app's configured URL and the request's own. */
export function allowedOrigins(selfOrigin: string, appUrl: string | undefined = env().NEXTAUTH_URL): string[] {
  return [normalizeOrigin(selfOrigin), normalizeOrigin(appUrl)].filter((o): o is string => o !== null);
}

/**
 * A browser names where a request comes from in `Origin` and `Sec-Fetch-Site`. A state-changing request
 * is refused when either says another site, or another port or subdomain of this one (`same-site`
 * is foreign here). A request with neither header is not a browser's cross-site request (curl, the
 * upload service's callback) and passes; its session cookie still has to be valid.
 */
export function checkOrigin(input: OriginInput): OriginVerdict {
  if (SAFE_METHODS.has(input.method.toUpperCase())) return { ok: true };
  const site = input.secFetchSite?.trim().toLowerCase() || null;
  if (site && site !== 'same-origin' && site !== 'none') {
    return { ok: false, message: 'This request came from another site and was refused.' };
  }
  if (input.origin !== null) {
    const origin = normalizeOrigin(input.origin);
    // "null" (sandboxed frames, some redirects) and anything unparsable count as foreign.
    const allowed = new Set([...allowedOrigins(input.selfOrigin, undefined), ...(input.allowed ?? []).map(normalizeOrigin)]);
    if (!origin || !allowed.has(origin)) {
      return { ok: false, message: 'This request came from another site and was refused.' };
    }
  }
  return { ok: true };
}

/** The request's own origin from its Host header (what the browser addressed), else its URL. */
export function selfOriginOf(url: string, headers: Headers): string {
  const parsed = new URL(url);
  const host = headers.get('host');
  const proto = headers.get('x-forwarded-proto')?.split(',')[0]?.trim() || parsed.protocol.replace(':', '');
  return host ? `${proto}://${host}` : parsed.origin;
}

/** checkOrigin over a Fetch API request, allowing NEXTAUTH_URL's origin too. */
export function checkRequestOrigin(req: { method: string; url: string; headers: Headers }): OriginVerdict {
  return checkHeadersOrigin(req.method, req.headers, selfOriginOf(req.url, req.headers));
}

/** checkOrigin over request headers alone (server actions read them through next/headers). */
export function checkHeadersOrigin(method: string, headers: Headers, selfOrigin?: string): OriginVerdict {
  const host = headers.get('host');
  const proto = headers.get('x-forwarded-proto')?.split(',')[0]?.trim() || 'http';
  const self = selfOrigin ?? (host ? `${proto}://${host}` : (env().NEXTAUTH_URL ?? 'http://localhost'));
  return checkOrigin({
    method,
    selfOrigin: self,
    origin: headers.get('origin'),
    secFetchSite: headers.get('sec-fetch-site'),
    allowed: allowedOrigins(self),
  });
}
