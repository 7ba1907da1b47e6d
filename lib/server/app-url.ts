import { env } from '../env';

/** An absolute link into the app, for e-mail: built from NEXTAUTH_URL, the app's public address. */
export function appUrl(path: string): string {
  return new URL(path, env().NEXTAUTH_URL ?? 'http://127.0.0.1:3000').toString();
}
