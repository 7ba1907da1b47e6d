import { test, expect } from '@playwright/test';

// Links shared before the paths were renamed keep working: each old short path answers a permanent
// redirect to its new home, and an old ?t= moment ends as the #t= form on the entry page.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';

test('old short paths redirect permanently to the new ones', async ({ page, request }) => {
  await page.goto(`/logs/${SLUG}`);
  const sessionHref = (await page.locator(`a[href^="/logs/${SLUG}/sessions/"]`).first().getAttribute('href'))!;
  const entryHref = (await page.locator(`a[href^="/logs/${SLUG}/entries/"]`).first().getAttribute('href'))!;
  const sessionId = sessionHref.split('/').pop()!;
  const entryId = entryHref.split('/').pop()!;

  const cases: [string, string][] = [
    [`/p/${SLUG}`, `/logs/${SLUG}`],
    [`/p/${SLUG}/s/${sessionId}`, `/logs/${SLUG}/sessions/${sessionId}`],
    [`/p/${SLUG}/e/${entryId}`, `/logs/${SLUG}/entries/${entryId}`],
    [`/p/${SLUG}/measurements`, `/logs/${SLUG}/measurements`],
    [`/p/${SLUG}/m/7?unit=in`, `/logs/${SLUG}/records/7?unit=in`],
    ['/b/edda-renwick', '/builders/edda-renwick'],
  ];
  for (const [from, to] of cases) {
    const res = await request.get(from, { maxRedirects: 0 });
    expect(res.status(), from).toBe(308);
    expect(new URL(res.headers().location!, 'http://x').pathname + new URL(res.headers().location!, 'http://x').search, from).toBe(to);
  }
  const profile = await request.get('/builders/edda-renwick');
  expect(profile.status()).toBe(200);
});

test('an old ?t= moment link on an old path lands on the #t= form of the new one and plays from there', async ({ page }) => {
  await page.goto(`/logs/${SLUG}`);
  // The seeded entry with the 12 s spigot clip.
  const entryHref = (await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().getAttribute('href'))!;
  const entryId = entryHref.split('/').pop()!;
  await page.goto(`/p/${SLUG}/e/${entryId}?t=8`);
  await expect(page).toHaveURL(new RegExp(`/logs/${SLUG}/entries/${entryId}\\?clip=\\d+#t=8$`));
  await page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));
  await expect.poll(() => page.locator('video').first().evaluate((v: HTMLVideoElement) => v.currentTime)).toBeCloseTo(8, 0);
});
