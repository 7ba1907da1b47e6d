// Plain JavaScript so next.config.mjs can import it; types in security-headers.d.mts.
/**
 * Security headers on every answer (pages, JSON, 404s, static files).
 *
 * Scripts: 'self' plus 'unsafe-inline', not nonces. The App Router writes its payload into inline
 * <script> tags; a nonce has to be fresh per response, which makes every page dynamic and uncacheable,
 * and published pages are to be cached. What keeps injected script out is that nothing we render is
 * HTML from users (React escapes, entry bodies are rendered from checked ProseMirror JSON, mail HTML only
 * in a sandboxed frame); the policy still forbids scripts from other hosts, plugins, <base> rewrites,
 * forms posting elsewhere and being framed. 'unsafe-eval' only in development (React's dev tools need it).
 *
 * Photos and clips are served by the upload service: its origin (UPLOADTHING_INGEST_URL, read when the
 * app is built) is allowed for images, media and uploads (connect-src). UPLOADS_FILE_ORIGINS adds more
 * origins (space separated) where a hosted service serves files from another host than it ingests on.
 */
function originOf(url) {
  try {
    return url ? new URL(url).origin : null;
  } catch {
    return null;
  }
}

export function contentSecurityPolicy(env = process.env) {
  const uploads = [originOf(env.UPLOADTHING_INGEST_URL), ...(env.UPLOADS_FILE_ORIGINS ?? '').split(/\s+/).map(originOf)]
    .filter(Boolean)
    .join(' ');
  const dev = env.NODE_ENV !== 'production';
  const src = (...parts) => parts.filter(Boolean).join(' ');
  return [
    "default-src 'self'",
    src('script-src', "'self'", "'unsafe-inline'", dev && "'unsafe-eval'"),
    "style-src 'self' 'unsafe-inline'",
    src('img-src', "'self'", 'data:', 'blob:', uploads),
    src('media-src', "'self'", 'blob:', uploads),
    src('connect-src', "'self'", uploads, dev && 'ws: wss:'),
    "font-src 'self' data:",
    "frame-src 'self'",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

export function securityHeaders(env = process.env) {
  return [
    { key: 'Content-Security-Policy', value: contentSecurityPolicy(env) },
    { key: 'X-Content-Type-Options', value: 'nosniff' },
    { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
    { key: 'X-Frame-Options', value: 'DENY' },
    { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(), payment=()' },
  ];
}
