import { CalculatorError } from '../../../lib/calculators/index';

/** The CalculatorError a call throws; fails the test if it returns or throws anything else. */
export function refusal(fn: () => unknown): CalculatorError {
  try {
    fn();
  } catch (error) {
    if (error instanceof CalculatorError) return error;
    throw error;
  }
  throw new Error('expected a CalculatorError');
}
