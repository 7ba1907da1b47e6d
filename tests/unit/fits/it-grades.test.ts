import { describe, expect, test } from 'vitest';
import { toleranceZone } from '../../../lib/fits/index';

const ISO1_T1 = 'ISO 286-1:2010 Table 1, standard tolerance grades — from memory';
const ISO1_IT0 = 'ISO 286-1:2010 annex, IT01 and IT0 — from memory';

// One printed row per size range: a size inside it, then IT1 … IT18 in µm.
const IT_ROWS: ReadonlyArray<readonly [number, readonly number[], string]> = [
  [2, [0.8, 1.2, 2, 3, 4, 6, 10, 14, 25, 40, 60, 100, 140, 250, 400, 600, 1000, 1400], ISO1_T1],
  [5, [1, 1.5, 2.5, 4, 5, 8, 12, 18, 30, 48, 75, 120, 180, 300, 480, 750, 1200, 1800], ISO1_T1],
  [8, [1, 1.5, 2.5, 4, 6, 9, 15, 22, 36, 58, 90, 150, 220, 360, 580, 900, 1500, 2200], ISO1_T1],
  [12, [1.2, 2, 3, 5, 8, 11, 18, 27, 43, 70, 110, 180, 270, 430, 700, 1100, 1800, 2700], ISO1_T1],
  [25, [1.5, 2.5, 4, 6, 9, 13, 21, 33, 52, 84, 130, 210, 330, 520, 840, 1300, 2100, 3300], ISO1_T1],
  [40, [1.5, 2.5, 4, 7, 11, 16, 25, 39, 62, 100, 160, 250, 390, 620, 1000, 1600, 2500, 3900], ISO1_T1],
  [60, [2, 3, 5, 8, 13, 19, 30, 46, 74, 120, 190, 300, 460, 740, 1200, 1900, 3000, 4600], ISO1_T1],
  [100, [2.5, 4, 6, 10, 15, 22, 35, 54, 87, 140, 220, 350, 540, 870, 1400, 2200, 3500, 5400], ISO1_T1],
  [150, [3.5, 5, 8, 12, 18, 25, 40, 63, 100, 160, 250, 400, 630, 1000, 1600, 2500, 4000, 6300], ISO1_T1],
  [200, [4.5, 7, 10, 14, 20, 29, 46, 72, 115, 185, 290, 460, 720, 1150, 1850, 2900, 4600, 7200], ISO1_T1],
  [300, [6, 8, 12, 16, 23, 32, 52, 81, 130, 210, 320, 520, 810, 1300, 2100, 3200, 5200, 8100], ISO1_T1],
  [350, [7, 9, 13, 18, 25, 36, 57, 89, 140, 230, 360, 570, 890, 1400, 2300, 3600, 5700, 8900], ISO1_T1],
  [450, [8, 10, 15, 20, 27, 40, 63, 97, 155, 250, 400, 630, 970, 1550, 2500, 4000, 6300, 9700], ISO1_T1],
  [600, [9, 11, 16, 22, 32, 44, 70, 110, 175, 280, 440, 700, 1100, 1750, 2800, 4400, 7000, 11000], ISO1_T1],
  [700, [10, 13, 18, 25, 36, 50, 80, 125, 200, 320, 500, 800, 1250, 2000, 3200, 5000, 8000, 12500], ISO1_T1],
  [900, [11, 15, 21, 28, 40, 56, 90, 140, 230, 360, 560, 900, 1400, 2300, 3600, 5600, 9000, 14000], ISO1_T1],
  [1100, [13, 18, 24, 33, 47, 66, 105, 165, 260, 420, 660, 1050, 1650, 2600, 4200, 6600, 10500, 16500], ISO1_T1],
  [1500, [15, 21, 29, 39, 55, 78, 125, 195, 310, 500, 780, 1250, 1950, 3100, 5000, 7800, 12500, 19500], ISO1_T1],
  [1800, [18, 25, 35, 46, 65, 92, 150, 230, 370, 600, 920, 1500, 2300, 3700, 6000, 9200, 15000, 23000], ISO1_T1],
  [2200, [22, 30, 41, 55, 78, 110, 175, 280, 440, 700, 1100, 1750, 2800, 4400, 7000, 11000, 17500, 28000], ISO1_T1],
  [3000, [26, 36, 50, 68, 96, 135, 210, 330, 540, 860, 1350, 2100, 3300, 5400, 8600, 13500, 21000, 33000], ISO1_T1],
];

describe('IT grades IT1 to IT18, every size range', () => {
  test.each(IT_ROWS)('%s mm: IT1…IT18 (%#) — %s', (size, values) => {
    values.forEach((itUm, i) => {
      const grade = i + 1;
      const h = toleranceZone(size, `h${grade}`);
      expect(h.grade).toBe(`IT${grade}`);
      expect(h.itUm).toBe(itUm);
      expect(h.upperUm).toBe(0);
      expect(h.lowerUm).toBe(-itUm);
      const H = toleranceZone(size, `H${grade}`);
      expect(H.upperUm).toBe(itUm);
    });
  });
});

// Size, IT01, IT0 in µm.
const FINE_ROWS: ReadonlyArray<readonly [number, number, number, string]> = [
  [2, 0.3, 0.5, ISO1_IT0],
  [5, 0.4, 0.6, ISO1_IT0],
  [8, 0.4, 0.6, ISO1_IT0],
  [12, 0.5, 0.8, ISO1_IT0],
  [25, 0.6, 1, ISO1_IT0],
  [40, 0.6, 1, ISO1_IT0],
  [60, 0.8, 1.2, ISO1_IT0],
  [100, 1, 1.5, ISO1_IT0],
  [150, 1.2, 2, ISO1_IT0],
  [200, 2, 3, ISO1_IT0],
  [300, 2.5, 4, ISO1_IT0],
  [350, 3, 5, ISO1_IT0],
  [500, 4, 6, ISO1_IT0],
];

describe('IT01 and IT0, up to 500 mm', () => {
  test.each(FINE_ROWS)('%s mm: IT01 = %s µm, IT0 = %s µm — %s', (size, it01, it0) => {
    const z01 = toleranceZone(size, 'h01');
    expect(z01.grade).toBe('IT01');
    expect(z01.itUm).toBe(it01);
    expect(z01.lowerUm).toBe(-it01);
    const z0 = toleranceZone(size, 'H0');
    expect(z0.grade).toBe('IT0');
    expect(z0.itUm).toBe(it0);
    expect(z0.upperUm).toBe(it0);
    expect(z0.lowerUm).toBe(0);
  });
});

describe('mm deviations are the µm values over 1000', () => {
  // ISO 286-2:2010, limit deviations for holes H — from memory: 25 H7 = +0.021 / 0 mm
  test('25 H7 in mm', () => {
    const z = toleranceZone(25, 'H7');
    expect(z.upperMm).toBe(0.021);
    expect(z.lowerMm).toBe(0);
  });
  // ISO 286-2:2010, limit deviations for shafts g — from memory: 25 g6 = −0.007 / −0.020 mm
  test('25 g6 in mm', () => {
    const z = toleranceZone(25, 'g6');
    expect(z.upperMm).toBe(-0.007);
    expect(z.lowerMm).toBe(-0.02);
  });
});
