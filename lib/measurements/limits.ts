/**
 * The limits of a measured feature from its specification, as deviations from the nominal in µm.
 * Five ways a drawing gives them: an ISO 286 zone (through lib/fits), one side of an ANSI B4.1
 * inch class (the hole of an inside feature, the shaft of an outside one), explicit upper and lower
 * deviations, ± a tolerance, or an ISO 2768-1 general tolerance class.
 */
import { inchFitSide, isFitError, toleranceZone, type ToleranceZone } from '../fits';
import { MeasurementError } from './errors';
import { GENERAL_CLASS_NAMES, generalTolerance, type GeneralClass } from './general-tolerance';
import { asEntered, signedAsEntered, sizeText, toUm, type LengthUnit } from './units';

export type FeatureKind = 'outside' | 'inside';
export const FEATURE_KINDS = ['outside', 'inside'] as const;

export const SPEC_TYPES = ['zone', 'inchClass', 'limits', 'plusMinus', 'general'] as const;
export type SpecType = (typeof SPEC_TYPES)[number];

/** Deviations are in the record's own unit. */
export type Spec =
  | { type: 'zone'; zone: string }
  /** An ANSI B4.1 class ("RC4"); the nominal is in inches, the side follows from inside/outside. */
  | { type: 'inchClass'; fitClass: string }
  | { type: 'limits'; upper: number; lower: number }
  | { type: 'plusMinus'; tolerance: number }
  | { type: 'general'; generalClass: GeneralClass };

export type RecordSpecInput = {
  kind: FeatureKind;
  nominal: number;
  unit: LengthUnit;
  spec: Spec;
};

export type Limits = {
  nominalUm: number;
  nominalMm: number;
  /** Upper and lower deviations from the nominal, µm. */
  upperUm: number;
  lowerUm: number;
  /** Width of the tolerance band, µm. */
  bandUm: number;
  /** Middle of the band as a deviation, µm. */
  middleUm: number;
  /** "k6", "+0.100 / 0 mm", "±0.002 in", "ISO 2768-m". */
  label: string;
  /** One line on where the limits come from. */
  source: string;
  /** The ISO 286 zone, when the spec is one. */
  zone: ToleranceZone | null;
  /** The ANSI B4.1 class, when the spec is one side of one ("RC4"). */
  inchClass?: string | null;
};

export const SPEC_TYPE_WORDS: Record<SpecType, string> = {
  zone: 'ISO 286 zone',
  inchClass: 'Inch class (ANSI B4.1)',
  limits: 'Upper and lower deviations',
  plusMinus: '± a tolerance',
  general: 'General tolerance (ISO 2768-1)',
};

function zoneLimits(input: RecordSpecInput, zone: string, nominalMm: number): ToleranceZone {
  const text = zone.trim();
  let z: ToleranceZone;
  try {
    z = toleranceZone(nominalMm, text);
  } catch (err) {
    if (isFitError(err)) {
      const field = err.code === 'SIZE_OUT_OF_RANGE' ? 'nominal' : 'spec.zone';
      throw new MeasurementError(field, err.message);
    }
    throw err;
  }
  if (input.kind === 'outside' && z.kind !== 'shaft') {
    throw new MeasurementError(
      'spec.zone',
      `${z.zone} is a hole zone (capital letter), but this is an outside feature: an outside (shaft-like) size takes a small letter, e.g. ${z.zone.toLowerCase()}.`,
    );
  }
  if (input.kind === 'inside' && z.kind !== 'hole') {
    throw new MeasurementError(
      'spec.zone',
      `${z.zone} is a shaft zone (small letter), but this is an inside feature: an inside (hole-like) size takes a capital letter, e.g. ${z.zone.toUpperCase()}.`,
    );
  }
  return z;
}

function inchClassLimits(input: RecordSpecInput, fitClass: string) {
  if (input.unit !== 'in') {
    throw new MeasurementError('unit', `An inch class is tabulated in inches: give the nominal size in inches (e.g. 1.500 in ${fitClass.trim() || 'RC4'}).`);
  }
  const side = input.kind === 'inside' ? 'hole' : 'shaft';
  try {
    return inchFitSide(input.nominal, fitClass, side);
  } catch (err) {
    if (isFitError(err)) {
      const field = err.code === 'UNKNOWN_INCH_CLASS' ? 'spec.fitClass' : 'nominal';
      throw new MeasurementError(field, err.message);
    }
    throw err;
  }
}

/** Limits of a record's specification; throws MeasurementError naming the field at fault. */
export function recordLimits(input: RecordSpecInput): Limits {
  const { nominal, unit, spec } = input;
  if (!(Number.isFinite(nominal) && nominal > 0)) throw new MeasurementError('nominal', 'The nominal size must be greater than zero.');
  const nominalUm = toUm(nominal, unit);
  // Through µm, so an inch nominal lands on the exact millimetre value (1.575 in → 40.005 mm).
  const nominalMm = nominalUm / 1000;
  let upperUm: number;
  let lowerUm: number;
  let label: string;
  let source: string;
  let zone: ToleranceZone | null = null;
  let inchClass: string | null = null;

  switch (spec.type) {
    case 'zone': {
      zone = zoneLimits(input, spec.zone, nominalMm);
      upperUm = zone.upperUm;
      lowerUm = zone.lowerUm;
      label = zone.zone;
      source = `ISO 286-2 zone ${zone.zone} at ${asEntered(nominal)} ${unit}`;
      break;
    }
    case 'inchClass': {
      const side = inchClassLimits(input, spec.fitClass);
      // A thou is 25.4 µm exactly.
      upperUm = side.upperThou === 0 ? 0 : (side.upperThou * 254) / 10;
      lowerUm = side.lowerThou === 0 ? 0 : (side.lowerThou * 254) / 10;
      inchClass = side.fit.fitClass;
      const sideWord = input.kind === 'inside' ? 'hole' : 'shaft';
      label = `${inchClass} ${sideWord}`;
      const t = (v: number) => (v > 0 ? `+${v}` : String(v));
      source = `ANSI B4.1 ${inchClass}, ${sideWord}, ${side.fit.step.text}: ${t(side.upperThou)} / ${t(side.lowerThou)} thou`;
      break;
    }
    case 'limits': {
      if (!Number.isFinite(spec.upper)) throw new MeasurementError('spec.upper', 'The upper deviation must be a number.');
      if (!Number.isFinite(spec.lower)) throw new MeasurementError('spec.lower', 'The lower deviation must be a number.');
      upperUm = toUm(spec.upper, unit);
      lowerUm = toUm(spec.lower, unit);
      if (!(upperUm > lowerUm)) {
        throw new MeasurementError('spec.upper', 'The upper deviation must be larger than the lower deviation (e.g. +0.1 and 0).');
      }
      if (nominalUm + lowerUm <= 0) {
        throw new MeasurementError('spec.lower', 'The lower deviation would make the smallest size zero or less.');
      }
      label = `${signedAsEntered(spec.upper)} / ${signedAsEntered(spec.lower)} ${unit}`;
      source = 'Deviations given on the drawing';
      break;
    }
    case 'plusMinus': {
      if (!(Number.isFinite(spec.tolerance) && spec.tolerance > 0)) {
        throw new MeasurementError('spec.tolerance', 'The ± tolerance must be greater than zero.');
      }
      upperUm = toUm(spec.tolerance, unit);
      lowerUm = -upperUm;
      if (nominalUm + lowerUm <= 0) throw new MeasurementError('spec.tolerance', 'The tolerance is larger than the size itself.');
      label = `±${asEntered(spec.tolerance)} ${unit}`;
      source = 'Symmetric tolerance given on the drawing';
      break;
    }
    case 'general': {
      const g = generalTolerance(nominalMm, spec.generalClass);
      upperUm = g.plusMinusUm;
      lowerUm = -g.plusMinusUm;
      label = `ISO 2768-${spec.generalClass}`;
      source = `ISO 2768-1 class ${spec.generalClass} (${GENERAL_CLASS_NAMES[spec.generalClass]}), ${g.rangeText}: ±${sizeText(g.plusMinusUm, 'mm')} mm`;
      break;
    }
    default:
      throw new MeasurementError('spec.type', 'Pick how the size is toleranced: an ISO 286 zone, an inch class, upper and lower deviations, ± a tolerance, or a general tolerance class.');
  }
  const bandUm = upperUm - lowerUm;
  return { nominalUm, nominalMm, upperUm, lowerUm, bandUm, middleUm: (upperUm + lowerUm) / 2, label, source, zone, inchClass };
}
