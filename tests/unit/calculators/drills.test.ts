import { describe, expect, test } from 'vitest';
import { DRILL_CHART, drillSize, nearestDrills } from '../../../lib/calculators/index';
import { refusal } from './refusal';

const B94 = 'ASME B94.11M drill chart — from memory';
const METRIC = 'metric drill sizes — common practice';

describe('drillSize', () => {
  // [typed, chart name, kind, inches, source]
  const ROWS: ReadonlyArray<readonly [string, string, string, number, string]> = [
    ['#7', '#7', 'number', 0.2010, B94],
    ['F', 'F', 'letter', 0.2570, B94],
    ['27/64', '27/64', 'fractional', 0.421875, B94],
    ['No. 7', '#7', 'number', 0.2010, B94],
    ['no 7', '#7', 'number', 0.2010, B94],
    ['#1', '#1', 'number', 0.2280, B94],
    ['#3', '#3', 'number', 0.2130, B94],
    ['#21', '#21', 'number', 0.1590, B94],
    ['#25', '#25', 'number', 0.1495, B94],
    ['#29', '#29', 'number', 0.1360, B94],
    ['#36', '#36', 'number', 0.1065, B94],
    ['#43', '#43', 'number', 0.0890, B94],
    ['#50', '#50', 'number', 0.0700, B94],
    ['#60', '#60', 'number', 0.0400, B94],
    ['#70', '#70', 'number', 0.0280, B94],
    ['#80', '#80', 'number', 0.0135, B94],
    ['A', 'A', 'letter', 0.234, B94],
    ['f', 'F', 'letter', 0.257, B94],
    ['I', 'I', 'letter', 0.272, B94],
    ['Q', 'Q', 'letter', 0.332, B94],
    ['Z', 'Z', 'letter', 0.413, B94],
    ['1/4', '1/4', 'fractional', 0.25, B94],
    ['1/2"', '1/2', 'fractional', 0.5, B94],
    ['8/16', '1/2', 'fractional', 0.5, B94],
    ['1-1/4', '1-1/4', 'fractional', 1.25, B94],
    ['1 1/4 in', '1-1/4', 'fractional', 1.25, B94],
    ['1 in', '1 in', 'fractional', 1, B94],
    ['1"', '1 in', 'fractional', 1, B94],
    ['2 in', '2 in', 'fractional', 2, B94],
    ['1/64', '1/64', 'fractional', 1 / 64, B94],
    ['6.8 mm', '6.8 mm', 'metric', 6.8 / 25.4, METRIC],
    ['6,8mm', '6.8 mm', 'metric', 6.8 / 25.4, METRIC],
    ['1.25 mm', '1.25 mm', 'metric', 1.25 / 25.4, METRIC],
    ['10 mm', '10 mm', 'metric', 10 / 25.4, METRIC],
    ['17.5 mm', '17.5 mm', 'metric', 17.5 / 25.4, METRIC],
  ];
  test.each(ROWS)('%s → %s (%s) = %s in — %s', (typed, name, kind, inches) => {
    const d = drillSize(typed);
    expect(d.name).toBe(name);
    expect(d.kind).toBe(kind);
    expect(d.diameterIn).toBeCloseTo(inches, 9);
    expect(d.diameterMm).toBeCloseTo(inches * 25.4, 9);
    expect(d.diameter).toEqual({ mm: d.diameterMm, in: d.diameterIn });
  });

  test('27/64 shows as 0.4219 in to four places — issue check', () => {
    expect(drillSize('27/64').diameterIn.toFixed(4)).toBe('0.4219');
  });

  test('1/4 and letter E are the same drill, and each says so — ASME B94.11M, from memory', () => {
    expect(drillSize('E').alsoNamed).toContain('1/4');
    expect(drillSize('1/4').alsoNamed).toContain('E');
  });

  test('number drills get smaller as the number grows, #1 to #80 — ASME B94.11M, from memory', () => {
    const numbers = DRILL_CHART.filter((d) => d.kind === 'number');
    expect(numbers).toHaveLength(80);
    for (let i = 1; i < numbers.length; i++) expect(numbers[i].diameterIn).toBeLessThan(numbers[i - 1].diameterIn);
    const letters = DRILL_CHART.filter((d) => d.kind === 'letter');
    expect(letters).toHaveLength(26);
    for (let i = 1; i < letters.length; i++) expect(letters[i].diameterIn).toBeGreaterThan(letters[i - 1].diameterIn);
    // #1 (0.228) is just under A (0.234): the two series meet there.
    expect(numbers[0].diameterIn).toBeLessThan(letters[0].diameterIn);
  });

  // [typed, code]
  const BAD: ReadonlyArray<readonly [string, string]> = [
    ['7', 'UNREADABLE'],
    ['6.8', 'UNREADABLE'],
    ['#81', 'UNKNOWN_DRILL'],
    ['#0', 'UNKNOWN_DRILL'],
    ['3/7', 'UNKNOWN_DRILL'],
    ['6.85 mm', 'UNKNOWN_DRILL'],
    ['80 mm', 'UNKNOWN_DRILL'],
    ['AA', 'UNREADABLE'],
    ['', 'UNREADABLE'],
  ];
  test.each(BAD)('%s is refused (%s) on the name field', (typed, code) => {
    const e = refusal(() => drillSize(typed));
    expect(e.code).toBe(code);
    expect(e.field).toBe('name');
  });

  test('a bare number says which drills it could mean', () => {
    expect(refusal(() => drillSize('7')).message).toMatch(/#7.*7 mm/);
  });
});

describe('nearestDrills', () => {
  test('around 6.78 mm: 6.8 mm, H, 17/64, 6.7 mm — ASME B94.11M, from memory', () => {
    const names = nearestDrills(6.78, { count: 4 }).map((m) => m.drill.name);
    expect(names).toEqual(['6.8 mm', 'H', '17/64', '6.7 mm']);
  });

  test('inch drills only, at least the size — ASME B94.11M, from memory', () => {
    const m = nearestDrills(0.2 * 25.4, { count: 3, kinds: ['fractional', 'number', 'letter'], side: 'above' });
    expect(m.map((x) => x.drill.name)).toEqual(['#7', '13/64', '#6']);
    expect(m.every((x) => x.difference.mm >= 0)).toBe(true);
  });

  test('one diameter appears once: 1/4 rather than both 1/4 and E', () => {
    const names = nearestDrills(6.35, { count: 3, kinds: ['fractional', 'letter'] }).map((m) => m.drill.name);
    expect(names[0]).toBe('1/4');
    expect(names).not.toContain('E');
  });

  test.each([
    [0, 'diameterMm'], [-1, 'diameterMm'], [Number.NaN, 'diameterMm'],
  ])('diameter %s is refused on %s', (d, field) => {
    expect(refusal(() => nearestDrills(d)).field).toBe(field);
  });

  test('count and side are checked', () => {
    expect(refusal(() => nearestDrills(5, { count: 0 })).field).toBe('count');
    expect(refusal(() => nearestDrills(5, { count: 2.5 })).code).toBe('NOT_WHOLE');
    expect(refusal(() => nearestDrills(5, { side: 'up' as 'above' })).field).toBe('side');
  });
});
