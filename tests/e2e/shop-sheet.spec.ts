import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';

// The builder prints the demo's spigot session as a shop sheet: Chromium's own PDF of it is one page of the
// paper chosen, with the spigot's limits in both units on it; entry and session pages print with no site chrome
// and no controls, a clip as its first frame with its moments beneath.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const ISO286 = 'ISO 286-2:2010: 130 k6 = +3 / +28 µm, 130 H7 = 0 / +40 µm — from memory';
const INWARD = 'IEEE/ASTM SI 10, converted limits rounded inward — from memory; 130.003 / 25.4 = 5.11823, 130.028 / 25.4 = 5.11921';
const PAPER = 'ISO 216: A4 is 210 × 297 mm = 595.28 × 841.89 pt; ANSI Letter 8.5 × 11 in = 612 × 792 pt';

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

/** Pages of a PDF as Chromium writes it (one /Type /Page object each), and the first page's size in points. */
function pdfFacts(pdf: Buffer): { pages: number; width: number; height: number } {
  const text = pdf.toString('latin1');
  const pages = (text.match(/\/Type\s*\/Page(?![a-zA-Z])/g) ?? []).length;
  const box = /\/MediaBox\s*\[\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s*\]/.exec(text);
  expect(box, 'the PDF names a MediaBox').not.toBeNull();
  return { pages, width: Number(box![3]) - Number(box![1]), height: Number(box![4]) - Number(box![2]) };
}

test('a session’s shop sheet prints on one page with the limits in both units', async ({ page }) => {
  await signInAsBuilder(page);
  await page.goto(`/projects/${SLUG}/log`);
  await page.getByRole('link', { name: 'Print sheet for session Turning the spigot to fit the chuck recess' }).click();
  await expect(page).toHaveURL(/\/sessions\/\d+\/sheet$/);
  const sheet = page.getByTestId('shop-sheet');
  await expect(sheet.getByRole('heading', { level: 1 })).toContainText('Turning the spigot to fit the chuck recess');

  const spigot = sheet.getByTestId('sheet-record').filter({ hasText: 'Spigot diameter' });
  await expect(spigot.getByTestId('limits-mm')).toContainText('130.003 – 130.028 mm'); // ISO286
  await expect(spigot.getByTestId('limits-in')).toContainText('5.1183 – 5.1192 in'); // INWARD
  await expect(spigot).toContainText('Micrometer');
  const recess = sheet.getByTestId('sheet-record').filter({ hasText: 'Chuck recess' });
  await expect(recess.getByTestId('limits-mm')).toContainText('130.000 – 130.040 mm'); // ISO286
  // Boxes to write in: three readings and a temperature per record.
  await expect(spigot.getByTestId('reading-box')).toHaveCount(4);
  await expect(sheet.getByTestId('sheet-flag')).toContainText('chuck key');
  await expect(sheet).toContainText('Follow your machine’s manual');

  // The page's controls and the site's header are not printed.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Print this sheet' })).toBeHidden();
  await expect(page.locator('body > header')).toBeHidden();
  await expect(spigot.getByTestId('limits-mm')).toBeVisible();

  const a4 = pdfFacts(await page.pdf({ preferCSSPageSize: true }));
  expect(a4.pages).toBe(1);
  expect(a4.width).toBeCloseTo(595.28, 0); // PAPER
  expect(a4.height).toBeCloseTo(841.89, 0);

  // Back to the screen for the form (page.pdf() under an emulated screen would print the screen's CSS).
  await page.emulateMedia({ media: null });
  await page.getByRole('radio', { name: 'Letter' }).check();
  await page.getByRole('button', { name: 'Update the sheet' }).click();
  await expect(page).toHaveURL(/paper=letter/);
  await expect(page.getByTestId('sheet-record')).toHaveCount(2);
  const letter = pdfFacts(await page.pdf({ preferCSSPageSize: true }));
  expect(letter.pages).toBe(1);
  expect(letter.width).toBeCloseTo(612, 0); // PAPER
  expect(letter.height).toBeCloseTo(792, 0);

  // Narrowed to the spigot alone.
  await page.getByRole('checkbox', { name: 'Chuck recess (register bore)' }).uncheck();
  await page.getByRole('button', { name: 'Update the sheet' }).click();
  await expect(page.getByTestId('sheet-record')).toHaveCount(1);
  await expect(page.getByTestId('sheet-record')).toContainText('Spigot diameter');
});

test('the bolt-circle session fits one A4 page with every hole and the cautions', async ({ page }) => {
  await signInAsBuilder(page);
  await page.goto(`/projects/${SLUG}/log`);
  await page.getByRole('link', { name: 'Print sheet for session Drill, tap and counterbore for the chuck screws' }).click();
  const bolt = page.getByTestId('sheet-calculation').filter({ hasText: 'Bolt circle of the three M8 holes' });
  // 124 mm pitch circle, hole 1 at 90°: (0, 62) mm — worked by hand, x = r·cos θ, y = r·sin θ.
  await expect(bolt.locator('tbody tr')).toHaveCount(3);
  await expect(bolt.locator('tbody tr').first()).toContainText('62.000');
  await expect(page.getByTestId('shop-sheet')).toContainText('Breaking taps and drills');
  const facts = pdfFacts(await page.pdf({ preferCSSPageSize: true }));
  expect(facts.pages).toBe(1);
});

/** In print media: no button, no link drawn as a button, no menu of links and no player with controls shows. */
async function expectNoControls(page: Page) {
  await expect(page.getByRole('button')).toHaveCount(0);
  await expect(page.getByRole('navigation')).toHaveCount(0);
  await expect(page.locator('[data-control]').filter({ visible: true })).toHaveCount(0);
  await expect(page.locator('form').filter({ visible: true })).toHaveCount(0);
  await expect(page.locator('video[controls]').filter({ visible: true })).toHaveCount(0);
}

test('an entry page prints its words, the clip as its first frame with its moments, and no controls', async ({ page }) => {
  // Signed in as the builder, so the page has its most controls: edit, flag, comment, reply, report.
  await signInAsBuilder(page);
  await page.goto(`/logs/${SLUG}`);
  await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().click();
  await expect(page).toHaveURL(/\/entries\/\d+/);
  await expect(page.getByRole('link', { name: 'Edit entry' })).toBeVisible();
  await expect(page.getByRole('button').first()).toBeVisible();
  // On screen the paper copy of the clip is not shown.
  await expect(page.getByTestId('clips-on-paper')).toBeHidden();

  await page.emulateMedia({ media: 'print' });
  await expect(page.locator('body > header')).toBeHidden();
  await expect(page.locator('body > footer')).toBeHidden();
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expectNoControls(page);
  await expect(page.getByRole('link', { name: 'Edit entry' })).toBeHidden();

  // The clip as its first frame: a video element without controls, showing a frame, its caption beneath.
  const clip = page.getByTestId('clip-on-paper');
  await expect(clip).toHaveCount(1);
  const frame = clip.locator('video');
  await expect(frame).toBeVisible();
  await expect(frame).not.toHaveAttribute('controls');
  await expect.poll(() => frame.evaluate((v: HTMLVideoElement) => v.readyState), { message: 'the first frame is loaded' }).toBeGreaterThanOrEqual(2);
  await expect(clip.locator('figcaption')).toHaveText('Last passes on the spigot');
  // Its moments, each of the clip's notes once, in time order, time and words (other tests may have added
  // notes to the demo clip, so the count comes from the clip itself).
  const entryId = page.url().match(/entries\/(\d+)/)![1];
  const media: { id: number; kind: string }[] = (await (await page.request.get(`/api/entries/${entryId}/media`)).json()).media;
  const clipId = media.find((m) => m.kind === 'clip')!.id;
  const notes: { startMs: number; text: string }[] = (await (await page.request.get(`/api/media/${clipId}/notes`)).json()).notes;
  const moments = clip.getByTestId('moment-on-paper');
  await expect(moments).toHaveCount(notes.length);
  const texts = await moments.allInnerTexts();
  notes.forEach((n, i) => expect(texts[i]).toContain(n.text.slice(0, 40)));
  // The demo's own notes, with their times (seeded: db/seeders).
  await expect(moments.filter({ hasText: 'Facing the spigot face with a sharp round-nose tool' })).toContainText('0:00–0:04');
  await expect(moments.filter({ hasText: 'Pass 3: spigot at 130.03 mm' })).toContainText('0:04–0:08');
  await expect(moments.filter({ hasText: 'Final reading 130.012 mm' })).toContainText('0:08');
  // The photos still print (they are links to the full-size photo, not buttons).
  await expect(page.getByRole('region', { name: 'Photos' }).getByRole('img').first()).toBeVisible();

  const dir = path.resolve(process.env.E2E_OUTPUT_DIR ?? '.data/test-results', 'print');
  await mkdir(dir, { recursive: true });
  await page.screenshot({ path: path.join(dir, 'entry-print.png'), fullPage: true });
  const pdf = pdfFacts(await page.pdf({ format: 'A4' }));
  expect(pdf.pages).toBeGreaterThanOrEqual(1);
});

test('a session page prints without its buttons and links drawn as buttons', async ({ page }) => {
  await signInAsBuilder(page);
  await page.goto(`/logs/${SLUG}`);
  await page.getByRole('link', { name: /Turning the spigot to fit the chuck recess/ }).first().click();
  await expect(page).toHaveURL(/\/sessions\/\d+/);
  await expect(page.getByRole('link', { name: 'Print sheet' })).toBeVisible();
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('heading', { level: 1 })).toHaveText('Turning the spigot to fit the chuck recess');
  await expectNoControls(page);
  await expect(page.getByRole('link', { name: 'Print sheet' })).toBeHidden();
  await expect(page.getByRole('link', { name: 'Edit in the log' })).toBeHidden();
  // The entries are content, not controls: still listed.
  await expect(page.getByRole('link', { name: /Turning the spigot toward size/ })).toBeVisible();
});
