/**
 * Judging one reading against a record's limits, and the two checks a careful machinist makes on
 * how it was taken: was the instrument fine enough, and was the part near 20 °C.
 */
import { MeasurementError } from './errors';
import type { Limits } from './limits';
import { asEntered, cleanUm, toMm, toUm, type LengthUnit } from './units';

export const INSTRUMENTS = [
  { value: 'caliper', label: 'Caliper', mm: 0.01, in: 0.001 },
  { value: 'micrometer', label: 'Micrometer', mm: 0.001, in: 0.0001 },
  { value: 'bore-gauge', label: 'Bore gauge', mm: 0.001, in: 0.0001 },
  { value: 'telescoping-gauge', label: 'Telescoping gauge', mm: 0.001, in: 0.0001 },
  { value: 'dial-indicator', label: 'Dial indicator', mm: 0.01, in: 0.001 },
  { value: 'other', label: 'Other', mm: 0.01, in: 0.001 },
] as const;
export type Instrument = (typeof INSTRUMENTS)[number]['value'];
export const INSTRUMENT_VALUES = INSTRUMENTS.map((i) => i.value) as [Instrument, ...Instrument[]];
export const instrumentLabel = (v: string): string => INSTRUMENTS.find((i) => i.value === v)?.label ?? v;

/** Reference temperature for dimensions, ISO 1. */
export const REFERENCE_TEMPERATURE_C = 20;
/** Common practice: tolerance bands this tight or tighter care about the part's temperature. */
export const TIGHT_BAND_UM = 50;
/** Common practice: more than this far from 20 °C is worth a warning on a tight band. */
export const TEMPERATURE_SLACK_C = 5;
/** Common practice for steel and cast iron: about 11 µm per metre per °C. */
export const GROWTH_PER_METRE_PER_C_UM = 11;
/** Common practice (the "ten to one" rule): an instrument should resolve a tenth of the band or finer. */
export const RESOLUTION_RATIO = 10;

export type ReadingState = 'inside' | 'over' | 'under';

export type ReadingJudgement = {
  /** The reading as a size, µm. */
  sizeUm: number;
  /** Reading minus nominal, µm. */
  deviationUm: number;
  state: ReadingState;
  /** How far past the limit it crossed, µm (0 when inside). */
  outsideByUm: number;
  /** Distance to the nearer limit, µm: positive inside, negative outside. */
  marginUm: number;
  nearest: 'upper' | 'lower';
};

// Half a hundredth of a micrometre absorbs the rounding of inch conversions at the limit itself.
const EPS_UM = 0.005;

export function judgeReading(limits: Limits, value: number, unit: LengthUnit): ReadingJudgement {
  const sizeUm = toUm(value, unit);
  const deviationUm = cleanUm(sizeUm - limits.nominalUm);
  const toUpper = cleanUm(limits.upperUm - deviationUm);
  const toLower = cleanUm(deviationUm - limits.lowerUm);
  let state: ReadingState = 'inside';
  if (toUpper < -EPS_UM) state = 'over';
  else if (toLower < -EPS_UM) state = 'under';
  const nearest = toUpper <= toLower ? 'upper' : 'lower';
  const marginUm = Math.min(toUpper, toLower);
  const outsideByUm = state === 'over' ? -toUpper : state === 'under' ? -toLower : 0;
  return { sizeUm, deviationUm, state, outsideByUm, marginUm: state === 'inside' ? Math.max(0, marginUm) : marginUm, nearest };
}

export type ResolutionCheck = {
  ok: boolean;
  resolutionUm: number;
  /** The coarsest resolution the band allows, µm (a tenth of the band). */
  neededUm: number;
};

/** Common practice: the instrument should resolve at most a tenth of the tolerance band. */
export function resolutionCheck(limits: Limits, resolution: number, unit: LengthUnit): ResolutionCheck {
  const resolutionUm = toUm(resolution, unit);
  const neededUm = limits.bandUm / RESOLUTION_RATIO;
  return { ok: resolutionUm <= neededUm + EPS_UM, resolutionUm, neededUm };
}

export type TemperatureCheck = {
  warn: boolean;
  temperatureC: number;
  /** T − 20 °C. */
  offC: number;
  /** Rough growth of a steel or cast-iron part of the nominal size from 20 °C to T, µm. */
  growthUm: number;
};

/**
 * ISO 1 puts every dimension at 20 °C. Common practice: warn when the part is more than 5 °C away
 * and the band is 50 µm or tighter, where a few degrees grow a steel part by a good share of it.
 */
export function temperatureCheck(limits: Limits, temperatureC: number | null | undefined): TemperatureCheck | null {
  if (temperatureC === null || temperatureC === undefined || !Number.isFinite(temperatureC)) return null;
  const offC = temperatureC - REFERENCE_TEMPERATURE_C;
  const growthUm = cleanUm((limits.nominalMm / 1000) * GROWTH_PER_METRE_PER_C_UM * offC);
  const warn = Math.abs(offC) > TEMPERATURE_SLACK_C && limits.bandUm <= TIGHT_BAND_UM;
  return { warn, temperatureC, offC, growthUm };
}

/** How far a reading may sit from the nominal before it is taken for a slip of the pen: 10 % + 1 mm. */
export function nearnessLimitMm(nominalMm: number): number {
  return nominalMm * 0.1 + 1;
}

/** Refuses a reading nowhere near the nominal (a misplaced decimal point, the wrong unit). */
export function checkNearNominal(nominal: number, nominalUnit: LengthUnit, value: number, unit: LengthUnit, field: string): void {
  if (!(Number.isFinite(value) && value > 0)) throw new MeasurementError(field, 'A reading must be a size greater than zero.');
  const nominalMm = toMm(nominal, nominalUnit);
  const valueMm = toMm(value, unit);
  const limitMm = nearnessLimitMm(nominalMm);
  if (Math.abs(valueMm - nominalMm) > limitMm) {
    throw new MeasurementError(
      field,
      `${asEntered(value)} ${unit} is nowhere near the nominal ${asEntered(nominal)} ${nominalUnit} (more than ${asEntered(Math.round(limitMm * 100) / 100)} mm away): check the decimal point and the unit.`,
    );
  }
}
