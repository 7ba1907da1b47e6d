import { describe, expect, test } from 'vitest';
import { toleranceZone } from '../../../lib/fits/index';

const N_TABLE = 'ISO 286-2:2010, limit deviations for holes N (N3…N8 carry Δ) — from memory';
const P_TABLE = 'ISO 286-2:2010, limit deviations for holes P — from memory';
const FOOTNOTES = 'ISO 286-1:2010, footnotes to the hole fundamental deviations — from memory';

// Every Δ cell of ISO 286-1 (grades 3 to 8, each range 3–500 mm), seen through
// hole N: [size, N3, N4, N5, N6, N7, N8] as [ES, EI] pairs in µm.
type NRow = readonly [number, readonly (readonly [number, number])[], string];
const N_ROWS: readonly NRow[] = [
  [5, [[-7, -9.5], [-6.5, -10.5], [-7, -12], [-5, -13], [-4, -16], [-2, -20]], N_TABLE],
  [8, [[-9, -11.5], [-8.5, -12.5], [-8, -14], [-7, -16], [-4, -19], [-3, -25]], N_TABLE],
  [12, [[-11, -14], [-10, -15], [-9, -17], [-9, -20], [-5, -23], [-3, -30]], N_TABLE],
  [25, [[-13.5, -17.5], [-13, -19], [-12, -21], [-11, -24], [-7, -28], [-3, -36]], N_TABLE],
  [40, [[-15.5, -19.5], [-14, -21], [-13, -24], [-12, -28], [-8, -33], [-3, -42]], N_TABLE],
  [60, [[-18, -23], [-17, -25], [-15, -28], [-14, -33], [-9, -39], [-4, -50]], N_TABLE],
  [100, [[-21, -27], [-19, -29], [-18, -33], [-16, -38], [-10, -45], [-4, -58]], N_TABLE],
  [150, [[-24, -32], [-23, -35], [-21, -39], [-20, -45], [-12, -52], [-4, -67]], N_TABLE],
  [200, [[-28, -38], [-27, -41], [-25, -45], [-22, -51], [-14, -60], [-5, -77]], N_TABLE],
  [300, [[-30, -42], [-30, -46], [-27, -50], [-25, -57], [-14, -66], [-5, -86]], N_TABLE],
  [350, [[-33, -46], [-32, -50], [-30, -55], [-26, -62], [-16, -73], [-5, -94]], N_TABLE],
  [450, [[-35, -50], [-35, -55], [-33, -60], [-27, -67], [-17, -80], [-6, -103]], N_TABLE],
];

const N_CASES = N_ROWS.flatMap(([size, pairs, source]) =>
  pairs.map(([es, ei], i) => [size, `N${i + 3}`, es, ei, source] as const),
);

describe('Δ correction, every grade 3–8 in every range 3–500 mm', () => {
  test.each(N_CASES)('%s mm %s → %s / %s µm — %s', (size, zone, es, ei) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(es);
    expect(z.lowerUm).toBe(ei);
  });
});

describe('where Δ stops', () => {
  test.each([
    // P…ZC take Δ up to IT7 only: P7 at 25 mm is −22 + 8, P8 is plain −22.
    [25, 'P7', -14, -35, P_TABLE],
    [25, 'P8', -22, -55, P_TABLE],
    // N above IT8 between 3 and 500 mm: ES = 0.
    [25, 'N9', 0, -52, N_TABLE],
    [25, 'N10', 0, -84, N_TABLE],
    // M above IT8: ES = −ei(m), no Δ.
    [25, 'M9', -8, -60, FOOTNOTES],
    // No Δ at or below 3 mm.
    [3, 'K7', 0, -10, FOOTNOTES],
    [3, 'M7', -2, -12, FOOTNOTES],
    [3, 'N7', -4, -14, FOOTNOTES],
    [3, 'P7', -6, -16, FOOTNOTES],
    // …and Δ from just above 3 mm.
    [3.001, 'K7', 3, -9, FOOTNOTES],
    [3.001, 'M7', 0, -12, FOOTNOTES],
    [3.001, 'N7', -4, -16, FOOTNOTES],
    // No Δ above 500 mm.
    [500, 'N7', -17, -80, N_TABLE],
    [500.001, 'N7', -44, -114, N_TABLE],
    [500.001, 'K7', 0, -70, FOOTNOTES],
  ] as const)('%s mm %s → %s / %s µm — %s', (size, zone, es, ei, _source) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(es);
    expect(z.lowerUm).toBe(ei);
  });
});

describe('special case: M6 at 250–315 mm', () => {
  test.each([
    // Footnote: ES of M6 in 250–315 mm is −9 µm instead of −20 + 9 = −11.
    [250.001, 'M6', -9, -41, FOOTNOTES],
    [280, 'M6', -9, -41, FOOTNOTES],
    [315, 'M6', -9, -41, FOOTNOTES],
    // Neighbours follow the ordinary rule.
    [250, 'M6', -8, -37, FOOTNOTES],
    [315.001, 'M6', -10, -46, FOOTNOTES],
    [300, 'M5', -13, -36, FOOTNOTES],
    [300, 'M7', 0, -52, FOOTNOTES],
  ] as const)('%s mm %s → %s / %s µm — %s', (size, zone, es, ei, _source) => {
    const z = toleranceZone(size, zone);
    expect(z.upperUm).toBe(es);
    expect(z.lowerUm).toBe(ei);
  });
});
