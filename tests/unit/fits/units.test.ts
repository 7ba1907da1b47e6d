import { describe, expect, test } from 'vitest';
import { inToMm, MM_PER_INCH, mmToIn, toleranceZone, umToIn, umToMm } from '../../../lib/fits/index';
import { formatIn, formatMm, formatUm } from '../../../lib/units/format';

const INCH = 'ISO/NIST definition of the inch, 1 in = 25.4 mm exactly';
const PRACTICE = 'common practice: metric limits to 0.001 mm, inch limits to 0.0001 in';

describe('conversions', () => {
  test.each([
    [25.4, 0.001, INCH],
    [254, 0.01, INCH],
    [12.7, 0.0005, INCH],
    [25400, 1, INCH],
  ] as const)('%s µm = %s in — %s', (um, inches, _source) => {
    expect(umToIn(um)).toBeCloseTo(inches, 12);
  });

  test('inch and millimetre', () => {
    // ISO/NIST definition of the inch
    expect(MM_PER_INCH).toBe(25.4);
    expect(inToMm(1)).toBe(25.4);
    expect(inToMm(2)).toBe(50.8);
    expect(mmToIn(25.4)).toBe(1);
    expect(mmToIn(50.8)).toBe(2);
    expect(umToMm(21)).toBe(0.021);
  });
});

describe('formatting', () => {
  test.each([
    [0.021, undefined, '0.021', PRACTICE],
    [0.021, true, '+0.021', PRACTICE],
    [-0.02, true, '-0.020', PRACTICE],
    [0, true, '0.000', PRACTICE],
    [25, undefined, '25.000', PRACTICE],
    [0.0105, true, '+0.0105', PRACTICE],
    [-0.0105, true, '-0.0105', PRACTICE],
    [-0.00015, undefined, '-0.00015', PRACTICE],
  ] as const)('formatMm(%s) → %s', (mm, signed, text, _source) => {
    expect(formatMm(mm, { signed: signed === true })).toBe(text);
  });

  test.each([
    [1, undefined, '1.0000', INCH],
    [0.0005, true, '+0.0005', INCH],
    [0.00005, true, '+0.0001', PRACTICE],
    [-0.00004, true, '0.0000', PRACTICE],
    [0.984252, undefined, '0.9843', PRACTICE],
  ] as const)('formatIn(%s) → %s', (inches, signed, text, _source) => {
    expect(formatIn(inches, { signed: signed === true })).toBe(text);
  });

  test('a zone shown in both units', () => {
    // ISO 286-2:2010 H7 at 18–30 mm — from memory: +21 µm = +0.021 mm = +0.0008 in
    const z = toleranceZone(25, 'H7');
    expect(formatMm(z.upperMm, { signed: true })).toBe('+0.021');
    expect(formatIn(umToIn(z.upperUm), { signed: true })).toBe('+0.0008');
    // ISO 286-2:2010 g6 at 18–30 mm — from memory: −20 µm = −0.0008 in
    const g = toleranceZone(25, 'g6');
    expect(formatIn(umToIn(g.lowerUm), { signed: true })).toBe('-0.0008');
  });

  test.each([
    [21, true, '+21'],
    [-7, undefined, '-7'],
    [10.5, true, '+10.5'],
    [0.15, undefined, '0.15'],
    [0, true, '0'],
  ] as const)('formatUm(%s) → %s', (um, signed, text) => {
    // common practice: micrometres as printed in the tables
    expect(formatUm(um, { signed: signed === true })).toBe(text);
  });
});
