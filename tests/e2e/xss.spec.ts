import { test, expect, type APIRequestContext, type Page } from '@playwright/test';
import { asNewVisitor, linkIn, waitForMail } from './support/accounts';

// Common cross-site scripting payloads typed where people type: account names, project, session and
// entry titles, project summaries, comments. Each payload, if it ever ran, would set window.__xss or
// open a dialog; every page that shows them must render them as inert text.
const PAYLOADS = [
  '<script>window.__xss=1</script>',
  '<img src=x onerror="window.__xss=1">',
  '"><svg onload="window.__xss=1">',
  "'><iframe srcdoc=\"<script>parent.__xss=1</script>\"></iframe>",
  '<a href="javascript:window.__xss=1">click me</a>',
  'javascript:window.__xss=1',
  '<details open ontoggle="window.__xss=1">x</details>',
  '</title><script>window.__xss=1</script>',
  '{{constructor.constructor("window.__xss=1")()}}',
  '<body onload="window.__xss=1">',
  '<math><mtext><table><mglyph><style><img src=x onerror="window.__xss=1">',
  'data:text/html;base64,PHNjcmlwdD53aW5kb3cuX194c3M9MTwvc2NyaXB0Pg==',
];

const stamp = Date.now().toString(36);
const password = 'scribed line 0.02';

/** Signs up through the API, then verifies the address with the link from the e-mail (the local mail service). */
async function signUp(page: Page, name: string, email: string) {
  await asNewVisitor(page);
  const res = await page.request.post('/api/account', { data: { name, email, password } });
  expect(res.status(), await res.text()).toBe(202);
  const mail = await waitForMail(page, email, (m) => /Verify your e-mail address/.test(m.subject));
  const token = new URL(linkIn(mail.text, '/verify-email'), 'http://x').searchParams.get('token');
  const verified = await page.request.post('/api/account/verify', { data: { token } });
  expect(verified.status(), await verified.text()).toBe(200);
}

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

async function json(res: Awaited<ReturnType<APIRequestContext["post"]>>, status = [200, 201]): Promise<any> {
  expect(status, `${res.url()} → ${res.status()}: ${await res.text()}`).toContain(res.status());
  return res.json();
}

/** Opens a page and proves nothing ran: no dialog, no flag, no element the payloads would create. */
async function expectInert(page: Page, path: string, mustShow: string[]) {
  const dialogs: string[] = [];
  page.on('dialog', (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  const res = await page.goto(path);
  expect(res?.status(), path).toBe(200);
  await page.waitForLoadState('networkidle');
  for (const text of mustShow) await expect(page.getByText(text, { exact: false }).first(), `${path} shows ${text}`).toBeVisible();
  expect(await page.evaluate(() => (window as unknown as { __xss?: number }).__xss), `${path}: a payload ran`).toBeUndefined();
  expect(dialogs, `${path}: a dialog opened`).toEqual([]);
  // None of the payloads' elements made it into the document as elements.
  const injected = await page.evaluate(() => ({
    // A script element whose code is a payload's (the page's own data scripts carry the text as JSON strings).
    scripts: [...document.scripts].filter((s) => /^\s*(window|parent)\.__xss=1\s*$/.test(s.textContent ?? '')).length,
    handlers: [...document.querySelectorAll('*')].filter((el) => [...el.attributes].some((a) => a.name.startsWith('on') && a.value.includes('__xss'))).length,
    jsLinks: [...document.querySelectorAll('a[href]')].filter((a) => /^\s*(javascript|data):/i.test(a.getAttribute('href') ?? '')).length,
    frames: [...document.querySelectorAll('iframe[srcdoc]')].length,
  }));
  expect(injected, path).toEqual({ scripts: 0, handlers: 0, jsLinks: 0, frames: 0 });
  page.removeAllListeners('dialog');
}

test('cross-site scripting payloads in names, titles, summaries and comments render as inert text', async ({ browser }) => {
  test.setTimeout(240_000);
  // The builder's name carries a payload; so does the reader's.
  const builderCtx = await browser.newContext();
  const builderPage = await builderCtx.newPage();
  const builderName = `Ilse ${PAYLOADS[1]}`.slice(0, 80);
  const builderEmail = `ilse-${stamp}@example.test`;
  await signUp(builderPage, builderName, builderEmail);
  await signIn(builderPage, builderEmail);
  const api = builderCtx.request;
  const builder = (await (await api.get('/api/me/account')).json()) as { handle: string };

  const { project } = await json(
    await api.post('/api/projects', { data: { title: `Gib strip ${stamp} ${PAYLOADS[0]}`.slice(0, 120), summary: PAYLOADS.join('\n'), units: 'mm', visibility: 'published' } }),
  );
  const { session } = await json(
    await api.post(`/api/projects/${project.id}/sessions`, { data: { title: `Scraping ${PAYLOADS[2]}`.slice(0, 120), heldOn: '2026-11-28', minutesSpent: 90, planned: PAYLOADS[4], done: PAYLOADS[6], nextSteps: PAYLOADS[7] } }),
  );
  await json(await api.patch(`/api/sessions/${session.id}/visibility`, { data: { visibility: 'published' } }));
  const body = {
    type: 'doc',
    content: [
      { type: 'paragraph', content: [{ type: 'text', text: PAYLOADS[3] }] },
      { type: 'paragraph', content: [{ type: 'text', text: 'a link', marks: [{ type: 'link', attrs: { href: 'javascript:window.__xss=1' } }] }] },
    ],
  };
  const { entry } = await json(await api.post(`/api/sessions/${session.id}/entries`, { data: { title: `Bluing ${PAYLOADS[8]}`.slice(0, 120), operation: 'finishing', body } }));

  // A reader with a payload in their name comments with every payload.
  const readerCtx = await browser.newContext();
  const readerPage = await readerCtx.newPage();
  const readerName = `Oskar ${PAYLOADS[2]}`.slice(0, 80);
  const readerEmail = `oskar-${stamp}@example.test`;
  await signUp(readerPage, readerName, readerEmail);
  await signIn(readerPage, readerEmail);
  // Posted in two comments (and a reply) to stay inside the per-member rate limit.
  const first = await json(await readerCtx.request.post(`/api/entries/${entry.id}/comments`, { data: { body: PAYLOADS.slice(0, 6).join('\n') } }));
  await json(await readerCtx.request.post(`/api/entries/${entry.id}/comments`, { data: { body: PAYLOADS.slice(6).join('\n') } }));
  await json(await readerCtx.request.post(`/api/entries/${entry.id}/comments`, { data: { body: `see https://example.test/a?b=1 and ${PAYLOADS[4]}`, parentId: first.comment.id } }));

  const anonymous = await (await browser.newContext()).newPage();
  const where = [
    { page: anonymous, path: '/', show: [`Scraping`] },
    { page: anonymous, path: `/logs/${project.slug}`, show: [`Gib strip ${stamp}`, '<script>window.__xss=1</script>'] },
    { page: anonymous, path: `/logs/${project.slug}/sessions/${session.id}`, show: ['Scraping "><svg onload="window.__xss=1">'] },
    { page: anonymous, path: `/logs/${project.slug}/entries/${entry.id}`, show: ['Bluing', PAYLOADS[3], 'onerror'] },
    { page: anonymous, path: `/builders/${builder.handle}`, show: ['Ilse', `Gib strip ${stamp}`] },
    { page: builderPage, path: '/projects', show: [`Gib strip ${stamp}`] },
    { page: builderPage, path: `/projects/${project.slug}/log`, show: ['Scraping'] },
    { page: builderPage, path: `/projects/${project.slug}/entries/${entry.id}/edit`, show: [] },
    { page: readerPage, path: `/logs/${project.slug}/entries/${entry.id}`, show: ['Oskar', 'https://example.test/a?b=1'] },
  ];
  for (const w of where) await expectInert(w.page, w.path, w.show);
  // On the edit page the title sits, as typed, in its input.
  await builderPage.goto(`/projects/${project.slug}/entries/${entry.id}/edit`);
  expect(await builderPage.locator('input').evaluateAll((els) => els.some((e) => (e as HTMLInputElement).value.startsWith('Bluing {{constructor')))).toBe(true);

  // The plain URL in the reply became a safe link; the javascript: one stayed text.
  const link = anonymous.getByRole('link', { name: 'https://example.test/a?b=1' });
  await anonymous.goto(`/logs/${project.slug}/entries/${entry.id}`);
  await expect(link).toHaveAttribute('href', 'https://example.test/a?b=1');
  await expect(link).toHaveAttribute('rel', /noopener/);
  await expect(anonymous.getByRole('link', { name: /javascript:/ })).toHaveCount(0);

  await builderCtx.close();
  await readerCtx.close();
});
