/**
 * Writing numbers and lengths: the one place for the whole app. Each length formatter names the unit
 * it takes — `formatMm` millimetres, `formatIn` inches, `formatUm` micrometres, `formatThou`
 * thousandths of an inch; `formatUmAs` and `formatMmAs` take µm or mm and write the unit asked for.
 * Rounding is half away from zero, once, at the end; the inch is exactly 25.4 mm.
 */
import type { LengthUnit } from '../types/units';

export const MM_PER_INCH = 25.4;
export const UM_PER_INCH = 25_400;

export interface NumberFormat {
  /** Fewest decimals written; trailing zeros are kept up to here ("25.000"). Default 0. */
  decimals?: number;
  /** Most decimals written: past `decimals` a digit is written only while the value needs it. Default `decimals`. */
  maxDecimals?: number;
  /** Write "+" before positive values (deviations). Default false. */
  signed?: boolean;
}

/**
 * Rounds |value| × 10^decimals to an integer, half away from zero. The tiny nudge absorbs binary
 * noise such as 0.0105 × 10^4 = 104.99999999999999.
 */
function scaledAbs(value: number, decimals: number): number {
  return Math.floor(Math.abs(value) * 10 ** decimals + 0.5 + 1e-7);
}

/** A number in plain decimal notation (never "1e-7"), as the options say. */
export function formatNumber(value: number, { decimals = 0, maxDecimals = decimals, signed = false }: NumberFormat = {}): string {
  if (!Number.isFinite(value)) return String(value);
  const places = Math.max(decimals, maxDecimals);
  const n = scaledAbs(value, places);
  const digits = String(n).padStart(places + 1, '0');
  let body = places === 0 ? digits : `${digits.slice(0, -places)}.${digits.slice(-places)}`;
  // Past `decimals`, only the digits the value needs.
  for (let extra = places - decimals; extra > 0 && body.endsWith('0'); extra--) body = body.slice(0, -1);
  if (body.endsWith('.')) body = body.slice(0, -1);
  if (n === 0) return body;
  if (value < 0) return `-${body}`;
  return signed ? `+${body}` : body;
}

/**
 * Millimetres, to 0.001 mm by default ("0.021", "+0.021", "25.000"); finer values (JS7 = ±10.5 µm,
 * IT01 grades) keep the digits they need, up to 0.00001 mm. Takes millimetres.
 */
export const formatMm = (mm: number, options: NumberFormat = {}): string => formatNumber(mm, { decimals: 3, maxDecimals: 5, ...options });

/** Millimetres to exactly 0.001, as read off a drawing or a DRO ("6.800"). Takes millimetres. */
export const readoutMm = (mm: number): string => formatMm(mm, { maxDecimals: 3 });

/** Inches, to 0.0001 in by default ("0.9843", "+0.0008"). Takes inches. */
export const formatIn = (inches: number, options: NumberFormat = {}): string => formatNumber(inches, { decimals: 4, ...options });

/** Micrometres as the tables print them: "21", "+21", "-7", "10.5". Takes micrometres. */
export const formatUm = (um: number, options: NumberFormat = {}): string => formatNumber(um, { maxDecimals: 2, ...options });

/** Thousandths of an inch as the inch tables print them: "+1.6", "-0.25", "0". Takes thou. */
export const formatThou = (thou: number, options: NumberFormat = {}): string => formatNumber(thou, { maxDecimals: 2, ...options });

/** A length given in micrometres, written in mm (formatMm) or inches (formatIn). */
export function formatUmAs(um: number, unit: LengthUnit, options: NumberFormat = {}): string {
  return unit === 'mm' ? formatMm(um / 1000, options) : formatIn(um / UM_PER_INCH, options);
}

/** A length given in millimetres, written in mm (formatMm) or inches (formatIn). */
export function formatMmAs(mm: number, unit: LengthUnit, options: NumberFormat = {}): string {
  return unit === 'mm' ? formatMm(mm, options) : formatIn(mm / MM_PER_INCH, options);
}
