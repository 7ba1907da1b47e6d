/**
 * The calculator boxes' reading and writing, on top of the app's one parser (lib/units/parse.ts) and
 * one set of formatters (lib/units/format.ts): a box takes a decimal comma, a fraction of an inch
 * ("4-1/2") and an exponent. A drill by its name or a diameter with its unit: drill-box.ts (its chart stays
 * on the pages that read one).
 */
import type { LengthUnit } from '../../types/units';
import { parseNumber, type ParseNumberOptions } from '../../units/parse';
import { formatMm, formatNumber, MM_PER_INCH } from '../../units/format';

/** What a calculator box accepts: fractions of an inch and exponents, besides plain decimals. */
export const BOX_NUMBER: ParseNumberOptions = { fractions: true, exponent: true };

/** A length typed in a unit, in millimetres (undefined when empty, NaN when unreadable). */
export function readLengthMm(text: string, unit: LengthUnit): number | undefined {
  const n = parseNumber(text, BOX_NUMBER);
  if (n === undefined || Number.isNaN(n)) return n;
  return unit === 'in' ? n * MM_PER_INCH : n;
}

/** A stored number as it goes back into a box (to 0.000001, no trailing zeros), or '' for anything that is not one. */
export const numberBox = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? formatNumber(v, { maxDecimals: 6 }) : '');

/** A stored length in mm as it goes back into a millimetre box (to 0.0001 mm, no trailing zeros), or ''. */
export const mmBox = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? formatMm(v, { decimals: 0, maxDecimals: 4 }) : '');

/** A length in mm as a label says it ("6.78 mm"), or '?' for anything that is not a number. */
export const mmLabel = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? `${formatMm(v, { decimals: 0, maxDecimals: 3 })} mm` : '?');
