import { test, expect } from '@playwright/test';

// The search page on the demo log, signed out: the header's box, ranked results with the words marked,
// the fit filter with each record's outcome, a refused field, the empty state, the keyboard and a phone.

test('words from the header: results with the words marked, each a link to where it is', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto('/fits');
  const box = page.getByRole('searchbox', { name: 'Search the logs' });
  await box.fill('spigot');
  await box.press('Enter');
  await expect(page).toHaveURL(/\/search\?q=spigot$/);
  await expect(page.getByRole('heading', { name: 'Search the logs' })).toBeVisible();
  const results = page.locator('[data-search-results] > li');
  await expect(results.first()).toBeVisible();
  // Every excerpt shown marks a word beginning with "spigot" (the prefix search).
  const marks = page.locator('[data-excerpt] mark');
  expect(await marks.count()).toBeGreaterThan(0);
  for (const text of await marks.allInnerTexts()) expect(text.toLowerCase()).toMatch(/^spigot/);
  const first = results.first().getByRole('link').first();
  const href = await first.getAttribute('href');
  expect(href).toMatch(/^\/logs\//);
  await first.click();
  await expect(page).toHaveURL(new RegExp(href!.replace(/[?#].*$/, '').replace(/[.*+?^${}()|[\]\\]/g, '\\$&')));
});

test('fit: 130 mm k6 finds the demo spigot with its limits and outcome; a bad zone is refused beside its box', async ({ page }) => {
  await page.goto('/search');
  // The words box has the focus on arrival: type and press Enter.
  await expect(page.getByLabel('Words')).toBeFocused();
  await page.getByLabel('Zone or fit').fill('k6');
  await page.getByLabel('From size').fill('130');
  await page.getByLabel('To size').fill('130');
  await page.getByLabel('Words').press('Enter');
  await expect(page).toHaveURL(/zone=k6/);
  const hit = page.locator('[data-search-results] > li', { hasText: 'Spigot diameter' }).first();
  await expect(hit).toBeVisible();
  // 130 k6: +0.003 / +0.028 mm (ISO 286-2:2010, shafts k, 120–140 mm — from memory).
  await expect(hit).toContainText('130.003 … 130.028 mm');
  await expect(hit.locator('[data-outcome]')).toContainText(/Inside|Outside by|No readings yet/);
  await expect(page.locator('[data-search-read]')).toContainText('k6 · 130 mm');

  await page.getByLabel('Zone or fit').fill('Q7');
  await page.getByRole('button', { name: 'Search' }).click();
  await expect(page.locator('[data-field-error="search-zone"]')).toContainText('ISO 286 zone');
  await expect(page.getByLabel('Zone or fit')).toHaveAttribute('aria-invalid', 'true');
});

test('nothing found says so; on a phone the page fits and the header links to search', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/');
  await page.getByRole('link', { name: 'Search', exact: true }).click();
  await expect(page).toHaveURL(/\/search$/);
  await page.getByLabel('Words').fill('qqzzxnothingmatches');
  await page.getByLabel('Words').press('Enter');
  await expect(page.getByText('Nothing found')).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.goto('/search?q=spigot+chuck');
  await expect(page.locator('[data-search-results] > li').first()).toBeVisible();
  const overflow2 = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow2).toBeLessThanOrEqual(0);
  await page.screenshot({ path: `${process.env.E2E_OUTPUT_DIR ?? '.data/e2e'}/search-phone.png`, fullPage: true });
});
