/**
 * Lengths in both units, and the small formatters the calculator pages share.
 *
 * Every calculator computes in millimetres; a length that is shown is returned
 * as a `Length` so the page never converts (and never rounds twice).
 */
import { MM_PER_INCH } from '../units/format';

export { MM_PER_INCH };

/** One length in both units, unrounded. */
export interface Length {
  mm: number;
  in: number;
}

/** Drops binary noise such as 1e-17 or -0 so coordinates read as 0. */
export function clean(value: number): number {
  return Math.abs(value) < 1e-12 ? 0 : value;
}

export function lengthFromMm(mm: number): Length {
  return { mm: clean(mm), in: clean(mm / MM_PER_INCH) };
}

export function lengthFromIn(inches: number): Length {
  return { mm: clean(inches * MM_PER_INCH), in: clean(inches) };
}

/** A percentage to one decimal: "75.4 %". */
export function formatPercent(percent: number): string {
  return `${(Math.round(percent * 10) / 10).toFixed(1)} %`;
}

/** An angle to 0.001°, as a rotary table with a vernier is read: "120.000°". */
export function formatAngle(deg: number): string {
  const rounded = Math.round(deg * 1000) / 1000;
  return `${(rounded === 0 ? 0 : rounded).toFixed(3)}°`;
}

/** Spindle speed rounded to a whole rev/min: "1194 rev/min". */
export function formatRpm(rpm: number): string {
  return `${Math.round(rpm)} rev/min`;
}
