import { describe, expect, test } from 'vitest';
import { boltCircle } from '../../../lib/calculators/index';
import { refusal } from './refusal';

// Coordinates per 1.000 in circle, centre origin, X right / Y up, angles counter-clockwise from +X.
const MH = "Machinery's Handbook hole-coordinate tables (per 1.000 in circle, centre origin) — from memory";
const TRIG = 'x = r·cos θ, y = r·sin θ — plane trigonometry';

describe('bolt-circle coordinates', () => {
  // [holes, start°, [[x, y] in inches per 1.000 in circle], source]
  const ROWS: ReadonlyArray<readonly [number, number, ReadonlyArray<readonly [number, number]>, string]> = [
    [3, 90, [[0, 0.5], [-0.4330, -0.25], [0.4330, -0.25]], MH],
    [4, 45, [[0.35355, 0.35355], [-0.35355, 0.35355], [-0.35355, -0.35355], [0.35355, -0.35355]], MH],
    [4, 0, [[0.5, 0], [0, 0.5], [-0.5, 0], [0, -0.5]], MH],
    [5, 90, [[0, 0.5], [-0.47553, 0.15451], [-0.29389, -0.40451], [0.29389, -0.40451], [0.47553, 0.15451]], MH],
    [6, 0, [[0.5, 0], [0.25, 0.43301], [-0.25, 0.43301], [-0.5, 0], [-0.25, -0.43301], [0.25, -0.43301]], MH],
    [8, 22.5, [[0.46194, 0.19134], [0.19134, 0.46194], [-0.19134, 0.46194], [-0.46194, 0.19134], [-0.46194, -0.19134], [-0.19134, -0.46194], [0.19134, -0.46194], [0.46194, -0.19134]], MH],
  ];
  test.each(ROWS)('%s holes from %s° on a 1.000 in circle — %s', (holes, start, expected) => {
    const r = boltCircle({ diameterMm: 25.4, holes, startAngleDeg: start });
    expect(r.holes).toHaveLength(expected.length);
    r.holes.forEach((h, i) => {
      expect(h.index).toBe(i + 1);
      expect(h.x.in).toBeCloseTo(expected[i][0], 4);
      expect(h.y.in).toBeCloseTo(expected[i][1], 4);
      expect(h.x.mm).toBeCloseTo(expected[i][0] * 25.4, 3);
    });
  });

  // [diameter mm, holes, chord mm, source]
  const CHORDS: ReadonlyArray<readonly [number, number, number, string]> = [
    [100, 6, 50, `${TRIG}: a hexagon's side is its radius`],
    [100, 4, 70.7107, TRIG],
    [100, 3, 86.6025, TRIG],
    [25.4, 5, 25.4 * 0.58779, MH],
  ];
  test.each(CHORDS)('Ø%s mm, %s holes: %s mm between neighbours — %s', (d, n, chord) => {
    expect(boltCircle({ diameterMm: d, holes: n }).chord.mm).toBeCloseTo(chord, 3);
  });

  test('the demo backplate: 3 × M8 on a 100 mm circle from 90° — plane trigonometry', () => {
    const r = boltCircle({ diameterMm: 100, holes: 3, startAngleDeg: 90 });
    expect(r.holes.map((h) => h.angleDeg)).toEqual([90, 210, 330]);
    expect(r.holes.map((h) => h.turnFromFirstDeg)).toEqual([0, 120, 240]);
    expect(r.holes[1].x.mm).toBeCloseTo(-43.3013, 4);
    expect(r.holes[0].x.mm).toBe(0);
    expect(Object.is(r.holes[0].x.mm, -0)).toBe(false);
    expect(r.stepDeg).toBe(120);
  });

  test('a midway pattern sits halfway between the first — plane trigonometry', () => {
    const r = boltCircle({ diameterMm: 100, holes: 4, startAngleDeg: 0, midway: true });
    expect(r.midwayHoles!.map((h) => h.angleDeg)).toEqual([45, 135, 225, 315]);
    expect(r.midwayHoles!.map((h) => h.turnFromFirstDeg)).toEqual([45, 135, 225, 315]);
    expect(r.midwayHoles![0].x.mm).toBeCloseTo(35.3553, 4);
    expect(r.midwayChord!.mm).toBeCloseTo(100 * Math.sin(Math.PI / 8), 9);
    expect(boltCircle({ diameterMm: 100, holes: 4 }).midwayHoles).toBeNull();
  });

  test('start angles wrap: −90° is 270°', () => {
    const r = boltCircle({ diameterMm: 50, holes: 2, startAngleDeg: -90 });
    expect(r.holes.map((h) => h.angleDeg)).toEqual([270, 90]);
    expect(r.holes[0].y.mm).toBeCloseTo(-25, 9);
  });

  // [input, field, code]
  const BAD: ReadonlyArray<readonly [object, string, string]> = [
    [{ diameterMm: 0, holes: 3 }, 'diameterMm', 'OUT_OF_RANGE'],
    [{ diameterMm: -10, holes: 3 }, 'diameterMm', 'OUT_OF_RANGE'],
    [{ diameterMm: Number.NaN, holes: 3 }, 'diameterMm', 'NOT_A_NUMBER'],
    [{ diameterMm: '100', holes: 3 }, 'diameterMm', 'NOT_A_NUMBER'],
    [{ diameterMm: 100, holes: 0 }, 'holes', 'OUT_OF_RANGE'],
    [{ diameterMm: 100, holes: 1 }, 'holes', 'OUT_OF_RANGE'],
    [{ diameterMm: 100, holes: 3.5 }, 'holes', 'NOT_WHOLE'],
    [{ diameterMm: 100, holes: 361 }, 'holes', 'OUT_OF_RANGE'],
    [{ diameterMm: 100, holes: 3, startAngleDeg: Number.POSITIVE_INFINITY }, 'startAngleDeg', 'NOT_A_NUMBER'],
  ];
  test.each(BAD)('%j is refused on %s (%s)', (input, field, code) => {
    const e = refusal(() => boltCircle(input as never));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});
