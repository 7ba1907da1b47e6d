import { z } from 'zod';
import { NOTE_KIND_OPTIONS, NOTE_TEXT_MAX, type NoteKind } from './log-words';

const KINDS = NOTE_KIND_OPTIONS.map((o) => o.value) as [NoteKind, ...NoteKind[]];
/** No clip runs longer than a day; past that a time is a typing slip. */
export const MAX_CLIP_MS = 24 * 3600 * 1000;
/** A clip holds at most this many notes, so its list (chapters, the reader's and the editor's list) is whole and bounded. */
export const NOTES_PER_CLIP_MAX = 500;
export { CAPTION_FILE_MAX_BYTES } from './log-words';

const ms = (label: string) =>
  z.coerce
    .number({ error: `The ${label} time must be a number of milliseconds.` })
    .int(`The ${label} time must be whole milliseconds.`)
    .min(0, `The ${label} time cannot be negative.`)
    .max(MAX_CLIP_MS, `The ${label} time is past the end of any clip.`);

const kind = z.enum(KINDS, { error: 'The kind must be note, measurement, caution or question.' });
const text = z
  .string({ error: 'Write the note.' })
  .trim()
  .min(1, 'Write the note.')
  .max(NOTE_TEXT_MAX, `Keep the note under ${NOTE_TEXT_MAX} characters.`);

// Checked even when other fields are wrong, so one answer names every bad field.
const endAfterStart = (n: { startMs?: unknown; endMs?: unknown }) => typeof n.startMs !== 'number' || typeof n.endMs !== 'number' || n.endMs > n.startMs;
const endAfterStartMessage = { path: ['endMs'], message: 'The end time must come after the start time.', when: () => true };

export const noteCreateSchema = z
  .object({
    startMs: ms('start'),
    endMs: ms('end').nullable().optional(),
    kind,
    text,
  })
  .refine(endAfterStart, endAfterStartMessage);
export type NoteCreateInput = z.infer<typeof noteCreateSchema>;

/** A change to a note: any of its fields, and the version it was read at. Start/end order is checked against the merged note. */
export const noteChangeSchema = z
  .object({
    startMs: ms('start').optional(),
    endMs: ms('end').nullable().optional(),
    kind: kind.optional(),
    text: text.optional(),
    version: z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive('The version you edited is missing; reload the page.'),
  })
  .refine(endAfterStart, endAfterStartMessage);

export const noteImportSchema = z.object({
  fileName: z.string({ error: 'Name the file you are importing.' }).trim().min(1, 'Name the file you are importing.').max(255, 'The file name is too long.'),
  text: z.string({ error: 'Send the file’s text.' }),
});

export const chaptersQuerySchema = z.object({
  format: z.enum(['vtt', 'txt'], { error: 'The format must be vtt or txt.' }).default('vtt'),
});
