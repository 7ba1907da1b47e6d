/**
 * Typed refusals of the shop calculators.
 *
 * A calculator never guesses: an unknown thread, a drill that is not in the
 * chart or a division no plate can give is refused. `field` names the input
 * that is wrong (the property name of the calculator's input type, so a form
 * can put the message beside that field); `message` says why in shop words and
 * is meant to be shown as is.
 */

export type CalculatorErrorCode =
  /** Not a number at all (missing, text, NaN, infinite). */
  | 'NOT_A_NUMBER'
  /** A count (holes, teeth, divisions…) that is not a whole number. */
  | 'NOT_WHOLE'
  /** A number outside what the calculator accepts (zero, negative, too large). */
  | 'OUT_OF_RANGE'
  /** Free text that could not be read as a thread, size or drill name. */
  | 'UNREADABLE'
  /** A thread the tables do not hold (1/4-19, M8x3, 9/32-32). */
  | 'UNKNOWN_THREAD'
  /** A screw size the tables do not hold for this calculator (no M18 socket head cap screw). */
  | 'NOT_TABULATED'
  /** A drill name that is not in the chart. */
  | 'UNKNOWN_DRILL'
  /** A choice outside its list (fit class, pressure angle, unit, material). */
  | 'UNKNOWN_CHOICE'
  /** Inputs that are each fine but cannot work together (7 divisions on a 24-hole plate). */
  | 'NOT_POSSIBLE';

export class CalculatorError extends Error {
  readonly code: CalculatorErrorCode;
  /** The input that is wrong, as named in the calculator's input type ('designation', 'divisions'…). */
  readonly field: string;

  constructor(code: CalculatorErrorCode, field: string, message: string) {
    super(message);
    this.name = 'CalculatorError';
    this.code = code;
    this.field = field;
  }
}

export function isCalculatorError(value: unknown): value is CalculatorError {
  return value instanceof CalculatorError;
}

/** Something worth saying beside a result that is still given (high engagement, thin wall…). */
export interface CalculatorWarning<C extends string = string> {
  code: C;
  /** Shop words, meant to be shown as is. */
  message: string;
}
