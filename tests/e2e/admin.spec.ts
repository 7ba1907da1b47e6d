import { test, expect, type Page } from '@playwright/test';

// The admins' jobs: accounts (search, paging, a role change that stays put, a phone-width page),
// comments reported by members (report, review, dismiss) and the upload clean-up. Demo accounts.
const PASSWORD = 'shop-demo-2026';
const BACKPLATE = '/logs/cast-iron-backplate-for-the-160-mm-three-jaw-chuck';

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
}

test('accounts: search, pages of 20, a role change the select keeps, and no sideways scrolling on a phone', async ({ page }) => {
  await signIn(page, 'juno@scribeline.test');
  await page.getByRole('link', { name: 'Accounts' }).first().click();
  await expect(page.getByRole('heading', { name: 'Accounts' })).toBeVisible();

  // Paging: more than 20 accounts means a second page, and the second page lists others.
  const countText = (await page.getByTestId('accounts-count').innerText()).trim();
  const total = Number(/^(\d+) accounts?/.exec(countText)?.[1]);
  expect(total).toBeGreaterThan(0);
  const rows = page.locator('[data-testid^="user-row-"]');
  await expect(rows).toHaveCount(Math.min(total, 20));
  if (total > 20) {
    const firstOnPage1 = await rows.first().getAttribute('data-testid');
    await page.getByRole('link', { name: 'Older →' }).click();
    await expect(page).toHaveURL(/page=2/);
    await expect(rows.first()).not.toHaveAttribute('data-testid', firstOnPage1!);
  } else {
    await expect(page.getByRole('navigation', { name: 'Pages of accounts' })).toHaveCount(0);
  }

  // Search by part of the name.
  await page.getByLabel('Find an account').fill('quill');
  await page.getByRole('button', { name: 'Search' }).click();
  await expect(page.getByTestId('accounts-count')).toContainText('match “quill”');
  const row = page.getByTestId('user-row-tobias@quill.test');
  await expect(row).toBeVisible();

  // The role select shows what the server confirmed, now and after a reload.
  const select = row.getByLabel('Site role for Tobias Quill');
  await select.selectOption('admin');
  await row.getByRole('button', { name: 'Set role' }).click();
  await expect(row.getByRole('status')).toContainText('Tobias Quill is now an admin.');
  await expect(select).toHaveValue('admin');
  await expect(row.getByRole('button', { name: 'Set role' })).toBeDisabled();
  await page.reload();
  await expect(page.getByTestId('user-row-tobias@quill.test').getByLabel('Site role for Tobias Quill')).toHaveValue('admin');
  const again = page.getByTestId('user-row-tobias@quill.test');
  await again.getByLabel('Site role for Tobias Quill').selectOption('member');
  await again.getByRole('button', { name: 'Set role' }).click();
  await expect(again.getByRole('status')).toContainText('Tobias Quill is now a member.');
  await expect(again.getByLabel('Site role for Tobias Quill')).toHaveValue('member');

  // A phone: the page is no wider than the screen and the header's links stay in view.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto('/admin/users');
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(width).toBeLessThanOrEqual(390);
  await expect(page.getByRole('link', { name: 'Accounts' }).first()).toBeInViewport();
  await expect(page.getByRole('navigation', { name: 'Admin' })).toBeInViewport();
});

test('a member reports a comment with a reason; an admin sees it among comments to review and dismisses the report', async ({ page }) => {
  test.setTimeout(90_000);
  await signIn(page, 'tobias@quill.test');
  await page.goto(BACKPLATE);
  await page.getByRole('link', { name: 'Turning the spigot toward size' }).first().click();
  // The answer is a reply inside the question's article: the innermost article is the answer itself.
  const answer = page.locator('article[data-comment-id]').filter({ hasText: 'Several. I checked the micrometer', hasNot: page.locator('article') });
  await expect(answer).toBeVisible();
  // Their own question has no Report; someone else's answer has.
  const ownControls = page.getByRole('group', { name: 'Actions on the comment by Tobias Quill' }).first();
  await expect(ownControls.getByRole('button', { name: 'Edit', exact: true })).toBeVisible();
  await expect(ownControls.getByRole('button', { name: 'Report', exact: true })).toHaveCount(0);
  await answer.getByRole('button', { name: 'Report', exact: true }).click();
  const form = page.getByRole('form', { name: /Report the comment by/ });
  await form.getByRole('button', { name: 'Send the report' }).click();
  await expect(form.getByRole('alert')).toContainText('Say why');
  const reason = `Readings quoted without the setting standard's own error ${Date.now().toString(36)}`;
  await form.getByLabel(/Why report it/).fill(reason);
  await form.getByRole('button', { name: 'Send the report' }).click();
  await expect(answer.getByRole('status').filter({ hasText: /Reported to the admins|already reported/ })).toBeVisible();
  await signOut(page);

  await signIn(page, 'juno@scribeline.test');
  await page.goto('/admin/comments');
  const item = page.locator('[data-testid^="reported-"]').filter({ hasText: reason });
  await expect(item).toBeVisible();
  await expect(item).toContainText('Tobias Quill');
  await expect(item.getByRole('link')).toHaveAttribute('href', /#comment-\d+$/);
  await item.getByRole('button', { name: 'Dismiss the reports' }).click();
  await expect(page.locator('[data-testid^="reported-"]').filter({ hasText: reason })).toHaveCount(0);
  // Dismissing leaves the comment where it was.
  await page.goto(BACKPLATE);
  await page.getByRole('link', { name: 'Turning the spigot toward size' }).first().click();
  await expect(page.locator('article[data-comment-id]').filter({ hasText: 'Several. I checked the micrometer', hasNot: page.locator('article') })).toBeVisible();

  // A member never sees the queue.
  await signOut(page);
  await signIn(page, 'tobias@quill.test');
  // The page says it is not there and keeps out of search engines (a streamed not-found keeps its 200;
  // DEVELOPERS.md "Reading a page"); nothing of the queue is sent.
  await page.goto('/admin/comments');
  await expect(page.getByRole('heading', { name: 'Nothing here' })).toBeVisible();
  await expect(page.locator('meta[name="robots"][content*="noindex"]')).toHaveCount(1);
  await expect(page.getByText(reason)).toHaveCount(0);
});

test('the upload clean-up runs from a button and says what it did', async ({ page }) => {
  await signIn(page, 'juno@scribeline.test');
  await page.goto('/admin/users');
  await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Upload clean-up' }).click();
  await expect(page.getByRole('heading', { name: 'Upload clean-up' })).toBeVisible();
  await page.getByRole('button', { name: 'Clean up stored files now' }).click();
  const result = page.getByTestId('sweep-result');
  await expect(result).toContainText(/Checked \d+ stored files?;/);
  await expect(page.getByRole('status').filter({ hasText: /Cleaned up at \d\d:\d\d/ })).toBeVisible();
});
