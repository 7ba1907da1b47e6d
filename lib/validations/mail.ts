import { z } from 'zod';

/** What a message is about; the outbox keeps it so a message can be traced to what caused it. */
export const MAIL_KINDS = [
  'session-published', 'flag-answered', 'mentor-invite', 'flag-raised',
  'verify-address', 'sign-up-attempt', 'password-reset', 'password-changed', 'confirm-new-address', 'address-change-notice',
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

const singleLine = (max: number, what: string) =>
  z
    .string()
    .trim()
    .min(1, `${what} is required`)
    .max(max, `${what} must be at most ${max} characters`)
    .refine((v) => !/[\r\n]/.test(v), `${what} must be on one line`);

/** One e-mail for the outbox, as the caller hands it over. */
export const outgoingMailSchema = z.object({
  to: z.string().trim().max(254, 'The address is too long').pipe(z.email('Enter a valid e-mail address')),
  subject: singleLine(200, 'The subject'),
  text: z.string().min(1, 'The message needs a plain-text body').max(200_000, 'The message is too long'),
  html: z.string().max(500_000, 'The HTML part is too long').nullish(),
  kind: z.enum(MAIL_KINDS, 'Unknown kind of e-mail'),
  // e.g. session-published:<sessionId>:<userId>
  dedupeKey: singleLine(191, 'The dedupe key').nullish(),
});
export type OutgoingMail = z.input<typeof outgoingMailSchema>;
