import { z } from 'zod';
import { parseNumber } from '@/lib/units/parse';
import {
  FEATURE_KINDS, GENERAL_CLASSES, INSTRUMENT_VALUES, LENGTH_UNITS, MAX_DECIMALS, MeasurementError, checkNearNominal, decimalsOf, recordLimits,
  type LengthUnit, type Spec,
} from '@/lib/measurements';

/** Largest nominal size a record takes, mm: bigger than any hobby part, small enough for the columns. */
export const MAX_NOMINAL_MM = 10_000;
export const FEATURE_MAX = 120;
export const READING_NOTE_MAX = 1000;
export const MAX_READINGS = 100;

/** Numbers arrive from JSON as numbers and from form fields as text ("130,012" with a decimal comma too; no fractions). */
function toNumberish(v: unknown): unknown {
  if (typeof v === 'string') {
    const n = parseNumber(v);
    // Text that is not a number goes on as text, so the schema names the field.
    return n === undefined ? undefined : Number.isNaN(n) ? v : n;
  }
  return v === null ? undefined : v;
}

const blankToNull = (v: unknown) => (v === '' || v === undefined ? null : v);

function decimal(label: string, missing: string) {
  return z.preprocess(
    toNumberish,
    z
      .number({ error: (iss) => (iss.input === undefined ? missing : `${label} must be a number.`) })
      .refine(Number.isFinite, `${label} must be a number.`)
      .refine((v) => Math.abs(v) < 1_000_000, `${label} is far too large.`)
      .refine((v) => decimalsOf(v) <= MAX_DECIMALS, `Give ${label.toLowerCase()} to at most ${MAX_DECIMALS} decimal places.`),
  );
}

const positive = (label: string, missing: string, zero = `${label} must be greater than zero.`) =>
  decimal(label, missing).refine((v) => v > 0, { message: zero });

const unitSchema = z.enum(LENGTH_UNITS, { error: 'The unit must be mm or in.' });
const idField = (label: string) =>
  z.preprocess(toNumberish, z.number({ error: `${label} must be a number.` }).int(`${label} must be a whole number.`).positive(`${label} must be a positive number.`));
const version = z.number({ error: 'The version you edited is missing; reload the page.' }).int().positive();

export const specSchema = z.discriminatedUnion(
  'type',
  [
    z.object({
      type: z.literal('zone'),
      zone: z
        .string({ error: 'Give the ISO 286 zone, e.g. h6 for a shaft or H7 for a hole.' })
        .trim()
        .min(1, 'Give the ISO 286 zone, e.g. h6 for a shaft or H7 for a hole.')
        .max(6, 'A zone is a letter and a grade, e.g. k6 or H7.'),
    }),
    z.object({
      type: z.literal('inchClass'),
      fitClass: z
        .string({ error: 'Give the inch class, e.g. RC4 or LN2.' })
        .trim()
        .min(1, 'Give the inch class, e.g. RC4 or LN2.')
        .max(6, 'An inch class is two letters and a number, e.g. RC4 or LC11.'),
    }),
    z.object({
      type: z.literal('limits'),
      upper: decimal('The upper deviation', 'Give the upper deviation, e.g. +0.1 (0 when the size itself is the upper limit).'),
      lower: decimal('The lower deviation', 'Give the lower deviation, e.g. 0 or -0.05.'),
    }),
    z.object({
      type: z.literal('plusMinus'),
      tolerance: positive('The ± tolerance', 'Give the ± tolerance, e.g. 0.05.'),
    }),
    z.object({
      type: z.literal('general'),
      generalClass: z.enum(GENERAL_CLASSES, { error: 'Pick a general tolerance class: f (fine), m (medium), c (coarse) or v (very coarse).' }),
    }),
  ],
  { error: 'Pick how the size is toleranced: an ISO 286 zone, an inch class, upper and lower deviations, ± a tolerance, or a general tolerance class.' },
);

export const readingInputSchema = z.object({
  value: positive('The reading', 'Give the reading.', 'A reading must be a size greater than zero.'),
  unit: unitSchema,
  instrument: z.enum(INSTRUMENT_VALUES, { error: 'Pick the instrument: caliper, micrometer, bore gauge, telescoping gauge, dial indicator or other.' }),
  resolution: positive(
    'The resolution',
    'Give the instrument’s resolution, e.g. 0.01 mm for a caliper.',
    'The instrument resolution cannot be zero: give the smallest step it reads, e.g. 0.01 mm for a caliper or 0.001 mm for a micrometer.',
  ).refine((v) => v <= 1, 'A resolution coarser than 1 is not a measuring instrument’s: give the smallest step it reads.'),
  measuredBy: z.preprocess((v) => (v == null ? '' : v), z.string({ error: 'Who measured must be a name.' }).trim().max(120, 'Keep the name under 120 characters.')),
  measuredAt: z.preprocess(
    (v) => (v === '' || v == null ? undefined : v),
    z
      .union([z.date(), z.string()], { error: 'Give the date and time it was measured.' })
      .transform((v) => (v instanceof Date ? v : new Date(v)))
      .refine((d) => !Number.isNaN(d.getTime()), 'Give the date and time it was measured, e.g. 2026-10-10 14:30.')
      .refine((d) => d.getTime() <= Date.now() + 24 * 3600 * 1000, 'The measuring time is in the future.')
      .refine((d) => d.getUTCFullYear() >= 1970, 'The measuring time is too long ago.')
      .optional(),
  ),
  temperatureC: z.preprocess(
    (v) => (toNumberish(v) === undefined ? null : toNumberish(v)),
    z
      .number({ error: 'The temperature must be a number of °C, or left empty.' })
      .min(-50, 'A part at below −50 °C is not measured in a shop: check the temperature.')
      .max(100, 'A part above 100 °C is too hot to measure: check the temperature.')
      .nullable(),
  ),
  pass: z.preprocess(
    (v) => (toNumberish(v) === undefined ? null : toNumberish(v)),
    z.number({ error: 'The pass must be a whole number, or left empty.' }).int('The pass must be a whole number.').min(1, 'Passes count from 1.').max(999, 'Passes count up to 999.').nullable(),
  ),
  note: z.preprocess((v) => (v == null ? '' : v), z.string({ error: 'The note must be text.' }).trim().max(READING_NOTE_MAX, `Keep the note under ${READING_NOTE_MAX} characters.`)),
});
export type ReadingData = z.output<typeof readingInputSchema>;

const recordFields = {
  feature: z
    .string({ error: 'Name the feature, e.g. “spigot diameter”.' })
    .trim()
    .min(2, 'Name the feature, e.g. “spigot diameter”.')
    .max(FEATURE_MAX, `Keep the feature under ${FEATURE_MAX} characters.`),
  kind: z.enum(FEATURE_KINDS, { error: 'Say whether it is an outside (shaft-like) or an inside (hole-like) feature.' }),
  nominal: positive('The nominal size', 'Give the nominal size.', 'The nominal size must be greater than zero.'),
  unit: unitSchema,
  spec: specSchema,
  timeNoteId: z.preprocess(blankToNull, idField('The clip moment').nullable()),
};

type RecordShape = { kind: (typeof FEATURE_KINDS)[number]; nominal: number; unit: LengthUnit; spec: Spec; readings?: { value: number; unit: LengthUnit }[] };

const pathOf = (field: string) => field.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p));

/**
 * The checks that need the record as a whole: a zone the standard defines at this size, a zone
 * letter that matches inside/outside, readings anywhere near the nominal. Every problem is reported
 * on its own field.
 */
export function recordIssues(r: RecordShape): { path: (string | number)[]; message: string }[] {
  const issues: { path: (string | number)[]; message: string }[] = [];
  // A nominal that failed its own checks has already been reported; nothing else can be judged against it.
  if (!(Number.isFinite(r.nominal) && r.nominal > 0)) return issues;
  const nominalMm = r.unit === 'mm' ? r.nominal : r.nominal * 25.4;
  if (nominalMm > MAX_NOMINAL_MM) {
    issues.push({ path: ['nominal'], message: `Nominal sizes go up to ${MAX_NOMINAL_MM} mm here.` });
    return issues;
  }
  try {
    recordLimits(r);
  } catch (err) {
    if (!(err instanceof MeasurementError)) throw err;
    issues.push({ path: pathOf(err.field), message: err.message });
  }
  (r.readings ?? []).forEach((reading, i) => {
    if (!(Number.isFinite(reading.value) && reading.value > 0)) return;
    try {
      checkNearNominal(r.nominal, r.unit, reading.value, reading.unit, `readings.${i}.value`);
    } catch (err) {
      if (!(err instanceof MeasurementError)) throw err;
      issues.push({ path: pathOf(err.field), message: err.message });
    }
  });
  return issues;
}

const addIssues = (r: RecordShape, ctx: z.RefinementCtx) => {
  for (const issue of recordIssues(r)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
};

/** A new record with its readings, saved together or not at all. */
export const measurementInputSchema = z
  .object({
    ...recordFields,
    readings: z
      .array(readingInputSchema, { error: 'Readings must be a list.' })
      .min(1, 'Add at least one reading.')
      .max(MAX_READINGS, `A record holds up to ${MAX_READINGS} readings.`),
  })
  .superRefine(addIssues);
export type MeasurementInput = z.output<typeof measurementInputSchema>;

/** A record's own fields without readings (checked again with its stored readings on the server). */
export const recordFieldsSchema = z.object(recordFields).superRefine(addIssues);
export const measurementUpdateSchema = z.object(recordFields).partial().extend({ version });

export const readingUpdateSchema = readingInputSchema.partial().extend({ version });

export const pairInputSchema = z.object({
  holeRecordId: idField('The hole record'),
  shaftRecordId: idField('The shaft record'),
});

/** What the record form holds before parsing: every field as typed. */
export type ReadingFormValues = {
  value: string;
  unit: LengthUnit;
  instrument: string;
  resolution: string;
  measuredBy: string;
  measuredAt: string;
  temperatureC: string;
  pass: string;
  note: string;
};
export type MeasurementFormValues = {
  feature: string;
  kind: (typeof FEATURE_KINDS)[number];
  nominal: string;
  unit: LengthUnit;
  spec: { type: Spec['type']; zone?: string; fitClass?: string; upper?: string; lower?: string; tolerance?: string; generalClass?: string };
  timeNoteId: string;
  readings: ReadingFormValues[];
};
