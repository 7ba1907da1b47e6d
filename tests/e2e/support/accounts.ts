import { expect, type Page } from '@playwright/test';

const MAILBOX = process.env.MAILBOX_URL ?? 'http://127.0.0.1:2590';

type Captured = { subject: string; text: string; to: string };

/** The mail worker sends every 5 s: polls the local mail service's API until a message to `to` matches. */
export async function waitForMail(page: Page, to: string, match: (m: Captured) => boolean, timeoutMs = 60_000): Promise<Captured> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await page.request.get(`${MAILBOX}/messages?to=${encodeURIComponent(to)}`);
    if (res.ok()) {
      const found = ((await res.json()) as { messages: Captured[] }).messages.find(match);
      if (found) return found;
    }
    if (Date.now() > until) throw new Error(`No matching e-mail to ${to} within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 1000));
  }
}

/** The first link in a message's text whose path starts with `path`, as a path of this site. */
export function linkIn(text: string, path: string): string {
  const m = new RegExp(`https?://[^\\s/]+(${path.replace(/[/.?]/g, (c) => `\\${c}`)}[^\\s]*)`).exec(text);
  if (!m) throw new Error(`No ${path} link in:\n${text}`);
  return m[1];
}

let clients = 0;
/**
 * Makes the page's browser a visitor of its own: its requests carry an address of the benchmarking range
 * (198.18.0.0/15) as X-Forwarded-For, which the test server believes from loopback (scripts/test.sh), so the
 * hourly per-client limits count each new member apart, as they would count real people.
 */
export async function asNewVisitor(page: Page): Promise<Record<string, string>> {
  clients += 1;
  const header = { 'x-forwarded-for': `198.18.${process.pid % 250}.${clients % 250}` };
  await page.context().setExtraHTTPHeaders(header);
  return header;
}

/**
 * Signs up through the form, follows the verification link from the e-mail, and signs in on the page it
 * lands on (the address filled in). Ends signed in, on `landing` (the projects page unless a return path was given).
 */
export async function signUpAndVerify(page: Page, who: { name: string; email: string; password: string }, landing: string | RegExp = 'My projects'): Promise<void> {
  await asNewVisitor(page);
  // Already on the sign-up page (reached from an invitation, say): keep its return path.
  if (!new URL(page.url()).pathname.startsWith('/sign-up')) await page.goto('/sign-up');
  await page.getByLabel('Your name').fill(who.name);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Check your mail' })).toBeVisible({ timeout: 30_000 });
  const mail = await waitForMail(page, who.email, (m) => /Verify your e-mail address/.test(m.subject));
  await page.goto(linkIn(mail.text, '/verify-email'));
  await page.getByRole('button', { name: 'Verify my address' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Address verified' })).toBeVisible();
  await expect(page.getByLabel('E-mail')).toHaveValue(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  if (typeof landing === 'string') await expect(page.getByRole('heading', { name: landing })).toBeVisible();
  else await expect(page).toHaveURL(landing);
}
