import { test, expect, type APIRequestContext, type Page } from '@playwright/test';
import { signUpAndVerify } from './support/accounts';

// A builder invites a mentor by e-mail; the mentor accepts, flags an entry; the builder sees the banner,
// says they have seen it, answers it; the flag shows answered; the mentor's e-mail arrives.
// Everything is made here, with fresh accounts, on a private project.
const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
const builder = { name: 'Rosalind Brack', email: `rosalind-${stamp}@example.test`, password: 'four-jaw independent' };
const mentor = { name: 'Halvard Quist', email: `halvard-${stamp}@example.test`, password: 'dial indicator 0.01' };
const MAILBOX = process.env.MAILBOX_URL ?? 'http://127.0.0.1:2590';

type Captured = { subject: string; text: string; to: string };
// Each of these actions writes rows and an e-mail in one transaction: give them longer than a click.
const slow = { timeout: 30_000 };

/** The mail worker sends every 5 s: poll the local mail service until a message matches. */
async function waitForMail(request: APIRequestContext, to: string, match: (m: Captured) => boolean, timeoutMs = 60_000): Promise<Captured> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await request.get(`${MAILBOX}/messages?to=${encodeURIComponent(to)}`);
    if (res.ok()) {
      const found = ((await res.json()) as { messages: Captured[] }).messages.find(match);
      if (found) return found;
    }
    if (Date.now() > until) throw new Error(`No matching e-mail to ${to} within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 1000));
  }
}

async function signIn(page: Page, who: { email: string; password: string }) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible({ timeout: 30_000 });
  // Sign-in refreshes the page once it lands: let that finish before navigating on.
  await page.waitForLoadState('networkidle');
}

test('mentor flags an entry → builder marks it seen → answers it → mentor is e-mailed', async ({ page, browser, request }) => {
  test.setTimeout(300_000);
  // Both sign up and verify their addresses (accepting an invitation needs a verified one).
  for (const who of [builder, mentor]) {
    const context = await browser.newContext();
    await signUpAndVerify(await context.newPage(), who);
    await context.close();
  }

  // The builder's private project with one session and one turning entry, made through the API as them.
  await signIn(page, builder);
  const api = page.request;
  const project = (await (await api.post('/api/projects', { data: { title: `First power-on ${stamp}`, summary: '', units: 'mm', visibility: 'private' } })).json()).project;
  const session = (await (await api.post(`/api/projects/${project.id}/sessions`, { data: { title: 'Mounting the new plate', heldOn: '2026-10-10', minutesSpent: 60 } })).json()).session;
  const entryRes = await api.post(`/api/sessions/${session.id}/entries`, { data: { title: 'First run with the plate on the spindle', operation: 'turning' } });
  expect(entryRes.status()).toBe(201);
  const entry = (await entryRes.json()).entry;

  // Invitation through the project settings.
  await page.goto(`/projects/${project.slug}/edit`, { waitUntil: 'networkidle' });
  await page.getByLabel('Their e-mail address').fill(mentor.email);
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`Invitation sent to ${mentor.email}`)).toBeVisible(slow);
  const invite = await waitForMail(request, mentor.email, (m) => m.subject.includes('asks you to mentor'));
  const link = /(https?:\/\/\S+\/invitations\/accept\?token=\S+)/.exec(invite.text)![1];

  // The mentor accepts, signed in as the invited address.
  const mentorContext = await browser.newContext();
  const m = await mentorContext.newPage();
  await signIn(m, mentor);
  await m.goto(new URL(link).pathname + new URL(link).search, { waitUntil: 'networkidle' });
  await m.getByRole('button', { name: /Accept and mentor/ }).click();
  await expect(m).toHaveURL(new RegExp(`/logs/${project.slug}$`), { timeout: 30_000 });
  await expect(m.getByRole('heading', { name: `First power-on ${stamp}` })).toBeVisible(slow);

  // …and flags the entry.
  await m.goto(`/logs/${project.slug}/entries/${entry.id}`, { waitUntil: 'networkidle' });
  await expect(m.getByTestId('operation-cautions')).toContainText('Usual cautions for turning');
  await m.getByRole('button', { name: 'Flag a risk' }).click();
  await m.getByRole('radio', { name: /^Warning/ }).check();
  await m.getByLabel('Hazard').selectOption('rotating-work');
  await m.getByLabel('What is the concern?').fill('A plate not fully seated on the spindle shoulder can shift at the first start.');
  await m.getByLabel('What to do instead').fill('Check it is seated and the chuck key is out; turn by hand, start slow, stand clear.');
  await m.getByRole('button', { name: 'Raise the flag' }).click();
  await expect(m.getByText('Flag raised.')).toBeVisible(slow);

  // The builder sees the banner on the entry's edit page (and the count above the log).
  await page.goto(`/projects/${project.slug}/log`);
  await expect(page.getByTestId('open-flags-summary')).toContainText('1 open risk flag from a mentor');
  await page.goto(`/projects/${project.slug}/entries/${entry.id}/edit`, { waitUntil: 'networkidle' });
  const flags = page.getByTestId('entry-flags');
  await expect(flags.getByRole('heading', { name: /Risk flags/ })).toContainText('1 open');
  await expect(flags).toContainText('A plate not fully seated on the spindle shoulder');
  await expect(flags.locator('[data-severity="warning"]').first()).toContainText('Warning');
  await expect(flags.locator('[data-flag-status="open"]')).toContainText('Waiting for the builder');

  await expect(flags.locator('[data-flag-mark="open"]').first()).toBeAttached();
  await flags.getByRole('button', { name: 'I’ve seen it' }).click();
  await expect(flags.locator('[data-flag-status="acknowledged"]')).toContainText('Seen by the builder', slow);
  await expect(flags.locator('[data-flag-status="acknowledged"] [data-flag-mark="acknowledged"]')).toBeAttached();

  const answer = `Seated with a feeler refusing all round; key on a lanyard; first start at 60 rpm. ${stamp}`;
  await flags.getByRole('button', { name: 'Answer', exact: true }).click();
  await flags.getByLabel(`Your answer to ${mentor.name}`).fill(answer);
  await flags.getByRole('button', { name: 'Send the answer' }).click();
  await expect(flags.getByText(`Answered. ${mentor.name} has been e-mailed your answer.`)).toBeVisible(slow);
  await expect(flags.getByTestId('resolved-flags')).toContainText('1 answered flag');

  // Readers of the entry (here the mentor) see it answered, folded away with the builder's answer.
  await m.goto(`/logs/${project.slug}/entries/${entry.id}`);
  const resolved = m.getByTestId('resolved-flags');
  await expect(resolved).toContainText('1 answered flag');
  await resolved.locator('summary').click();
  await expect(resolved.locator('[data-flag-status="resolved"]')).toContainText('Answered');
  await expect(resolved.locator('[data-flag-status="resolved"] [data-flag-mark="resolved"]')).toBeAttached();
  await expect(resolved).toContainText(answer);

  // The mentor's e-mail arrives with the answer and a link to the entry.
  const mail = await waitForMail(request, mentor.email, (x) => x.subject.includes('answered your flag'));
  expect(mail.subject).toContain(builder.name);
  expect(mail.text).toContain(answer);
  expect(mail.text).toContain(`/logs/${project.slug}/entries/${entry.id}#flag-`);
  await mentorContext.close();
});
