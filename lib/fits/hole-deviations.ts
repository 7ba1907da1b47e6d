/**
 * Hole-specific data of ISO 286-1:2010 — from memory.
 *
 * Most hole deviations are not stored: the standard derives them from the
 * shaft table by its own rules (see zone.ts). What cannot be derived is
 * stored here as printed:
 *  - the J column (upper deviation ES of J6, J7, J8), which is not a mirror of j;
 *  - the Δ values (Δ = ITn − IT(n−1)) added to ES of K, M, N up to IT8 and of
 *    P…ZC up to IT7, sizes above 3 mm up to 500 mm. Stored as the printed
 *    table rather than computed so that the data reads like the standard.
 */

import { expandColumn, MAIN_UPPER_MM, MAIN_INDEX_500, toCum, type Row } from './ranges';

/** Upper deviation ES of hole J, µm, by grade. Tabulated for J6, J7, J8 up to 500 mm only. */
const J_UPPER: Record<6 | 7 | 8, readonly Row[]> = {
  6: [[3, 2], [10, 5], [18, 6], [30, 8], [50, 10], [80, 13], [120, 16], [180, 18], [250, 22], [315, 25], [400, 29], [500, 33]],
  7: [[3, 4], [6, 6], [10, 8], [18, 10], [30, 12], [50, 14], [80, 18], [120, 22], [180, 26], [250, 30], [315, 36], [400, 39], [500, 43]],
  8: [[3, 6], [6, 10], [10, 12], [18, 15], [30, 20], [50, 24], [80, 28], [120, 34], [180, 41], [250, 47], [315, 55], [400, 60], [500, 66]],
};

export const J_HOLE_UPPER_CUM: Record<6 | 7 | 8, Int32Array> = {
  6: expandColumn(J_UPPER[6]),
  7: expandColumn(J_UPPER[7]),
  8: expandColumn(J_UPPER[8]),
};

type DeltaRow = readonly [upToMm: number, it3: number, it4: number, it5: number, it6: number, it7: number, it8: number];

// Δ in µm.      up to  IT3  IT4  IT5  IT6  IT7  IT8
const DELTA_ROWS: readonly DeltaRow[] = [
  [3,     0,   0,   0,   0,   0,   0],
  [6,     1, 1.5,   1,   3,   4,   6],
  [10,    1, 1.5,   2,   3,   6,   7],
  [18,    1,   2,   3,   3,   7,   9],
  [30,  1.5,   2,   3,   4,   8,  12],
  [50,  1.5,   3,   4,   5,   9,  14],
  [80,    2,   3,   5,   6,  11,  16],
  [120,   2,   4,   5,   7,  13,  19],
  [180,   3,   4,   6,   7,  15,  23],
  [250,   3,   4,   6,   9,  17,  26],
  [315,   4,   4,   7,   9,  20,  29],
  [400,   4,   5,   7,  11,  21,  32],
  [500,   5,   5,   7,  13,  23,  34],
];

/** Grades for which Δ is tabulated. */
export const DELTA_MIN_GRADE = 3;
export const DELTA_MAX_GRADE = 8;

/** Δ in 0.01 µm, laid out [mainRange * 6 + (grade − 3)], main ranges up to 500 mm. */
export const DELTA_CUM: Int32Array = (() => {
  if (DELTA_ROWS.length !== MAIN_INDEX_500 + 1) throw new Error('fits table: Δ rows do not match the size ranges');
  const out = new Int32Array(DELTA_ROWS.length * 6);
  DELTA_ROWS.forEach((row, main) => {
    if (row[0] !== MAIN_UPPER_MM[main]) throw new Error(`fits table: Δ row ${main} ends at ${row[0]} mm`);
    for (let g = 0; g < 6; g++) out[main * 6 + g] = toCum(row[g + 1] as number);
  });
  return out;
})();
