import { z } from 'zod';

export const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'That does not look like an e-mail address.' }));

export const signUpSchema = z.object({
  name: z.string({ error: 'Enter your name.' }).trim().min(2, 'Your name needs at least 2 characters.').max(80, 'Keep your name under 80 characters.'),
  email: emailSchema,
  password: z
    .string({ error: 'Choose a password.' })
    .min(10, 'Use at least 10 characters for your password.')
    .max(200, 'Keep your password under 200 characters.'),
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
