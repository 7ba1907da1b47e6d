// The fields of the forms that come before there is a session (sign up, sign in, forgot and reset password),
// written with zod's small build (zod/mini: the same validation, functions instead of methods), so those
// pages load a few kilobytes of it rather than the whole library. The server checks with the same schemas;
// user.ts builds the signed-in account forms on these fields.
import * as z from 'zod/mini';

export const emailSchema = z.pipe(
  z
    .string({ error: 'Enter your e-mail address.' })
    .check(z.trim(), z.toLowerCase(), z.minLength(1, 'Enter your e-mail address.'), z.maxLength(254, 'That e-mail address is too long.')),
  z.email({ error: 'That does not look like an e-mail address.' }),
);

export const PASSWORD_MIN_LENGTH = 10;
/** bcrypt reads only the first 72 bytes of a password: longer ones are refused, never cut. */
export const PASSWORD_MAX_BYTES = 72;

export const passwordBytes = (value: string): number => new TextEncoder().encode(value).length;

/** A new password's shape; how guessable it is, the server judges (lib/auth/password-rules.ts). */
export const newPasswordSchema = z
  .string({ error: 'Choose a password.' })
  .check(
    z.refine((v) => [...v].length >= PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters for your password.`),
    z.refine((v) => passwordBytes(v) <= PASSWORD_MAX_BYTES, `Passwords can be at most ${PASSWORD_MAX_BYTES} bytes (accented letters and symbols take 2 to 4): use a shorter one.`),
  );

export const nameSchema = z
  .string({ error: 'Enter your name.' })
  .check(z.trim(), z.minLength(2, 'Your name needs at least 2 characters.'), z.maxLength(80, 'Keep your name under 80 characters.'));

/** Where to go once the account is ready (an invitation, say); judged again by safeNextPath wherever it is used. */
export const nextSchema = z.optional(z.string().check(z.maxLength(2048, 'That return address is too long.')));

export const tokenSchema = z
  .string({ error: 'The link is missing its token.' })
  .check(z.trim(), z.minLength(10, 'That link is not complete.'), z.maxLength(1000, 'That link is not valid.'));

export const signUpSchema = z.object({
  name: nameSchema,
  email: emailSchema,
  password: newPasswordSchema,
  next: nextSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Enter your password.' }).check(z.minLength(1, 'Enter your password.'), z.maxLength(200, 'That password is too long.')),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });

export const passwordResetSchema = z.object({ token: tokenSchema, password: newPasswordSchema });
