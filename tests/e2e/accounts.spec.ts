import { test, expect } from '@playwright/test';
import { linkIn, signUpAndVerify, waitForMail } from './support/accounts';

// Accounts in the browser: sign up → verify by the e-mailed link (read from the local mail service's API)
// → signed in; the settings page changes the name and the password, and the old session cookie stops working.
const stamp = Date.now().toString(36);

test('sign up, verify by the e-mailed link, sign in; the settings page changes name and password', async ({ page, browser }) => {
  const who = { name: 'Oskar Vintner', email: `oskar-${stamp}@example.test`, password: 'fly cutter on the mill' };

  // The sign-in page puts the cursor in the e-mail box.
  await page.goto('/sign-in');
  await expect(page.getByLabel('E-mail')).toBeFocused();

  // A common password is refused beside the field, by the server.
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill(who.name);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill('password1234');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.locator('[data-field-error="password"]')).toContainText('most common passwords');

  await signUpAndVerify(page, who);
  // Verified: no notice asking to verify.
  await expect(page.getByTestId('verify-address-notice')).toHaveCount(0);

  await page.goto('/settings');
  await expect(page.getByRole('heading', { name: 'Your account' })).toBeVisible();
  await expect(page.getByText('✓ verified')).toBeVisible();
  await page.getByLabel('Your name', { exact: true }).fill('Oskar Vintner-Hale');
  await page.getByRole('button', { name: 'Save the name' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Your name is saved.' })).toBeVisible();
  await expect(page.getByText('Signed in as Oskar Vintner-Hale')).toBeVisible();

  // A copy of today's cookie, as a thief would keep it.
  const stolen = await page.context().cookies();
  await page.getByLabel('Current password', { exact: true }).fill(who.password);
  await page.getByLabel('New password', { exact: true }).fill('tailstock die holder again');
  await page.getByRole('button', { name: 'Change the password' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Password changed' })).toBeVisible({ timeout: 30_000 });
  // This browser signed in again with the new password; the copied cookie no longer opens the account.
  await page.reload();
  await expect(page.getByRole('heading', { name: 'Settings' })).toBeVisible();
  const other = await browser.newContext();
  await other.addCookies(stolen);
  const thief = await other.newPage();
  await thief.goto('/settings');
  await expect(thief).toHaveURL(/\/sign-in\?next=%2Fsettings/);
  await other.close();
  await waitForMail(page, who.email, (m) => /password was changed/.test(m.subject));
});

test('an invitation survives sign-up: create an account from it, verify, and come back to accept', async ({ page, browser }) => {
  const builderContext = await browser.newContext();
  const builder = await builderContext.newPage();
  await builder.goto('/sign-in');
  await builder.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await builder.getByLabel('Password').fill('shop-demo-2026');
  await builder.getByRole('button', { name: 'Sign in' }).click();
  await expect(builder.getByRole('heading', { name: 'My projects' })).toBeVisible();
  const projects = await (await builder.request.get('/api/projects?scope=mine')).json();
  const project = (projects.projects ?? projects)[0];
  const invitee = { name: 'Greta Anvil', email: `greta-${stamp}@example.test`, password: 'parting tool angle check' };
  const sent = await builder.request.post(`/api/projects/${project.id}/invitations`, { data: { email: invitee.email } });
  expect(sent.status()).toBe(201);
  await builderContext.close();

  const invite = await waitForMail(page, invitee.email, (m) => /mentor/.test(m.subject));
  const invitePath = linkIn(invite.text, '/invitations/accept');

  // Someone signed in with another address (an account of this test's own: signing out ends every session of
  // it) is told so, and can switch: signing out brings them to sign-in with the invitation as the page to come
  // back to (the invitation stays open for the invited address).
  const other = await (await browser.newContext()).newPage();
  await signUpAndVerify(other, { name: 'Ivo Knurl', email: `ivo-${stamp}@example.test`, password: 'knurling wheel pressure' });
  await expect(other.getByTestId('signed-in-as')).toBeVisible();
  await other.goto(invitePath);
  await expect(other.getByRole('alert').filter({ hasText: 'Signed in with another address' })).toBeVisible();
  await other.getByRole('button', { name: 'Sign out and switch account' }).click();
  await expect(other).toHaveURL(/\/sign-in\?next=%2Finvitations%2Faccept/);
  await expect(other.getByTestId('signed-in-as')).toHaveCount(0);
  await other.context().close();

  await page.goto(invitePath);
  await page.getByRole('link', { name: 'Create an account' }).click();
  await expect(page).toHaveURL(/\/sign-up\?next=%2Finvitations%2Faccept/);
  await signUpAndVerify(page, invitee, /\/invitations\/accept\?token=/);
  await expect(page.getByRole('heading', { name: project.title })).toBeVisible();
  await page.getByRole('button', { name: /Accept/ }).click();
  await expect(page).toHaveURL(new RegExp(`/logs/${project.slug}|/projects`), { timeout: 30_000 });
});
