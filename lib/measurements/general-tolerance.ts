/**
 * General tolerances for linear sizes without an individual tolerance, ISO 2768-1:1989 table 1.
 * Permissible deviations ± in µm by tolerance class and nominal size range (mm):
 *
 *             0.5–3   >3–6   >6–30  >30–120  >120–400  >400–1000  >1000–2000  >2000–4000
 *   f fine      50      50     100     150      200       300         500         —
 *   m medium   100     100     200     300      500       800        1200        2000
 *   c coarse   200     300     500     800     1200      2000        3000        4000
 *   v v.coarse  —      500    1000    1500     2500      4000        6000        8000
 *
 * Below 0.5 mm the standard asks for the deviation to be written beside the size, so it is
 * refused here, as is anything above 4000 mm and the two cells the table leaves empty.
 */
import { MeasurementError } from './errors';

export const GENERAL_CLASSES = ['f', 'm', 'c', 'v'] as const;
export type GeneralClass = (typeof GENERAL_CLASSES)[number];

export const GENERAL_CLASS_NAMES: Record<GeneralClass, string> = { f: 'fine', m: 'medium', c: 'coarse', v: 'very coarse' };

/** Upper ends of the ranges, mm; the first range starts at 0.5 mm, inclusive. */
export const GENERAL_RANGES_MM = [3, 6, 30, 120, 400, 1000, 2000, 4000] as const;
export const GENERAL_MIN_MM = 0.5;

const NONE = -1;
const TABLE_UM: Record<GeneralClass, readonly number[]> = {
  f: [50, 50, 100, 150, 200, 300, 500, NONE],
  m: [100, 100, 200, 300, 500, 800, 1200, 2000],
  c: [200, 300, 500, 800, 1200, 2000, 3000, 4000],
  v: [NONE, 500, 1000, 1500, 2500, 4000, 6000, 8000],
};

export type GeneralTolerance = {
  generalClass: GeneralClass;
  /** ± this many µm. */
  plusMinusUm: number;
  /** "over 30 up to 120 mm". */
  rangeText: string;
};

function rangeText(i: number): string {
  return i === 0 ? `${GENERAL_MIN_MM} up to ${GENERAL_RANGES_MM[0]} mm` : `over ${GENERAL_RANGES_MM[i - 1]} up to ${GENERAL_RANGES_MM[i]} mm`;
}

/** ± deviation of a general tolerance class at a nominal size; throws MeasurementError where the table has none. */
export function generalTolerance(nominalMm: number, generalClass: GeneralClass): GeneralTolerance {
  const table = TABLE_UM[generalClass];
  if (!table) throw new MeasurementError('spec.generalClass', 'Pick a general tolerance class: f (fine), m (medium), c (coarse) or v (very coarse).');
  if (!(nominalMm >= GENERAL_MIN_MM)) {
    throw new MeasurementError(
      'nominal',
      `ISO 2768-1 general tolerances start at 0.5 mm; below that the drawing must give the tolerance beside the size. Use explicit limits instead.`,
    );
  }
  const i = GENERAL_RANGES_MM.findIndex((top) => nominalMm <= top);
  if (i < 0) throw new MeasurementError('nominal', 'ISO 2768-1 general tolerances stop at 4000 mm. Use explicit limits instead.');
  const um = table[i]!;
  if (um === NONE) {
    throw new MeasurementError(
      'spec.generalClass',
      `ISO 2768-1 gives no class ${generalClass} (${GENERAL_CLASS_NAMES[generalClass]}) tolerance ${rangeText(i)}. Pick another class or give explicit limits.`,
    );
  }
  return { generalClass, plusMinusUm: um, rangeText: rangeText(i) };
}
