import { z } from 'zod';
import { formatMm } from '@/lib/units/format';
import { looksLikeInchClass, MAX_SIZE_MM, MM_PER_INCH, normaliseInchClass, parseDesignation, type Designation } from '@/lib/fits';
import { SIZE_UNITS, type SizeUnit } from './fits-words';

export type { SizeUnit } from './fits-words';

/** What the fits page and GET /api/fits agree on once the input has been read. */
export type FitsEntry = {
  /** Which input the size and zone came from, so an engine refusal can be pinned to the right field. */
  source: 'q' | 'fields';
  nominalMm: number;
  /** Unit the size was given in. */
  unit: SizeUnit;
  /** The size in that unit (1 for "1 in"). */
  nominalInput: number;
  /** The size as typed, decimal comma turned into a point ("25", "1-1/4"). */
  nominalText: string;
  zone?: string;
  /** "H7/g6", hole first. */
  fit?: string;
  /** ANSI B4.1 inch class ("RC4"); the size is then in inches. */
  inchClass?: string;
  roundJs: boolean;
};

export type ReadResult<T> = { ok: true; value: T } | { ok: false; message: string };

const MAX_IN = Math.floor((MAX_SIZE_MM / MM_PER_INCH) * 10_000) / 10_000;

// Leading size of a typed designation, with an optional diameter sign ("Ø25", "1-1/4", ".5").
const LEADING_SIZE = /^(\s*(?:[Øø⌀∅Φφ]|dia\.?(?=\s|\d))?\s*(?:\d+[\s-]+\d+\/\d+|\d+\/\d+|\d+(?:[.,]\d+)?|[.,]\d+))/i;
// A unit written right after the size.
const UNIT_AHEAD = /^\s*(?:mm|millimet|inch|in(?![A-Za-z])|"|″|'')/i;
// A size on its own: decimal (point or comma), or for inches a fraction or mixed number.
const DECIMAL = /^(?:\d+(?:[.,]\d+)?|[.,]\d+)$/;
const FRACTION = /^(?:\d+[\s-]+\d+\/\d+|\d+\/\d+)$/;

function rangeMessage(nominalMm: number, unit: SizeUnit, shown: string): string | null {
  if (!(nominalMm > 0)) return `The size must be greater than 0; ${shown} ${unit} is not a size.`;
  if (nominalMm > MAX_SIZE_MM) {
    const asMm = unit === 'in' ? ` (${formatMm(nominalMm, { decimals: 0, maxDecimals: 3 })} mm)` : '';
    return `${shown} ${unit}${asMm} is above ${MAX_SIZE_MM} mm${unit === 'in' ? ` (${MAX_IN} in)` : ''}, the largest size ISO 286 covers.`;
  }
  return null;
}

/**
 * A typed designation ("25 H7/g6", "1 in g6", "Ø25h6", "25"). `unit` is the unit of a size that
 * names none: with unit 'in', "1 H7" is read as one inch. A unit written in the text always wins.
 * The zone is read but not checked against the size; the engine does that.
 */
export function readDesignationText(text: string, unit: SizeUnit = 'mm', options: { isoRange?: boolean } = {}): ReadResult<Designation> {
  const trimmed = text.trim();
  let toParse = trimmed;
  if (unit === 'in') {
    const lead = LEADING_SIZE.exec(trimmed);
    if (lead && !UNIT_AHEAD.test(trimmed.slice(lead[0].length))) {
      toParse = `${lead[0]} in ${trimmed.slice(lead[0].length).trimStart()}`.trim();
    }
  }
  if (/^\s*-\s*\d/.test(trimmed)) {
    return { ok: false, message: `The size must be greater than 0: a nominal size is never negative.` };
  }
  let d: Designation;
  try {
    d = parseDesignation(toParse);
  } catch (err) {
    return { ok: false, message: err instanceof Error ? err.message : 'Could not read that.' };
  }
  // An inch class's own table says how far it goes (the engine refuses past it).
  const isoRange = options.isoRange !== false && d.inchClass === undefined;
  const range = isoRange || !(d.nominalMm > 0) ? rangeMessage(d.nominalMm, d.unit, d.nominalText) : null;
  if (range) return { ok: false, message: range };
  return { ok: true, value: d };
}

/** A size on its own ("25", "25,4", and for inches also "1/2" or "1-1/4"), converted exactly to mm. */
export function readSizeText(
  text: string,
  unit: SizeUnit,
  options: { isoRange?: boolean } = {},
): ReadResult<{ nominalMm: number; nominalInput: number; nominalText: string }> {
  const t = text.trim();
  if (/^[-−]/.test(t) && DECIMAL.test(t.slice(1).trim())) {
    return { ok: false, message: `The size must be greater than 0; ${t} ${unit} is not a size.` };
  }
  if (FRACTION.test(t) && unit === 'mm') {
    return { ok: false, message: `${t} looks like a fraction of an inch: give the size in mm as a decimal, or set the unit to inches.` };
  }
  if (!DECIMAL.test(t) && !FRACTION.test(t)) {
    const example = unit === 'in' ? '1, 0.375 or 1-1/4' : '25 or 12.5';
    return { ok: false, message: `The size must be a number, e.g. ${example}; "${t}" is not one.` };
  }
  // parseDesignation converts inches exactly (the typed decimal scaled as an integer).
  const read = readDesignationText(t, unit, options);
  if (!read.ok) return read;
  return { ok: true, value: { nominalMm: read.value.nominalMm, nominalInput: read.value.nominalInput, nominalText: read.value.nominalText } };
}

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

const text = (field: string, max: number, example: string) =>
  z.preprocess(
    blankToUndefined,
    z
      .string({ error: `${field} must be text, e.g. ${example}.` })
      .trim()
      .max(max, `${field} is too long: write it like ${example}.`)
      .optional(),
  );

/**
 * The query of GET /api/fits: either q ("25 H7/g6", read like the page's one box), or size with
 * zone or fit. unit says what the size is in (mm by default; 25.4 mm to the inch, exactly);
 * round=1 rounds JS/js of grades 7–11 as ISO 286-1 allows.
 */
export const fitsQuerySchema = z
  .object({
    q: text('q', 60, '"25 H7/g6"'),
    size: text('size', 20, '25'),
    zone: text('zone', 12, 'H7 or g6'),
    fit: text('fit', 24, 'H7/g6 or RC4'),
    unit: z.preprocess(blankToUndefined, z.enum(SIZE_UNITS, { error: 'unit must be mm or in.' }).optional()),
    round: z.preprocess(
      blankToUndefined,
      z.enum(['0', '1', 'true', 'false'], { error: 'round must be 1 (round JS/js as ISO 286-1 allows) or 0.' }).default('0'),
    ),
  })
  .transform((query, ctx): FitsEntry => {
    const roundJs = query.round === '1' || query.round === 'true';
    if (query.q !== undefined) {
      if (query.size !== undefined || query.zone !== undefined || query.fit !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['q'], message: 'Send either q (e.g. "25 H7/g6") or size with zone or fit, not both.' });
        return z.NEVER;
      }
      const read = readDesignationText(query.q, query.unit ?? 'mm');
      if (!read.ok) {
        ctx.addIssue({ code: 'custom', path: ['q'], message: read.message });
        return z.NEVER;
      }
      const d = read.value;
      if (d.inchClass !== undefined) {
        return { source: 'q', nominalMm: d.nominalMm, unit: d.unit, nominalInput: d.nominalInput, nominalText: d.nominalText, inchClass: d.inchClass, roundJs };
      }
      if (d.zone === undefined && d.fit === undefined) {
        ctx.addIssue({
          code: 'custom',
          path: ['q'],
          message: `Read the size ${d.nominalText} ${d.unit}; add a zone such as "H7" or a fit such as "H7/g6" after it.`,
        });
        return z.NEVER;
      }
      return {
        source: 'q',
        nominalMm: d.nominalMm,
        unit: d.unit,
        nominalInput: d.nominalInput,
        nominalText: d.nominalText,
        zone: d.zone,
        fit: d.fit ? `${d.fit.hole}/${d.fit.shaft}` : undefined,
        roundJs,
      };
    }

    if (query.fit !== undefined && query.zone === undefined && looksLikeInchClass(query.fit)) {
      let inchClass: string | undefined;
      try {
        inchClass = normaliseInchClass(query.fit);
      } catch (err) {
        ctx.addIssue({ code: 'custom', path: ['fit'], message: err instanceof Error ? err.message : 'Not an inch class.' });
      }
      if (query.unit === 'mm') {
        ctx.addIssue({ code: 'custom', path: ['unit'], message: `${inchClass ?? 'An inch class'} is tabulated in inches: send unit=in (or leave unit out).` });
      }
      let inches: { nominalMm: number; nominalInput: number; nominalText: string } | undefined;
      if (query.size === undefined) {
        ctx.addIssue({ code: 'custom', path: ['size'], message: 'Give the nominal size in inches, e.g. size=1.5.' });
      } else {
        // The class's own table says how far it goes (to 200 in for RC and LC): the engine decides.
        const read = readSizeText(query.size, 'in', { isoRange: false });
        if (read.ok) inches = read.value;
        else ctx.addIssue({ code: 'custom', path: ['size'], message: read.message });
      }
      if (inchClass === undefined || inches === undefined || query.unit === 'mm') return z.NEVER;
      return { source: 'fields', ...inches, unit: 'in', inchClass, roundJs };
    }

    const unit = query.unit ?? 'mm';
    let size: { nominalMm: number; nominalInput: number; nominalText: string } | undefined;
    if (query.size === undefined) {
      ctx.addIssue({ code: 'custom', path: ['size'], message: 'Give the nominal size, e.g. size=25 (mm) or size=1&unit=in.' });
    } else {
      const read = readSizeText(query.size, unit);
      if (read.ok) size = read.value;
      else ctx.addIssue({ code: 'custom', path: ['size'], message: read.message });
    }
    if (query.zone === undefined && query.fit === undefined) {
      const message = 'Give a tolerance zone (zone=H7) or a fit, hole first (fit=H7/g6).';
      ctx.addIssue({ code: 'custom', path: ['zone'], message });
      ctx.addIssue({ code: 'custom', path: ['fit'], message });
    } else if (query.zone !== undefined && query.fit !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['fit'], message: 'Give either zone or fit, not both.' });
    }
    if (!size || (query.zone === undefined) === (query.fit === undefined)) return z.NEVER;
    return { source: 'fields', ...size, unit, zone: query.zone, fit: query.fit, roundJs };
  });
