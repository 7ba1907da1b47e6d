/**
 * Nominal size ranges of ISO 286 and the helpers that turn the printed
 * tables (rows of "up to and including X mm") into flat arrays that can be
 * indexed in a few nanoseconds.
 *
 * Every range is "above X up to and including Y": 30 mm belongs to 18–30,
 * 30.001 mm to 30–40.
 */

/** Largest nominal size the standard covers. */
export const MAX_SIZE_MM = 3150;

/**
 * Upper bounds of the finest subdivision used anywhere in ISO 286
 * (the intermediate ranges used by a, b, c and r…zc). 41 ranges.
 */
export const FINE_UPPER_MM: readonly number[] = [
  3, 6, 10, 14, 18, 24, 30, 40, 50, 65, 80, 100, 120, 140, 160, 180, 200, 225, 250, 280, 315, 355, 400,
  450, 500, 560, 630, 710, 800, 900, 1000, 1120, 1250, 1400, 1600, 1800, 2000, 2240, 2500, 2800, 3150,
];

/** Upper bounds of the main ranges, the rows of the IT table. 21 ranges. */
export const MAIN_UPPER_MM: readonly number[] = [
  3, 6, 10, 18, 30, 50, 80, 120, 180, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3150,
];

/** Index of the last main range ending at 500 mm (ranges beyond it have no IT01/IT0 and no Δ). */
export const MAIN_INDEX_500 = MAIN_UPPER_MM.indexOf(500);

/** Index of the main range 250–315 mm (home of the M6 exception). */
export const MAIN_INDEX_250_315 = MAIN_UPPER_MM.indexOf(315);

/** Marks "not defined here" in the flat tables; no real deviation comes near it. */
export const NONE = -2147483648;

/** For each fine range, the main range it lies in. */
export const MAIN_OF_FINE: Uint8Array = (() => {
  const out = new Uint8Array(FINE_UPPER_MM.length);
  let main = 0;
  FINE_UPPER_MM.forEach((upper, i) => {
    while ((MAIN_UPPER_MM[main] as number) < upper) main++;
    out[i] = main;
  });
  return out;
})();

/**
 * Index of the fine range holding `nominalMm` (caller guarantees 0 < size ≤ 3150).
 * Binary search: about six comparisons.
 */
export function fineRangeIndex(nominalMm: number): number {
  let lo = 0;
  let hi = FINE_UPPER_MM.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (nominalMm <= (FINE_UPPER_MM[mid] as number)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/** One printed row: the value applies up to and including `upToMm`, from the end of the previous row. */
export type Row = readonly [upToMm: number, valueUm: number];

/** Micrometres to the engine's internal integer unit (0.01 µm), so half and tenth micrometres stay exact. */
export const CUM_PER_UM = 100;

export function toCum(um: number): number {
  return Math.round(um * CUM_PER_UM);
}

/**
 * Spreads a printed column (rows with merged cells) over the fine ranges,
 * in 0.01 µm. Sizes at or below `fromMm` and beyond the last row are NONE.
 * Throws at load time if a row does not end on a range boundary, so a typo
 * in a table cannot pass silently.
 */
export function expandColumn(rows: readonly Row[], fromMm = 0): Int32Array {
  const out = new Int32Array(FINE_UPPER_MM.length).fill(NONE);
  let fine = FINE_UPPER_MM.indexOf(fromMm) + 1; // fromMm = 0 → index 0
  if (fromMm !== 0 && fine === 0) throw new Error(`fits table: ${fromMm} mm is not a range boundary`);
  for (const [upTo, value] of rows) {
    const end = FINE_UPPER_MM.indexOf(upTo);
    if (end < fine) throw new Error(`fits table: row up to ${upTo} mm is out of order or not a boundary`);
    for (; fine <= end; fine++) out[fine] = toCum(value);
  }
  return out;
}
