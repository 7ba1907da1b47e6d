import { test, expect, type Page } from '@playwright/test';

// Links to a moment of a clip always play from that moment: opened fresh, opened when the browser has
// the clip cached already, as an old ?t= link, and from the measurements table on the same page.
// Uses the seeded demo entry "Turning the spigot toward size" (a 12 s clip with notes at 0:00, 0:04,
// 0:06.5, 0:08 and 0:10, a reader's question asked at 0:09, and a measurement linked to the 0:08 note).
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';

const videoTime = (page: Page) => page.locator('video').first().evaluate((v: HTMLVideoElement) => v.currentTime);
const videoReady = (page: Page) => page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));

async function openSpigotEntry(page: Page): Promise<{ entryPath: string; clipId: string }> {
  await page.goto(`/logs/${SLUG}`);
  await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: 'Turning the spigot toward size' })).toBeVisible();
  await videoReady(page);
  const clipId = (await page.locator('[data-clip-workbench]').first().getAttribute('data-clip-workbench'))!;
  return { entryPath: new URL(page.url()).pathname, clipId };
}

test('a moment link plays from that moment, also when the browser has seen the clip before', async ({ page }) => {
  const { entryPath, clipId } = await openSpigotEntry(page);
  // The clip is now in this browser's cache; each link below must still land on its moment.
  for (const [seconds, clock, noteText] of [
    [6, '0:06', 'Pass 3'],
    [9, '0:09', 'reader’s question at 0:09 from Tobias Quill'],
    [2, '0:02', 'Facing the spigot face'],
  ] as const) {
    await page.goto(`${entryPath}?clip=${clipId}#t=${seconds}`);
    await videoReady(page);
    await expect.poll(() => videoTime(page)).toBeCloseTo(seconds, 0);
    // The clock under the player and the note marked "Now" agree with the frame on screen.
    const workbench = page.locator(`[data-clip-workbench="${clipId}"]`);
    await expect(workbench.getByText(new RegExp(`^${clock} / 0:1[12]`))).toBeVisible();
    await expect(workbench.locator('[aria-live="polite"]')).toContainText(noteText);
    await page.goto('about:blank');
  }
});

test('an old ?t= link is answered with a redirect to the moment form and plays from there', async ({ page }) => {
  const { entryPath } = await openSpigotEntry(page);
  await page.goto(`${entryPath}?t=9`);
  await expect(page).toHaveURL(/\?clip=\d+#t=9$/);
  await videoReady(page);
  await expect.poll(() => videoTime(page)).toBeCloseTo(9, 0);
});

test('"In the clip at 0:08" in the measurements table plays the clip from 0:08 without leaving the page', async ({ page }) => {
  await openSpigotEntry(page);
  await page.evaluate(() => ((window as unknown as { stayed: boolean }).stayed = true));
  await page.locator('video').first().evaluate((v: HTMLVideoElement) => {
    v.currentTime = 1;
  });
  await page.getByRole('link', { name: /In the clip at 0:08/ }).click();
  await expect.poll(() => videoTime(page)).toBeCloseTo(8, 0);
  // Another test may have added its own note at 0:08: whichever it is, the marked note is the one at 0:08.
  await expect(page.locator('[data-clip-workbench] [aria-live="polite"]')).toContainText(/at 0:08/);
  expect(await page.evaluate(() => (window as unknown as { stayed?: boolean }).stayed)).toBe(true);
  await expect(page).toHaveURL(/#t=8$/);
});
