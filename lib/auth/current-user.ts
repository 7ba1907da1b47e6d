import 'server-only';
import { cache } from 'react';
import { cookies, headers } from 'next/headers';
import { getToken } from 'next-auth/jwt';
import type { NextRequest } from 'next/server';
import { findActor } from '../server/users';
import { env } from '../env';

export type CurrentUser = NonNullable<Awaited<ReturnType<typeof findActor>>>;

type CookieSource = Parameters<typeof getToken>[0]['req'];

// The session cookie names the account and the account's session version at sign-in. Everything else
// (role, verified address) is read fresh from the database on every request, in the same one query, so a
// role change or a deleted account takes effect at once; signing out, a new password or a new role raise
// the row's version, and every cookie issued before then stops working.
async function userFrom(req: CookieSource): Promise<CurrentUser | null> {
  const token = await getToken({ req, secret: env().NEXTAUTH_SECRET });
  const id = Number(token?.sub);
  if (!Number.isInteger(id) || id <= 0) return null;
  const version = token?.sv;
  if (typeof version !== 'number' || !Number.isInteger(version)) return null;
  const user = await findActor(id);
  return user && user.sessionVersion === version ? user : null;
}

/** For route handlers. */
export function getUserFromRequest(req: NextRequest): Promise<CurrentUser | null> {
  return userFrom(req as unknown as CookieSource);
}

/** For server components and server actions: read once per request (React cache), however many components ask. */
export const getCurrentUser = cache(async (): Promise<CurrentUser | null> => {
  const [cookieStore, headerList] = await Promise.all([cookies(), headers()]);
  return userFrom({ cookies: cookieStore, headers: headerList } as unknown as CookieSource);
});
