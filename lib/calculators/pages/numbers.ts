/**
 * Numbers on the calculator pages, both ways. Reading what a machinist types into a box (a decimal
 * comma, a fraction of an inch "4-1/2", a drill by its name or a diameter with its unit): `readNumber`
 * is the one parser. Writing them back: `numberText`/`lengthText` for boxes, URLs and labels (no
 * trailing zeros), `readoutMm`/`readoutIn` for results (fixed places, as read off a drawing or a DRO).
 */
import { drillSize, type DrillSize } from '../drills';
import { CalculatorError } from '../errors';
import { MM_PER_INCH } from '../units';
import type { LengthUnit } from '../../types/units';

/** undefined for an empty box, NaN for something that is not a number. */
export function readNumber(text: string | null | undefined): number | undefined {
  const s = (text ?? '').trim().replace(',', '.');
  if (s === '') return undefined;
  const frac = /^(?:(\d+)(?:\s*-\s*|\s+))?(\d+)\s*\/\s*(\d+)$/.exec(s);
  if (frac) {
    const bottom = Number(frac[3]);
    if (bottom === 0) return Number.NaN;
    return (frac[1] ? Number(frac[1]) : 0) + Number(frac[2]) / bottom;
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(s)) return Number.NaN;
  return Number(s);
}

/** A number as it goes back into a box or a URL: no binary noise, no trailing zeros. */
export function numberText(n: number, decimals = 6): string {
  return String(Number(n.toFixed(decimals)));
}


/** A length typed in a unit, in millimetres (undefined when empty, NaN when unreadable). */
export function readLengthMm(text: string, unit: LengthUnit): number | undefined {
  const n = readNumber(text);
  if (n === undefined || Number.isNaN(n)) return n;
  return unit === 'in' ? n * MM_PER_INCH : n;
}

/** A length in mm written back in the unit of the box. */
export function lengthText(mm: number, unit: LengthUnit): string {
  return unit === 'in' ? numberText(mm / MM_PER_INCH, 5) : numberText(mm, 4);
}

/** Millimetres to 0.001, the way a machinist reads them off a drawing or a DRO: "6.800". Takes millimetres. */
export function readoutMm(mm: number): string {
  const r = Math.round(mm * 1000) / 1000;
  return (r === 0 ? 0 : r).toFixed(3);
}

/** Inches to 0.0001: "0.2677". Takes inches. */
export function readoutIn(inches: number): string {
  const r = Math.round(inches * 10000) / 10000;
  return (r === 0 ? 0 : r).toFixed(4);
}

/** A stored number as it goes back into a box, or '' for anything that is not one. */
export const numberBox = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? numberText(v) : '');

/** A stored length in mm as it goes back into a millimetre box, or ''. */
export const mmBox = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? lengthText(v, 'mm') : '');

/** A length in mm as a label says it ("6.78 mm"), or '?' for anything that is not a number. */
export const mmLabel = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? `${numberText(v, 3)} mm` : '?');

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
      const n = readNumber(m[1]) ?? Number.NaN;
      if (n > 0) return { diameterMm: m[2].toLowerCase() === 'mm' ? n : n * MM_PER_INCH, drill: null };
    }
    if (/^\s*\d*[.,]\d+\s*$/.test(text ?? '')) {
      throw new CalculatorError('UNREADABLE', field, `Give the unit: ${text.trim()} mm or ${text.trim()} in.`);
    }
    if (err instanceof CalculatorError) throw new CalculatorError(err.code, field, err.message);
    throw err;
  }
}
