/**
 * Unit helpers for showing limits in millimetres and inches.
 *
 * The inch is exactly 25.4 mm (25 400 µm), so conversions are single
 * multiplications or divisions by that constant; formatting rounds only at
 * the very end, for display.
 */

export const MM_PER_INCH = 25.4;
export const UM_PER_INCH = 25400;

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

export interface FormatOptions {
  /** Write "+" before positive values (deviations); default false. */
  signed?: boolean;
}

/**
 * Rounds |value| × 10^decimals to an integer, half away from zero. The tiny
 * nudge absorbs binary noise such as 0.0105 × 10^4 = 104.99999999999999.
 */
function scaledAbs(value: number, decimals: number): number {
  const scaled = Math.abs(value) * 10 ** decimals;
  return Math.floor(scaled + 0.5 + 1e-7);
}

function render(n: number, decimals: number, negative: boolean, signed: boolean): string {
  const digits = String(n).padStart(decimals + 1, '0');
  const body = decimals === 0 ? digits : `${digits.slice(0, -decimals)}.${digits.slice(-decimals)}`;
  if (n === 0) return body;
  if (negative) return `-${body}`;
  return signed ? `+${body}` : body;
}

/**
 * Millimetres to 0.001 mm ("0.021", "+0.021", "-0.020", "25.000"). Values
 * finer than a micrometre (JS7 = ±10.5 µm, IT01 grades) keep the extra
 * digits they need, up to 0.00001 mm, rather than being rounded away.
 */
export function formatMm(mm: number, options?: FormatOptions): string {
  if (!Number.isFinite(mm)) return String(mm);
  let decimals = 3;
  let n = scaledAbs(mm, decimals);
  while (decimals < 5 && Math.abs(Math.abs(mm) * 10 ** decimals - n) > 1e-6) {
    decimals++;
    n = scaledAbs(mm, decimals);
  }
  return render(n, decimals, mm < 0, options?.signed === true);
}

/** Inches to 0.0001 in ("0.9843", "+0.0008"), rounded half away from zero. */
export function formatIn(inches: number, options?: FormatOptions): string {
  if (!Number.isFinite(inches)) return String(inches);
  const n = scaledAbs(inches, 4);
  return render(n, 4, inches < 0, options?.signed === true);
}

/** Micrometres as written in the tables: "21", "+21", "-7", "10.5". */
export function formatUm(um: number, options?: FormatOptions): string {
  if (!Number.isFinite(um)) return String(um);
  const n = scaledAbs(um, 2);
  const whole = Math.floor(n / 100);
  const frac = n % 100;
  const body = frac === 0 ? String(whole) : `${whole}.${String(frac).padStart(2, '0').replace(/0$/, '')}`;
  if (n === 0) return '0';
  if (um < 0) return `-${body}`;
  return options?.signed === true ? `+${body}` : body;
}
