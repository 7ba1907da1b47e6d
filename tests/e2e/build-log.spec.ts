import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';

// The builder's daily round trip: write a formatted entry, add a photo, note a moment of a clip,
// and a reader who is signed out sees it all. Uses the seeded demo project.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
const fixture = (name: string) => path.join(__dirname, '..', 'fixtures', 'media', name);

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

test('write an entry with formatting and a photo; a signed-out reader sees it rendered', async ({ page, browser }) => {
  await signInAsBuilder(page);
  await page.goto(`/projects/${SLUG}/log`);
  const firstSession = page.getByRole('form', { name: 'New entry' }).first();
  await firstSession.getByLabel('New entry title').fill(`Checking the register ${stamp}`);
  await firstSession.getByLabel('Operation').selectOption('fitting');
  await firstSession.getByRole('button', { name: 'Add entry' }).click();
  await expect(page).toHaveURL(/\/entries\/\d+\/edit$/);
  const entryId = page.url().match(/entries\/(\d+)\/edit/)![1];

  const editor = page.locator('.ProseMirror');
  await editor.click();
  await page.keyboard.type('Runout at the register: ');
  await page.getByRole('button', { name: 'Bold' }).click();
  await page.keyboard.type('0.01 mm');
  await page.getByRole('button', { name: 'Bold' }).click();
  await page.keyboard.type(' total indicator reading.');
  await expect(page.getByRole('status').filter({ hasText: /^✓?\s*Saved/ })).toBeVisible({ timeout: 15_000 });

  // A photo through the real upload path (SDK → local upload service → callback → row).
  await page.locator('input[type="file"][multiple]').setInputFiles(fixture('scribe-4x3.png'));
  // The manager lists it only once the upload service has called back and the row exists.
  await expect(page.getByRole('form', { name: 'Caption for “scribe-4x3.png”' })).toBeVisible({ timeout: 20_000 });

  // Reload: everything persisted.
  await page.reload();
  await expect(page.locator('.ProseMirror strong')).toHaveText('0.01 mm');
  await expect(page.getByRole('form', { name: 'Caption for “scribe-4x3.png”' })).toBeVisible();

  const reader = await (await browser.newContext()).newPage();
  const res = await reader.goto(`/logs/${SLUG}/entries/${entryId}`);
  expect(res?.status()).toBe(200);
  await expect(reader.getByRole('heading', { level: 1, name: `Checking the register ${stamp}` })).toBeVisible();
  await expect(reader.locator('.prose-entry strong')).toHaveText('0.01 mm');
  await expect(reader.locator('.prose-entry')).toContainText('total indicator reading.');
  // The public page does not carry the editor.
  await expect(reader.locator('.ProseMirror')).toHaveCount(0);
  const gallery = reader.getByRole('list', { name: 'Photo' });
  await expect(gallery.locator('img')).toHaveCount(1);
  await gallery.getByRole('link').first().click();
  const viewer = reader.getByRole('dialog');
  await expect(viewer).toBeVisible();
  await reader.keyboard.press('Escape');
  await expect(viewer).toBeHidden();
  await reader.context().close();
});

test('note at the current moment of a clip, seek by clicking a note, and it persists', async ({ page }) => {
  await signInAsBuilder(page);
  await page.goto(`/logs/${SLUG}`);
  await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: 'Turning the spigot toward size' })).toBeVisible();
  await page.getByRole('link', { name: 'Edit entry' }).click();
  await expect(page).toHaveURL(/\/edit$/);

  const video = page.locator('video').first();
  await expect(video).toBeVisible();
  await page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));

  // Clicking a note seeks the player to its moment.
  await page.getByRole('button', { name: /^0:08, Measurement: Final reading/ }).click();
  await expect.poll(() => video.evaluate((v: HTMLVideoElement) => Math.round(v.currentTime))).toBe(8);
  await expect(page.getByRole('button', { name: /Note at 0:08/ })).toBeVisible();

  // A note at the current time.
  await page.getByRole('button', { name: /Note at 0:08/ }).click();
  const form = page.getByRole('form', { name: 'New note at 0:08' });
  await form.getByText('Caution', { exact: true }).click();
  const text = `Deburr the spigot edge before trying the chuck ${stamp}`;
  await form.getByLabel('What is happening here').fill(text);
  await form.getByRole('button', { name: 'Save note' }).click();
  const saved = page.getByRole('button', { name: new RegExp(`^0:08, Caution(, Now)?: ${text}`) });
  await expect(saved).toBeVisible();

  await page.reload();
  await expect(page.getByRole('button', { name: new RegExp(`^0:08, Caution(, Now)?: ${text}`) })).toBeVisible();

  // A moment link (#t=) opens the clip at that second for a reader, although this browser has just
  // played the clip (cached metadata once made the seek run before the player was there: it stayed at 0:00).
  const entryUrl = page.url().replace(/\/projects\/[^/]+\/entries\/(\d+)\/edit$/, `/logs/${SLUG}/entries/$1`);
  const clipId = await page.locator('[data-clip-workbench]').first().getAttribute('data-clip-workbench');
  await page.goto(`${entryUrl}?clip=${clipId}#t=6`);
  await page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));
  await expect.poll(() => page.locator('video').first().evaluate((v: HTMLVideoElement) => Math.round(v.currentTime))).toBe(6);
  await expect(page.getByRole('button', { name: /^0:04 to 0:08, Measurement, Now: Pass 3/ })).toHaveAttribute('aria-current', 'true');
});
