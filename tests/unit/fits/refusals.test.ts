import { describe, expect, test } from 'vitest';
import { FitError, isZoneDefined, toleranceZone, type FitErrorCode } from '../../../lib/fits/index';

const LIMITS = 'ISO 286-1:2010, fundamental deviation tables (blank cells and column limits) — from memory';
const NOTES = 'ISO 286-1:2010, table footnotes — from memory';
const ISO1_T1 = 'ISO 286-1:2010 Table 1 and annex (grade limits) — from memory';
const SYMBOLS = 'ISO 286-1:2010, designation of tolerance classes — from memory';

function refusal(run: () => unknown): FitError {
  try {
    run();
  } catch (error) {
    if (error instanceof FitError) return error;
    throw error;
  }
  throw new Error('expected a FitError, got a result');
}

type Case = readonly [number, string, FitErrorCode, string];

const CASES: readonly Case[] = [
  // letters outside their size range
  [24, 't6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [10, 'T7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [14, 'v6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [5, 'V7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [18, 'y6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [12, 'Y7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [1, 'a11', 'LETTER_NOT_DEFINED_AT_SIZE', NOTES],
  [0.5, 'b11', 'LETTER_NOT_DEFINED_AT_SIZE', NOTES],
  [1, 'A11', 'LETTER_NOT_DEFINED_AT_SIZE', NOTES],
  [0.8, 'B12', 'LETTER_NOT_DEFINED_AT_SIZE', NOTES],
  [10.001, 'cd6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [12, 'CD7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [25, 'ef7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [25, 'EF8', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [10.001, 'fg6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [40, 'FG7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  // only d…u (and H, JS, K, M, N…) go above 500 mm
  [500.001, 'a11', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'b11', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'c11', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'C11', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [501, 'v6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'x7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [700, 'y6', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [501, 'z8', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'za7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [600, 'ZB8', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  [3150, 'ZC7', 'LETTER_NOT_DEFINED_AT_SIZE', LIMITS],
  // grades the standard does not use at that size
  [600, 'h01', 'GRADE_NOT_DEFINED', ISO1_T1],
  [500.001, 'H0', 'GRADE_NOT_DEFINED', ISO1_T1],
  [1, 'h14', 'GRADE_NOT_DEFINED', ISO1_T1],
  [0.5, 'H18', 'GRADE_NOT_DEFINED', ISO1_T1],
  [0.9, 'js15', 'GRADE_NOT_DEFINED', ISO1_T1],
  [25, 'K9', 'GRADE_NOT_DEFINED', NOTES],
  [3.001, 'K9', 'GRADE_NOT_DEFINED', NOTES],
  [100, 'K12', 'GRADE_NOT_DEFINED', NOTES],
  [600, 'K9', 'GRADE_NOT_DEFINED', NOTES],
  [1, 'N9', 'GRADE_NOT_DEFINED', NOTES],
  [0.5, 'N11', 'GRADE_NOT_DEFINED', NOTES],
  // Δ is tabulated for grades 3–8 only
  [25, 'K2', 'GRADE_NOT_DEFINED', NOTES],
  [100, 'M1', 'GRADE_NOT_DEFINED', NOTES],
  [50, 'N0', 'GRADE_NOT_DEFINED', NOTES],
  [25, 'P2', 'GRADE_NOT_DEFINED', NOTES],
  [30, 'ZC01', 'GRADE_NOT_DEFINED', NOTES],
  // J / j
  [25, 'J9', 'J_NOT_TABULATED', LIMITS],
  [25, 'j4', 'J_NOT_TABULATED', LIMITS],
  // not zones at all
  [25, 'Q7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'i7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'L6', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'w6', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'O7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'h19', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'H07', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'H', 'UNKNOWN_ZONE', SYMBOLS],
  [25, '7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'Js7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'IT7', 'UNKNOWN_ZONE', SYMBOLS],
  [25, 'H7x', 'UNKNOWN_ZONE', SYMBOLS],
  [25, '', 'UNKNOWN_ZONE', SYMBOLS],
  // sizes outside 0 < D ≤ 3150 mm
  [0, 'H7', 'SIZE_OUT_OF_RANGE', ISO1_T1],
  [-5, 'h6', 'SIZE_OUT_OF_RANGE', ISO1_T1],
  [3150.001, 'H7', 'SIZE_OUT_OF_RANGE', ISO1_T1],
  [Number.NaN, 'H7', 'SIZE_OUT_OF_RANGE', ISO1_T1],
  [Number.POSITIVE_INFINITY, 'g6', 'SIZE_OUT_OF_RANGE', ISO1_T1],
];

describe('refusals', () => {
  test.each(CASES)('%s mm %s → %s — %s', (size, zone, code) => {
    const error = refusal(() => toleranceZone(size, zone));
    expect(error.code).toBe(code);
    expect(error.name).toBe('FitError');
    expect(error).toBeInstanceOf(Error);
    expect(error.message.length).toBeGreaterThan(20);
    expect(isZoneDefined(size, zone)).toBe(false);
  });
});

describe('just inside the limits the same zones are answered', () => {
  test.each([
    [24.001, 't6', 54, 41, 'ISO 286-2:2010 shafts t — from memory'],
    [14.001, 'v6', 50, 39, 'ISO 286-2:2010 shafts v — from memory'],
    [18.001, 'y6', 76, 63, 'ISO 286-2:2010 shafts y — from memory'],
    [1.001, 'a11', -270, -330, 'ISO 286-2:2010 shafts a — from memory'],
    [1.001, 'B11', 200, 140, 'ISO 286-2:2010 holes B — from memory'],
    [10, 'cd6', -56, -65, 'ISO 286-2:2010 shafts cd — from memory'],
    [500, 'zc7', 2663, 2600, 'ISO 286-2:2010 shafts zc — from memory'],
    [500, 'H0', 6, 0, ISO1_T1],
    [1.001, 'h14', 0, -250, ISO1_T1],
    [1, 'h13', 0, -140, ISO1_T1],
    [3, 'K9', 0, -25, NOTES],
    [1.001, 'N9', -4, -29, NOTES],
    [1, 'N8', -4, -18, NOTES],
    [3150, 'H7', 210, 0, ISO1_T1],
    [3150, 'u6', 3335, 3200, 'ISO 286-2:2010 shafts u — from memory'],
    [3, 'K2', 0, -1.2, NOTES],
    [600, 'K2', 0, -11, NOTES],
  ] as const)('%s mm %s → %s / %s µm — %s', (size, zone, upper, lower, _source) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(upper);
    expect(z.lowerUm).toBe(lower);
    expect(isZoneDefined(size, zone)).toBe(true);
  });
});

describe('messages speak plainly', () => {
  // common practice: the message names the zone, the size and the limit
  test('t below its range', () => {
    const e = refusal(() => toleranceZone(20, 't6'));
    expect(e.message).toContain('t6');
    expect(e.message).toContain('20 mm');
    expect(e.message).toContain('above 24 mm');
  });
  test('letter above 500 mm', () => {
    const e = refusal(() => toleranceZone(600, 'x7'));
    expect(e.message).toContain('up to 500 mm');
  });
  test('mixed case zone explains hole and shaft letters', () => {
    const e = refusal(() => toleranceZone(25, 'Js7'));
    expect(e.message).toContain('JS7');
    expect(e.message).toContain('js7');
  });
  test('size out of range gives the range', () => {
    const e = refusal(() => toleranceZone(4000, 'H7'));
    expect(e.message).toContain('3150 mm');
  });
  test('IT0 above 500 mm', () => {
    const e = refusal(() => toleranceZone(800, 'h0'));
    expect(e.message).toContain('500 mm');
  });
});
