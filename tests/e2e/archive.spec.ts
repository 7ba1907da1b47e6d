import { readFile } from 'node:fs/promises';
import { test, expect, type Page } from '@playwright/test';
import { signUpAndVerify } from './support/accounts';
import { rawZip, unzip } from '../support/zip';

// The builder keeps the demo project as one zip from its page (watching it arrive), another member brings it
// back as a new project from the projects page and finds its sessions, notes, records and photos; hostile
// archives are refused in the form with a message saying what is wrong, and nothing of them is kept.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const TITLE = 'Cast-iron backplate for the 160 mm three-jaw chuck';
const SESSIONS = ['Bore and thread the plate to the spindle nose', 'Turning the spigot to fit the chuck recess', 'Drill, tap and counterbore for the chuck screws', 'Cutting the 36-tooth change gear'];
const stamp = Date.now().toString(36);

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

/** Sends a zip through "Bring in an archive" and waits for the form's refusal. */
async function bringIn(page: Page, name: string, buffer: Buffer) {
  await page.getByLabel(/Archive file/).setInputFiles({ name, mimeType: 'application/zip', buffer });
  await page.getByRole('button', { name: 'Bring in an archive' }).click();
  return page.getByRole('alert').filter({ hasText: 'Not brought in' });
}

test('the builder downloads the demo archive with progress; another member brings it back and finds it all', async ({ page, browser }) => {
  test.setTimeout(120_000);
  await signInAsBuilder(page);
  await page.goto(`/projects/${SLUG}/log`);
  await page.getByRole('link', { name: 'Download an archive' }).click();
  await expect(page).toHaveURL(/\/edit#archive$/);

  // Hold the zip's first byte back a moment, so the page's progress can be seen before it completes.
  await page.route(/\/api\/projects\/\d+\/archive$/, async (route) => {
    await new Promise((r) => setTimeout(r, 1500));
    await route.continue();
  });
  const downloading = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Download archive' }).click();
  const status = page.locator('#archive-status');
  await expect(status).toContainText('Preparing the archive: 4 sessions');
  await expect(page.getByRole('progressbar', { name: 'Archive received' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Preparing the archive…' })).toBeDisabled();
  const download = await downloading;
  expect(download.suggestedFilename()).toBe(`${SLUG}-archive.zip`);
  await expect(page.getByRole('status').filter({ hasText: 'Archive ready' })).toContainText(`Saved as ${SLUG}-archive.zip`);

  const zip = await readFile((await download.path())!);
  const files = await unzip(zip);
  const manifest = JSON.parse(files.get('scribeline-archive.json')!.toString('utf8'));
  expect(manifest).toMatchObject({ format: 'scribeline-archive', version: 1, project: { title: TITLE, slug: SLUG } });
  expect(manifest.counts.sessions).toBe(4);
  const names = [...files.keys()];
  expect(files.get('index.html')!.toString('utf8')).toContain(SESSIONS[1]);
  expect(names.filter((n) => /^entries\/e\d+\.html$/.test(n)).length).toBe(manifest.counts.entries);
  expect(names.filter((n) => /^markdown\/e\d+\.md$/.test(n)).length).toBe(manifest.counts.entries);
  const vtt = names.filter((n) => /^notes\/m\d+\.vtt$/.test(n));
  expect(vtt.length).toBeGreaterThan(0);
  // WebVTT files open with the signature line (W3C WebVTT, section 4.1).
  expect(files.get(vtt[0])!.toString('utf8')).toMatch(/^WEBVTT/);
  expect(files.get('measurements/records-and-readings.csv')!.toString('utf8')).toContain('Spigot diameter');
  expect(Array.isArray(JSON.parse(files.get('calculations/calculations.json')!.toString('utf8')))).toBe(true);
  expect(names.some((n) => n.startsWith('media/'))).toBe(true);

  // Another member, on a phone's width, brings it back.
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const other = await context.newPage();
  await signUpAndVerify(other, { name: 'Ilse Marrow', email: `ilse-${stamp}@example.test`, password: 'knurled thumb screw 1958' });
  await expect(other.getByRole('heading', { name: 'Bring in an archive' })).toBeVisible();
  expect(await other.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await other.getByLabel(/Archive file/).setInputFiles({ name: download.suggestedFilename(), mimeType: 'application/zip', buffer: zip });
  await other.getByRole('button', { name: 'Bring in an archive' }).click();
  await expect(other).toHaveURL(/\/projects\/[^/]+\/log\?imported=1$/, { timeout: 60_000 });
  await expect(other.getByRole('status').filter({ hasText: 'Archive brought in' })).toContainText('4 sessions');
  for (const title of SESSIONS) await expect(other.getByRole('heading', { level: 2, name: title })).toBeVisible();
  const slug = new URL(other.url()).pathname.split('/')[2];

  // Its spigot entry: the clip's notes, the records and the photo (its bytes served from the upload service).
  await other.goto(`/logs/${slug}`);
  await other.getByRole('link', { name: new RegExp(SESSIONS[1]) }).first().click();
  await expect(other).toHaveURL(/\/sessions\/\d+$/);
  await expect(other.getByRole('heading', { level: 1, name: SESSIONS[1] })).toBeVisible();
  await other.getByRole('main').getByRole('link', { name: /Turning the spigot toward size/ }).filter({ visible: true }).click();
  await expect(other).toHaveURL(/\/entries\/\d+/);
  await expect(other.getByRole('heading', { level: 1, name: 'Turning the spigot toward size' })).toBeVisible();
  await expect(other.getByRole('list', { name: 'Notes in time order' })).toContainText('Pass 3: spigot at 130.03 mm');
  await expect(other.getByRole('region', { name: 'Measurements' })).toContainText('Spigot diameter');
  const photo = other.getByRole('region', { name: 'Photos' }).getByRole('img').first();
  await photo.scrollIntoViewIfNeeded();
  await expect(photo).toBeVisible();
  await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
  await context.close();
});

test('hostile archives are refused in the form with a clear message, and nothing is kept', async ({ page }) => {
  test.setTimeout(90_000);
  await signUpAndVerify(page, { name: 'Bram Oakes', email: `bram-${stamp}@example.test`, password: 'boring bar chatter 1961' });
  const manifest = (extra: Record<string, unknown> = {}) => ({
    name: 'scribeline-archive.json',
    data: Buffer.from(JSON.stringify({ format: 'scribeline-archive', version: 1, createdAt: new Date().toISOString(), project: { title: 'x', slug: 'x' }, counts: { sessions: 0, entries: 0, media: 0, notes: 0, records: 0, readings: 0, pairs: 0, calculations: 0 }, files: [], ...extra })),
  });

  const escaping = await bringIn(page, 'escaping.zip', rawZip([manifest(), { name: 'media/../../etc/cron.d/job', data: Buffer.from('x') }]));
  await expect(escaping).toContainText('climbs out of the folder');
  await expect(escaping).toContainText('Nothing from it was kept.');

  const wrong = await bringIn(page, 'wrong-manifest.zip', rawZip([manifest({ format: 'some-other-journal' })]));
  await expect(wrong).toContainText('This is not a Scribeline archive');

  const none = await bringIn(page, 'no-manifest.zip', rawZip([{ name: 'index.html', data: Buffer.from('<p>hello</p>') }]));
  await expect(none).toContainText('scribeline-archive.json is missing');

  // The form stays usable, and the member still has no project.
  await expect(page.getByRole('button', { name: 'Bring in an archive' })).toBeEnabled();
  await page.reload();
  await expect(page.getByText('No projects yet')).toBeVisible();
});
