import { describe, expect, test } from 'vitest';
import { analyseFit, FitError, type FitErrorCode, type FitKind } from '../../../lib/fits/index';

const ANSI = 'ANSI B4.2-1978, preferred metric hole-basis fits — from memory';
const ISO2 = 'ISO 286-2:2010 limit deviations, clearances worked by hand — from memory';

// [size, fit, max clearance mm, min clearance mm, kind, source]
type Row = readonly [number, string, number, number, FitKind, string];

const ROWS: readonly Row[] = [
  [25, 'H11/c11', 0.37, 0.11, 'clearance', ANSI],
  [25, 'H9/d9', 0.169, 0.065, 'clearance', ANSI],
  [25, 'H8/f7', 0.074, 0.02, 'clearance', ANSI],
  [25, 'H7/g6', 0.041, 0.007, 'clearance', ANSI],
  [25, 'H7/h6', 0.034, 0, 'clearance', ANSI],
  [25, 'H7/k6', 0.019, -0.015, 'transition', ANSI],
  [25, 'H7/n6', 0.006, -0.028, 'transition', ANSI],
  [25, 'H7/p6', -0.001, -0.035, 'interference', ANSI],
  [25, 'H7/s6', -0.014, -0.048, 'interference', ANSI],
  // u6 at 24–30 mm is +61/+48 µm in ISO 286-2, so 25 H7/u6 is −0.027/−0.061;
  // −0.020/−0.054 belongs to 20 mm (u6 = +54/+41 at 18–24 mm).
  [25, 'H7/u6', -0.027, -0.061, 'interference', ANSI],
  [20, 'H7/u6', -0.02, -0.054, 'interference', ANSI],
  [40, 'H11/c11', 0.44, 0.12, 'clearance', ANSI],
  [40, 'H9/d9', 0.204, 0.08, 'clearance', ANSI],
  [40, 'H8/f7', 0.089, 0.025, 'clearance', ANSI],
  [40, 'H7/g6', 0.05, 0.009, 'clearance', ANSI],
  [40, 'H7/h6', 0.041, 0, 'clearance', ANSI],
  [40, 'H7/k6', 0.023, -0.018, 'transition', ANSI],
  [40, 'H7/n6', 0.008, -0.033, 'transition', ANSI],
  [40, 'H7/p6', -0.001, -0.042, 'interference', ANSI],
  [40, 'H7/s6', -0.018, -0.059, 'interference', ANSI],
  [40, 'H7/u6', -0.035, -0.076, 'interference', ANSI],
  [10, 'H11/c11', 0.26, 0.08, 'clearance', ANSI],
  [10, 'H9/d9', 0.112, 0.04, 'clearance', ANSI],
  [10, 'H8/f7', 0.05, 0.013, 'clearance', ANSI],
  [10, 'H7/g6', 0.029, 0.005, 'clearance', ANSI],
  [10, 'H7/h6', 0.024, 0, 'clearance', ANSI],
  [10, 'H7/k6', 0.014, -0.01, 'transition', ANSI],
  [10, 'H7/n6', 0.005, -0.019, 'transition', ANSI],
  // limiting case: largest clearance exactly 0 is still an interference fit (ISO 286-1)
  [10, 'H7/p6', 0, -0.024, 'interference', ANSI],
  [10, 'H7/s6', -0.008, -0.032, 'interference', ANSI],
  [10, 'H7/u6', -0.013, -0.037, 'interference', ANSI],
  [100, 'H11/c11', 0.61, 0.17, 'clearance', ANSI],
  [100, 'H9/d9', 0.294, 0.12, 'clearance', ANSI],
  [100, 'H8/f7', 0.125, 0.036, 'clearance', ANSI],
  [100, 'H7/g6', 0.069, 0.012, 'clearance', ANSI],
  [100, 'H7/h6', 0.057, 0, 'clearance', ANSI],
  [100, 'H7/k6', 0.032, -0.025, 'transition', ANSI],
  [100, 'H7/n6', 0.012, -0.045, 'transition', ANSI],
  [100, 'H7/p6', -0.002, -0.059, 'interference', ANSI],
  [100, 'H7/s6', -0.036, -0.093, 'interference', ANSI],
  [100, 'H7/u6', -0.089, -0.146, 'interference', ANSI],
  // other fits, worked from the ISO 286-2 zones
  [25, 'H7/js6', 0.0275, -0.0065, 'transition', ISO2],
  [25, 'K7/h6', 0.019, -0.015, 'transition', ISO2],
  [25, 'G7/h6', 0.041, 0.007, 'clearance', ISO2],
  [25, 'S7/h6', -0.014, -0.048, 'interference', ISO2],
  [2, 'H7/p6', 0.004, -0.012, 'transition', ISO2],
  [600, 'H7/s6', -0.24, -0.354, 'interference', ISO2],
];

describe('fits', () => {
  test.each(ROWS)('%s mm %s → %s / %s mm, %s — %s', (size, fit, maxMm, minMm, kind) => {
    const r = analyseFit(size, fit);
    expect(r.maxClearanceMm).toBe(maxMm);
    expect(r.minClearanceMm).toBe(minMm);
    expect(r.maxClearanceUm).toBeCloseTo(maxMm * 1000, 9);
    expect(r.minClearanceUm).toBeCloseTo(minMm * 1000, 9);
    expect(r.kind).toBe(kind);
    expect(r.fit).toBe(fit);
    expect(r.hole.kind).toBe('hole');
    expect(r.shaft.kind).toBe('shaft');
  });

  test('the two zones come back with the analysis', () => {
    // ISO 286-2:2010 H7 and g6 at 18–30 mm — from memory
    const r = analyseFit(25, 'H7/g6');
    expect([r.hole.upperUm, r.hole.lowerUm]).toEqual([21, 0]);
    expect([r.shaft.upperUm, r.shaft.lowerUm]).toEqual([-7, -20]);
  });

  test('roundJs reaches the zones of a fit', () => {
    // ISO 286-1:2010 js rounding note — from memory: 25 JS7 ±10 instead of ±10.5
    const r = analyseFit(25, 'JS7/h6', { roundJs: true });
    expect(r.hole.upperUm).toBe(10);
    expect(r.maxClearanceUm).toBe(23);
    expect(r.minClearanceUm).toBe(-10);
  });

  test('spaces and a dash are read as the fit stroke', () => {
    // common practice: "H7 / g6" and "H7-g6" are written on drawings too
    expect(analyseFit(25, ' H7 / g6 ').fit).toBe('H7/g6');
    expect(analyseFit(25, 'H7-g6').maxClearanceUm).toBe(41);
  });
});

describe('fits that are refused', () => {
  test.each([
    ['g6/H7', 'FIT_ORDER', 'H7/g6'],
    ['h6/K7', 'FIT_ORDER', 'K7/h6'],
    ['H7/H8', 'FIT_NEEDS_HOLE_AND_SHAFT', 'two holes'],
    ['g6/h6', 'FIT_NEEDS_HOLE_AND_SHAFT', 'two shafts'],
    ['H7', 'FIT_NEEDS_HOLE_AND_SHAFT', 'hole first'],
    ['H7/q6', 'UNKNOWN_ZONE', 'q6'],
  ] as const)('%s → %s', (fit, code, says) => {
    // ISO 286-1:2010, designation of fits (hole class first) — from memory
    let caught: unknown;
    try {
      analyseFit(25, fit);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(FitError);
    expect((caught as FitError).code).toBe(code as FitErrorCode);
    expect((caught as FitError).message).toContain(says);
  });

  test('a zone not defined at the size refuses the whole fit', () => {
    // ISO 286-1:2010, t not defined at or below 24 mm — from memory
    expect(() => analyseFit(20, 'H7/t6')).toThrow(FitError);
  });
});
