/**
 * The calculator boxes' reading and writing, on top of the app's one parser (lib/units/parse.ts) and
 * one set of formatters (lib/units/format.ts): a box takes a decimal comma, a fraction of an inch
 * ("4-1/2") and an exponent; a drill by its name or a diameter with its unit.
 */
import { drillSize, type DrillSize } from '../drills';
import { CalculatorError } from '../errors';
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

export interface DrillReading {
  diameterMm: number;
  /** The chart drill, when the text named one. */
  drill: DrillSize | null;
}

/**
 * A drill you have: a chart name (#7, F, 27/64, 6.8 mm) or any diameter with its unit (6.75 mm,
 * 0.2 in). A bare number is refused, as the drill chart refuses it: #7 and 7 mm differ by 1.9 mm.
 */
export function readDrill(text: string, field = 'drill'): DrillReading {
  try {
    const drill = drillSize(text);
    return { diameterMm: drill.diameterMm, drill };
  } catch (err) {
    const m = /^\s*(\d*[.,]?\d+)\s*(mm|in|inch|")\s*$/i.exec(text ?? '');
    if (m) {
      const n = parseNumber(m[1]) ?? Number.NaN;
      if (n > 0) return { diameterMm: m[2].toLowerCase() === 'mm' ? n : n * MM_PER_INCH, drill: null };
    }
    if (/^\s*\d*[.,]\d+\s*$/.test(text ?? '')) {
      throw new CalculatorError('UNREADABLE', field, `Give the unit: ${text.trim()} mm or ${text.trim()} in.`);
    }
    if (err instanceof CalculatorError) throw new CalculatorError(err.code, field, err.message);
    throw err;
  }
}
