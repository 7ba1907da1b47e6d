import { safeNextPath } from '@/lib/auth/safe-redirect';

/** Only paths of this site may be returned to after signing in (the one helper, lib/auth/safe-redirect.ts). */
export function safeNext(next: string | null): string {
  return safeNextPath(next, '/projects');
}

/** A link to another auth page that keeps the return path. */
export function withNext(path: string, next: string | null, extra: Record<string, string> = {}): string {
  const q = new URLSearchParams(extra);
  const target = safeNextPath(next, '');
  if (target) q.set('next', target);
  const s = q.toString();
  return s ? `${path}?${s}` : path;
}
