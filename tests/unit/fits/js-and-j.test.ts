import { describe, expect, test } from 'vitest';
import { FitError, toleranceZone } from '../../../lib/fits/index';

const JS = 'ISO 286-2:2010, limit deviations js / JS (±IT/2, half micrometres printed) — from memory';
const ROUND = 'ISO 286-1:2010, note on js7…js11: odd IT may be rounded to the even value below — from memory';
const J = 'ISO 286-2:2010, limit deviations j / J (tabulated grades only) — from memory';

describe('JS / js as printed: ±IT/2, half micrometres kept', () => {
  test.each([
    [25, 'js7', 10.5, JS],
    [25, 'JS7', 10.5, JS],
    [25, 'js6', 6.5, JS],
    [25, 'JS8', 16.5, JS],
    [45, 'js7', 12.5, JS],
    [350, 'JS7', 28.5, JS],
    [200, 'js9', 57.5, JS],
    [200, 'JS10', 92.5, JS],
    [550, 'js9', 87.5, JS],
    [60, 'js9', 37, JS],
    [25, 'js12', 105, JS],
    [2, 'js1', 0.4, JS],
  ] as const)('%s mm %s = ±%s µm — %s', (size, zone, half, _source) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(half);
    expect(z.lowerUm).toBe(-half);
    expect(z.upperUm - z.lowerUm).toBeCloseTo(z.itUm, 9);
  });
});

describe('JS / js with { roundJs: true }', () => {
  test.each([
    // grades 7–11 with odd IT: rounded down to the even value
    [25, 'js7', 10, 21, ROUND],
    [25, 'JS7', 10, 21, ROUND],
    [25, 'js8', 16, 33, ROUND],
    [45, 'JS7', 12, 25, ROUND],
    [350, 'js7', 28, 57, ROUND],
    [200, 'js9', 57, 115, ROUND],
    [200, 'JS10', 92, 185, ROUND],
    [550, 'JS9', 87, 175, ROUND],
    [100, 'js9', 43, 87, ROUND],
    [300, 'js11', 160, 320, ROUND],
    // even IT: unchanged
    [60, 'js9', 37, 74, ROUND],
    [25, 'js10', 42, 84, ROUND],
    // grades outside 7–11: unchanged even when odd
    [25, 'js6', 6.5, 13, ROUND],
    [12, 'JS6', 5.5, 11, ROUND],
    [25, 'js5', 4.5, 9, ROUND],
  ] as const)('%s mm %s = ±%s µm (IT %s µm) — %s', (size, zone, half, it, _source) => {
    const z = toleranceZone(size, zone, { roundJs: true });
    expect(z.upperUm).toBe(half);
    expect(z.lowerUm).toBe(-half);
    expect(z.itUm).toBe(it);
  });

  test('default is the printed half micrometre', () => {
    // ISO 286-2:2010 js7 at 18–30 mm — from memory
    expect(toleranceZone(25, 'js7').upperUm).toBe(10.5);
    expect(toleranceZone(25, 'js7', { roundJs: false }).upperUm).toBe(10.5);
  });
});

describe('J and j: tabulated grades and sizes only', () => {
  test.each([
    [25, 'j5', 5, -4, J],
    [25, 'j6', 9, -4, J],
    [25, 'j7', 13, -8, J],
    [2, 'j8', 8, -6, J],
    [3, 'j8', 8, -6, J],
    [500, 'j7', 31, -32, J],
    [25, 'J6', 8, -5, J],
    [25, 'J7', 12, -9, J],
    [25, 'J8', 20, -13, J],
    [500, 'J8', 66, -31, J],
    [50, 'J7', 14, -11, J],
    [50.001, 'J7', 18, -12, J],
  ] as const)('%s mm %s → %s / %s µm — %s', (size, zone, upper, lower, _source) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(upper);
    expect(z.lowerUm).toBe(lower);
  });

  test.each([
    [25, 'j4', J], [25, 'j9', J], [3.001, 'j8', J], [600, 'j6', J], [500.001, 'j5', J],
    [25, 'J5', J], [25, 'J9', J], [25, 'J01', J], [500.001, 'J7', J], [1000, 'J6', J],
  ] as const)('%s mm %s is refused with J_NOT_TABULATED — %s', (size, zone, _source) => {
    let caught: unknown;
    try {
      toleranceZone(size, zone);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(FitError);
    expect((caught as FitError).code).toBe('J_NOT_TABULATED');
    expect((caught as FitError).message).toMatch(/js|JS/);
  });
});
