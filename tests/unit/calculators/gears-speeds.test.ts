import { describe, expect, test } from 'vitest';
import {
  CUTTING_SPEEDS, cutterFor, speedRange, spindleSpeed, spurGear,
} from '../../../lib/calculators/index';
import { refusal } from './refusal';

const ISO53 = 'ISO 53 basic rack: d = m·z, da = m·(z + 2), h = 2.25·m — from memory';
const B61 = 'ANSI B6.1 full-depth teeth: D = N/P, Do = (N + 2)/P, ht = 2.157/P — from memory';
const CUTTERS = "Machinery's Handbook, involute cutter numbers 1–8 — from memory";
const SPEED = 'rev/min = 1000·v/(π·d), or 12·sfm/(π·d in) ≈ 3.82·sfm/d — common practice';

describe('spur gears by module', () => {
  // [teeth, module, pitch Ø, outside Ø, whole depth, cutter, source]
  const ROWS: ReadonlyArray<readonly [number, number, number, number, number, number, string]> = [
    [36, 1.5, 54, 57, 3.375, 3, ISO53],
    [20, 2, 40, 44, 4.5, 6, ISO53],
    [12, 1, 12, 14, 2.25, 8, ISO53],
    [60, 0.5, 30, 31, 1.125, 2, ISO53],
    [135, 1, 135, 137, 2.25, 1, ISO53],
  ];
  test.each(ROWS)('%s teeth, module %s: pitch Ø%s, outside Ø%s, depth %s, cutter No. %s — %s', (z, m, d, da, h, cutter) => {
    const g = spurGear({ teeth: z, module: m });
    expect(g.pitchDiameter.mm).toBeCloseTo(d, 9);
    expect(g.outsideDiameter.mm).toBeCloseTo(da, 9);
    expect(g.wholeDepth.mm).toBeCloseTo(h, 9);
    expect(g.cutter?.number).toBe(cutter);
    expect(g.circularPitch.mm).toBeCloseTo(Math.PI * m, 9);
    expect(g.outsideDiameter.in).toBeCloseTo(da / 25.4, 9);
  });

  test('base circle at 20° and 14.5° — involute geometry, d·cos α', () => {
    expect(spurGear({ teeth: 20, module: 2 }).baseDiameter.mm).toBeCloseTo(37.5877, 4);
    expect(spurGear({ teeth: 20, module: 2 }, { pressureAngleDeg: 14.5 }).baseDiameter.mm).toBeCloseTo(40 * Math.cos((14.5 * Math.PI) / 180), 9);
  });
});

describe('spur gears by diametral pitch', () => {
  // [teeth, DP, pitch Ø in, outside Ø in, whole depth in, source]
  const ROWS: ReadonlyArray<readonly [number, number, number, number, number, string]> = [
    [40, 20, 2, 2.1, 0.10785, B61],
    [40, 16, 2.5, 2.625, 0.1348, B61],
    [24, 12, 2, 2.1667, 0.1798, B61],
    [48, 24, 2, 2.0833, 0.0899, B61],
  ];
  test.each(ROWS)('%s teeth, %s DP: pitch Ø%s in, outside Ø%s in, depth %s in — %s', (z, p, d, da, h) => {
    for (const pressureAngleDeg of [20, 14.5] as const) {
      const g = spurGear({ teeth: z, diametralPitch: p }, { pressureAngleDeg });
      expect(g.pitchDiameter.in).toBeCloseTo(d, 4);
      expect(g.outsideDiameter.in).toBeCloseTo(da, 4);
      expect(g.wholeDepth.in).toBeCloseTo(h, 4);
      expect(g.module).toBeCloseTo(25.4 / p, 9);
    }
  });
});

describe('involute cutter numbers', () => {
  // [teeth, cutter, source]
  const ROWS: ReadonlyArray<readonly [number, number, string]> = [
    [12, 8, CUTTERS], [13, 8, CUTTERS], [14, 7, CUTTERS], [16, 7, CUTTERS], [17, 6, CUTTERS], [20, 6, CUTTERS],
    [21, 5, CUTTERS], [25, 5, CUTTERS], [26, 4, CUTTERS], [34, 4, CUTTERS], [35, 3, CUTTERS], [54, 3, CUTTERS],
    [55, 2, CUTTERS], [134, 2, CUTTERS], [135, 1, CUTTERS], [1000, 1, CUTTERS],
  ];
  test.each(ROWS)('%s teeth → No. %s — %s', (z, n) => {
    expect(cutterFor(z)?.number).toBe(n);
    expect(cutterFor(z)?.reverseNumber).toBe(9 - n);
  });

  test('below 12 teeth no cutter of the set, with a warning', () => {
    const g = spurGear({ teeth: 10, module: 1 });
    expect(g.cutter).toBeNull();
    expect(g.warnings.map((w) => w.code)).toEqual(['UNDERCUT', 'NO_CUTTER']);
  });

  test('undercut below 17 teeth at 20° and 32 at 14.5° — 2 / sin²α, common practice', () => {
    expect(spurGear({ teeth: 16, module: 1 }).warnings.map((w) => w.code)).toEqual(['UNDERCUT']);
    expect(spurGear({ teeth: 17, module: 1 }).warnings).toEqual([]);
    expect(spurGear({ teeth: 31, module: 1 }, { pressureAngleDeg: 14.5 }).warnings.map((w) => w.code)).toEqual(['UNDERCUT']);
    expect(spurGear({ teeth: 32, module: 1 }, { pressureAngleDeg: 14.5 }).warnings).toEqual([]);
  });

  // [input, options, field, code]
  const BAD: ReadonlyArray<readonly [object, object, string, string]> = [
    [{ teeth: 36 }, {}, 'module', 'NOT_A_NUMBER'],
    [{ teeth: 36, module: 1.5, diametralPitch: 16 }, {}, 'diametralPitch', 'NOT_POSSIBLE'],
    [{ teeth: 36.5, module: 1.5 }, {}, 'teeth', 'NOT_WHOLE'],
    [{ teeth: 3, module: 1.5 }, {}, 'teeth', 'OUT_OF_RANGE'],
    [{ teeth: 36, module: 0 }, {}, 'module', 'OUT_OF_RANGE'],
    [{ teeth: 36, diametralPitch: -4 }, {}, 'diametralPitch', 'OUT_OF_RANGE'],
    [{ teeth: 36, module: 1.5 }, { pressureAngleDeg: 25 }, 'pressureAngleDeg', 'UNKNOWN_CHOICE'],
  ];
  test.each(BAD)('%j %j is refused on %s (%s)', (input, options, field, code) => {
    const e = refusal(() => spurGear(input as never, options as never));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});

describe('spindle speed', () => {
  // [v, unit, d mm, rev/min, source]
  const ROWS: ReadonlyArray<readonly [number, 'm/min' | 'sfm', number, number, string]> = [
    [30, 'm/min', 8, 1193.66, SPEED],
    [100, 'm/min', 50, 636.62, SPEED],
    [25, 'm/min', 160, 49.74, SPEED],
    [100, 'sfm', 25.4, 381.97, SPEED],
    [90, 'sfm', 12.7, 687.55, SPEED],
  ];
  test.each(ROWS)('%s %s on Ø%s mm → %s rev/min — %s', (v, unit, d, rpm) => {
    const r = spindleSpeed({ cuttingSpeed: v, unit, diameterMm: d });
    expect(r.rpm).toBeCloseTo(rpm, 1);
  });

  test('the shop short form rpm ≈ 3.82 × sfm / d agrees — common practice', () => {
    expect(spindleSpeed({ cuttingSpeed: 80, unit: 'sfm', diameterMm: 0.5 * 25.4 }).rpm).toBeCloseTo((3.82 * 80) / 0.5, -1);
  });

  test('every material has HSS slower than carbide, in both units — common practice', () => {
    expect(CUTTING_SPEEDS.length).toBeGreaterThanOrEqual(6);
    for (const row of CUTTING_SPEEDS) {
      expect(row.hss.sfm[0]).toBeLessThan(row.hss.sfm[1]);
      expect(row.hss.sfm[1]).toBeLessThanOrEqual(row.carbide.sfm[1]);
      expect(row.hss.mPerMin[0]).toBeCloseTo(row.hss.sfm[0] * 0.3048, -1);
      expect(row.source).toMatch(/common practice/);
    }
  });

  test('speedRange gives rev/min for both ends — mild steel with HSS, 80–110 sfm on 1 in ≈ 306–420, common practice', () => {
    const r = speedRange({ material: 'mild-steel', tool: 'hss', diameterMm: 25.4 });
    expect(r.rpm[0]).toBeCloseTo(305.6, 0);
    expect(r.rpm[1]).toBeCloseTo(420.2, 0);
  });

  // [input, field, code]
  const BAD: ReadonlyArray<readonly [object, string, string]> = [
    [{ cuttingSpeed: 30, unit: 'm/s', diameterMm: 8 }, 'unit', 'UNKNOWN_CHOICE'],
    [{ cuttingSpeed: 0, unit: 'm/min', diameterMm: 8 }, 'cuttingSpeed', 'OUT_OF_RANGE'],
    [{ cuttingSpeed: 30, unit: 'm/min', diameterMm: 0 }, 'diameterMm', 'OUT_OF_RANGE'],
    [{ cuttingSpeed: 30, unit: 'm/min', diameterMm: Number.NaN }, 'diameterMm', 'NOT_A_NUMBER'],
    [{ cuttingSpeed: 30, unit: 'm/min' }, 'diameterMm', 'NOT_A_NUMBER'],
  ];
  test.each(BAD)('%j is refused on %s (%s)', (input, field, code) => {
    const e = refusal(() => spindleSpeed(input as never));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });

  test('speedRange refuses an unknown material or tool', () => {
    expect(refusal(() => speedRange({ material: 'unobtainium' as 'brass', tool: 'hss', diameterMm: 10 })).field).toBe('material');
    expect(refusal(() => speedRange({ material: 'brass', tool: 'diamond' as 'hss', diameterMm: 10 })).field).toBe('tool');
  });
});
