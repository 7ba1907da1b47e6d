import { describe, expect, test } from 'vitest';
import { toleranceZone } from '../../../lib/fits/index';

const ISO1_T1 = 'ISO 286-1:2010 Table 1, ranges "above … up to and including" — from memory';
const SHAFTS = 'ISO 286-2:2010, limit deviations for shafts, intermediate ranges — from memory';

// A size that ends a range belongs to it; a hair above belongs to the next.
// [size, IT7 µm] read through H7.
const MAIN: ReadonlyArray<readonly [number, number, string]> = [
  [3, 10, ISO1_T1], [3.001, 12, ISO1_T1],
  [6, 12, ISO1_T1], [6.001, 15, ISO1_T1],
  [10, 15, ISO1_T1], [10.001, 18, ISO1_T1],
  [18, 18, ISO1_T1], [18.001, 21, ISO1_T1],
  [30, 21, ISO1_T1], [30.001, 25, ISO1_T1],
  [50, 25, ISO1_T1], [50.001, 30, ISO1_T1],
  [80, 30, ISO1_T1], [80.001, 35, ISO1_T1],
  [120, 35, ISO1_T1], [120.001, 40, ISO1_T1],
  [180, 40, ISO1_T1], [180.001, 46, ISO1_T1],
  [250, 46, ISO1_T1], [250.001, 52, ISO1_T1],
  [315, 52, ISO1_T1], [315.001, 57, ISO1_T1],
  [400, 57, ISO1_T1], [400.001, 63, ISO1_T1],
  [500, 63, ISO1_T1], [500.001, 70, ISO1_T1],
  [630, 70, ISO1_T1], [630.001, 80, ISO1_T1],
  [800, 80, ISO1_T1], [800.001, 90, ISO1_T1],
  [1000, 90, ISO1_T1], [1000.001, 105, ISO1_T1],
  [1250, 105, ISO1_T1], [1250.001, 125, ISO1_T1],
  [1600, 125, ISO1_T1], [1600.001, 150, ISO1_T1],
  [2000, 150, ISO1_T1], [2000.001, 175, ISO1_T1],
  [2500, 175, ISO1_T1], [2500.001, 210, ISO1_T1],
  [3150, 210, ISO1_T1], [0.001, 10, ISO1_T1],
];

describe('main range boundaries', () => {
  test.each(MAIN)('%s mm: H7 = +%s / 0 µm — %s', (size, it7) => {
    const z = toleranceZone(size, 'H7');
    expect(z.itUm).toBe(it7);
    expect(z.upperUm).toBe(it7);
  });
});

// Intermediate ranges: [size, zone, lower deviation ei µm].
const SUB: ReadonlyArray<readonly [number, string, number, string]> = [
  [14, 'x6', 40, SHAFTS], [14.001, 'x6', 45, SHAFTS],
  [24, 'u6', 41, SHAFTS], [24.001, 'u6', 48, SHAFTS],
  [40, 'u6', 60, SHAFTS], [40.001, 'u6', 70, SHAFTS],
  [65, 'r6', 41, SHAFTS], [65.001, 'r6', 43, SHAFTS],
  [100, 's6', 71, SHAFTS], [100.001, 's6', 79, SHAFTS],
  [140, 's6', 92, SHAFTS], [140.001, 's6', 100, SHAFTS],
  [160, 's6', 100, SHAFTS], [160.001, 's6', 108, SHAFTS],
  [200, 's6', 122, SHAFTS], [200.001, 's6', 130, SHAFTS],
  [225, 's6', 130, SHAFTS], [225.001, 's6', 140, SHAFTS],
  [280, 's6', 158, SHAFTS], [280.001, 's6', 170, SHAFTS],
  [355, 's6', 190, SHAFTS], [355.001, 's6', 208, SHAFTS],
  [450, 's6', 232, SHAFTS], [450.001, 's6', 252, SHAFTS],
  [560, 's6', 280, SHAFTS], [560.001, 's6', 310, SHAFTS],
  [710, 's6', 340, SHAFTS], [710.001, 's6', 380, SHAFTS],
  [900, 's6', 430, SHAFTS], [900.001, 's6', 470, SHAFTS],
  [1120, 's6', 520, SHAFTS], [1120.001, 's6', 580, SHAFTS],
  [1400, 's6', 640, SHAFTS], [1400.001, 's6', 720, SHAFTS],
  [1800, 's6', 820, SHAFTS], [1800.001, 's6', 920, SHAFTS],
  [2240, 's6', 1000, SHAFTS], [2240.001, 's6', 1100, SHAFTS],
  [2800, 's6', 1250, SHAFTS], [2800.001, 's6', 1400, SHAFTS],
  // Letters that are not split at an intermediate boundary keep one value.
  [14, 'u6', 33, SHAFTS], [14.001, 'u6', 33, SHAFTS],
  [24, 's6', 35, SHAFTS], [24.001, 's6', 35, SHAFTS],
  [65, 'p6', 32, SHAFTS], [65.001, 'p6', 32, SHAFTS],
];

describe('intermediate range boundaries', () => {
  test.each(SUB)('%s mm %s: ei = +%s µm — %s', (size, zone, ei) => {
    expect(toleranceZone(size, zone).lowerUm).toBe(ei);
  });
});

// Hole letters follow the same subdivisions (ES = −ei + Δ for IT7, 3–500 mm).
describe('intermediate boundaries on holes', () => {
  test.each([
    [24, 'U7', -33, 'ISO 286-2:2010, limit deviations for holes U — from memory'],
    [24.001, 'U7', -40, 'ISO 286-2:2010, limit deviations for holes U — from memory'],
    [65, 'R7', -30, 'ISO 286-2:2010, limit deviations for holes R — from memory'],
    [65.001, 'R7', -32, 'ISO 286-2:2010, limit deviations for holes R — from memory'],
    [14, 'X7', -33, 'ISO 286-2:2010, limit deviations for holes X — from memory'],
    [14.001, 'X7', -38, 'ISO 286-2:2010, limit deviations for holes X — from memory'],
  ] as const)('%s mm %s: ES = %s µm — %s', (size, zone, es, _source) => {
    expect(toleranceZone(size, zone).upperUm).toBe(es);
  });
});
