import { z } from 'zod';
// Type-only: the model module pulls in Sequelize, which must never reach a browser bundle.
import type { FlagHazard, FlagSeverity, FlagStatus } from '../../db/models/risk-flag';

export type { FlagHazard, FlagSeverity, FlagStatus };

/** The three severities, each said in words: what the builder should do about a flag of that weight. */
export const FLAG_SEVERITY_OPTIONS = [
  { value: 'caution', label: 'Caution', meaning: 'A risk to keep in mind: carry on, with care.' },
  { value: 'warning', label: 'Warning', meaning: 'Change how this is done before doing it again.' },
  { value: 'stop', label: 'Stop', meaning: 'Do not run this again as shown until the flag is answered.' },
] as const satisfies readonly { value: FlagSeverity; label: string; meaning: string }[];

/** Our list of hazards, with the words shown for each: the one place these labels live. */
export const FLAG_HAZARD_OPTIONS = [
  { value: 'rotating-work', label: 'Rotating work and chucks' },
  { value: 'flying-chips', label: 'Flying chips' },
  { value: 'dust-fumes', label: 'Dust and fumes' },
  { value: 'sharp-edges', label: 'Sharp edges' },
  { value: 'lifting', label: 'Lifting heavy parts' },
  { value: 'electrical', label: 'Electrical' },
  { value: 'part-breakage', label: 'Part breakage' },
  { value: 'tool-breakage', label: 'Tool breakage' },
  { value: 'other', label: 'Other' },
] as const satisfies readonly { value: FlagHazard; label: string }[];

export const FLAG_STATUS_LABEL: Record<FlagStatus, string> = {
  open: 'Waiting for the builder',
  acknowledged: 'Seen by the builder',
  resolved: 'Answered',
};

/**
 * The builder's two steps, in the same words as the status each one leads to: "I've seen it" makes the flag
 * "Seen by the builder", "Answer" makes it "Answered". (The API and the database keep acknowledge/resolve.)
 */
export const FLAG_STEP_WORDS = {
  seen: { button: 'I’ve seen it', done: 'Marked as seen: the mentor can tell you have read the flag.', leadsTo: 'acknowledged' },
  answer: { button: 'Answer', submit: 'Send the answer', leadsTo: 'resolved' },
  /** One line under the buttons while the flag waits. */
  hint: 'Say you have seen it once you have read it; answer when you have acted on it.',
} as const satisfies {
  seen: { button: string; done: string; leadsTo: FlagStatus };
  answer: { button: string; submit: string; leadsTo: FlagStatus };
  hint: string;
};

export const severityLabel = (s: FlagSeverity) => FLAG_SEVERITY_OPTIONS.find((o) => o.value === s)?.label ?? s;
export const severityMeaning = (s: FlagSeverity) => FLAG_SEVERITY_OPTIONS.find((o) => o.value === s)?.meaning ?? '';
export const hazardLabel = (h: FlagHazard) => FLAG_HAZARD_OPTIONS.find((o) => o.value === h)?.label ?? h;

export const FLAG_TEXT_MAX = 2000;
export const FLAG_ANSWER_MAX = 4000;

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
