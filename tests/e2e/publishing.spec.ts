import { test, expect, type Page } from '@playwright/test';

// The builder logs a session (on the bench by default), puts it in the open log from the log page after
// confirming who will be told, and a signed-out reader finds it on the home page and opens it. Uses the seeded demo project; removes its session at the end.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
const title = `Parting off the spare blank ${stamp}`;

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

test('a new session stays on the bench until the builder confirms putting it in the open log; then the home page lists it', async ({ page, browser }) => {
  // Several pages and two browsers: more than the default minute when pages compile on first use.
  test.setTimeout(180_000);
  await signInAsBuilder(page);
  await page.goto(`/projects/${SLUG}/log`);
  await page.getByRole('button', { name: 'Add a session' }).click();
  const form = page.getByRole('form', { name: 'New session' });
  await form.getByLabel('Session title').fill(title);
  await form.getByLabel('Done').fill('Parted off a 20 mm slice for the next gear blank.');
  await form.getByRole('button', { name: 'Add session' }).click();

  const card = page.locator('li[data-testid^="session-"]').filter({ has: page.getByRole('heading', { name: title }) });
  await expect(card).toBeVisible();
  const sessionId = (await card.getAttribute('data-testid'))!.replace('session-', '');
  const control = card.getByRole('group', { name: 'Who can read this session' });
  await expect(control.getByRole('radio', { name: /On the bench/ })).toBeChecked();

  const reader = await (await browser.newContext()).newPage();
  try {
    // Private: not listed, and its page is a 404 to a reader.
    await reader.goto('/');
    await expect(reader.getByRole('list', { name: 'Recently published sessions' }).getByText(title)).toHaveCount(0);
    expect((await reader.goto(`/logs/${SLUG}/sessions/${sessionId}`))?.status()).toBe(404);

    // Arrow keys only move the choice: nothing is saved, and the session stays on the bench.
    await control.getByRole('radio', { name: /On the bench/ }).focus();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    await expect(control.getByRole('radio', { name: /In the open log/ })).toBeChecked();
    await expect(control.getByRole('radio', { name: /In the open log/ })).toBeFocused();
    await page.waitForTimeout(500);
    expect((await reader.goto(`/logs/${SLUG}/sessions/${sessionId}`))?.status()).toBe(404);

    // Putting it in the open log asks first and says who is told (the demo's two followers have e-mail on).
    const confirm = control.getByRole('group', { name: 'Confirm putting it in the open log' });
    await expect(confirm).toContainText(/(One follower gets|\d+ followers get) an e-mail about it\./);
    await confirm.getByRole('button', { name: 'Keep it on the bench' }).click();
    await expect(control.getByRole('radio', { name: /On the bench/ })).toBeChecked();
    await expect(control.getByRole('radio', { name: /On the bench/ })).toBeFocused();

    await control.getByRole('radio', { name: /In the open log/ }).check();
    await confirm.getByRole('button', { name: 'Yes, put it in the open log' }).click();
    await expect(control.getByRole('status')).toContainText(`“${title}” is now in the open log.`);
    // Focus stays on the control, on the choice now in force.
    await expect(control.getByRole('radio', { name: /In the open log/ })).toBeFocused();

    await reader.goto('/');
    const item = reader.getByRole('list', { name: 'Recently published sessions' }).getByRole('listitem').first();
    await expect(item.getByRole('link', { name: title })).toBeVisible();
    await expect(item).toContainText('Edda Renwick');
    await expect(item).toContainText('Parted off a 20 mm slice');
    await item.getByRole('link', { name: title }).click();
    await expect(reader.getByRole('heading', { level: 1, name: title })).toBeVisible();
    // The builder's name leads to their profile, which counts the session.
    await reader.goto('/');
    const builderLink = item.getByRole('link', { name: 'Edda Renwick' });
    await expect(builderLink).toHaveAttribute('href', '/builders/edda-renwick');
    await reader.goto('/builders/edda-renwick');
    await expect(reader.getByRole('heading', { level: 1, name: 'Edda Renwick' })).toBeVisible();
    await expect(reader.getByRole('link', { name: /Sign in to follow Edda Renwick/ })).toBeVisible();
  } finally {
    await reader.context().close();
    const res = await page.request.delete(`/api/sessions/${sessionId}`);
    expect(res.status()).toBe(204);
  }
});
