import { z } from 'zod';
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH } from './user-words';

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

export { PASSWORD_MIN_LENGTH, PASSWORD_MAX_BYTES } from './user-words';

export const passwordBytes = (value: string): number => new TextEncoder().encode(value).length;

/** A new password's shape; how guessable it is, the server judges (lib/auth/password-rules.ts). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .refine((v) => [...v].length >= PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters for your password.`)
  .refine((v) => passwordBytes(v) <= PASSWORD_MAX_BYTES, `Passwords can be at most ${PASSWORD_MAX_BYTES} bytes (accented letters and symbols take 2 to 4): use a shorter one.`);

export const nameSchema = z
  .string({ error: 'Enter your name.' })
  .trim()
  .min(2, 'Your name needs at least 2 characters.')
  .max(80, 'Keep your name under 80 characters.');

/** Where to go once the account is ready (an invitation, say); judged again by safeNextPath wherever it is used. */
const nextSchema = z.string().max(2048, 'That return address is too long.').optional();

export const signUpSchema = z.object({
  name: nameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  next: nextSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const setSiteRoleSchema = z.object({
  userId: z.coerce.number({ error: 'Pick an account.' }).int().positive('Pick an account.'),
  siteRole: z.enum(['member', 'admin'], { error: 'The role must be member or admin.' }),
});

const currentPasswordSchema = z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200, 'Enter your current password.');
const tokenSchema = z.string({ error: 'The link is missing its token.' }).trim().min(10, 'That link is not complete.').max(1000, 'That link is not valid.');

export const accountLinkSchema = z.object({ token: tokenSchema });

export const resendVerificationSchema = z.object({ next: nextSchema });

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetSchema = z.object({ token: tokenSchema, password: newPasswordSchema });

export const changeNameSchema = z.object({ name: nameSchema });
export type ChangeNameInput = z.infer<typeof changeNameSchema>;

export const changePasswordSchema = z.object({ currentPassword: currentPasswordSchema, newPassword: newPasswordSchema });
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export const changeEmailSchema = z.object({ email: emailSchema, currentPassword: currentPasswordSchema });
export type ChangeEmailInput = z.infer<typeof changeEmailSchema>;

export const DELETE_CHOICES = ['remove', 'keep'] as const;
export const deleteAccountSchema = z.object({
  logs: z.enum(DELETE_CHOICES, { error: 'Choose whether your published logs are removed or kept.' }),
  currentPassword: currentPasswordSchema,
});
export type DeleteAccountInput = z.infer<typeof deleteAccountSchema>;
