/**
 * Standard tolerance grades (IT values) of ISO 286-1:2010 — from memory.
 *
 * Table 1 of ISO 286-1 (IT1…IT18, sizes up to 3150 mm) together with the
 * IT01 and IT0 values of its annex (sizes up to 500 mm only). Values are the
 * printed, rounded ones in micrometres; the standard's formulas give
 * slightly different numbers and are deliberately not used.
 */

import { MAIN_UPPER_MM, NONE, toCum } from './ranges';

/** Grade labels in table order: index 0 = IT01, 1 = IT0, 2 = IT1 … 19 = IT18. */
export const IT_GRADES = [
  'IT01', 'IT0', 'IT1', 'IT2', 'IT3', 'IT4', 'IT5', 'IT6', 'IT7', 'IT8', 'IT9',
  'IT10', 'IT11', 'IT12', 'IT13', 'IT14', 'IT15', 'IT16', 'IT17', 'IT18',
] as const;

export const GRADE_COUNT = IT_GRADES.length;

type ItRow = readonly [
  upToMm: number,
  it01: number | null, it0: number | null,
  it1: number, it2: number, it3: number, it4: number, it5: number, it6: number,
  it7: number, it8: number, it9: number, it10: number, it11: number, it12: number,
  it13: number, it14: number, it15: number, it16: number, it17: number, it18: number,
];

// µm.       up to  IT01  IT0  IT1  IT2  IT3  IT4  IT5  IT6  IT7  IT8  IT9  IT10  IT11  IT12  IT13  IT14  IT15   IT16   IT17   IT18
const IT_ROWS: readonly ItRow[] = [
  [3,    0.3,  0.5, 0.8, 1.2,   2,   3,   4,   6,  10,  14,  25,   40,   60,  100,  140,  250,  400,   600,  1000,  1400],
  [6,    0.4,  0.6,   1, 1.5, 2.5,   4,   5,   8,  12,  18,  30,   48,   75,  120,  180,  300,  480,   750,  1200,  1800],
  [10,   0.4,  0.6,   1, 1.5, 2.5,   4,   6,   9,  15,  22,  36,   58,   90,  150,  220,  360,  580,   900,  1500,  2200],
  [18,   0.5,  0.8, 1.2,   2,   3,   5,   8,  11,  18,  27,  43,   70,  110,  180,  270,  430,  700,  1100,  1800,  2700],
  [30,   0.6,    1, 1.5, 2.5,   4,   6,   9,  13,  21,  33,  52,   84,  130,  210,  330,  520,  840,  1300,  2100,  3300],
  [50,   0.6,    1, 1.5, 2.5,   4,   7,  11,  16,  25,  39,  62,  100,  160,  250,  390,  620, 1000,  1600,  2500,  3900],
  [80,   0.8,  1.2,   2,   3,   5,   8,  13,  19,  30,  46,  74,  120,  190,  300,  460,  740, 1200,  1900,  3000,  4600],
  [120,    1,  1.5, 2.5,   4,   6,  10,  15,  22,  35,  54,  87,  140,  220,  350,  540,  870, 1400,  2200,  3500,  5400],
  [180,  1.2,    2, 3.5,   5,   8,  12,  18,  25,  40,  63, 100,  160,  250,  400,  630, 1000, 1600,  2500,  4000,  6300],
  [250,    2,    3, 4.5,   7,  10,  14,  20,  29,  46,  72, 115,  185,  290,  460,  720, 1150, 1850,  2900,  4600,  7200],
  [315,  2.5,    4,   6,   8,  12,  16,  23,  32,  52,  81, 130,  210,  320,  520,  810, 1300, 2100,  3200,  5200,  8100],
  [400,    3,    5,   7,   9,  13,  18,  25,  36,  57,  89, 140,  230,  360,  570,  890, 1400, 2300,  3600,  5700,  8900],
  [500,    4,    6,   8,  10,  15,  20,  27,  40,  63,  97, 155,  250,  400,  630,  970, 1550, 2500,  4000,  6300,  9700],
  [630,  null, null,  9,  11,  16,  22,  32,  44,  70, 110, 175,  280,  440,  700, 1100, 1750, 2800,  4400,  7000, 11000],
  [800,  null, null, 10,  13,  18,  25,  36,  50,  80, 125, 200,  320,  500,  800, 1250, 2000, 3200,  5000,  8000, 12500],
  [1000, null, null, 11,  15,  21,  28,  40,  56,  90, 140, 230,  360,  560,  900, 1400, 2300, 3600,  5600,  9000, 14000],
  [1250, null, null, 13,  18,  24,  33,  47,  66, 105, 165, 260,  420,  660, 1050, 1650, 2600, 4200,  6600, 10500, 16500],
  [1600, null, null, 15,  21,  29,  39,  55,  78, 125, 195, 310,  500,  780, 1250, 1950, 3100, 5000,  7800, 12500, 19500],
  [2000, null, null, 18,  25,  35,  46,  65,  92, 150, 230, 370,  600,  920, 1500, 2300, 3700, 6000,  9200, 15000, 23000],
  [2500, null, null, 22,  30,  41,  55,  78, 110, 175, 280, 440,  700, 1100, 1750, 2800, 4400, 7000, 11000, 17500, 28000],
  [3150, null, null, 26,  36,  50,  68,  96, 135, 210, 330, 540,  860, 1350, 2100, 3300, 5400, 8600, 13500, 21000, 33000],
];

/**
 * IT values in 0.01 µm, laid out [mainRange * GRADE_COUNT + gradeIndex];
 * NONE where the grade is not defined (IT01/IT0 above 500 mm).
 */
export const IT_CUM: Int32Array = (() => {
  if (IT_ROWS.length !== MAIN_UPPER_MM.length) throw new Error('fits table: IT rows do not match the size ranges');
  const out = new Int32Array(MAIN_UPPER_MM.length * GRADE_COUNT).fill(NONE);
  IT_ROWS.forEach((row, main) => {
    if (row[0] !== MAIN_UPPER_MM[main]) throw new Error(`fits table: IT row ${main} ends at ${row[0]} mm`);
    for (let g = 0; g < GRADE_COUNT; g++) {
      const v = row[g + 1];
      if (typeof v === 'number') out[main * GRADE_COUNT + g] = toCum(v);
    }
  });
  return out;
})();
