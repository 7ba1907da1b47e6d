/**
 * ANSI B4.1 inch classes against rows of the published tables. Every value here is typed from
 * memory of ANSI B4.1-1967 (R2009) as reproduced in Machinery's Handbook, 29th edition
 * ("Allowances and Tolerances for Fits"), limits in thousandths of an inch.
 */
import { describe, expect, test } from 'vitest';
import { FitError, inchFit, type FitErrorCode } from '../../../lib/fits/index';

const MH = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009)";
const RC = `${MH}, Running and Sliding Fits table — from memory`;
const LC = `${MH}, Locational Clearance Fits table — from memory`;
const LT = `${MH}, Locational Transition Fits table — from memory`;
const LN = `${MH}, Locational Interference Fits table — from memory`;
const FN = `${MH}, Force and Shrink Fits table — from memory`;

/**
 * [size in, class, first two columns as printed, hole upper, shaft upper, shaft lower, source].
 * The printed columns: RC/LC clearance min, max; LT largest interference (negative), largest
 * clearance; LN/FN interference min, max. The hole's lower limit is always 0.
 */
type Row = readonly [number, string, number, number, number, number, number, string];

const ROWS: readonly Row[] = [
  // running and sliding fits
  [0.1, 'RC1', 0.1, 0.45, 0.2, -0.1, -0.25, RC],
  [0.12, 'RC1', 0.1, 0.45, 0.2, -0.1, -0.25, RC], // "to 0.12" includes 0.12
  [0.5, 'RC1', 0.25, 0.75, 0.3, -0.25, -0.45, RC],
  [2, 'RC1', 0.4, 1.2, 0.5, -0.4, -0.7, RC],
  [10, 'RC1', 0.8, 2.3, 0.9, -0.8, -1.4, RC],
  [150, 'RC1', 6, 14, 5, -6, -9, RC],
  [0.2, 'RC2', 0.15, 0.65, 0.3, -0.15, -0.35, RC],
  [1, 'RC2', 0.3, 1.2, 0.5, -0.3, -0.7, RC],
  [5, 'RC2', 0.6, 2.3, 1.0, -0.6, -1.3, RC],
  [18, 'RC2', 1.2, 3.8, 1.6, -1.2, -2.2, RC],
  [0.05, 'RC3', 0.3, 0.95, 0.4, -0.3, -0.55, RC],
  [0.75, 'RC3', 0.8, 2.1, 0.8, -0.8, -1.3, RC],
  [3, 'RC3', 1.2, 3.1, 1.2, -1.2, -1.9, RC],
  [12, 'RC3', 2.5, 5.7, 2.0, -2.5, -3.7, RC],
  [60, 'RC3', 10, 20, 6, -10, -14, RC],
  [0.25, 'RC4', 0.5, 2.0, 0.9, -0.5, -1.1, RC],
  [1.5, 'RC4', 1.0, 3.6, 1.6, -1.0, -2.0, RC],
  [1.97, 'RC4', 1.0, 3.6, 1.6, -1.0, -2.0, RC],
  [1.98, 'RC4', 1.2, 4.2, 1.8, -1.2, -2.4, RC],
  [8, 'RC4', 2.0, 6.6, 2.8, -2.0, -3.8, RC],
  [200, 'RC4', 22, 63, 25, -22, -38, RC],
  [0.4, 'RC5', 1.0, 2.5, 0.9, -1.0, -1.6, RC],
  [1.25, 'RC5', 2.0, 4.6, 1.6, -2.0, -3.0, RC],
  [6, 'RC5', 3.5, 7.6, 2.5, -3.5, -5.1, RC],
  [16, 'RC5', 8, 14.5, 4, -8, -10.5, RC],
  [100, 'RC5', 25, 45, 12, -25, -33, RC],
  [0.1, 'RC6', 0.6, 2.2, 1.0, -0.6, -1.2, RC],
  [2.5, 'RC6', 2.5, 7.3, 3.0, -2.5, -4.3, RC],
  [14, 'RC6', 6.0, 15.5, 6.0, -6.0, -9.5, RC],
  [35, 'RC6', 12, 28, 10, -12, -18, RC],
  [0.3, 'RC7', 1.6, 3.9, 1.4, -1.6, -2.5, RC],
  [4, 'RC7', 5.0, 10.7, 3.5, -5.0, -7.2, RC],
  [9, 'RC7', 7.0, 14.3, 4.5, -7.0, -9.8, RC],
  [19.69, 'RC7', 12, 22, 6, -12, -16, RC],
  [0.6, 'RC8', 3.5, 7.9, 2.8, -3.5, -5.1, RC],
  [1, 'RC8', 4.5, 10.0, 3.5, -4.5, -6.5, RC],
  [7, 'RC8', 8, 18, 6, -8, -12, RC],
  [13, 'RC8', 14, 29, 9, -14, -20, RC],
  // the printed cell (shaft −4.5/−6.0, a 1.5 band) is narrower than grade 10's 1.8 at this step: the table wins
  [0.15, 'RC9', 4.5, 9.0, 3.0, -4.5, -6.0, RC],
  [3.15, 'RC9', 9, 20.5, 7, -9, -13.5, RC],
  [3.16, 'RC9', 10, 24, 9, -10, -15, RC],
  [11, 'RC9', 18, 38, 12, -18, -26, RC],
  [120, 'RC9', 100, 200, 60, -100, -140, RC],
  // locational clearance fits
  [0.1, 'LC1', 0, 0.45, 0.25, 0, -0.2, LC],
  [1.5, 'LC1', 0, 1.0, 0.6, 0, -0.4, LC],
  [17, 'LC1', 0, 2.6, 1.6, 0, -1.0, LC],
  [0.1, 'LC2', 0, 0.65, 0.4, 0, -0.25, LC],
  [2, 'LC2', 0, 1.9, 1.2, 0, -0.7, LC],
  [45, 'LC2', 0, 8, 5, 0, -3, LC],
  [0.1, 'LC3', 0, 1.0, 0.6, 0, -0.4, LC],
  [1, 'LC3', 0, 2.0, 1.2, 0, -0.8, LC],
  [10, 'LC3', 0, 5.0, 3.0, 0, -2.0, LC],
  [0.1, 'LC4', 0, 2.6, 1.6, 0, -1.0, LC],
  [5, 'LC4', 0, 10, 6, 0, -4, LC],
  [80, 'LC4', 0, 50, 30, 0, -20, LC],
  [0.3, 'LC5', 0.2, 1.2, 0.6, -0.2, -0.6, LC],
  [1.19, 'LC5', 0.3, 1.6, 0.8, -0.3, -0.8, LC],
  [10, 'LC5', 0.7, 3.9, 2.0, -0.7, -1.9, LC],
  [15, 'LC5', 0.7, 4.3, 2.2, -0.7, -2.1, LC],
  [0.5, 'LC6', 0.6, 3.2, 1.6, -0.6, -1.6, LC],
  [4, 'LC6', 1.4, 7.1, 3.5, -1.4, -3.6, LC],
  [12, 'LC6', 2.2, 10.2, 5.0, -2.2, -5.2, LC],
  [0.2, 'LC7', 0.8, 3.8, 1.8, -0.8, -2.0, LC],
  [3, 'LC7', 2.5, 10, 4.5, -2.5, -5.5, LC],
  [16, 'LC7', 5, 21, 10, -5, -11, LC],
  [0.12, 'LC8', 1.0, 3.6, 1.6, -1.0, -2.0, LC],
  [1.75, 'LC8', 3.0, 9.5, 4.0, -3.0, -5.5, LC],
  [9.85, 'LC8', 7, 18.5, 7, -7, -11.5, LC],
  [0.35, 'LC9', 3.0, 8.7, 3.5, -3.0, -5.2, LC],
  [2, 'LC9', 6, 17.5, 7, -6, -10.5, LC],
  [19, 'LC9', 16, 42, 16, -16, -26, LC],
  [0.1, 'LC10', 4, 12, 4, -4, -8, LC],
  [1, 'LC10', 7, 23, 8, -7, -15, LC],
  [12, 'LC10', 20, 60, 20, -20, -40, LC],
  [190, 'LC10', 90, 410, 160, -90, -250, LC],
  [0.1, 'LC11', 5, 17, 6, -5, -11, LC],
  [2.5, 'LC11', 14, 50, 18, -14, -32, LC],
  [25, 'LC11', 40, 140, 50, -40, -90, LC],
  // locational transition fits
  [0.1, 'LT1', -0.12, 0.52, 0.4, 0.12, -0.12, LT],
  [1, 'LT1', -0.25, 1.05, 0.8, 0.25, -0.25, LT],
  [12, 'LT1', -0.6, 2.6, 2.0, 0.6, -0.6, LT],
  [0.5, 'LT2', -0.35, 1.35, 1.0, 0.35, -0.35, LT],
  [6, 'LT2', -0.8, 3.3, 2.5, 0.8, -0.8, LT],
  [19.69, 'LT2', -1.2, 5.2, 4.0, 1.2, -1.2, LT],
  [0.25, 'LT3', -0.5, 0.5, 0.6, 0.5, 0.1, LT],
  [2, 'LT3', -0.8, 1.1, 1.2, 0.8, 0.1, LT],
  [8, 'LT3', -1.4, 1.6, 1.8, 1.4, 0.2, LT],
  [0.3, 'LT4', -0.7, 0.8, 0.9, 0.7, 0.1, LT],
  [1.5, 'LT4', -1.1, 1.5, 1.6, 1.1, 0.1, LT],
  [14, 'LT4', -2.4, 3.3, 3.5, 2.4, 0.2, LT],
  [0.1, 'LT5', -0.5, 0.15, 0.4, 0.5, 0.25, LT],
  [1, 'LT5', -1.1, 0.2, 0.8, 1.1, 0.6, LT],
  [10, 'LT5', -2.6, 0.6, 2.0, 2.6, 1.4, LT],
  [0.2, 'LT6', -0.8, 0.2, 0.5, 0.8, 0.3, LT],
  [3, 'LT6', -2.0, 0.4, 1.2, 2.0, 0.8, LT],
  [18, 'LT6', -4.3, 0.7, 2.5, 4.3, 1.8, LT],
  // locational interference fits
  [0.1, 'LN1', 0, 0.45, 0.25, 0.45, 0.25, LN],
  [2, 'LN1', 0.1, 1.3, 0.7, 1.3, 0.8, LN],
  [15, 'LN1', 0.2, 2.6, 1.4, 2.6, 1.6, LN],
  [0.3, 'LN2', 0, 1.0, 0.6, 1.0, 0.6, LN],
  [1.5, 'LN2', 0, 1.6, 1.0, 1.6, 1.0, LN],
  [5, 'LN2', 0.2, 2.8, 1.6, 2.8, 1.8, LN],
  [19.69, 'LN2', 0.3, 4.4, 2.5, 4.4, 2.8, LN],
  [0.1, 'LN3', 0.1, 0.75, 0.4, 0.75, 0.5, LN],
  [1, 'LN3', 0.4, 1.7, 0.8, 1.7, 1.2, LN],
  [13, 'LN3', 2.3, 5.9, 2.2, 5.9, 4.5, LN],
  // force and shrink fits (the table's finer steps)
  [0.1, 'FN1', 0.05, 0.5, 0.25, 0.5, 0.3, FN],
  [0.6, 'FN1', 0.2, 0.9, 0.4, 0.9, 0.6, FN],
  [2, 'FN1', 0.6, 1.8, 0.7, 1.8, 1.3, FN],
  [18, 'FN1', 4.4, 7.0, 1.6, 7.0, 6.0, FN],
  [0.5, 'FN2', 0.5, 1.6, 0.7, 1.6, 1.2, FN],
  [1, 'FN2', 0.6, 1.9, 0.8, 1.9, 1.4, FN],
  [3, 'FN2', 1.0, 2.9, 1.2, 2.9, 2.2, FN],
  [9, 'FN2', 4.2, 7.2, 1.8, 7.2, 6.0, FN],
  [16, 'FN2', 6.5, 10.6, 2.5, 10.6, 9.0, FN],
  [1, 'FN3', 0.8, 2.1, 0.8, 2.1, 1.6, FN],
  [1.97, 'FN3', 1.2, 2.8, 1.0, 2.8, 2.2, FN],
  [4, 'FN3', 2.6, 4.9, 1.4, 4.9, 4.0, FN],
  [12, 'FN3', 7.0, 10.2, 2.0, 10.2, 9.0, FN],
  [0.1, 'FN4', 0.3, 0.95, 0.4, 0.95, 0.7, FN],
  [1.5, 'FN4', 1.5, 3.1, 1.0, 3.1, 2.5, FN],
  [5, 'FN4', 5.4, 8.0, 1.6, 8.0, 7.0, FN],
  [11, 'FN4', 10.0, 13.2, 2.0, 13.2, 12.0, FN],
  [19.69, 'FN4', 19.5, 23.6, 2.5, 23.6, 22.0, FN],
  [0.2, 'FN5', 0.5, 1.7, 0.7, 1.7, 1.2, FN],
  [1, 'FN5', 1.3, 3.3, 1.2, 3.3, 2.5, FN],
  [2.56, 'FN5', 3.2, 6.2, 1.8, 6.2, 5.0, FN],
  [2.57, 'FN5', 4.2, 7.2, 1.8, 7.2, 6.0, FN],
  [7, 'FN5', 9.5, 13.6, 2.5, 13.6, 12.0, FN],
  [15, 'FN5', 21.5, 27.2, 3.5, 27.2, 25.0, FN],
];

/** The printed columns as clearances (hole − shaft; interference negative), [min, max]. */
function printedAsClearance(fitClass: string, a: number, b: number): [number, number] {
  const family = fitClass.slice(0, 2);
  if (family === 'RC' || family === 'LC') return [a, b];
  if (family === 'LT') return [a, b]; // largest interference printed negative, largest clearance
  return [0 - b, 0 - a]; // LN, FN: interference min, max
}

const tenths = (n: number) => Math.round(n * 100) + 0;

describe('inch classes: rows of the published tables', () => {
  test('at least 80 rows, every family and every class', () => {
    expect(ROWS.length).toBeGreaterThanOrEqual(80);
    const classes = new Set(ROWS.map((r) => r[1]));
    expect(classes.size).toBe(9 + 11 + 6 + 3 + 5);
  });

  test.each(ROWS)('%s in %s (%#)', (size, fitClass, a, b, holeUpper, shaftUpper, shaftLower, source) => {
    expect(source).toMatch(/from memory/);
    const f = inchFit(size, fitClass);
    expect(tenths(f.hole.upperThou)).toBe(tenths(holeUpper));
    expect(f.hole.lowerThou).toBe(0);
    expect(tenths(f.shaft.upperThou)).toBe(tenths(shaftUpper));
    expect(tenths(f.shaft.lowerThou)).toBe(tenths(shaftLower));
    const [minC, maxC] = printedAsClearance(fitClass, a, b);
    expect(tenths(f.minClearanceThou)).toBe(tenths(minC));
    expect(tenths(f.maxClearanceThou)).toBe(tenths(maxC));
  });
});

describe('inch classes: kind of fit per family', () => {
  // ANSI B4.1-1967 (R2009), the descriptions of the classes — from memory: RC and LC always clear,
  // LT may clear or interfere, LN and FN always interfere (LN1/LN2 down to zero at the small sizes).
  test.each([
    [1, 'RC4', 'clearance'], [0.1, 'LC1', 'clearance'], [100, 'LC11', 'clearance'],
    [1, 'LT1', 'transition'], [0.5, 'LT3', 'transition'], [10, 'LT6', 'transition'],
    [0.1, 'LN1', 'interference'], [1, 'LN2', 'interference'], [5, 'FN1', 'interference'], [19, 'FN5', 'interference'],
  ] as const)('%s in %s is a %s fit', (size, fitClass, kind) => {
    expect(inchFit(size, fitClass).kind).toBe(kind);
  });

  test('a force fit has both clearance limits negative', () => {
    const f = inchFit(2, 'FN2'); // Force and Shrink Fits table — from memory: 0.8 to 2.7 interference
    expect(f.maxClearanceThou).toBeLessThan(0);
    expect(f.minClearanceThou).toBeLessThan(0);
    expect(tenths(f.minClearanceThou)).toBe(tenths(-2.7));
    expect(tenths(f.maxClearanceThou)).toBe(tenths(-0.8));
  });
});

describe('inch classes: millimetre equivalents', () => {
  // 1 in = 25.4 mm exactly (ANSI/ASME definition of the inch, 1959): a thou is 0.0254 mm.
  test('1.5 RC4 in millimetres', () => {
    const f = inchFit(1.5, 'RC4');
    expect(f.nominalMm).toBe(38.1);
    expect(f.mm.hole.upperMm).toBeCloseTo(0.04064, 10);
    expect(f.mm.shaft.upperMm).toBeCloseTo(-0.0254, 10);
    expect(f.mm.shaft.lowerMm).toBeCloseTo(-0.0508, 10);
    expect(f.mm.maxClearanceMm).toBeCloseTo(0.09144, 10);
    expect(f.mm.minClearanceMm).toBeCloseTo(0.0254, 10);
  });
});

function refusal(run: () => unknown): FitError {
  try {
    run();
  } catch (error) {
    if (error instanceof FitError) return error;
    throw error;
  }
  throw new Error('expected a FitError, got a result');
}

describe('inch classes: refusals', () => {
  // Extents of the tables in ANSI B4.1-1967 (R2009) as the handbook prints them — from memory:
  // RC and LC to 200 in, LT, LN and FN to 19.69 in; LT3/LT4 begin over 0.24 in, FN3 over 0.95 in.
  const T = `${MH}, table extents — from memory`;
  test.each([
    [1, 'RC10', 'UNKNOWN_INCH_CLASS', T],
    [1, 'LC12', 'UNKNOWN_INCH_CLASS', T],
    [1, 'LT7', 'UNKNOWN_INCH_CLASS', T],
    [1, 'LN4', 'UNKNOWN_INCH_CLASS', T],
    [1, 'FN6', 'UNKNOWN_INCH_CLASS', T],
    [1, 'RC0', 'UNKNOWN_INCH_CLASS', T],
    [1, 'XY3', 'UNKNOWN_INCH_CLASS', T],
    [1, 'H7', 'UNKNOWN_INCH_CLASS', T],
    [1, '', 'UNKNOWN_INCH_CLASS', T],
    [0, 'RC4', 'INCH_SIZE_OUT_OF_RANGE', T],
    [-1, 'RC4', 'INCH_SIZE_OUT_OF_RANGE', T],
    [Number.NaN, 'RC4', 'INCH_SIZE_OUT_OF_RANGE', T],
    [200.001, 'RC1', 'INCH_SIZE_OUT_OF_RANGE', T],
    [201, 'LC11', 'INCH_SIZE_OUT_OF_RANGE', T],
    [19.7, 'LT1', 'INCH_SIZE_OUT_OF_RANGE', T],
    [20, 'LN3', 'INCH_SIZE_OUT_OF_RANGE', T],
    [19.691, 'FN2', 'INCH_SIZE_OUT_OF_RANGE', T],
    [0.1, 'LT3', 'INCH_CLASS_NOT_AT_SIZE', T],
    [0.24, 'LT4', 'INCH_CLASS_NOT_AT_SIZE', T],
    [0.95, 'FN3', 'INCH_CLASS_NOT_AT_SIZE', T],
    [0.5, 'FN3', 'INCH_CLASS_NOT_AT_SIZE', T],
  ] as const)('%s in %s → %s', (size, fitClass, code: FitErrorCode, source) => {
    expect(source).toMatch(/from memory/);
    const err = refusal(() => inchFit(size, fitClass));
    expect(err.code).toBe(code);
    expect(err.message.length).toBeGreaterThan(10);
  });

  test('the refusals name the class and where its table stops or starts', () => {
    expect(refusal(() => inchFit(19.7, 'LT1')).message).toMatch(/LT1 .*19\.69 in/);
    expect(refusal(() => inchFit(0.95, 'FN3')).message).toMatch(/FN3 .*begins over 0\.95 in/);
    expect(refusal(() => inchFit(1, 'RC10')).message).toMatch(/RC1 to RC9/);
  });

  test('class names are read in any case and spacing', () => {
    expect(inchFit(1.5, 'rc 4').fitClass).toBe('RC4');
    expect(inchFit(1.5, ' LC-11 ').fitClass).toBe('LC11');
  });
});
