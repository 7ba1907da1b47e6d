/**
 * What a shop sheet says about a measured feature: the sizes to hit in both units, and the
 * instrument fine enough to tell them apart. Pure; the sheet's loader and its tests use it.
 *
 *   sheetLimits(recordLimits({ kind: 'outside', nominal: 130, unit: 'mm', spec: { type: 'zone', zone: 'k6' } }), 'mm')
 *     → mm 130.003 … 130.028 (exact), in 5.1183 … 5.1192 (rounded inward)
 *   instrumentFor(limits, 'outside', 'mm') → micrometer (0.001 mm), the band being 25 µm
 */
import { formatNumber } from '../units/format';
import type { FeatureKind, Limits } from './limits';
import { INSTRUMENTS, RESOLUTION_RATIO, type Instrument } from './readings';
import { toUm, type LengthUnit } from './units';

/** The smallest step a sheet writes in each unit: a micrometer's reading (domain: 0.001 mm / 0.0001 in). */
const STEP: Record<LengthUnit, number> = { mm: 0.001, in: 0.0001 };
const PLACES: Record<LengthUnit, number> = { mm: 3, in: 4 };

export type SheetSizes = {
  unit: LengthUnit;
  /** Smallest and largest size allowed, as written on the sheet. */
  min: string;
  max: string;
  /** Lower and upper deviation from the nominal, signed. */
  lower: string;
  upper: string;
  /** True in the record's own unit; in the other unit the limits are rounded inward to the step. */
  exact: boolean;
};

// Binary noise (130.028 / 25.4 × 10⁴ = 51192.9133…) must not push a value over a step.
const NUDGE = 1e-6;

function fixed(value: number, unit: LengthUnit, signed = false): string {
  return formatNumber(value, { decimals: PLACES[unit], signed });
}

/**
 * The limits in one unit. In the record's own unit they are written as toleranced (finer digits kept,
 * as formatUmAs does); converted to the other unit the largest size is rounded down and the smallest up,
 * so a part inside the converted limits is inside the original ones (IEEE/ASTM SI 10, converting
 * toleranced dimensions — from memory; common practice).
 */
function sizesIn(limits: Limits, unit: LengthUnit, own: boolean): SheetSizes {
  const perUnit = toUm(1, unit);
  const minExact = (limits.nominalUm + limits.lowerUm) / perUnit;
  const maxExact = (limits.nominalUm + limits.upperUm) / perUnit;
  const step = STEP[unit];
  const stepsOf = (v: number) => v / step;
  const onStep = (v: number) => Math.abs(stepsOf(v) - Math.round(stepsOf(v))) < NUDGE * 1000;
  if (own || (onStep(minExact) && onStep(maxExact))) {
    // Written as toleranced: to the step, finer digits only where the value has them (JS7 = ±10.5 µm).
    const write = (v: number, signed = false) => formatNumber(v, { decimals: PLACES[unit], maxDecimals: PLACES[unit] + 2, signed });
    return {
      unit,
      min: write(minExact),
      max: write(maxExact),
      lower: write(limits.lowerUm / perUnit, true),
      upper: write(limits.upperUm / perUnit, true),
      exact: true,
    };
  }
  const minIn = Math.ceil(stepsOf(minExact) - NUDGE) * step;
  const maxIn = Math.floor(stepsOf(maxExact) + NUDGE) * step;
  const nominal = limits.nominalUm / perUnit;
  return {
    unit,
    min: fixed(minIn, unit),
    max: fixed(maxIn, unit),
    lower: fixed(minIn - nominal, unit, true),
    upper: fixed(maxIn - nominal, unit, true),
    exact: false,
  };
}

/** The limits in the record's own unit first, then in the other one (rounded inward). */
export function sheetLimits(limits: Limits, ownUnit: LengthUnit): [SheetSizes, SheetSizes] {
  const other: LengthUnit = ownUnit === 'mm' ? 'in' : 'mm';
  return [sizesIn(limits, ownUnit, true), sizesIn(limits, other, false)];
}

export type InstrumentAdvice = {
  instrument: Instrument;
  /** "Micrometer", "Bore gauge or telescoping gauge". */
  label: string;
  /** What it reads in the record's unit: "0.001 mm". */
  resolutionText: string;
  /** The coarsest resolution the ten-to-one rule allows, µm. */
  neededUm: number;
  /** False when even the finest usual instrument reads coarser than a tenth of the band. */
  meetsRule: boolean;
};

/**
 * The coarsest usual instrument that resolves a tenth of the tolerance band (the ten-to-one rule,
 * common practice): a caliper where it will do, otherwise a micrometer for an outside feature and a
 * bore or telescoping gauge for an inside one. Resolutions are the instruments' usual ones
 * (caliper 0.01 mm / 0.001 in, micrometer 0.001 mm / 0.0001 in).
 */
export function instrumentFor(limits: Limits, kind: FeatureKind, unit: LengthUnit): InstrumentAdvice {
  const neededUm = limits.bandUm / RESOLUTION_RATIO;
  const fine: Instrument = kind === 'outside' ? 'micrometer' : 'bore-gauge';
  const pick = (value: Instrument, meetsRule: boolean): InstrumentAdvice => {
    const spec = INSTRUMENTS.find((i) => i.value === value)!;
    return {
      instrument: value,
      label: value === 'bore-gauge' ? 'Bore gauge or telescoping gauge' : spec.label,
      resolutionText: `${formatNumber(spec[unit], { decimals: PLACES[unit] - 1, maxDecimals: PLACES[unit] })} ${unit}`,
      neededUm,
      meetsRule,
    };
  };
  const caliper = INSTRUMENTS.find((i) => i.value === 'caliper')!;
  // A hundredth of a micrometre absorbs the inch conversion (0.001 in = 25.4 µm exactly).
  if (toUm(caliper[unit], unit) <= neededUm + 0.01) return pick('caliper', true);
  const fineSpec = INSTRUMENTS.find((i) => i.value === fine)!;
  return pick(fine, toUm(fineSpec[unit], unit) <= neededUm + 0.01);
}
