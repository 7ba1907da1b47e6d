/**
 * Conversions between micrometres, millimetres and inches. The inch is exactly 25.4 mm (25 400 µm),
 * so each is a single multiplication or division; writing them is lib/units/format.ts's job.
 */
import { MM_PER_INCH, UM_PER_INCH } from '../units/format';

export { MM_PER_INCH };

export function umToMm(um: number): number {
  return um / 1000;
}

export function umToIn(um: number): number {
  return um / UM_PER_INCH;
}

export function mmToIn(mm: number): number {
  return mm / MM_PER_INCH;
}

export function inToMm(inches: number): number {
  return inches * MM_PER_INCH;
}
