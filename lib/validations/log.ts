import { z } from 'zod';
import { NOTE_KIND_OPTIONS, OPERATIONS, type Operation } from './log-words';

export { NOTE_KIND_OPTIONS, OPERATIONS };
export type { NoteKind, Operation } from './log-words';

const operationValues = OPERATIONS.map((o) => o.value) as [Operation, ...Operation[]];

const id = (field: string) => z.coerce.number({ error: `${field} must be a number.` }).int().positive(`${field} must be a positive whole number.`);
const version = z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive();
const text = (label: string, max: number) => z.string({ error: `${label} must be text.` }).trim().max(max, `Keep ${label.toLowerCase()} under ${max} characters.`);

export const sessionInputSchema = z.object({
  title: z.string({ error: 'Give the session a title.' }).trim().min(2, 'The title needs at least 2 characters.').max(120, 'Keep the title under 120 characters.'),
  // The database stores years 1000–9999; a shop session is well inside 1900–2999.
  heldOn: z.iso
    .date({ error: 'Give the date as YYYY-MM-DD.' })
    .refine((d) => d >= '1900-01-01' && d <= '2999-12-31', 'Give a date between 1900 and 2999.'),
  minutesSpent: z.coerce.number({ error: 'Time spent must be a number of minutes.' }).int('Time spent must be whole minutes.').min(0, 'Time spent cannot be negative.').max(24 * 60, 'A session cannot be longer than a day.'),
  planned: text('What was planned', 5000).default(''),
  done: text('What got done', 5000).default(''),
  nextSteps: text('What is next', 5000).default(''),
});
export type SessionInput = z.infer<typeof sessionInputSchema>;
export const sessionUpdateSchema = sessionInputSchema.partial().extend({ version });

/** A ProseMirror document as the editor sends it; its nodes are checked against the schema on the server. */
export const docSchema = z.object({ type: z.literal('doc', { error: 'The body must be a document.' }), content: z.array(z.unknown()).optional() }).passthrough();

/** The longest entry title: the editor's box and the server read this one number. */
export const ENTRY_TITLE_MAX = 120;
export const entryTitleSchema = z
  .string({ error: 'Give the entry a title.' })
  .trim()
  .min(2, 'The title needs at least 2 characters.')
  .max(ENTRY_TITLE_MAX, `Keep the title to ${ENTRY_TITLE_MAX} characters or fewer.`);

export const entryInputSchema = z.object({
  title: entryTitleSchema,
  operation: z.enum(operationValues, { error: 'Pick an operation from the list.' }),
  body: docSchema.optional(),
});
export const entryUpdateSchema = entryInputSchema.partial().extend({ version });

export const moveSchema = z.object({
  /** Where it goes: another session for an entry; position counted from 0. */
  sessionId: id('sessionId').optional(),
  position: z.coerce.number({ error: 'position must be a number.' }).int().min(0, 'position cannot be negative.'),
});

export const idSchema = id;
