/**
 * Lengths inside the measurement computations are micrometres (µm), as doubles. Values come in
 * as typed (mm or inch, at most five decimals), so one multiplication by 1000 or by 25 400
 * (the inch is exactly 25.4 mm) and a rounding to 0.0001 µm removes the binary noise.
 */
import { formatNumber, formatThou, formatUm, formatUmAs, MM_PER_INCH, readoutMm, UM_PER_INCH } from '../units/format';

import type { LengthUnit } from '../types/units';
export type { LengthUnit };
export const LENGTH_UNITS = ['mm', 'in'] as const;

/** Most decimals a typed length may carry: 0.00001 mm or 0.00001 in. */
export const MAX_DECIMALS = 5;

const UM_PER: Record<LengthUnit, number> = { mm: 1000, in: UM_PER_INCH };

export function cleanUm(um: number): number {
  const r = Math.round(um * 1e4) / 1e4;
  return r === 0 ? 0 : r; // never −0
}

export function toUm(value: number, unit: LengthUnit): number {
  return cleanUm(value * UM_PER[unit]);
}

export function fromUm(um: number, unit: LengthUnit): number {
  return um / UM_PER[unit];
}

export function toMm(value: number, unit: LengthUnit): number {
  return unit === 'mm' ? value : value * MM_PER_INCH;
}

/** Decimals written in a number ("130.40" → 2 when typed, 130.4 → 1 as a number). */
export function decimalsOf(value: number | string): number {
  const text = typeof value === 'number' ? numberText(value) : value.trim();
  const dot = text.indexOf('.');
  return dot < 0 ? 0 : text.length - dot - 1;
}

/** A number as plain decimal text, never in exponent form (1e-7 → "0.0000001"). */
export function numberText(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const s = String(value);
  if (!/e/i.test(s)) return s;
  return value.toFixed(12).replace(/\.?0+$/, '');
}

/**
 * A value in its own unit as a machinist writes it: with as many decimals as the instrument
 * resolves (130.4 read on a 0.01 mm caliper is "130.40").
 */
export function asEntered(value: number, resolution?: number): string {
  const d = Math.min(MAX_DECIMALS, Math.max(decimalsOf(value), resolution === undefined ? 0 : decimalsOf(resolution)));
  return formatNumber(value, { decimals: d });
}

/** A deviation as typed, signed: 0.1 → "+0.1", 0 → "0", -0.05 → "-0.05". */
export function signedAsEntered(value: number): string {
  if (value === 0) return '0';
  return value > 0 ? `+${asEntered(value)}` : asEntered(value);
}

/** A size in µm written in a unit: mm to 0.001 (finer where needed), inches to 0.0001. */
export function sizeText(um: number, unit: LengthUnit): string {
  return formatUmAs(um, unit);
}

/** A deviation in µm written in a unit, signed: "+0.012", "-0.0008". */
export function deviationText(um: number, unit: LengthUnit): string {
  return formatUmAs(um, unit, { signed: true });
}

/** An unsigned amount (how far outside, stock left) in a unit. */
export function amountText(um: number, unit: LengthUnit): string {
  return sizeText(Math.abs(um), unit);
}

/** An amount to set on a dial, rounded to what a dial shows: 0.001 mm or 0.0001 in. */
export function dialText(um: number, unit: LengthUnit): string {
  return unit === 'mm' ? readoutMm(Math.abs(um) / 1000) : formatUmAs(Math.abs(um), 'in');
}

export function umText(um: number, signed = false): string {
  return formatUm(um, { signed });
}

/** Thousandths of an inch ("thou"), to a hundredth of a thou: 2 µm → "0.08". */
export function thou(um: number): number {
  return um / 25.4;
}

export function thouText(um: number, signed = false): string {
  return formatThou(thou(um), { decimals: 2, signed });
}

export const otherUnit = (unit: LengthUnit): LengthUnit => (unit === 'mm' ? 'in' : 'mm');
