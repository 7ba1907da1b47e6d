import { test, expect, type Page } from '@playwright/test';

// Forms that post through server actions and whose lists come from the page: the follow button, the
// follows on /settings (e-mail switch, unfollow), and the builder hiding a comment with a reason and
// showing it again. Demo accounts and data (db/seeders).
const PASSWORD = 'shop-demo-2026';
const BACKPLATE = '/logs/cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const slow = { timeout: 30_000 };

async function signIn(page: Page, email: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible(slow);
}

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
}

test('a reader follows a project, switches its e-mail off and unfollows it in the settings', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, 'wren@talbot-bench.test');
  await page.goto(BACKPLATE);
  const follow = page.getByTestId('follow');
  await follow.getByRole('button', { name: 'Follow this project' }).click();
  await expect(follow.getByRole('status')).toContainText('Following this project', slow);
  await expect(follow.getByText('E-mail when a session is published: on')).toBeVisible();

  await page.goto('/settings');
  const title = (await page.getByRole('list', { name: 'Your follows' }).getByRole('link', { name: /backplate/i }).first().innerText()).trim();
  const mail = page.getByRole('switch', { name: `E-mail for ${title}` });
  await expect(mail).toHaveAttribute('aria-checked', 'true');
  await mail.click();
  await expect(page.getByRole('status').filter({ hasText: `E-mail for “${title}” is now off.` })).toBeVisible(slow);
  // The list is the page's, rendered again by the action.
  await expect(mail).toHaveAttribute('aria-checked', 'false');
  await page.getByRole('button', { name: `Unfollow ${title}` }).click();
  await expect(page.getByRole('status').filter({ hasText: `You no longer follow “${title}”.` })).toBeVisible(slow);
  await expect(page.getByRole('button', { name: `Unfollow ${title}` })).toHaveCount(0);

  await page.goto(BACKPLATE);
  await expect(page.getByTestId('follow').getByRole('button', { name: 'Follow this project' })).toBeVisible();
});

test('the builder hides a comment with a reason readers see, then shows it again', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, 'edda@renwick-shop.test');
  await page.goto(BACKPLATE);
  await page.getByRole('link', { name: 'Turning the spigot toward size' }).first().click();
  const comment = page.locator('article[data-comment-id]').filter({ hasText: 'the grey dust gets into the cross-slide ways', hasNot: page.locator('article') });
  await expect(comment).toBeVisible(slow);
  await comment.getByRole('button', { name: 'Hide', exact: true }).click();
  const form = page.getByRole('form', { name: /Hide the comment by/ });
  await form.getByRole('button', { name: 'Hide comment' }).click();
  await expect(form.getByRole('alert')).toContainText('Say why');
  await form.getByLabel(/Why hide it\? Readers see this reason/).fill('Moved to the dust-extraction thread.');
  await expect(form.getByText(/^36 \/ 300/)).toBeVisible();
  await form.getByRole('button', { name: 'Hide comment' }).click();
  await expect(comment).toContainText('Hidden by the builder: Moved to the dust-extraction thread.', slow);
  await comment.getByRole('button', { name: 'Show again' }).click();
  await expect(comment).not.toContainText('Hidden by the builder', slow);
  await expect(comment.getByRole('button', { name: 'Hide', exact: true })).toBeVisible();
  await signOut(page);
});
