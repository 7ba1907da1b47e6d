import { describe, expect, test } from 'vitest';
import { FitError, parseDesignation, toleranceZone } from '../../../lib/fits/index';

const PRACTICE = 'common practice: how sizes and zones are written on drawings and in shop notes';
const INCH = 'ISO/NIST definition of the inch, 1 in = 25.4 mm exactly';

describe('what people type', () => {
  test.each([
    ['25 H7/g6', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['Ø25H7', 25, 'mm', 25, 'H7', undefined, PRACTICE],
    ['ø 25 h6', 25, 'mm', 25, 'h6', undefined, PRACTICE],
    ['⌀25 g6', 25, 'mm', 25, 'g6', undefined, PRACTICE],
    ['25h6', 25, 'mm', 25, 'h6', undefined, PRACTICE],
    ['25mm H7', 25, 'mm', 25, 'H7', undefined, PRACTICE],
    ['25 mm H7/g6', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['25,4 H7', 25.4, 'mm', 25.4, 'H7', undefined, PRACTICE],
    ['12.5 js6', 12.5, 'mm', 12.5, 'js6', undefined, PRACTICE],
    ['25 (H7/g6)', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['25 H7-g6', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['25 H7 g6', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['25H7/g6', 25, 'mm', 25, undefined, ['H7', 'g6'], PRACTICE],
    ['  40 zc10  ', 40, 'mm', 40, 'zc10', undefined, PRACTICE],
    ['2 h01', 2, 'mm', 2, 'h01', undefined, PRACTICE],
    ['25', 25, 'mm', 25, undefined, undefined, PRACTICE],
    ['1.000 in H7', 25.4, 'in', 1, 'H7', undefined, INCH],
    ['1" g6', 25.4, 'in', 1, 'g6', undefined, INCH],
    ['1.5in H7/f7', 38.1, 'in', 1.5, undefined, ['H7', 'f7'], INCH],
    ['0.375 inch H7', 9.525, 'in', 0.375, 'H7', undefined, INCH],
    ['.5" h6', 12.7, 'in', 0.5, 'h6', undefined, INCH],
    ['2 inches H8', 50.8, 'in', 2, 'H8', undefined, INCH],
    ['1/2" H7', 12.7, 'in', 0.5, 'H7', undefined, INCH],
    ['1-1/4 in g6', 31.75, 'in', 1.25, 'g6', undefined, INCH],
    ['3/8 in H7', 9.525, 'in', 0.375, 'H7', undefined, INCH],
  ] as const)('%s → %s mm — %s', (text, mm, unit, input, zone, fit, _source) => {
    const d = parseDesignation(text);
    expect(d.nominalMm).toBe(mm);
    expect(d.unit).toBe(unit);
    expect(d.nominalInput).toBe(input);
    expect(d.zone).toBe(zone);
    expect(d.fit).toEqual(fit === undefined ? undefined : { hole: fit[0], shaft: fit[1] });
  });

  test('the size is kept as typed', () => {
    // common practice: "1.000 in" carries three places of intent
    expect(parseDesignation('1.000 in H7').nominalText).toBe('1.000');
    expect(parseDesignation('25,40 H7').nominalText).toBe('25.40');
  });

  test('an inch size feeds the metric tables', () => {
    // ISO 286-2:2010 H7 at 18–30 mm — from memory: 1 in = 25.4 mm lies in 18–30, H7 = +21/0
    const d = parseDesignation('1.000 in H7');
    const z = toleranceZone(d.nominalMm, d.zone as string);
    expect(z.upperUm).toBe(21);
  });
});

describe('what cannot be read', () => {
  test.each([
    ['', 'Nothing to read'],
    ['   ', 'Nothing to read'],
    ['H7 25', 'size'],
    ['abc', 'size'],
    ['25 Q7', 'Q7'],
    ['25 H7/', 'shaft zone'],
    ['25 H7/g6 please', 'please'],
    ['25 g6/H7', 'hole first'],
    ['25 H7/H8', 'two holes'],
    ['25 Js7', 'JS7'],
    ['25 H19', '19'],
    ['1/2 H7', 'inch'],
    ['25 ??', '??'],
  ] as const)('%j → UNREADABLE mentioning %j', (text, says) => {
    // common practice: the message points at the part that could not be read
    let caught: unknown;
    try {
      parseDesignation(text);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(FitError);
    expect((caught as FitError).code).toBe('UNREADABLE');
    expect((caught as FitError).message).toContain(says);
  });
});
