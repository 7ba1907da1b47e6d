import { test, expect, type Page } from '@playwright/test';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../db/seeders/demo-accounts';

// Security headers on every kind of answer, cross-site refusal over real HTTP, and the pages working under the CSP.

const FOREIGN = 'https://attacker.example';
const builder = DEMO_ACCOUNTS.find((a) => a.key === 'builder')!;

async function signIn(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(builder.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

/** A real server action's id from the build's manifest (any id will do for the origin check). */
function someActionId(): string {
  const file = path.resolve(__dirname, '..', '..', process.env.NEXT_DIST_DIR ?? '.next-test', 'server', 'server-reference-manifest.json');
  try {
    const manifest = JSON.parse(fs.readFileSync(file, 'utf8')) as { node?: Record<string, unknown> };
    const id = Object.keys(manifest.node ?? {})[0];
    if (id) return id;
  } catch {
    // fall through
  }
  return '7f'.padEnd(42, '0');
}

test.describe('security headers', () => {
  for (const [what, url, status] of [
    ['a page', '/', 200],
    ['a JSON answer', '/api/health', 200],
    ['a 404', '/no-such-page-here', 404],
    ['an API 404', '/api/projects/999999999', 404],
  ] as const) {
    test(`on ${what}`, async ({ request }) => {
      const res = await request.get(url);
      expect(res.status()).toBe(status);
      const h = res.headers();
      const csp = h['content-security-policy'] ?? '';
      for (const directive of ["frame-ancestors 'none'", "object-src 'none'", "base-uri 'self'", "form-action 'self'", "default-src 'self'"]) {
        expect(csp, `${url}: ${directive}`).toContain(directive);
      }
      // Media and images only from the app and the upload service.
      const upload = new URL(process.env.UPLOADTHING_INGEST_URL ?? 'http://127.0.0.1:3110').origin;
      expect(csp).toMatch(new RegExp(`media-src 'self' blob: ${upload.replace(/[.]/g, '\\.')}`));
      expect(csp).toMatch(new RegExp(`connect-src 'self' ${upload.replace(/[.]/g, '\\.')}`));
      expect(h['x-content-type-options']).toBe('nosniff');
      expect(h['referrer-policy']).toBe('strict-origin-when-cross-origin');
    });
  }
});

test.describe('cross-site requests over HTTP', () => {
  test('a foreign-origin server action → 403 (not 500)', async ({ request }) => {
    const res = await request.post('/settings', {
      headers: { origin: FOREIGN, 'next-action': someActionId(), 'content-type': 'text/plain;charset=UTF-8', accept: 'text/x-component' },
      data: '[]',
    });
    expect(res.status()).toBe(403);
  });

  test('a foreign-origin server action on a published log page → 403 (the proxy skips only plain reads there)', async ({ request }) => {
    for (const path of ['/logs/cast-iron-backplate-for-the-160-mm-three-jaw-chuck', '/builders/edda-renwick']) {
      const res = await request.post(path, {
        headers: { origin: FOREIGN, 'next-action': someActionId(), 'content-type': 'text/plain;charset=UTF-8', accept: 'text/x-component' },
        data: '[]',
      });
      expect(res.status(), path).toBe(403);
    }
  });

  test('signed in: a foreign Origin or Sec-Fetch-Site cross-site cannot create a project; the same origin can', async ({ page }) => {
    await signIn(page);
    const api = page.request;
    const mine = async () => ((await (await api.get('/api/projects?scope=mine')).json()) as { projects: unknown[] }).projects.length;
    const before = await mine();
    const data = { title: 'Cross-site attempt', summary: '', units: 'mm', visibility: 'private' };
    expect((await api.post('/api/projects', { headers: { origin: FOREIGN }, data })).status()).toBe(403);
    expect((await api.post('/api/projects', { headers: { 'sec-fetch-site': 'cross-site' }, data })).status()).toBe(403);
    // The form another site could send without asking first: text/plain.
    expect((await api.post('/api/projects', { headers: { 'content-type': 'text/plain' }, data: JSON.stringify(data) })).status()).toBe(415);
    expect(await mine()).toBe(before);
    // next-auth's own routes are covered too.
    expect((await api.post('/api/auth/signout', { headers: { origin: FOREIGN }, form: { csrfToken: 'x' } })).status()).toBe(403);
  });
});

test('pages work under the policy: no CSP violation on the log, the editor and the mailbox', async ({ page }) => {
  const violations: string[] = [];
  page.on('console', (m) => {
    if (/Content Security Policy|Refused to (load|execute|connect|frame)/i.test(m.text())) violations.push(m.text());
  });
  await signIn(page);
  await page.goto('/projects');
  const firstLog = page.locator('a[href$="/log"]').first();
  await firstLog.click();
  await page.waitForLoadState('networkidle');
  const edit = page.locator('a[href*="/entries/"][href$="/edit"]').first();
  if (await edit.count()) {
    await edit.click();
    await page.waitForLoadState('networkidle');
  }
  await page.goto('/dev/mailbox');
  await page.waitForLoadState('networkidle');
  await page.goto('/');
  await page.waitForLoadState('networkidle');
  expect(violations).toEqual([]);
});
