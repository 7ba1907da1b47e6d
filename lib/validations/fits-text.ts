// Reading a typed size or designation ("25 H7/g6", "1-1/4 in RC4"), without the schemas of fits.ts: the fits
// page reads its box with it in the browser, which loads no zod.
import { formatMm } from '@/lib/units/format';
import { MAX_SIZE_MM, MM_PER_INCH, parseDesignation, type Designation } from '@/lib/fits';
import type { SizeUnit } from './fits-words';

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

