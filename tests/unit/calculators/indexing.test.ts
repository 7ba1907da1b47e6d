import { describe, expect, test } from 'vitest';
import {
  DEFAULT_CHANGE_GEARS, DEFAULT_HOLE_CIRCLES, directIndexing, simpleIndexing,
} from '../../../lib/calculators/index';
import { refusal } from './refusal';

const MH_SIMPLE = "Machinery's Handbook simple indexing table, 40:1 head, the three usual plates — from memory";
const MH_DIFF = "Machinery's Handbook, differential indexing — from memory";
const COMMON = 'common practice';

describe('simple indexing on a 40:1 head', () => {
  // [divisions, whole turns, holes, circle, source]
  const ROWS: ReadonlyArray<readonly [number, number, number, number | null, string]> = [
    [36, 1, 2, 18, MH_SIMPLE],
    [7, 5, 15, 21, MH_SIMPLE],
    [2, 20, 0, null, MH_SIMPLE],
    [3, 13, 5, 15, MH_SIMPLE],
    [6, 6, 10, 15, MH_SIMPLE],
    [9, 4, 8, 18, MH_SIMPLE],
    [13, 3, 3, 39, MH_SIMPLE],
    [17, 2, 6, 17, MH_SIMPLE],
    [24, 1, 10, 15, MH_SIMPLE],
    [30, 1, 5, 15, MH_SIMPLE],
    [40, 1, 0, null, MH_SIMPLE],
    [52, 0, 30, 39, MH_SIMPLE],
    [60, 0, 10, 15, MH_SIMPLE],
    [72, 0, 10, 18, MH_SIMPLE],
    [100, 0, 6, 15, MH_SIMPLE],
    [360, 0, 2, 18, MH_SIMPLE],
  ];
  test.each(ROWS)('%s divisions: %s turns + %s holes on the %s circle — %s', (n, whole, holes, circle) => {
    const r = simpleIndexing(n);
    expect(r.possible).toBe(true);
    expect(r.move!.wholeTurns).toBe(whole);
    expect(r.move!.holes).toBe(holes);
    expect(r.move!.circle).toBe(circle);
    expect(r.differential).toBeNull();
  });

  test('36 divisions lists every circle that works, with the sector arms — common practice', () => {
    const r = simpleIndexing(36);
    expect(r.options.map((o) => [o.circle, o.holes])).toEqual([[18, 2], [27, 3]]);
    expect(r.move!.sector).toEqual({ spaces: 2, holesBetweenArms: 3 });
    expect(r.move!.description).toBe('1 turn and 2 holes on the 18-hole circle');
    expect(r.turnsPerDivision).toEqual({ whole: 1, numerator: 1, denominator: 9, value: 40 / 36 });
    expect(r.degreesPerDivision).toBe(10);
  });

  test('the default plates are the three commonly supplied — common practice', () => {
    expect(DEFAULT_HOLE_CIRCLES).toEqual([15, 16, 17, 18, 19, 20, 21, 23, 27, 29, 31, 33, 37, 39, 41, 43, 47, 49]);
    expect(simpleIndexing(36).circlesSource).toMatch(/common practice/);
  });

  test('own circles replace the defaults', () => {
    const r = simpleIndexing(127, { circles: [127, 100] });
    expect(r.possible).toBe(true);
    expect(r.move!.description).toBe('40 holes on the 127-hole circle');
    expect(r.circles).toEqual([100, 127]);
    expect(r.circlesSource).toBe('Your own hole circles');
  });

  test('a head with another ratio — 5 divisions on 90:1 = 18 turns, common practice', () => {
    expect(simpleIndexing(5, { ratio: 90 }).move!.description).toBe('18 turns');
  });
});

describe('differential indexing when no circle serves', () => {
  test('127 divisions: index 120, gears 56 / 24, plate against the crank — ' + MH_DIFF, () => {
    const r = simpleIndexing(127);
    expect(r.possible).toBe(false);
    expect(r.move).toBeNull();
    expect(r.message).toMatch(/cannot give 127/);
    const d = r.differential!;
    expect(d.approximateDivisions).toBe(120);
    expect(d.index.description).toBe('5 holes on the 15-hole circle');
    expect(d.gearRatio).toMatchObject({ numerator: 7, denominator: 3 });
    expect(d.train).toEqual({ kind: 'simple', driver: 56, driven: 24 });
    expect(d.plateDirection).toBe('opposite');
  });

  test('97 divisions: index 100 with the plate turning the same way — ' + MH_DIFF, () => {
    const d = simpleIndexing(97).differential!;
    expect(d.approximateDivisions).toBe(100);
    expect(d.plateDirection).toBe('same');
    expect(d.gearRatio).toMatchObject({ numerator: 6, denominator: 5 });
    expect(d.train.kind).toBe('simple');
  });

  test('the gears come from the commonly supplied set — ' + COMMON, () => {
    expect(DEFAULT_CHANGE_GEARS).toEqual([24, 24, 28, 32, 40, 44, 48, 56, 64, 72, 86]);
  });

  test('with too few circles and gears it says none was found', () => {
    const r = simpleIndexing(127, { circles: [17], gears: [24, 86] });
    expect(r.possible).toBe(false);
    expect(r.differential).toBeNull();
    expect(r.message).toMatch(/no differential set-up was found/);
  });
});

describe('direct indexing', () => {
  // [divisions, plate, holes to move, source]
  const ROWS: ReadonlyArray<readonly [number, number, number, string]> = [
    [6, 24, 4, COMMON], [2, 24, 12, COMMON], [8, 24, 3, COMMON], [24, 24, 1, COMMON], [12, 36, 3, COMMON],
  ];
  test.each(ROWS)('%s divisions on a %s-hole plate: %s holes — %s', (n, plate, holes) => {
    const r = directIndexing(n, plate);
    expect(r.holesToMove).toBe(holes);
    expect(r.degreesPerDivision).toBe(360 / n);
  });

  test('7 on a 24-hole plate is refused, listing what it gives', () => {
    const e = refusal(() => directIndexing(7));
    expect(e.code).toBe('NOT_POSSIBLE');
    expect(e.field).toBe('divisions');
    expect(e.message).toMatch(/2, 3, 4, 6, 8, 12, 24/);
  });
});

describe('indexing refusals', () => {
  // [call, field, code]
  const BAD: ReadonlyArray<readonly [string, () => unknown, string, string]> = [
    ['1 division', () => simpleIndexing(1), 'divisions', 'OUT_OF_RANGE'],
    ['0 divisions', () => simpleIndexing(0), 'divisions', 'OUT_OF_RANGE'],
    ['2.5 divisions', () => simpleIndexing(2.5), 'divisions', 'NOT_WHOLE'],
    ['NaN divisions', () => simpleIndexing(Number.NaN), 'divisions', 'NOT_A_NUMBER'],
    ['too many divisions', () => simpleIndexing(100_000), 'divisions', 'OUT_OF_RANGE'],
    ['ratio 0', () => simpleIndexing(36, { ratio: 0 }), 'ratio', 'OUT_OF_RANGE'],
    ['no circles', () => simpleIndexing(36, { circles: [] }), 'circles', 'NOT_A_NUMBER'],
    ['a circle of 1', () => simpleIndexing(36, { circles: [18, 1] }), 'circles', 'OUT_OF_RANGE'],
    ['a circle of 18.5', () => simpleIndexing(36, { circles: [18.5] }), 'circles', 'OUT_OF_RANGE'],
    ['a gear of 0', () => simpleIndexing(127, { gears: [0, 24] }), 'gears', 'OUT_OF_RANGE'],
    ['direct, plate of 1', () => directIndexing(2, 1), 'plateHoles', 'OUT_OF_RANGE'],
    ['direct, more divisions than holes', () => directIndexing(48, 24), 'divisions', 'OUT_OF_RANGE'],
  ];
  test.each(BAD)('%s is refused on %s', (_label, call, field, code) => {
    const e = refusal(call);
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});
