/**
 * Reading what people type for a toleranced size:
 *
 *   "25 H7/g6"  "Ø25H7"  "ø 25 h6"  "25h6"  "25mm H7"  "25,4 H7"
 *   "1.000 in H7"  "1\" g6"  "1/2 in H7"  "1-1/4\" g6"  "25 (H7/g6)"  "25 H7-g6"
 *
 * Inches are converted exactly (25.4 mm per inch): the typed decimal is
 * scaled as an integer, so "1.000 in" is exactly 25.4 and "0.375 in" is the
 * double nearest 9.525.
 *
 * Everything that cannot be read throws FitError 'UNREADABLE' with a message
 * saying which part could not be read. Whether the zone is defined at that
 * size is not checked here; toleranceZone / analyseFit do that.
 */

import { FitError } from './errors';
import { normaliseInchClass } from './inch';
import { parseZoneText } from './letters';

export interface Designation {
  nominalMm: number;
  unit: 'mm' | 'in';
  /** The size in the unit it was typed in (1 for "1.000 in"). */
  nominalInput: number;
  /** The size exactly as typed, decimal comma turned into a point ("1.000", "25.4", "1-1/4"). */
  nominalText: string;
  /** Single zone, when one zone was given ("H7"). */
  zone?: string;
  /** Fit, when a hole and a shaft were given, hole first. */
  fit?: { hole: string; shaft: string };
  /** ANSI B4.1 inch class ("RC4"), when one was given; its size is always in inches. */
  inchClass?: string;
}

const DIAMETER_SIGN = /^(?:[Øø⌀∅Φφ]|dia\.?(?=\s|\d))\s*/i;
// Mixed number "1-1/4" or "1 1/4", plain fraction "3/8", or decimal "25", "25.4", "25,4", ".5".
const NUMBER = /^(?:(\d+)[\s-]+(\d+)\/(\d+)|(\d+)\/(\d+)|(\d+(?:[.,]\d+)?|[.,]\d+))/;
const UNIT = /^(?:(mm|millimet(?:er|re)s?)|(inch(?:es)?|in\.?|"|″|''))(?![A-Za-z])/i;
// An ANSI B4.1 class written after the size: "RC4", "lc 11", "FN-2".
const INCH_CLASS = /^\(?\s*((?:RC|LC|LT|LN|FN)\s*-?\s*\d{1,2})\s*\)?$/i;
const ZONE_PAIR = /^\(?\s*([A-Za-z]{1,2}\d{1,2})\s*(?:([/-])\s*|\s+)?([A-Za-z]{1,2}\d{1,2})?\s*\)?/;

function unreadable(message: string): FitError {
  return new FitError('UNREADABLE', message);
}

function quote(s: string): string {
  return `"${s}"`;
}

/** Exact inch → mm for a decimal written as text: digits × 254 / 10^(scale+1). */
function decimalInchesToMm(text: string): number {
  const [whole = '', frac = ''] = text.split('.');
  const mantissa = Number(`${whole}${frac}` || '0');
  if (!Number.isSafeInteger(mantissa * 254)) return Number(text) * 25.4;
  return (mantissa * 254) / 10 ** (frac.length + 1);
}

/** Exact inch → mm for whole + num/den inches. */
function fractionInchesToMm(whole: number, num: number, den: number): number {
  return ((whole * den + num) * 254) / (den * 10);
}

export function parseDesignation(text: string): Designation {
  if (typeof text !== 'string' || text.trim() === '') {
    throw unreadable('Nothing to read: type a size and a zone, e.g. "25 H7/g6" or "1.000 in g6".');
  }
  const original = text.trim();
  let rest = original.replace(DIAMETER_SIGN, '');

  const num = NUMBER.exec(rest);
  if (num === null) {
    throw unreadable(`Could not find the size at the start of ${quote(original)}: begin with a number, e.g. "25 H7" or "Ø25 H7".`);
  }
  rest = rest.slice(num[0].length).trimStart();

  const unitMatch = UNIT.exec(rest);
  if (unitMatch !== null) rest = rest.slice(unitMatch[0].length).trimStart();
  const classMatch = INCH_CLASS.exec(rest.trim());
  // The inch classes are tabulated in inches: a size without a unit before one is in inches.
  const unit: 'mm' | 'in' = unitMatch !== null ? (unitMatch[2] !== undefined ? 'in' : 'mm') : classMatch !== null ? 'in' : 'mm';

  let nominalText: string;
  let nominalInput: number;
  let nominalMm: number;
  if (num[6] !== undefined) {
    nominalText = num[6].replace(',', '.');
    if (nominalText.startsWith('.')) nominalText = `0${nominalText}`;
    nominalInput = Number(nominalText);
    nominalMm = unit === 'in' ? decimalInchesToMm(nominalText) : nominalInput;
  } else {
    const whole = num[1] !== undefined ? Number(num[1]) : 0;
    const top = Number(num[2] ?? num[4]);
    const bottom = Number(num[3] ?? num[5]);
    nominalText = num[1] !== undefined ? `${num[1]}-${num[2]}/${num[3]}` : `${num[4]}/${num[5]}`;
    if (unit !== 'in') {
      throw unreadable(`${quote(nominalText)} looks like a fraction of an inch: add the unit, e.g. "${nominalText} in".`);
    }
    if (bottom === 0) throw unreadable(`${quote(nominalText)} divides by zero.`);
    nominalInput = whole + top / bottom;
    nominalMm = fractionInchesToMm(whole, top, bottom);
  }

  const result: Designation = { nominalMm, unit, nominalInput, nominalText };
  if (rest === '') return result;

  if (classMatch !== null) {
    let name: string;
    try {
      name = normaliseInchClass(classMatch[1] as string);
    } catch (error) {
      throw unreadable(error instanceof Error ? error.message : `Could not read ${quote(rest)}.`);
    }
    if (unit !== 'in') {
      throw unreadable(
        `${name} is an inch class (ANSI B4.1): give the size in inches, e.g. "1.500 ${name}". For a size in millimetres use an ISO 286 fit such as "25 H7/g6".`,
      );
    }
    result.inchClass = name;
    return result;
  }

  const zones = ZONE_PAIR.exec(rest);
  if (zones === null || zones[0].trim() === '') {
    throw unreadable(`Read the size ${nominalText} ${unit}, but could not read ${quote(rest)} as a tolerance zone such as "H7" or a fit such as "H7/g6".`);
  }
  const leftover = rest.slice(zones[0].length).trim();
  if (leftover !== '') {
    throw unreadable(`Read ${quote(original.slice(0, original.length - leftover.length).trim())}, but could not read the rest: ${quote(leftover)}.`);
  }
  const first = zones[1] as string;
  const second = zones[3];
  if (zones[2] !== undefined && second === undefined) {
    throw unreadable(`${quote(rest)} ends after "${zones[2]}": write the shaft zone too, e.g. "${first}/g6".`);
  }

  const readOne = (zone: string) => {
    try {
      return parseZoneText(zone);
    } catch (error) {
      // Same explanation as toleranceZone gives, under this function's single error code.
      throw unreadable(error instanceof Error ? error.message : `Could not read ${quote(zone)}.`);
    }
  };
  const a = readOne(first);
  if (second === undefined) {
    result.zone = a.text;
    return result;
  }
  const b = readOne(second);
  if (a.isHole && !b.isHole) {
    result.fit = { hole: a.text, shaft: b.text };
    return result;
  }
  if (!a.isHole && b.isHole) {
    throw unreadable(`${quote(`${a.text}/${b.text}`)} is written shaft first: a fit is written hole first, ${b.text}/${a.text}.`);
  }
  throw unreadable(
    `${quote(`${a.text}/${b.text}`)} pairs ${a.isHole ? 'two holes' : 'two shafts'}: a fit needs a hole zone (capital letter) and a shaft zone (small letter), e.g. "H7/g6".`,
  );
}
