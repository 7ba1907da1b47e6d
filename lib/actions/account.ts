'use server';

import { revalidatePath } from 'next/cache';
import { headers } from 'next/headers';
import { authedAction } from './authed';
import { formFields } from './form-data';
import { clientAddress } from '../auth/options';
import { changeName, changePassword, deleteAccount, requestEmailChange, resendVerification } from '../server/accounts';

// Sign-up, following an address link and the password reset are flows before a session and stay on their
// JSON routes (/api/account/*), which count mail per client; these are the signed-in member's own settings.

/** The member's name; it is in the header of every page, so every page is rendered afresh. */
export const changeNameAction = authedAction<FormData, never>(async (user, form) => {
  const { name } = formFields(form);
  await changeName(user, { name });
  revalidatePath('/', 'layout');
  return { ok: true, message: 'Your name is saved.' };
});

/** A link to the new address (given the current password); nothing changes until it is followed. */
export const changeEmailAction = authedAction<FormData, never>(async (user, form) => {
  const { email, currentPassword } = formFields(form);
  const { message } = await requestEmailChange(user, { email, currentPassword }, clientAddress(await headers()));
  revalidatePath('/settings');
  return { ok: true, message };
});

/**
 * A new password, given the current one. Every session ends, this browser's too: nothing is rendered
 * again here (the page would find no session); the form signs in with the new password, then refreshes.
 */
export const changePasswordAction = authedAction<FormData, { email: string }>(async (user, form) => {
  const { currentPassword, newPassword } = formFields(form);
  return { ok: true, data: await changePassword(user, { currentPassword, newPassword }) };
});

/** Deletes the account (`logs`: keep or remove; the password confirms); the form then signs out. */
export const deleteAccountAction = authedAction<FormData, never>(async (user, form) => {
  const { logs, currentPassword } = formFields(form);
  await deleteAccount(user, { logs, currentPassword });
});

/** "Send the link again" for a member whose address is not verified yet; `next` rides in the link. */
export const resendVerificationAction = authedAction<FormData, never>(async (user, form) => {
  const { next } = formFields(form);
  const { message } = await resendVerification(user, next === undefined ? {} : { next }, clientAddress(await headers()));
  return { ok: true, message };
});
