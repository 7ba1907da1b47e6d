/**
 * Typed refusals of the fits engine.
 *
 * Every combination ISO 286 does not define is refused with a FitError rather
 * than answered with a guess: a wrong limit on a drawing costs a part.
 * The `code` lets the UI react (highlight the size or the zone); the message
 * says why in shop words and is meant to be shown as is.
 */

export type FitErrorCode =
  /** Nominal size not a number, ≤ 0 mm or above 3150 mm. */
  | 'SIZE_OUT_OF_RANGE'
  /** The letter exists but not at this size (t at or below 24 mm, x above 500 mm, a at or below 1 mm…). */
  | 'LETTER_NOT_DEFINED_AT_SIZE'
  /** The grade exists but the standard does not use it here (IT0 above 500 mm, IT14 at or below 1 mm, K9 above 3 mm…). */
  | 'GRADE_NOT_DEFINED'
  /** Not a zone at all: unknown letter, unknown grade, mixed case, missing grade. */
  | 'UNKNOWN_ZONE'
  /** J/j asked for with a grade or at a size the standard does not tabulate. */
  | 'J_NOT_TABULATED'
  /** A fit written shaft first ("g6/H7"). */
  | 'FIT_ORDER'
  /** A fit that is not one hole and one shaft ("H7/H8", "g6/h6", "H7"). */
  | 'FIT_NEEDS_HOLE_AND_SHAFT'
  /** Free text (a typed designation) that could not be read. */
  | 'UNREADABLE'
  /** Not one of the ANSI B4.1 inch classes RC1–RC9, LC1–LC11, LT1–LT6, LN1–LN3, FN1–FN5. */
  | 'UNKNOWN_INCH_CLASS'
  /** An inch size not above 0 or past the end of the class's table (200 in for RC/LC, 19.69 in for LT/LN/FN). */
  | 'INCH_SIZE_OUT_OF_RANGE'
  /** A size step the class's table leaves empty (LT3/LT4 up to 0.24 in, FN3 up to 0.95 in). */
  | 'INCH_CLASS_NOT_AT_SIZE'
  /** An inch class given with a size in millimetres. */
  | 'INCH_CLASS_NEEDS_INCHES';

export class FitError extends Error {
  readonly code: FitErrorCode;

  constructor(code: FitErrorCode, message: string) {
    super(message);
    this.name = 'FitError';
    this.code = code;
  }
}

export function isFitError(value: unknown): value is FitError {
  return value instanceof FitError;
}
