import { z } from 'zod';
import { readingInputSchema } from './measurements';

/**
 * The id a phone gives each write it queues (a UUID from crypto.randomUUID()): sent again with every retry,
 * stored with a unique key, so the same write never lands twice.
 */
export const clientIdSchema = z
  .string({ error: 'clientId must be the write’s id, a UUID.' })
  .trim()
  .regex(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i, 'clientId must be a UUID, e.g. 3f2b8c1e-5d4a-4c7b-9e21-6a0f1d2c3b4a.')
  .transform((v) => v.toLowerCase());

const recordVersion = z
  .number({ error: 'recordVersion must be the version of the record the reading was judged against.' })
  .int('recordVersion must be a whole number.')
  .positive('recordVersion must be a positive whole number.');

/**
 * A reading as POST /api/measurements/[id]/readings takes it, plus what a queued write carries: its `clientId`
 * and, optionally, the `recordVersion` it was judged against (a record changed since is a 409, not a silent save).
 */
export const readingOnceSchema = readingInputSchema.extend({
  clientId: clientIdSchema.optional(),
  recordVersion: recordVersion.optional(),
});

/** Longest line a bench note adds to "What got done". */
export const BENCH_NOTE_MAX = 1000;

/** A line for the session's "What got done", written at the bench: `clock` is the phone's own time of day. */
export const sessionNoteSchema = z.object({
  clientId: clientIdSchema,
  text: z
    .string({ error: 'The note must be text.' })
    .trim()
    .min(1, 'Write the note first.')
    .max(BENCH_NOTE_MAX, `Keep the note under ${BENCH_NOTE_MAX} characters.`),
  clock: z
    .string({ error: 'clock must be a time of day, e.g. 14:05.' })
    .regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'clock must be a time of day, e.g. 14:05.')
    .optional(),
});

/** Minutes the bench timer adds to the session's time spent. */
export const sessionTimeSchema = z.object({
  clientId: clientIdSchema,
  minutes: z
    .number({ error: 'minutes must be a number of minutes.' })
    .int('minutes must be whole minutes.')
    .min(1, 'Add at least one minute.')
    .max(24 * 60, 'A session cannot be longer than a day.'),
});
