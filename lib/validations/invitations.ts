import { z } from 'zod';

/** How long a mentor invitation link works. */
export const INVITATION_LIFETIME_DAYS = 7;
export const INVITATION_NOTE_MAX = 600;

export const invitationInputSchema = z.object({
  email: z
    .string({ error: "Enter the mentor's e-mail address." })
    .trim()
    .toLowerCase()
    .min(1, "Enter the mentor's e-mail address.")
    .max(254, 'That e-mail address is too long.')
    .pipe(z.email({ error: 'That does not look like an e-mail address.' })),
  note: z
    .string({ error: 'The note must be text.' })
    .trim()
    .max(INVITATION_NOTE_MAX, `Keep the note under ${INVITATION_NOTE_MAX} characters.`)
    .optional()
    .default(''),
});
export type InvitationInput = z.infer<typeof invitationInputSchema>;
export type InvitationFormValues = z.input<typeof invitationInputSchema>;

export const acceptInvitationSchema = z.object({
  token: z.string({ error: 'The invitation token is missing.' }).trim().min(1, 'The invitation token is missing.').max(2000, 'The invitation token is too long.'),
});
