/**
 * Input checks shared by the calculators. Inputs may arrive from a URL or a
 * saved result, so nothing is trusted to be the type it claims to be.
 */
import { CalculatorError } from './errors';

export interface NumberRule {
  /** Words for the field in the message ("the drill diameter"). */
  label: string;
  min?: number;
  /** true: min itself is refused (a diameter must be more than 0). */
  minExclusive?: boolean;
  max?: number;
  whole?: boolean;
  /** Appended to range messages, e.g. " mm". */
  unit?: string;
}

export function requireNumber(value: unknown, field: string, rule: NumberRule): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CalculatorError('NOT_A_NUMBER', field, `Enter ${rule.label} as a number.`);
  }
  if (rule.whole && !Number.isInteger(value)) {
    throw new CalculatorError('NOT_WHOLE', field, `${capital(rule.label)} must be a whole number.`);
  }
  const unit = rule.unit ?? '';
  if (rule.min !== undefined && (rule.minExclusive ? value <= rule.min : value < rule.min)) {
    const words = rule.minExclusive ? `more than ${rule.min}${unit}` : `at least ${rule.min}${unit}`;
    throw new CalculatorError('OUT_OF_RANGE', field, `${capital(rule.label)} must be ${words}.`);
  }
  if (rule.max !== undefined && value > rule.max) {
    throw new CalculatorError('OUT_OF_RANGE', field, `${capital(rule.label)} can be at most ${rule.max}${unit} here.`);
  }
  return value;
}

export function requireText(value: unknown, field: string, label: string): string {
  if (typeof value !== 'string' || value.trim() === '') {
    throw new CalculatorError('UNREADABLE', field, `Enter ${label}.`);
  }
  if (value.length > 60) {
    throw new CalculatorError('UNREADABLE', field, `${capital(label)} is too long to be read.`);
  }
  return value;
}

export function requireChoice<T extends string | number>(value: unknown, field: string, choices: readonly T[], label: string): T {
  if (!(choices as readonly unknown[]).includes(value)) {
    throw new CalculatorError('UNKNOWN_CHOICE', field, `Choose ${label}: ${choices.join(', ')}.`);
  }
  return value as T;
}

export function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Greatest common divisor of two non-negative integers. */
export function gcd(a: number, b: number): number {
  let x = Math.abs(a);
  let y = Math.abs(b);
  while (y) [x, y] = [y, x % y];
  return x;
}
