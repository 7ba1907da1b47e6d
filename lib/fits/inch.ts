/**
 * ANSI B4.1 inch fit classes beside ISO 286: a table look-up, in thousandths of an inch.
 *
 *   inchFit(1.5, 'RC4') → hole +1.6 / 0, shaft −1.0 / −2.0, clearance 1.0 … 3.6 thou
 *
 * Clearance is hole minus shaft, as in analyseFit; an interference is a negative clearance, so a
 * force fit has both limits negative. Sizes are "over X to Y", Y included, as the tables read.
 */
import { FitError } from './errors';
import { fitKind, type FitKind, analyseFit, type FitAnalysis } from './fit';
import {
  FAMILY_TABLES, INCH_CLASSES, INCH_ROWS, type InchClassInfo, type InchFamily,
} from './inch-tables';

export type { InchFamily } from './inch-tables';

export interface InchSide {
  /** Upper and lower deviation from the basic size, thousandths of an inch. */
  upperThou: number;
  lowerThou: number;
  toleranceThou: number;
  /** Tolerance grade of the standard (4 … 13). */
  grade: number;
}

export interface InchFit {
  /** "RC4". */
  fitClass: string;
  family: InchFamily;
  /** "Running and sliding fits". */
  familyTitle: string;
  nominalIn: number;
  /** The same size in mm, exactly 25.4 mm to the inch. */
  nominalMm: number;
  /** The table's size step holding the size, e.g. over 1.19 to 1.97 in. */
  step: { overIn: number; toIn: number; text: string };
  hole: InchSide;
  shaft: InchSide;
  /** Largest clearance (hole upper − shaft lower), thou; negative means interference. */
  maxClearanceThou: number;
  /** Smallest clearance (hole lower − shaft upper), thou; negative means interference. */
  minClearanceThou: number;
  kind: FitKind;
  /** Millimetre equivalents of every limit (0.0254 mm per thou, unrounded). */
  mm: {
    hole: { upperMm: number; lowerMm: number };
    shaft: { upperMm: number; lowerMm: number };
    maxClearanceMm: number;
    minClearanceMm: number;
  };
  /** The nearest ISO 286 hole-basis fit in spirit: a comparison, never the same limits. */
  isoNearest: { fit: string; approximate: true };
  /** Where the numbers come from. */
  source: string;
}

export const INCH_FAMILY_TITLES: Readonly<Record<InchFamily, string>> = {
  RC: FAMILY_TABLES.RC.title,
  LC: FAMILY_TABLES.LC.title,
  LT: FAMILY_TABLES.LT.title,
  LN: FAMILY_TABLES.LN.title,
  FN: FAMILY_TABLES.FN.title,
};
/** Every class, in the standard's order: RC1 … RC9, LC1 … LC11, LT1 … LT6, LN1 … LN3, FN1 … FN5. */
export const INCH_CLASS_NAMES: readonly string[] = Object.keys(INCH_CLASSES);
export const INCH_SOURCE = 'ANSI B4.1-1967 (R2009)';

/** Largest size of a class's table, inches (200 for RC and LC, 19.69 for LT, LN and FN). */
export function inchClassMaxIn(fitClass: string): number {
  const info = INCH_CLASSES[normaliseInchClass(fitClass)] as InchClassInfo;
  const steps = FAMILY_TABLES[info.family].steps;
  return steps[steps.length - 1] as number;
}

const CLASS_TEXT = /^\s*(RC|LC|LT|LN|FN)\s*-?\s*(\d{1,2})\s*$/i;

/** True for text shaped like an inch class ("RC4", "lc 11"), whether or not the class exists. */
export function looksLikeInchClass(text: string): boolean {
  return typeof text === 'string' && CLASS_TEXT.test(text);
}

/** "rc 4" → "RC4"; throws UNKNOWN_INCH_CLASS for anything that is not a class of the standard. */
export function normaliseInchClass(text: string): string {
  if (INCH_CLASSES[text] !== undefined) return text;
  const m = typeof text === 'string' ? CLASS_TEXT.exec(text) : null;
  const name = m ? `${(m[1] as string).toUpperCase()}${Number(m[2])}` : '';
  if (m && INCH_CLASSES[name] !== undefined) return name;
  const shown = typeof text === 'string' ? text.trim() : String(text);
  if (m) {
    const family = (m[1] as string).toUpperCase() as InchFamily;
    const last = INCH_CLASS_NAMES.filter((c) => c.startsWith(family)).at(-1);
    throw new FitError('UNKNOWN_INCH_CLASS', `${shown} is not an ANSI B4.1 class: the ${INCH_FAMILY_TITLES[family].toLowerCase()} run from ${family}1 to ${last}.`);
  }
  throw new FitError(
    'UNKNOWN_INCH_CLASS',
    `"${shown}" is not an ANSI B4.1 class: the classes are RC1–RC9, LC1–LC11, LT1–LT6, LN1–LN3 and FN1–FN5.`,
  );
}

// Hundredths of a thou, so every printed value (0.05, 0.12, 0.45 …) is an exact integer.
interface Cell { holeUpper: number; shaftUpper: number; shaftLower: number; holeGrade: number; shaftGrade: number; stepText: string; source: string }
const HUNDREDTHS = 100;
const CELLS = new Map<string, readonly (Cell | null)[]>();
for (const [name, info] of Object.entries(INCH_CLASSES)) {
  const rows = INCH_ROWS[name] ?? [];
  const steps = FAMILY_TABLES[info.family].steps;
  CELLS.set(
    name,
    rows.map((r, i) =>
      r === null
        ? null
        : {
            stepText: `over ${i === 0 ? 0 : steps[i - 1]} to ${steps[i]} in`,
            source: `ANSI B4.1-1967 (R2009), ${FAMILY_TABLES[info.family].title.toLowerCase()}, over ${i === 0 ? 0 : steps[i - 1]} to ${steps[i]} in`,
            holeUpper: Math.round(r[2] * HUNDREDTHS),
            shaftUpper: Math.round(r[3] * HUNDREDTHS),
            shaftLower: Math.round(r[4] * HUNDREDTHS),
            holeGrade: info.holeGrade,
            shaftGrade: info.shaftGrade,
          },
    ),
  );
}

const stepNumber = (n: number) => String(n);

/** Index of the step holding the size ("over X to Y", Y included), or −1 past the end. */
function stepIndex(steps: readonly number[], nominalIn: number): number {
  for (let i = 0; i < steps.length; i++) if (nominalIn <= (steps[i] as number)) return i;
  return -1;
}

const fromHundredths = (h: number) => (h === 0 ? 0 : h / HUNDREDTHS);
// A thou is 0.0254 mm exactly; through the integer hundredths to keep binary noise out.
const hundredthsToMm = (h: number) => (h === 0 ? 0 : (h * 254) / 1_000_000);

/**
 * Limits of an inch class at a basic size in inches.
 * Throws FitError: UNKNOWN_INCH_CLASS, INCH_SIZE_OUT_OF_RANGE (not above 0, or past the class's
 * table), INCH_CLASS_NOT_AT_SIZE (a cell the standard leaves empty).
 */
export function inchFit(nominalIn: number, fitClass: string): InchFit {
  const name = normaliseInchClass(fitClass);
  const info = INCH_CLASSES[name] as InchClassInfo;
  const table = FAMILY_TABLES[info.family];
  const steps = table.steps;
  if (typeof nominalIn !== 'number' || !Number.isFinite(nominalIn) || nominalIn <= 0) {
    throw new FitError('INCH_SIZE_OUT_OF_RANGE', `The size must be a number of inches greater than 0 for ${name}.`);
  }
  const i = stepIndex(steps, nominalIn);
  if (i < 0) {
    const last = steps[steps.length - 1] as number;
    throw new FitError(
      'INCH_SIZE_OUT_OF_RANGE',
      `${name} is tabulated up to ${last} in (${table.title.toLowerCase()}, ${INCH_SOURCE}); ${nominalIn} in is past the end of its table.`,
    );
  }
  const cell = (CELLS.get(name) as readonly (Cell | null)[])[i];
  const overIn = i === 0 ? 0 : (steps[i - 1] as number);
  const toIn = steps[i] as number;
  if (cell === null || cell === undefined) {
    const stepText = `over ${stepNumber(overIn)} to ${stepNumber(toIn)} in`;
    const first = (CELLS.get(name) as readonly (Cell | null)[]).findIndex((c) => c !== null);
    throw new FitError(
      'INCH_CLASS_NOT_AT_SIZE',
      `${name} has no values ${stepText}: its table begins over ${stepNumber(steps[first - 1] as number)} in.`,
    );
  }
  const maxC = cell.holeUpper - cell.shaftLower;
  const minC = -cell.shaftUpper;
  return {
    fitClass: name,
    family: info.family,
    familyTitle: table.title,
    nominalIn,
    nominalMm: (nominalIn * 254) / 10,
    step: { overIn, toIn, text: cell.stepText },
    hole: { upperThou: fromHundredths(cell.holeUpper), lowerThou: 0, toleranceThou: fromHundredths(cell.holeUpper), grade: cell.holeGrade },
    shaft: {
      upperThou: fromHundredths(cell.shaftUpper),
      lowerThou: fromHundredths(cell.shaftLower),
      toleranceThou: fromHundredths(cell.shaftUpper - cell.shaftLower),
      grade: cell.shaftGrade,
    },
    maxClearanceThou: fromHundredths(maxC),
    minClearanceThou: fromHundredths(minC),
    kind: fitKind(maxC, minC),
    mm: {
      hole: { upperMm: hundredthsToMm(cell.holeUpper), lowerMm: 0 },
      shaft: { upperMm: hundredthsToMm(cell.shaftUpper), lowerMm: hundredthsToMm(cell.shaftLower) },
      maxClearanceMm: hundredthsToMm(maxC),
      minClearanceMm: hundredthsToMm(minC),
    },
    isoNearest: { fit: info.isoNearest, approximate: true },
    source: cell.source,
  };
}

/** True when inchFit would answer (the class exists and its table has the size). */
export function isInchFitDefined(nominalIn: number, fitClass: string): boolean {
  try {
    inchFit(nominalIn, fitClass);
    return true;
  } catch (err) {
    if (err instanceof FitError) return false;
    throw err;
  }
}

/** One side of a class as a pair of deviations, thou: the hole or the shaft of "1.500 RC4". */
export function inchFitSide(nominalIn: number, fitClass: string, side: 'hole' | 'shaft'): InchSide & { fit: InchFit } {
  const fit = inchFit(nominalIn, fitClass);
  return { ...fit[side], fit };
}

/**
 * The nearest ISO 286 hole-basis fit worked out at the same size, for comparison; null (with the
 * reason) where ISO 286 does not define it there.
 */
export function inchFitIsoComparison(fit: InchFit): { fit: string; analysis: FitAnalysis | null; reason?: string } {
  try {
    return { fit: fit.isoNearest.fit, analysis: analyseFit(fit.nominalMm, fit.isoNearest.fit) };
  } catch (err) {
    if (err instanceof FitError) return { fit: fit.isoNearest.fit, analysis: null, reason: err.message };
    throw err;
  }
}
