import { describe, expect, test } from 'vitest';
import { toleranceZone } from '../../../lib/fits/index';

const SHAFTS = 'ISO 286-2:2010, tables of limit deviations for shafts — from memory';
const FD = 'ISO 286-1:2010, fundamental deviations for shafts, with Table 1 IT — from memory';

// [nominal mm, zone, upper µm (es), lower µm (ei), source]
type Row = readonly [number, string, number, number, string];

const ROWS: readonly Row[] = [
  // a
  [2, 'a11', -270, -330, SHAFTS],
  [12, 'a11', -290, -400, SHAFTS],
  [60, 'a11', -340, -530, SHAFTS],
  [70, 'a11', -360, -550, SHAFTS],
  [480, 'a11', -1650, -2050, SHAFTS],
  // b
  [35, 'b11', -170, -330, SHAFTS],
  [45, 'b11', -180, -340, SHAFTS],
  [8, 'b9', -150, -186, SHAFTS],
  // c
  [25, 'c11', -110, -240, SHAFTS],
  [2, 'c11', -60, -120, SHAFTS],
  [8, 'c11', -80, -170, SHAFTS],
  [110, 'c11', -180, -400, SHAFTS],
  [150, 'c11', -210, -460, SHAFTS],
  [45, 'c9', -130, -192, SHAFTS],
  // cd (up to 10 mm only)
  [2, 'cd5', -34, -38, SHAFTS],
  [5, 'cd6', -46, -54, SHAFTS],
  [8, 'cd7', -56, -71, SHAFTS],
  // d
  [25, 'd9', -65, -117, SHAFTS],
  [40, 'd8', -80, -119, SHAFTS],
  [60, 'd10', -100, -220, SHAFTS],
  [100, 'd11', -120, -340, SHAFTS],
  [600, 'd9', -260, -435, SHAFTS],
  [2000, 'd11', -430, -1350, SHAFTS],
  // e
  [25, 'e8', -40, -73, SHAFTS],
  [12, 'e7', -32, -50, SHAFTS],
  [150, 'e9', -85, -185, SHAFTS],
  [700, 'e8', -160, -285, SHAFTS],
  // ef (up to 10 mm only)
  [2, 'ef4', -10, -13, SHAFTS],
  [4, 'ef6', -14, -22, SHAFTS],
  [7, 'ef8', -18, -40, SHAFTS],
  // f
  [25, 'f7', -20, -41, SHAFTS],
  [12, 'f7', -16, -34, SHAFTS],
  [2, 'f6', -6, -12, SHAFTS],
  [60, 'f8', -30, -76, SHAFTS],
  [200, 'f7', -50, -96, SHAFTS],
  [900, 'f7', -86, -176, SHAFTS],
  [3000, 'f6', -145, -280, SHAFTS],
  // fg (up to 10 mm only)
  [2, 'fg4', -4, -7, SHAFTS],
  [5, 'fg5', -6, -11, SHAFTS],
  [9, 'fg6', -8, -17, SHAFTS],
  // g, one per main range
  [2, 'g6', -2, -8, SHAFTS],
  [5, 'g6', -4, -12, SHAFTS],
  [8, 'g6', -5, -14, SHAFTS],
  [15, 'g6', -6, -17, SHAFTS],
  [25, 'g6', -7, -20, SHAFTS],
  [40, 'g6', -9, -25, SHAFTS],
  [60, 'g6', -10, -29, SHAFTS],
  [100, 'g6', -12, -34, SHAFTS],
  [150, 'g6', -14, -39, SHAFTS],
  [200, 'g6', -15, -44, SHAFTS],
  [300, 'g6', -17, -49, SHAFTS],
  [350, 'g6', -18, -54, SHAFTS],
  [450, 'g6', -20, -60, SHAFTS],
  [1000, 'g6', -26, -82, SHAFTS],
  [25, 'g5', -7, -16, SHAFTS],
  // h
  [25, 'h6', 0, -13, SHAFTS],
  [60, 'h7', 0, -30, SHAFTS],
  [100, 'h9', 0, -87, SHAFTS],
  [200, 'h11', 0, -290, SHAFTS],
  [8, 'h13', 0, -220, SHAFTS],
  [50, 'h1', 0, -1.5, SHAFTS],
  [3150, 'h18', 0, -33000, SHAFTS],
  [2, 'h01', 0, -0.3, FD],
  [400, 'h0', 0, -5, FD],
  // js
  [25, 'js6', 6.5, -6.5, SHAFTS],
  [25, 'js7', 10.5, -10.5, SHAFTS],
  [60, 'js9', 37, -37, SHAFTS],
  [25, 'js11', 65, -65, SHAFTS],
  [15, 'js5', 4, -4, SHAFTS],
  [2, 'js13', 70, -70, SHAFTS],
  // j (tabulated grades only)
  [25, 'j5', 5, -4, SHAFTS],
  [25, 'j6', 9, -4, SHAFTS],
  [25, 'j7', 13, -8, SHAFTS],
  [2, 'j8', 8, -6, SHAFTS],
  [2, 'j5', 2, -2, SHAFTS],
  [2, 'j6', 4, -2, SHAFTS],
  [2, 'j7', 6, -4, SHAFTS],
  [60, 'j6', 12, -7, SHAFTS],
  [100, 'j7', 20, -15, SHAFTS],
  [300, 'j6', 16, -16, SHAFTS],
  [400, 'j6', 18, -18, SHAFTS],
  [480, 'j7', 31, -32, SHAFTS],
  // k: ei from the IT4–IT7 column, 0 for other grades and above 500 mm
  [25, 'k6', 15, 2, SHAFTS],
  [2, 'k6', 6, 0, SHAFTS],
  [5, 'k6', 9, 1, SHAFTS],
  [40, 'k5', 13, 2, SHAFTS],
  [100, 'k7', 38, 3, SHAFTS],
  [200, 'k6', 33, 4, SHAFTS],
  [450, 'k6', 45, 5, SHAFTS],
  [25, 'k8', 33, 0, SHAFTS],
  [25, 'k3', 4, 0, SHAFTS],
  [25, 'k4', 8, 2, SHAFTS],
  [600, 'k6', 44, 0, SHAFTS],
  // m
  [25, 'm6', 21, 8, SHAFTS],
  [2, 'm6', 8, 2, SHAFTS],
  [60, 'm7', 41, 11, SHAFTS],
  [300, 'm6', 52, 20, SHAFTS],
  [1000, 'm6', 90, 34, SHAFTS],
  [3000, 'm6', 211, 76, SHAFTS],
  // n
  [25, 'n6', 28, 15, SHAFTS],
  [2, 'n6', 10, 4, SHAFTS],
  [100, 'n6', 45, 23, SHAFTS],
  [200, 'n6', 60, 31, SHAFTS],
  [600, 'n6', 88, 44, SHAFTS],
  [2200, 'n6', 220, 110, SHAFTS],
  // p
  [25, 'p6', 35, 22, SHAFTS],
  [2, 'p6', 12, 6, SHAFTS],
  [60, 'p6', 51, 32, SHAFTS],
  [150, 'p6', 68, 43, SHAFTS],
  [700, 'p6', 138, 88, SHAFTS],
  [3000, 'p6', 375, 240, SHAFTS],
  // r, every subdivision from 50 to 630 mm
  [25, 'r6', 41, 28, SHAFTS],
  [60, 'r6', 60, 41, SHAFTS],
  [70, 'r6', 62, 43, SHAFTS],
  [90, 'r6', 73, 51, SHAFTS],
  [110, 'r6', 76, 54, SHAFTS],
  [130, 'r6', 88, 63, SHAFTS],
  [150, 'r6', 90, 65, SHAFTS],
  [170, 'r6', 93, 68, SHAFTS],
  [190, 'r6', 106, 77, SHAFTS],
  [210, 'r6', 109, 80, SHAFTS],
  [240, 'r6', 113, 84, SHAFTS],
  [260, 'r6', 126, 94, SHAFTS],
  [300, 'r6', 130, 98, SHAFTS],
  [340, 'r6', 144, 108, SHAFTS],
  [380, 'r6', 150, 114, SHAFTS],
  [420, 'r6', 166, 126, SHAFTS],
  [480, 'r6', 172, 132, SHAFTS],
  [520, 'r6', 194, 150, SHAFTS],
  [600, 'r6', 199, 155, SHAFTS],
  // s
  [25, 's6', 48, 35, SHAFTS],
  [2, 's6', 20, 14, SHAFTS],
  [12, 's6', 39, 28, SHAFTS],
  [60, 's6', 72, 53, SHAFTS],
  [70, 's6', 78, 59, SHAFTS],
  [90, 's6', 93, 71, SHAFTS],
  [110, 's6', 101, 79, SHAFTS],
  [130, 's6', 117, 92, SHAFTS],
  [150, 's6', 125, 100, SHAFTS],
  [170, 's6', 133, 108, SHAFTS],
  [190, 's6', 151, 122, SHAFTS],
  [210, 's6', 159, 130, SHAFTS],
  [240, 's6', 169, 140, SHAFTS],
  [260, 's6', 190, 158, SHAFTS],
  [300, 's6', 202, 170, SHAFTS],
  [340, 's6', 226, 190, SHAFTS],
  [380, 's6', 244, 208, SHAFTS],
  [420, 's6', 272, 232, SHAFTS],
  [480, 's6', 292, 252, SHAFTS],
  [1100, 's6', 586, 520, SHAFTS],
  [1200, 's6', 646, 580, SHAFTS],
  // t (above 24 mm only)
  [25, 't6', 54, 41, SHAFTS],
  [35, 't6', 64, 48, SHAFTS],
  [45, 't6', 70, 54, SHAFTS],
  [60, 't6', 85, 66, SHAFTS],
  [70, 't6', 94, 75, SHAFTS],
  [90, 't6', 113, 91, SHAFTS],
  [110, 't6', 126, 104, SHAFTS],
  [800, 't6', 610, 560, SHAFTS],
  [3000, 't6', 2235, 2100, SHAFTS],
  // u
  [20, 'u6', 54, 41, SHAFTS],
  [25, 'u6', 61, 48, SHAFTS],
  [2, 'u6', 24, 18, SHAFTS],
  [12, 'u6', 44, 33, SHAFTS],
  [35, 'u6', 76, 60, SHAFTS],
  [45, 'u6', 86, 70, SHAFTS],
  [60, 'u6', 106, 87, SHAFTS],
  [70, 'u6', 121, 102, SHAFTS],
  [90, 'u6', 146, 124, SHAFTS],
  [110, 'u6', 166, 144, SHAFTS],
  [1500, 'u6', 1678, 1600, SHAFTS],
  // v (above 14 mm, up to 500 mm)
  [15, 'v6', 50, 39, SHAFTS],
  [20, 'v6', 60, 47, SHAFTS],
  [25, 'v6', 68, 55, SHAFTS],
  [35, 'v6', 84, 68, SHAFTS],
  [45, 'v6', 97, 81, SHAFTS],
  [480, 'v6', 700, 660, SHAFTS],
  // x
  [2, 'x6', 26, 20, SHAFTS],
  [5, 'x6', 36, 28, SHAFTS],
  [8, 'x6', 43, 34, SHAFTS],
  [12, 'x6', 51, 40, SHAFTS],
  [15, 'x6', 56, 45, SHAFTS],
  [20, 'x6', 67, 54, SHAFTS],
  [25, 'x6', 77, 64, SHAFTS],
  [35, 'x6', 96, 80, SHAFTS],
  [45, 'x6', 113, 97, SHAFTS],
  // y (above 18 mm, up to 500 mm)
  [20, 'y6', 76, 63, SHAFTS],
  [25, 'y6', 88, 75, SHAFTS],
  [35, 'y6', 110, 94, SHAFTS],
  [300, 'y6', 682, 650, SHAFTS],
  // z
  [2, 'z6', 32, 26, SHAFTS],
  [12, 'z6', 61, 50, SHAFTS],
  [15, 'z6', 71, 60, SHAFTS],
  [20, 'z6', 86, 73, SHAFTS],
  [25, 'z6', 101, 88, SHAFTS],
  [35, 'z7', 137, 112, SHAFTS],
  [480, 'z6', 1290, 1250, SHAFTS],
  // za
  [2, 'za6', 38, 32, SHAFTS],
  [12, 'za7', 82, 64, SHAFTS],
  [15, 'za7', 95, 77, SHAFTS],
  [60, 'za7', 256, 226, SHAFTS],
  // zb
  [2, 'zb7', 50, 40, SHAFTS],
  [8, 'zb7', 82, 67, SHAFTS],
  [12, 'zb8', 117, 90, SHAFTS],
  [15, 'zb8', 135, 108, SHAFTS],
  [90, 'zb8', 499, 445, SHAFTS],
  // zc
  [2, 'zc7', 70, 60, SHAFTS],
  [12, 'zc8', 157, 130, SHAFTS],
  [15, 'zc8', 177, 150, SHAFTS],
  [25, 'zc9', 270, 218, SHAFTS],
  [480, 'zc10', 2850, 2600, SHAFTS],
  [400, 'zc11', 2460, 2100, SHAFTS],
];

describe('shaft limit deviations', () => {
  test.each(ROWS)('%s mm %s → %s / %s µm — %s', (size, zone, upper, lower) => {
    const z = toleranceZone(size, zone);
    expect(z.kind).toBe('shaft');
    expect(z.zone).toBe(zone);
    expect(z.upperUm).toBe(upper);
    expect(z.lowerUm).toBe(lower);
  });
});

describe('fundamental deviation of a shaft', () => {
  // ISO 286-1:2010 — from memory: a…h are fixed by es, j…zc by ei.
  test.each([
    [25, 'g6', -7, FD],
    [25, 'd9', -65, FD],
    [25, 'k6', 2, FD],
    [25, 's6', 35, FD],
    [25, 'j6', -4, FD],
  ] as const)('%s mm %s: fundamental deviation %s µm — %s', (size, zone, fd, _source) => {
    expect(toleranceZone(size, zone).fundamentalUm).toBe(fd);
  });
});
