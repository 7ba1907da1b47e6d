/**
 * Limit deviations of one tolerance zone at one nominal size (ISO 286-1:2010
 * rules applied to the stored tables).
 *
 * Shafts:  a…h  es from the table, ei = es − IT
 *          js   ±IT/2
 *          j    ei from the j table (j5, j6, j7, j8 as tabulated only)
 *          k…zc ei from the table (k: IT4–IT7 column, else 0), es = ei + IT
 * Holes:   A…H  EI = −es of the same shaft letter, ES = EI + IT
 *          JS   ±IT/2
 *          J    ES from the J table (J6, J7, J8 only)
 *          K, M, N up to IT8 and P…ZC up to IT7, sizes 3–500 mm:
 *               ES = −ei + Δ   (K uses the k column of grades IT4–IT7)
 *          otherwise ES = −ei, except N above IT8 (3–500 mm): ES = 0,
 *          and the special cases of the table footnotes:
 *            M6 at 250–315 mm: ES = −9 µm
 *            K above IT8 only up to 3 mm
 *            N above IT8 not at or below 1 mm
 *            A, B, a, b not at or below 1 mm
 *          EI = ES − IT
 * Grades:  IT01 and IT0 only up to 500 mm, IT14…IT18 not at or below 1 mm.
 *
 * Internally everything is integer 0.01 µm so that half micrometres
 * (JS7 = ±10.5) and the fine grades (IT01 = 0.3 µm) stay exact.
 */

import { FitError } from './errors';
import { DELTA_CUM, DELTA_MAX_GRADE, DELTA_MIN_GRADE, J_HOLE_UPPER_CUM } from './hole-deviations';
import { GRADE_COUNT, IT_CUM } from './it-table';
import { LETTER, LETTER_SIZE_LIMITS, readZone, SHAFT_LETTERS, type ZoneSpec } from './letters';
import {
  CUM_PER_UM, fineRangeIndex, MAIN_INDEX_250_315, MAIN_INDEX_500, MAIN_OF_FINE, MAX_SIZE_MM, NONE,
} from './ranges';
import { J_SHAFT_LOWER_CUM, SHAFT_LOWER_CUM, SHAFT_UPPER_CUM } from './shaft-deviations';

export interface ZoneOptions {
  /**
   * Round JS/js of grades 7 to 11 with an odd IT value down to the even
   * number below (ISO 286-1 allows it): 25 js7 becomes ±10 µm instead of
   * ±10.5 µm. `itUm` still reports the true IT value. Default false.
   */
  roundJs?: boolean;
}

export interface ToleranceZone {
  /** Zone as normalised text: "H7", "g6", "js7", "h01". */
  zone: string;
  kind: 'hole' | 'shaft';
  /** Letter as written: "H", "js", "ZC". */
  letter: string;
  /** Grade label: "IT7", "IT01". */
  grade: string;
  nominalMm: number;
  /** Upper limit deviation (ES or es), µm. */
  upperUm: number;
  /** Lower limit deviation (EI or ei), µm. */
  lowerUm: number;
  /** Upper limit deviation, mm (0.021 for 25 H7). */
  upperMm: number;
  /** Lower limit deviation, mm. */
  lowerMm: number;
  /** Standard tolerance IT of the grade at this size, µm. */
  itUm: number;
  /**
   * The fundamental deviation, µm: the limit nearest the zero line, which
   * the letter fixes (EI for A…H, ES for J…ZC, es for a…h, ei for j…zc).
   * For JS/js, symmetric about the zero line, it is the upper deviation +IT/2.
   */
  fundamentalUm: number;
}

/** Deviations in 0.01 µm, for callers inside the engine that need exact arithmetic. */
export interface ZoneCum {
  upper: number;
  lower: number;
  it: number;
  fundamental: number;
}

function sizeText(mm: number): string {
  return `${mm} mm`;
}

function sizeRangeError(nominalMm: number): FitError {
  const shown = typeof nominalMm === 'number' ? sizeText(nominalMm) : JSON.stringify(nominalMm);
  return new FitError(
    'SIZE_OUT_OF_RANGE',
    `${shown} is outside ISO 286: nominal sizes run from just above 0 up to and including ${MAX_SIZE_MM} mm.`,
  );
}

function zoneName(spec: ZoneSpec): string {
  return `${spec.isHole ? 'Hole' : 'Shaft'} ${spec.text}`;
}

function letterName(spec: ZoneSpec): string {
  return `${spec.isHole ? 'hole' : 'shaft'} letter ${spec.letter}`;
}

function letterError(spec: ZoneSpec, nominalMm: number): FitError {
  const limits = LETTER_SIZE_LIMITS[SHAFT_LETTERS[spec.letterIndex] as keyof typeof LETTER_SIZE_LIMITS];
  const span = limits.aboveMm === 0
    ? `up to ${limits.upToMm} mm`
    : `above ${limits.aboveMm} mm up to ${limits.upToMm} mm`;
  return new FitError(
    'LETTER_NOT_DEFINED_AT_SIZE',
    `${zoneName(spec)} cannot be used at ${sizeText(nominalMm)}: ISO 286 defines ${letterName(spec)} only ${span}.`,
  );
}

function jError(spec: ZoneSpec, nominalMm: number): FitError {
  const which = spec.isHole
    ? 'hole J only as J6, J7 and J8, up to 500 mm'
    : 'shaft j only as j5, j6 and j7 up to 500 mm, and j8 up to 3 mm';
  const instead = spec.isHole ? `JS${spec.text.slice(1)}` : `js${spec.text.slice(1)}`;
  return new FitError(
    'J_NOT_TABULATED',
    `${zoneName(spec)} is not tabulated at ${sizeText(nominalMm)}: ISO 286 gives ${which}. Use ${instead} for a zone centred on the size.`,
  );
}

function deltaError(spec: ZoneSpec, nominalMm: number): FitError {
  return new FitError(
    'GRADE_NOT_DEFINED',
    `${zoneName(spec)} is not defined at ${sizeText(nominalMm)}: ${spec.letter} holes of this grade need the Δ correction, ` +
      `which ISO 286 tabulates only for grades ${DELTA_MIN_GRADE} to ${DELTA_MAX_GRADE}.`,
  );
}

/** Δ for a hole of the given grade (3…8) in a main range up to 500 mm. */
function delta(main: number, grade: number): number {
  return DELTA_CUM[main * 6 + (grade - DELTA_MIN_GRADE)] as number;
}

// Columns by letter index, so the hot path indexes arrays instead of looking up names.
const EMPTY = new Int32Array(0);
const UPPER_BY_LETTER: readonly Int32Array[] = SHAFT_LETTERS.map(
  (l) => (SHAFT_UPPER_CUM as Record<string, Int32Array>)[l] ?? EMPTY,
);
const LOWER_BY_LETTER: readonly Int32Array[] = SHAFT_LETTERS.map(
  (l) => (SHAFT_LOWER_CUM as Record<string, Int32Array>)[l] ?? EMPTY,
);

// Reused for every call: the engine is synchronous, and allocating a fresh
// scratch object per look-up is measurable at a million look-ups a second.
const scratch: ZoneCum = { upper: 0, lower: 0, it: 0, fundamental: 0 };

/**
 * Computes a zone in 0.01 µm into the shared scratch object (valid until the
 * next call). Throws FitError for every combination ISO 286 does not define.
 */
export function computeZoneCum(nominalMm: number, spec: ZoneSpec, roundJs: boolean): ZoneCum {
  if (!(nominalMm > 0 && nominalMm <= MAX_SIZE_MM)) throw sizeRangeError(nominalMm);

  const fine = fineRangeIndex(nominalMm);
  const main = MAIN_OF_FINE[fine] as number;
  const grade = spec.grade;

  const it = IT_CUM[main * GRADE_COUNT + spec.gradeIndex] as number;
  if (it === NONE) {
    throw new FitError(
      'GRADE_NOT_DEFINED',
      `${spec.gradeLabel} is defined only up to 500 mm, so ${spec.text} cannot be used at ${sizeText(nominalMm)}; the finest grade there is IT1.`,
    );
  }
  if (grade >= 14 && nominalMm <= 1) {
    throw new FitError(
      'GRADE_NOT_DEFINED',
      `Grades IT14 to IT18 are not used at or below 1 mm: ${spec.text} at ${sizeText(nominalMm)} would be a tolerance larger than the part itself.`,
    );
  }

  const li = spec.letterIndex;
  let upper: number;
  let lower: number;
  let fundamental: number;

  if (li === LETTER.js) {
    let half = it / 2;
    // Odd IT of grades 7–11 may be rounded down to the even value below.
    if (roundJs && grade >= 7 && grade <= 11 && it % (2 * CUM_PER_UM) === CUM_PER_UM) half = (it - CUM_PER_UM) / 2;
    upper = half;
    lower = 0 - half;
    fundamental = upper;
  } else if (li < LETTER.js) {
    // a…h / A…H: es from the table; the hole mirrors it (EI = −es).
    const es = (UPPER_BY_LETTER[li] as Int32Array)[fine] as number;
    if (es === NONE || (li <= 1 && nominalMm <= 1)) throw letterError(spec, nominalMm);
    if (spec.isHole) {
      lower = 0 - es; // `0 - x`, not `-x`: keeps H's lower deviation +0 rather than −0
      upper = lower + it;
      fundamental = lower;
    } else {
      upper = es;
      lower = es - it;
      fundamental = upper;
    }
  } else if (li === LETTER.j) {
    if (spec.isHole) {
      const table = grade >= 6 && grade <= 8 ? J_HOLE_UPPER_CUM[grade as 6 | 7 | 8] : undefined;
      const es = table === undefined ? NONE : (table[fine] as number);
      if (es === NONE) throw jError(spec, nominalMm);
      upper = es;
      lower = es - it;
      fundamental = upper;
    } else {
      const table = grade >= 5 && grade <= 8 ? J_SHAFT_LOWER_CUM[grade as 5 | 6 | 7 | 8] : undefined;
      const ei = table === undefined ? NONE : (table[fine] as number);
      if (ei === NONE) throw jError(spec, nominalMm);
      lower = ei;
      upper = ei + it;
      fundamental = lower;
    }
  } else {
    // k…zc / K…ZC
    const ei = (LOWER_BY_LETTER[li] as Int32Array)[fine] as number;
    if (ei === NONE) throw letterError(spec, nominalMm);
    if (!spec.isHole) {
      // k: the tabulated value applies to grades IT4–IT7 only, otherwise ei = 0.
      lower = li === LETTER.k && (grade < 4 || grade > 7) ? 0 : ei;
      upper = lower + it;
      fundamental = lower;
    } else {
      const deltaZone = nominalMm > 3 && main <= MAIN_INDEX_500;
      let es: number;
      if (li === LETTER.k) {
        if (grade > 8 && nominalMm > 3) {
          throw new FitError(
            'GRADE_NOT_DEFINED',
            `${zoneName(spec)} is not defined at ${sizeText(nominalMm)}: ISO 286 gives hole K coarser than grade 8 only up to 3 mm. Use K8 or finer, or JS/H.`,
          );
        }
        if (!deltaZone) es = 0 - ei; // 0 at or below 3 mm and above 500 mm
        else if (grade < DELTA_MIN_GRADE) throw deltaError(spec, nominalMm);
        else es = delta(main, grade) - ei;
      } else if (li === LETTER.m) {
        if (!deltaZone || grade > 8) es = 0 - ei;
        else if (grade < DELTA_MIN_GRADE) throw deltaError(spec, nominalMm);
        else if (grade === 6 && main === MAIN_INDEX_250_315) es = -9 * CUM_PER_UM; // footnote: M6 at 250–315 mm is −9 µm, not −11
        else es = delta(main, grade) - ei;
      } else if (li === LETTER.n) {
        if (grade > 8 && nominalMm <= 1) {
          throw new FitError(
            'GRADE_NOT_DEFINED',
            `${zoneName(spec)} is not used at or below 1 mm (ISO 286 footnote): use N8 or finer.`,
          );
        }
        if (!deltaZone) es = 0 - ei;
        else if (grade > 8) es = 0;
        else if (grade < DELTA_MIN_GRADE) throw deltaError(spec, nominalMm);
        else es = delta(main, grade) - ei;
      } else {
        // P…ZC: Δ applies up to IT7 only.
        if (!deltaZone || grade > 7) es = 0 - ei;
        else if (grade < DELTA_MIN_GRADE) throw deltaError(spec, nominalMm);
        else es = delta(main, grade) - ei;
      }
      upper = es;
      lower = es - it;
      fundamental = upper;
    }
  }

  scratch.upper = upper;
  scratch.lower = lower;
  scratch.it = it;
  scratch.fundamental = fundamental;
  return scratch;
}

export function buildZone(nominalMm: number, spec: ZoneSpec, cum: ZoneCum): ToleranceZone {
  // Divide rather than multiply by 0.01: the quotient of two exact integers is
  // the double nearest the decimal, so 2100 gives exactly 21 and 0.021.
  return {
    zone: spec.text,
    kind: spec.isHole ? 'hole' : 'shaft',
    letter: spec.letter,
    grade: spec.gradeLabel,
    nominalMm,
    upperUm: cum.upper / CUM_PER_UM,
    lowerUm: cum.lower / CUM_PER_UM,
    upperMm: cum.upper / (CUM_PER_UM * 1000),
    lowerMm: cum.lower / (CUM_PER_UM * 1000),
    itUm: cum.it / CUM_PER_UM,
    fundamentalUm: cum.fundamental / CUM_PER_UM,
  };
}

/**
 * Limit deviations of a tolerance zone at a nominal size.
 *
 *   toleranceZone(25, 'H7')  → upperUm 21, lowerUm 0
 *   toleranceZone(25, 'g6')  → upperUm −7, lowerUm −20
 *   toleranceZone(25, 'js7') → ±10.5   (with { roundJs: true }: ±10)
 *
 * Throws FitError when ISO 286 does not define the zone at that size.
 */
export function toleranceZone(nominalMm: number, zone: string, options?: ZoneOptions): ToleranceZone {
  const spec = readZone(zone);
  const cum = computeZoneCum(nominalMm, spec, options?.roundJs === true);
  return buildZone(nominalMm, spec, cum);
}

/** True when ISO 286 defines the zone at this size (never throws). */
export function isZoneDefined(nominalMm: number, zone: string): boolean {
  try {
    computeZoneCum(nominalMm, readZone(zone), false);
    return true;
  } catch {
    return false;
  }
}
