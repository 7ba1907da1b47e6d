/**
 * ISO 286 limits and fits for Scribeline: pure functions, no I/O.
 *
 *   toleranceZone(25, 'H7')      → +21 / 0 µm
 *   analyseFit(25, 'H7/g6')      → clearance 41…7 µm
 *   parseDesignation('Ø25 H7/g6') → { nominalMm: 25, fit: { hole: 'H7', shaft: 'g6' } }
 */

export { FitError, isFitError, type FitErrorCode } from './errors';
export { toleranceZone, isZoneDefined, type ToleranceZone, type ZoneOptions } from './zone';
export { analyseFit, fitKind, type FitAnalysis, type FitKind } from './fit';
export { parseDesignation, type Designation } from './parse';
export {
  MM_PER_INCH, UM_PER_INCH, umToMm, mmToUm, umToIn, mmToIn, inToMm, formatMm, formatIn, formatUm,
  type FormatOptions,
} from './units';
export {
  SHAFT_LETTERS, HOLE_LETTERS, GRADES, IT_GRADES, J_HOLE_GRADES, J_SHAFT_GRADES, LETTER_SIZE_LIMITS,
  type ShaftLetter, type HoleLetter,
} from './letters';
export { type ItGrade } from './it-table';
export { MAX_SIZE_MM } from './ranges';
export { PREFERRED_HOLE_BASIS_FITS, type PreferredFit, type FitFamily } from './preferred-fits';
export {
  inchFit, inchFitSide, inchFitIsoComparison, isInchFitDefined, inchClassMaxIn, inchGradeTolerance, normaliseInchClass, looksLikeInchClass,
  INCH_CLASS_NAMES, INCH_FAMILIES, INCH_FAMILY_TITLES, INCH_SOURCE,
  type InchFit, type InchSide, type InchFamily,
} from './inch';
