/**
 * A refusal of the measurement computations, pinned to the input field it is about
 * ("nominal", "spec.zone", "readings.1.value"), so a form can show it beside that field
 * and the server can answer 400 naming it.
 */
export class MeasurementError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'MeasurementError';
    this.field = field;
  }
}

export function isMeasurementError(value: unknown): value is MeasurementError {
  return value instanceof MeasurementError;
}
