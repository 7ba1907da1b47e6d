// Integration tests run against the real MariaDB, on the test database only.
import { encode } from 'next-auth/jwt';
import { NextRequest } from 'next/server';
import bcrypt from 'bcryptjs';
import { initModels, User } from '@/db/models';
import { closeSequelize } from '@/db/connection';

export function guardTestDatabase(): void {
  const name = process.env.DB_NAME ?? '';
  const host = process.env.DB_HOST ?? '127.0.0.1';
  if (!name.endsWith('_test') || !['127.0.0.1', 'localhost'].includes(host)) {
    throw new Error(`Refusing to run integration tests against database "${name}" on ${host}: use npm test (DB_NAME must end in _test, on 127.0.0.1).`);
  }
  process.env.NEXTAUTH_SECRET ??= 'integration-test-secret-0123456789';
}

export async function closeDb(): Promise<void> {
  await closeSequelize();
}

let counter = 0;
/** A fresh account with a unique e-mail (verified unless asked otherwise); returns it and a cookie that signs it in. */
export async function makeUser(siteRole: 'member' | 'admin' = 'member', options: { verified?: boolean } = {}) {
  initModels();
  const tag = `${Date.now().toString(36)}-${process.pid}-${++counter}`;
  const user = await User.create({
    email: `it-${tag}@example.test`,
    name: `Test ${tag}`,
    handle: `it-${tag}`,
    passwordHash: await bcrypt.hash('integration-pass', 4),
    siteRole,
    emailVerifiedAt: options.verified === false ? null : new Date(),
  });
  return { id: user.id, email: user.email, cookie: await sessionCookie(user.id, user.sessionVersion ?? 0) };
}

/** A session cookie as sign-in would issue it: the account and its session version at that moment. */
export async function sessionCookie(userId: number, sessionVersion: number): Promise<string> {
  const token = await encode({ token: { sub: String(userId), sv: sessionVersion }, secret: process.env.NEXTAUTH_SECRET! });
  return `next-auth.session-token=${token}`;
}

export function request(path: string, init: { method?: string; cookie?: string; body?: unknown; rawBody?: string } = {}): NextRequest {
  const headers: Record<string, string> = {};
  if (init.cookie) headers.cookie = init.cookie;
  let body: string | undefined = init.rawBody;
  // A raw body is declared JSON too (tests of other types set content-type on the request).
  if (init.rawBody !== undefined) headers['content-type'] = 'application/json';
  if (init.body !== undefined) {
    headers['content-type'] = 'application/json';
    body = JSON.stringify(init.body);
  }
  return new NextRequest(new URL(path, 'http://127.0.0.1:3000'), { method: init.method ?? 'GET', headers, body });
}

export const params = <P,>(p: P) => ({ params: Promise.resolve(p) });
