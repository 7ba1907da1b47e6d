/**
 * A hole record and a shaft record of the same nominal size make a fit. The specifications give
 * its clearance range (ISO 286-1: maximum clearance = hole upper − shaft lower, minimum clearance =
 * hole lower − shaft upper; negative is interference); the latest readings give the clearance
 * actually made.
 */
import { fitKind, type FitKind } from '../fits';
import { MeasurementError } from './errors';
import type { FeatureKind, Limits } from './limits';
import { cleanUm } from './units';

export type PairSide = { kind: FeatureKind; limits: Limits; /** Latest reading as a size, µm, or null without readings. */ latestSizeUm: number | null };

export type PairAnalysis = {
  kind: FitKind;
  maxClearanceUm: number;
  minClearanceUm: number;
  /** "H7/k6" when both sides are ISO 286 zones; "RC4" when both are sides of one inch class. */
  fit: string | null;
  /** Latest hole reading − latest shaft reading, µm; null until both have a reading. */
  actualClearanceUm: number | null;
  /** Where the actual clearance sits against the range. */
  actualState: 'within' | 'too-loose' | 'too-tight' | 'unknown';
  /** How far outside the range, µm. */
  outsideByUm: number;
};

// Nominal sizes compare equal to a thousandth of a micrometre (an inch nominal converts exactly).
export function sameNominal(a: Limits, b: Limits): boolean {
  return Math.abs(a.nominalUm - b.nominalUm) < 0.001;
}

export function checkPairable(hole: { kind: FeatureKind; limits: Limits }, shaft: { kind: FeatureKind; limits: Limits }): void {
  if (hole.kind !== 'inside') throw new MeasurementError('holeRecordId', 'The hole side of a fit must be an inside (hole-like) feature.');
  if (shaft.kind !== 'outside') throw new MeasurementError('shaftRecordId', 'The shaft side of a fit must be an outside (shaft-like) feature.');
  if (!sameNominal(hole.limits, shaft.limits)) {
    throw new MeasurementError('shaftRecordId', 'A fit pairs a hole and a shaft of the same nominal size: these two records have different nominal sizes.');
  }
}

export function analysePair(hole: PairSide, shaft: PairSide): PairAnalysis {
  checkPairable(hole, shaft);
  const maxC = cleanUm(hole.limits.upperUm - shaft.limits.lowerUm);
  const minC = cleanUm(hole.limits.lowerUm - shaft.limits.upperUm);
  const fit =
    hole.limits.zone && shaft.limits.zone
      ? `${hole.limits.zone.zone}/${shaft.limits.zone.zone}`
      : hole.limits.inchClass && hole.limits.inchClass === shaft.limits.inchClass
        ? hole.limits.inchClass
        : null;
  let actual: number | null = null;
  let actualState: PairAnalysis['actualState'] = 'unknown';
  let outsideByUm = 0;
  if (hole.latestSizeUm !== null && shaft.latestSizeUm !== null) {
    actual = cleanUm(hole.latestSizeUm - shaft.latestSizeUm);
    if (actual > maxC + 0.005) {
      actualState = 'too-loose';
      outsideByUm = cleanUm(actual - maxC);
    } else if (actual < minC - 0.005) {
      actualState = 'too-tight';
      outsideByUm = cleanUm(minC - actual);
    } else actualState = 'within';
  }
  return { kind: fitKind(maxC, minC), maxClearanceUm: maxC, minClearanceUm: minC, fit, actualClearanceUm: actual, actualState, outsideByUm };
}
