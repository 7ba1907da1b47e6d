import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';
import { signUpAndVerify } from './support/accounts';

// A reader asks about a moment of a clip; the builder finds the question among the clip's notes and a
// click there plays from that moment. The entry and its clip are made here; the demo builder's
// published project only gives them a published session to live in.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
// 12 s, H.264: the demo clip, uploaded through the real upload path like any builder's clip.
const CLIP = path.join(__dirname, '..', '..', 'db', 'seeders', 'media', 'spigot-turning.mp4');
const reader = { name: `Ilse Marrow ${stamp}`, email: `ilse-${stamp}@example.test`, password: 'knurled thimble' };

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible({ timeout: 30_000 });
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
const videoTime = (page: Page) => page.locator('video').first().evaluate((v: HTMLVideoElement) => v.currentTime);
const videoReady = (page: Page) => page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));

test('a reader comments pinned to a moment of a clip; the builder sees it among the notes and it seeks the player', async ({ browser }) => {
  test.setTimeout(180_000);

  // The builder writes an entry in a published session and uploads a clip to it.
  const builder = await (await browser.newContext()).newPage();
  await signIn(builder, 'edda@renwick-shop.test', 'shop-demo-2026');
  await builder.goto(`/logs/${SLUG}`);
  const sessionHref = await builder.locator(`a[href^="/logs/${SLUG}/sessions/"]`).first().getAttribute('href');
  const sessionId = sessionHref!.match(/\/sessions\/(\d+)/)![1];
  const made = await builder.request.post(`/api/sessions/${sessionId}/entries`, { data: { title: `Spigot passes ${stamp}`, operation: 'turning' } });
  expect(made.status()).toBe(201);
  const entryId: number = (await made.json()).entry.id;
  try {
    await builder.goto(`/projects/${SLUG}/entries/${entryId}/edit`);
    await builder.locator(`input[type="file"][accept*="video/mp4"]:not([capture])`).setInputFiles(CLIP);
    await expect(builder.getByRole('form', { name: 'Caption for “spigot-turning.mp4”' })).toBeVisible({ timeout: 30_000 });

    // A new member signs up and signs in.
    const page = await (await browser.newContext()).newPage();
    await signUpAndVerify(page, reader);

    // The reader plays to a moment and asks about it there, before the comment form's code has arrived (it loads
    // on demand; on a slow phone it can come after the click): the form still opens pinned to that moment.
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    let formCodeHeld = false;
    await page.route('**/_next/static/chunks/**', async (route) => {
      const response = await route.fetch();
      const body = await response.text();
      if (body.includes('Tie it to the clip at')) {
        formCodeHeld = true;
        await released;
      }
      await route.fulfill({ response, body });
    });
    await page.goto(`/logs/${SLUG}/entries/${entryId}`);
    await videoReady(page);
    await page.locator('video').first().evaluate((v: HTMLVideoElement) => {
      v.currentTime = 5.4;
    });
    await expect.poll(() => formCodeHeld).toBe(true);
    await page.getByRole('button', { name: 'Ask about this moment (0:05)' }).click();
    const form = page.getByRole('form', { name: 'New comment' });
    await expect(form).toHaveCount(0); // still on its way
    release();
    await expect(form.getByRole('checkbox', { name: 'Tie it to the clip at 0:05' })).toBeChecked();
    await expect(form.getByLabel('Your comment')).toBeFocused();
    const question = `How did you measure the spigot here? ${stamp}`;
    await form.getByLabel('Your comment').fill(question);
    await form.getByRole('button', { name: 'Post comment' }).click();
    await expect(form.getByRole('status')).toContainText('Posted');

    const thread = page.locator('#comments article').filter({ hasText: question });
    await expect(thread.getByRole('button', { name: /^Asked at 0:05/ })).toBeVisible();
    // Already among the notes for the reader too, marked as a reader's question.
    await expect(page.getByRole('list', { name: 'Notes in time order' }).getByRole('button', { name: new RegExp(`^0:05, Reader’s question from ${escape(reader.name)}(, Now)?: ${escape(question)}`) })).toBeVisible();

    // The builder opens the entry's edit page: the question is among the clip's notes.
    await builder.goto(`/projects/${SLUG}/entries/${entryId}/edit`);
    const notes = builder.getByRole('list', { name: 'Notes in time order' });
    const item = notes.getByRole('button', { name: new RegExp(`^0:05, Reader’s question from ${escape(reader.name)}(, Now)?: ${escape(question)}`) });
    await expect(item).toBeVisible();
    await expect(item).toContainText('Reader’s question');
    await expect(item).toContainText(reader.name);

    // Clicking it seeks the player to that moment (pinned at whole seconds: 5.4 s → 0:05).
    await videoReady(builder);
    await builder.locator('video').first().evaluate((v: HTMLVideoElement) => {
      v.currentTime = 0;
    });
    await item.click();
    await expect.poll(() => videoTime(builder)).toBeCloseTo(5, 1);
    await expect(item).toHaveAttribute('aria-current', 'true');

    // And on the reader's page, signed out, the same question seeks the player as notes do.
    const anonymous = await (await browser.newContext()).newPage();
    await anonymous.goto(`/logs/${SLUG}/entries/${entryId}`);
    await videoReady(anonymous);
    await anonymous.getByRole('button', { name: new RegExp(`^0:05, Reader’s question from ${escape(reader.name)}`) }).click();
    await expect.poll(() => videoTime(anonymous)).toBeCloseTo(5, 1);
    await expect(anonymous.getByRole('link', { name: 'Sign in to comment' })).toHaveAttribute('href', `/sign-in?next=${encodeURIComponent(`/logs/${SLUG}/entries/${entryId}#comments`)}`);
  } finally {
    // Tidy up: the builder deletes the entry (its clip and comments go with it).
    expect((await builder.request.delete(`/api/entries/${entryId}`)).status()).toBe(204);
  }
});
