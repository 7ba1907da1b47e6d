// Type-only: the model module pulls in Sequelize, which must never reach a browser bundle.
import type { FlagHazard, FlagSeverity, FlagStatus } from '../../db/models/risk-flag';

// The words of risk flags, without their schemas (lib/validations/flags.ts): what a reader's page shows
// needs these and must not bring the validation library along.

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
