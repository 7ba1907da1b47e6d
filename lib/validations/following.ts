import { z } from 'zod';
import { VISIBILITY_LABEL } from './visibility';

/** A session's visibility, in the builder's words: what each state means for who can read it. */
export const SESSION_VISIBILITY_OPTIONS = [
  { value: 'private', label: VISIBILITY_LABEL.private, hint: 'Only you and your mentors.' },
  { value: 'unlisted', label: VISIBILITY_LABEL.unlisted, hint: 'Whoever you give its address to; no page lists it.' },
  { value: 'published', label: VISIBILITY_LABEL.published, hint: 'On the home page and your profile; followers get one e-mail.' },
] as const;

export const sessionVisibilitySchema = z.object({
  visibility: z.enum(['private', 'unlisted', 'published'], { error: 'Visibility must be private, unlisted or published.' }),
  // Optional: a client that sends the version it saw gets a 409 if the session changed meanwhile.
  version: z.number({ error: 'The version must be a whole number.' }).int().positive().optional(),
});

export const followMailSchema = z.object({
  mail: z.boolean({ error: 'mail must be true or false.' }),
});

export const handleSchema = z
  .string({ error: 'Give a builder handle.' })
  .trim()
  .min(1, 'Give a builder handle.')
  .max(40, 'A handle is at most 40 characters.');

export const unsubscribeSchema = z.object({
  token: z.string({ error: 'The unsubscribe link is missing its token.' }).min(1, 'The unsubscribe link is missing its token.').max(200, 'That unsubscribe token is too long.'),
});
