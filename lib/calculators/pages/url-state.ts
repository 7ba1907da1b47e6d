/**
 * The pieces every calculator page uses to keep its boxes in the URL: reading a parameter, writing
 * a query with only what differs from the defaults, and the request a page hands to the calculators.
 */
import type { CalculatorInputs, CalculatorKind } from '../registry';
import type { LengthUnit } from '../../types/units';

export interface SearchLike {
  get(name: string): string | null;
}

/** A calculation a page asks for: which calculator, with which input. */
export type CalcRequest = { [K in CalculatorKind]: { kind: K; input: CalculatorInputs[K] } }[CalculatorKind];

/** A page's searchParams record as URLSearchParams (the first value of a repeated key). */
export function searchFromRecord(record: Record<string, string | string[] | undefined>): URLSearchParams {
  const out = new URLSearchParams();
  for (const [k, v] of Object.entries(record)) {
    const value = Array.isArray(v) ? v[0] : v;
    if (typeof value === 'string') out.set(k, value);
  }
  return out;
}

/** "?a=1&b=2" from the pairs that hold something, or "". */
export function queryOf(pairs: Array<[string, string | false | null | undefined]>): string {
  const out = new URLSearchParams();
  // '' is kept: a box emptied on purpose must not come back with its default on reload.
  for (const [k, v] of pairs) if (v !== false && v !== null && v !== undefined) out.set(k, v);
  const s = out.toString();
  return s ? `?${s}` : '';
}

/** A text parameter, cut to what its box would hold. */
export const textParam = (p: SearchLike, key: string, max = 80) => (p.get(key) ?? '').slice(0, max);

/** One of a few values, or the fallback for anything else. */
export function choiceParam<T extends string>(p: SearchLike, key: string, options: readonly T[], fallback: T): T {
  const v = p.get(key);
  return (options as readonly string[]).includes(v ?? '') ? (v as T) : fallback;
}

export const unitParam = (p: SearchLike, key = 'unit') => choiceParam<LengthUnit>(p, key, ['mm', 'in'], 'mm');

/** Drops keys whose value is undefined, so stored inputs hold only what was given. */
export function definedOnly<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}

export const storedText = (v: unknown) => (typeof v === 'string' ? v : '');
