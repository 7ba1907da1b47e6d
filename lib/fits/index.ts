/**
 * ISO 286 limits and fits for Scribeline: pure functions, no I/O.
 *
 *   toleranceZone(25, 'H7')      → +21 / 0 µm
 *   analyseFit(25, 'H7/g6')      → clearance 41…7 µm
 *   parseDesignation('Ø25 H7/g6') → { nominalMm: 25, fit: { hole: 'H7', shaft: 'g6' } }
 */

export { FitError, isFitError, type FitErrorCode } from './errors';
export { toleranceZone, isZoneDefined, type ToleranceZone } from './zone';
export { analyseFit, fitKind, type FitAnalysis, type FitKind } from './fit';
export { parseDesignation, type Designation } from './parse';
export {
  MM_PER_INCH, umToMm, umToIn, mmToIn, inToMm,
} from './units';
export {
  SHAFT_LETTERS, HOLE_LETTERS, GRADES, IT_GRADES,
} from './letters';
export { MAX_SIZE_MM } from './ranges';
export { PREFERRED_HOLE_BASIS_FITS, type PreferredFit } from './preferred-fits';
export {
  inchFit, inchFitSide, inchFitIsoComparison, isInchFitDefined, inchClassMaxIn, normaliseInchClass, looksLikeInchClass,
  INCH_CLASS_NAMES, INCH_FAMILY_TITLES,
  type InchFit, type InchFamily,
} from './inch';
