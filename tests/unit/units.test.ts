// The one number parser (lib/units/parse.ts) and the one set of length formatters (lib/units/format.ts).
import { describe, expect, test } from 'vitest';
import { parseNumber, type ParseNumberOptions } from '@/lib/units/parse';
import { formatIn, formatMm, formatMmAs, formatNumber, formatThou, formatUm, formatUmAs, readoutMm } from '@/lib/units/format';

// The inch is exactly 25.4 mm (international yard and pound agreement, 1959 — from memory).
const INCH = 'international inch = 25.4 mm exactly (1959 agreement — from memory)';
const ISO = 'ISO 286-2:2010, 25 H7 = +21/0 µm, 25 g6 = -7/-20 µm (from memory)';
const SHOP = 'common practice: decimal comma or point, fractions of an inch written 4-1/2 or 4 1/2';

describe('parseNumber', () => {
  test.each([
    // [text, options, expected, source]
    ['6.8', {}, 6.8, SHOP],
    ['6,8', {}, 6.8, SHOP],
    ['  -0.05 ', {}, -0.05, SHOP],
    ['.5', {}, 0.5, SHOP],
    ['', {}, undefined, SHOP],
    ['   ', { fractions: true }, undefined, SHOP],
    ['3/8', {}, Number.NaN, SHOP],
    ['3/8', { fractions: true }, 0.375, SHOP],
    ['4-1/2', { fractions: true }, 4.5, SHOP],
    ['4 1/2', { fractions: true }, 4.5, SHOP],
    ['1/0', { fractions: true }, Number.NaN, SHOP],
    ['2.5e-3', {}, Number.NaN, SHOP],
    ['2.5e-3', { exponent: true }, 0.0025, SHOP],
    ['12 mm', { fractions: true, exponent: true }, Number.NaN, SHOP],
    ['1.2.3', {}, Number.NaN, SHOP],
  ] as [string, ParseNumberOptions, number | undefined, string][])('%j with %j → %s (%s)', (text, options, expected) => {
    const n = parseNumber(text, options);
    if (expected === undefined) expect(n).toBeUndefined();
    else if (Number.isNaN(expected)) expect(n).toBeNaN();
    else expect(n).toBe(expected);
  });
});

describe('formatters name the unit they take', () => {
  test.each([
    // [written, expected, source]
    [formatUmAs(21, 'mm', { signed: true }), '+0.021', ISO],
    [formatUmAs(-20, 'mm', { signed: true }), '-0.020', ISO],
    [formatUmAs(21, 'in', { signed: true }), '+0.0008', `${ISO}; ${INCH}: 21 µm = 0.000827 in`],
    [formatUmAs(25_021, 'in'), '0.9851', `${ISO}; ${INCH}: 25.021 mm = 0.98508 in`],
    [formatMmAs(25, 'in'), '0.9843', `${INCH}: 25 mm = 0.98425 in`],
    [formatMmAs(25.4, 'in'), '1.0000', INCH],
    [formatMm(25), '25.000', 'common practice: mm to 0.001'],
    [formatMm(0.0105), '0.0105', 'ISO 286-2:2010, JS7 at 18–30 mm = ±10.5 µm (from memory): finer digits kept'],
    [readoutMm(0.0105), '0.011', 'common practice: a DRO reads 0.001 mm; half away from zero'],
    [readoutMm(6.8), '6.800', 'common practice: a drill chart lists mm to 0.001'],
    [formatIn(0.25), '0.2500', 'common practice: inches to 0.0001 (a tenth)'],
    [formatUm(10.5, { signed: true }), '+10.5', 'ISO 286-2:2010 JS7 (from memory)'],
    [formatUm(-7), '-7', ISO],
    [formatThou(1.6, { signed: true }), '+1.6', 'ANSI B4.1 RC tables print thousandths (from memory)'],
    [formatThou(0), '0', 'ANSI B4.1 (from memory)'],
    [formatMm(6.78, { decimals: 0, maxDecimals: 4 }), '6.78', 'common practice: a box shows what was typed, no trailing zeros'],
    [formatNumber(1e-7, { maxDecimals: 6 }), '0', 'plain decimals, never exponent form'],
    [formatNumber(-0.0000001, { decimals: 2 }), '0.00', 'no negative zero'],
    [formatNumber(100_000.5, { maxDecimals: 6 }), '100000.5', 'trailing zeros dropped even for large values'],
  ])('%s = %s (%s)', (written, expected) => expect(written).toBe(expected));
});
