// The one place a `next` / callbackUrl target is judged before anything navigates to it.

const PLACEHOLDER_ORIGIN = 'http://scribeline.invalid';

/**
 * A path on this site to go to after signing in (or verifying, or resetting), or `fallback`.
 * The target is parsed as a browser would (backslashes, tabs and dot segments included) and kept only
 * when it resolves to the same origin and to a path that cannot be read as another host (`//host`).
 * `origin` is the site's own origin when an absolute URL of it should be accepted too.
 */
export function safeNextPath(target: unknown, fallback = '/projects', origin: string = PLACEHOLDER_ORIGIN): string {
  if (typeof target !== 'string' || target.length === 0 || target.length > 2048) return fallback;
  let base: URL;
  let url: URL;
  try {
    base = new URL(origin);
    url = new URL(target, base);
  } catch {
    return fallback;
  }
  if (url.protocol !== base.protocol || url.origin !== base.origin) return fallback;
  // A relative target must itself look like a path; only then is the parsed form trusted.
  if (!/^https?:/i.test(target) && !target.startsWith('/')) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  if (!path.startsWith('/') || path.startsWith('//') || path.startsWith('/\\')) return fallback;
  return path;
}
