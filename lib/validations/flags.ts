import { z } from 'zod';
// Type-only: the model module pulls in Sequelize, which must never reach a browser bundle.
import type { FlagHazard, FlagSeverity, FlagStatus } from '../../db/models/risk-flag';
import { FLAG_SEVERITY_OPTIONS, FLAG_HAZARD_OPTIONS, FLAG_TEXT_MAX, FLAG_ANSWER_MAX } from './flag-words';

export type { FlagHazard, FlagSeverity, FlagStatus };
// The words live apart so a reader's page can show them without the schemas below.
export { FLAG_SEVERITY_OPTIONS, FLAG_HAZARD_OPTIONS, FLAG_STATUS_LABEL, FLAG_STEP_WORDS, severityLabel, severityMeaning, hazardLabel, FLAG_TEXT_MAX, FLAG_ANSWER_MAX } from './flag-words';

const SEVERITIES = FLAG_SEVERITY_OPTIONS.map((o) => o.value) as [FlagSeverity, ...FlagSeverity[]];
const HAZARDS = FLAG_HAZARD_OPTIONS.map((o) => o.value) as [FlagHazard, ...FlagHazard[]];

const id = (field: string) => z.coerce.number({ error: `${field} must be a number.` }).int(`${field} must be a whole number.`).positive(`${field} must be a positive whole number.`);
const version = z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive();
const words = (what: string, max: number) =>
  z
    .string({ error: `Say ${what}.` })
    .trim()
    .min(3, `Say ${what} (at least 3 characters).`)
    .max(max, `Keep it under ${max} characters.`);

const severity = z.enum(SEVERITIES, { error: 'Pick a severity: caution, warning or stop.' });
const hazard = z.enum(HAZARDS, { error: 'Pick a hazard from the list.' });
const concern = words('what the concern is', FLAG_TEXT_MAX);
const instead = words('what to do instead', FLAG_TEXT_MAX);

/** What a flag points at: the entry as a whole, one of its timestamped notes, or one of its measurement records. */
export const flagTargetSchema = z.union(
  [z.literal('entry'), z.object({ noteId: id('target.noteId') }).strict(), z.object({ recordId: id('target.recordId') }).strict()],
  { error: 'The target must be "entry", { noteId } or { recordId }.' },
);

export const flagInputSchema = z.object({
  target: flagTargetSchema.default('entry'),
  severity,
  hazard,
  concern,
  instead,
});

export const flagUpdateSchema = z.object({
  severity: severity.optional(),
  hazard: hazard.optional(),
  concern: concern.optional(),
  instead: instead.optional(),
  version,
});

export const flagAcknowledgeSchema = z.object({ version: version.optional() });

export const flagResolveSchema = z.object({
  answer: z
    .string({ error: 'Write your answer to the mentor.' })
    .trim()
    .min(3, 'Write your answer to the mentor (at least 3 characters).')
    .max(FLAG_ANSWER_MAX, `Keep the answer under ${FLAG_ANSWER_MAX} characters.`),
  version,
});
