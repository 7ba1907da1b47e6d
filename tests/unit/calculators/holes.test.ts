import { describe, expect, test } from 'vitest';
import { clearanceHole, counterbore, screwSize } from '../../../lib/calculators/index';
import { refusal } from './refusal';

const ISO273 = 'ISO 273:1979 Table 1 — from memory';
const INCH = 'inch close-fit / free-fit clearance drill table — common practice, from memory';
const ISO4762 = 'ISO 4762 head dimensions dk max, k max — from memory';
const B183 = 'ASME B18.3 socket head cap screw head dimensions — from memory';
const DIN974 = 'DIN 974-1 counterbore diameters for ISO 4762 — from memory';
const B183CB = 'ASME B18.3 appendix counterbore sizes — from memory';
const COMMON = 'common practice';

describe('clearance holes, metric (ISO 273 fine / medium / coarse)', () => {
  // [size, close, normal, loose mm, source]
  const ROWS: ReadonlyArray<readonly [string, number, number, number, string]> = [
    ['M8', 8.4, 9, 10, ISO273],
    ['M1.6', 1.7, 1.8, 2, ISO273],
    ['M2', 2.2, 2.4, 2.6, ISO273],
    ['M2.5', 2.7, 2.9, 3.1, ISO273],
    ['M3', 3.2, 3.4, 3.6, ISO273],
    ['M4', 4.3, 4.5, 4.8, ISO273],
    ['M5', 5.3, 5.5, 5.8, ISO273],
    ['M6', 6.4, 6.6, 7, ISO273],
    ['M10', 10.5, 11, 12, ISO273],
    ['M12', 13, 13.5, 14.5, ISO273],
    ['M16', 17, 17.5, 18.5, ISO273],
    ['M20', 21, 22, 24, ISO273],
    ['M24', 25, 26, 28, ISO273],
    ['M30', 31, 33, 35, ISO273],
    ['M36', 37, 39, 42, ISO273],
    ['M64', 66, 70, 74, ISO273],
    ['M8x1', 8.4, 9, 10, `${ISO273}: the pitch does not change the hole`],
  ];
  test.each(ROWS)('%s: %s / %s / %s mm — %s', (size, close, normal, loose) => {
    const got = (['close', 'normal', 'loose'] as const).map((fit) => clearanceHole(size, fit));
    expect(got.map((g) => g.diameter.mm)).toEqual([close, normal, loose]);
    expect(got.map((g) => g.isoSeries)).toEqual(['fine', 'medium', 'coarse']);
    for (const g of got) {
      expect(g.drill.kind).toBe('metric');
      expect(g.drill.diameterMm).toBe(g.diameter.mm);
      expect(g.diameter.in).toBeCloseTo(g.diameter.mm / 25.4, 12);
      // Inch drills here end at 2-1/4 in (57.15 mm).
      if (g.diameter.mm <= 57.15) expect(g.drillOtherSystem!.diameterMm).toBeGreaterThanOrEqual(g.diameter.mm);
      else expect(g.drillOtherSystem).toBeNull();
    }
  });

  test('the default class is normal (medium series) — ISO 273, from memory', () => {
    expect(clearanceHole('M8').diameter.mm).toBe(9);
  });
});

describe('clearance holes, inch', () => {
  // [size, close drill, normal drill, source]
  const ROWS: ReadonlyArray<readonly [string, string, string, string]> = [
    ['#4', '#32', '#30', INCH],
    ['#6', '#27', '#18', INCH],
    ['#8', '#18', '#9', INCH],
    ['#10', '#9', '#2', INCH],
    ['1/4', 'F', 'H', INCH],
    ['1/4-20', 'F', 'H', INCH],
    ['5/16-18 UNC', 'P', 'Q', INCH],
    ['3/8', 'W', 'X', INCH],
    ['1/2', '33/64', '17/32', INCH],
    ['3/4', '49/64', '25/32', INCH],
    ['1 in', '1-1/64', '1-1/32', INCH],
  ];
  test.each(ROWS)('%s: close %s, normal %s — %s', (size, close, normal) => {
    expect(clearanceHole(size, 'close').drill.name).toBe(close);
    expect(clearanceHole(size, 'normal').drill.name).toBe(normal);
    expect(clearanceHole(size, 'close').isoSeries).toBeNull();
  });

  test.each(['#0', '#4', '#10', '1/4', '1/2', '1 in', '1-1/2'])(
    'loose %s is at least 20 %% over size and larger than normal — common practice',
    (size) => {
      const loose = clearanceHole(size, 'loose');
      const normal = clearanceHole(size, 'normal');
      expect(loose.diameter.mm).toBeGreaterThanOrEqual(1.2 * loose.screw.majorDiameterMm - 1e-9);
      expect(loose.diameter.mm).toBeGreaterThan(normal.diameter.mm);
      expect(['fractional', 'number', 'letter']).toContain(loose.drill.kind);
    },
  );

  test('an inch hole names the smallest metric drill at least as large — common practice', () => {
    const h = clearanceHole('1/4-20', 'normal'); // H = 6.756 mm
    expect(h.drillOtherSystem?.name).toBe('6.8 mm');
    expect(h.clearance.in).toBeCloseTo(0.016, 6);
  });
});

describe('screw sizes and refusals', () => {
  test.each([
    ['M8', 'metric', 'M8'], ['1/4', 'unified', '1/4'], ['#10', 'unified', '#10'], ['10', 'unified', '#10'],
    ['1-1/2', 'unified', '1-1/2'], ['1 1/2"', 'unified', '1-1/2'], ['1"', 'unified', '1'], ['5/16-18 UNC', 'unified', '5/16'],
  ])('%s reads as %s %s', (text, system, size) => {
    const s = screwSize(text);
    expect(s.system).toBe(system);
    expect(s.size).toBe(size);
  });

  // [size, fit, field, code]
  const BAD: ReadonlyArray<readonly [string, string, string, string]> = [
    ['1', 'normal', 'size', 'UNREADABLE'],
    ['M9', 'normal', 'size', 'UNKNOWN_THREAD'],
    ['9/32', 'normal', 'size', 'UNKNOWN_THREAD'],
    ['M8', 'snug', 'fit', 'UNKNOWN_CHOICE'],
    ['', 'normal', 'size', 'UNREADABLE'],
  ];
  test.each(BAD)('%s / %s is refused on %s (%s)', (size, fit, field, code) => {
    const e = refusal(() => clearanceHole(size, fit as 'normal'));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});

describe('counterbores for socket head cap screws', () => {
  // [size, head Ø, head height, counterbore Ø (mm), source]
  const METRIC: ReadonlyArray<readonly [string, number, number, number, string]> = [
    ['M3', 5.5, 3, 6.5, `${ISO4762}; ${DIN974}`],
    ['M4', 7, 4, 8, `${ISO4762}; ${DIN974}`],
    ['M5', 8.5, 5, 10, `${ISO4762}; ${DIN974}`],
    ['M6', 10, 6, 11, `${ISO4762}; ${DIN974}`],
    ['M8', 13, 8, 15, `${ISO4762}; ${DIN974}`],
    ['M10', 16, 10, 18, `${ISO4762}; ${DIN974}`],
    ['M12', 18, 12, 20, `${ISO4762}; ${DIN974}`],
    ['M16', 24, 16, 26, `${ISO4762}; ${DIN974}`],
    ['M20', 30, 20, 33, `${ISO4762}; ${DIN974}`],
    ['M42', 63, 42, 70, `${ISO4762}; ${COMMON}: head + 10 % rounded up`],
  ];
  test.each(METRIC)('%s: head Ø%s × %s, counterbore Ø%s — %s', (size, dk, k, cb) => {
    const r = counterbore(size);
    expect(r.head.diameter.mm).toBe(dk);
    expect(r.head.height.mm).toBe(k);
    expect(r.counterbore.diameter.mm).toBe(cb);
    expect(r.counterbore.diameter.mm).toBeGreaterThan(dk);
    expect(r.counterbore.depth.mm).toBe(k + (r.screw.majorDiameterMm <= 10 ? 0.5 : 1));
    expect(r.throughHole.fit).toBe('normal');
  });

  // [size, head Ø in, height in, counterbore Ø in, source]
  const INCH_ROWS: ReadonlyArray<readonly [string, number, number, number, string]> = [
    ['#10', 0.312, 0.190, 3 / 8, `${B183}; ${B183CB}`],
    ['1/4-20', 0.375, 0.25, 7 / 16, `${B183}; ${B183CB}`],
    ['5/16', 0.469, 0.3125, 17 / 32, `${B183}; ${B183CB}`],
    ['3/8', 0.562, 0.375, 5 / 8, `${B183}; ${B183CB}`],
    ['1/2', 0.75, 0.5, 13 / 16, `${B183}; ${B183CB}`],
  ];
  test.each(INCH_ROWS)('%s: head Ø%s × %s in, counterbore Ø%s in — %s', (size, a, h, cb) => {
    const r = counterbore(size);
    expect(r.head.diameter.in).toBeCloseTo(a, 9);
    expect(r.head.height.in).toBeCloseTo(h, 9);
    expect(r.counterbore.diameter.in).toBeCloseTo(cb, 9);
    expect(r.counterbore.depth.in).toBeCloseTo(h + 1 / 32, 9);
  });

  test('1 in cap screw: depth allowance 1/16 in above 1/2 in — ASME B18.3, common practice', () => {
    const r = counterbore('1 in');
    expect(r.counterbore.diameter.in).toBeCloseTo(1.625, 9);
    expect(r.counterbore.depth.in).toBeCloseTo(1 + 1 / 16, 9);
  });

  // [size, centre to edge mm, spacing mm, wall to edge, wall between, warnings, source]
  const WALLS: ReadonlyArray<readonly [string, number | undefined, number | undefined, number | null, number | null, string[], string]> = [
    ['M8', 10, undefined, 2.5, null, [], `${COMMON}: 1.5 mm minimum wall`],
    ['M8', 9, undefined, 1.5, null, [], `${COMMON}: exactly at the minimum is accepted`],
    ['M8', 8.5, undefined, 1, null, ['THIN_WALL'], COMMON],
    ['M8', 7, undefined, -0.5, null, ['BREAKS_OUT'], COMMON],
    ['M8', undefined, 16, null, 1, ['THIN_WALL'], COMMON],
    ['M8', 12, 20, 4.5, 5, [], COMMON],
    ['M24', 22, undefined, 2, null, ['THIN_WALL'], `${COMMON}: 10 % of a 36 mm head is 3.6 mm`],
  ];
  test.each(WALLS)('%s, %s mm to the edge, %s mm spacing → walls %s / %s mm %j — %s', (size, edge, spacing, toEdge, between, codes) => {
    const r = counterbore(size, { holeCentreToEdgeMm: edge, holeSpacingMm: spacing });
    if (toEdge === null) expect(r.wall.toEdge).toBeNull();
    else expect(r.wall.toEdge!.mm).toBeCloseTo(toEdge, 9);
    if (between === null) expect(r.wall.betweenHoles).toBeNull();
    else expect(r.wall.betweenHoles!.mm).toBeCloseTo(between, 9);
    expect(r.warnings.map((w) => w.code)).toEqual(codes);
  });

  test('minimum wall is the larger of 1.5 mm and 10 % of the head — common practice', () => {
    expect(counterbore('M8').wall.minimumAdvised.mm).toBe(1.5);
    expect(counterbore('M24').wall.minimumAdvised.mm).toBeCloseTo(3.6, 9);
  });

  // [size, options, field, code]
  const BAD: ReadonlyArray<readonly [string, object, string, string]> = [
    ['M18', {}, 'size', 'NOT_TABULATED'],
    ['#12', {}, 'size', 'NOT_TABULATED'],
    ['M8', { holeCentreToEdgeMm: 0 }, 'holeCentreToEdgeMm', 'OUT_OF_RANGE'],
    ['M8', { holeCentreToEdgeMm: Number.NaN }, 'holeCentreToEdgeMm', 'NOT_A_NUMBER'],
    ['M8', { holeSpacingMm: -5 }, 'holeSpacingMm', 'OUT_OF_RANGE'],
    ['M8', { fit: 'tight' }, 'fit', 'UNKNOWN_CHOICE'],
  ];
  test.each(BAD)('%s %j is refused on %s (%s)', (size, options, field, code) => {
    const e = refusal(() => counterbore(size, options));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});
