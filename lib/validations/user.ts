import { z } from 'zod';
import { emailSchema, nameSchema, newPasswordSchema, nextSchema, tokenSchema } from './account-fields';

// The signed-in account forms; the fields, and the forms before there is a session, are in account-fields.ts.

export const setSiteRoleSchema = z.object({
  userId: z.coerce.number({ error: 'Pick an account.' }).int().positive('Pick an account.'),
  siteRole: z.enum(['member', 'admin'], { error: 'The role must be member or admin.' }),
});

const currentPasswordSchema = z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(200, 'Enter your current password.');

export const accountLinkSchema = z.object({ token: tokenSchema });

export const resendVerificationSchema = z.object({ next: nextSchema });

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
