/**
 * A fit: one hole zone and one shaft zone at the same nominal size, written
 * hole first as the standard writes it ("H7/g6").
 *
 * Clearance is hole minus shaft; a negative clearance is an interference.
 *   maxClearance = hole upper − shaft lower
 *   minClearance = hole lower − shaft upper
 * ISO 286-1 kinds of fit:
 *   clearance     minClearance ≥ 0 (the limiting case 0 included)
 *   interference  maxClearance ≤ 0 (the limiting case 0 included)
 *   transition    anything in between
 */

import { FitError } from './errors';
import { readZone, type ZoneSpec } from './letters';
import { CUM_PER_UM } from './ranges';
import { buildZone, computeZoneCum, type ToleranceZone, type ZoneOptions } from './zone';

export type FitKind = 'clearance' | 'transition' | 'interference';

export interface FitAnalysis {
  /** Normalised fit text, "H7/g6". */
  fit: string;
  nominalMm: number;
  hole: ToleranceZone;
  shaft: ToleranceZone;
  /** Largest clearance (hole upper − shaft lower), µm; negative means interference. */
  maxClearanceUm: number;
  /** Smallest clearance (hole lower − shaft upper), µm; negative means interference. */
  minClearanceUm: number;
  maxClearanceMm: number;
  minClearanceMm: number;
  kind: FitKind;
}

interface FitSpec {
  text: string;
  hole: ZoneSpec;
  shaft: ZoneSpec;
}

function readFitText(raw: string): FitSpec {
  if (typeof raw !== 'string') {
    throw new FitError('FIT_NEEDS_HOLE_AND_SHAFT', 'A fit is written as text, hole first, e.g. "H7/g6".');
  }
  const text = raw.trim();
  const cut = text.search(/[/-]/);
  if (cut < 0) {
    throw new FitError(
      'FIT_NEEDS_HOLE_AND_SHAFT',
      `"${text}" is not a fit: a fit pairs a hole zone and a shaft zone, hole first, e.g. "H7/g6".`,
    );
  }
  const first = readZone(text.slice(0, cut));
  const second = readZone(text.slice(cut + 1));
  if (first.isHole && !second.isHole) return { text: `${first.text}/${second.text}`, hole: first, shaft: second };
  if (!first.isHole && second.isHole) {
    throw new FitError(
      'FIT_ORDER',
      `"${text}" is written shaft first: write the hole first, as ${second.text}/${first.text}.`,
    );
  }
  const what = first.isHole ? 'two holes' : 'two shafts';
  throw new FitError(
    'FIT_NEEDS_HOLE_AND_SHAFT',
    `"${text}" pairs ${what}: a fit needs one hole zone (capital letter) and one shaft zone (small letter), hole first, e.g. "H7/g6".`,
  );
}

const FIT_CACHE_LIMIT = 2048;
const fitCache = new Map<string, FitSpec>();

function readFit(raw: string): FitSpec {
  const hit = fitCache.get(raw);
  if (hit !== undefined) return hit;
  const spec = readFitText(raw);
  if (fitCache.size >= FIT_CACHE_LIMIT) fitCache.clear();
  fitCache.set(raw, spec);
  return spec;
}

export function fitKind(maxClearance: number, minClearance: number): FitKind {
  if (minClearance >= 0) return 'clearance';
  if (maxClearance <= 0) return 'interference';
  return 'transition';
}

/**
 * Limits of a fit at a nominal size.
 *
 *   analyseFit(25, 'H7/g6') → maxClearanceUm 41, minClearanceUm 7, kind 'clearance'
 *
 * Throws FitError for a fit written shaft first, two holes or two shafts,
 * or when either zone is not defined at the size.
 */
export function analyseFit(nominalMm: number, fit: string, options?: ZoneOptions): FitAnalysis {
  const spec = readFit(fit);
  const roundJs = options?.roundJs === true;
  const holeCum = computeZoneCum(nominalMm, spec.hole, roundJs);
  const hole = buildZone(nominalMm, spec.hole, holeCum);
  const holeUpper = holeCum.upper;
  const holeLower = holeCum.lower;
  const shaftCum = computeZoneCum(nominalMm, spec.shaft, roundJs);
  const shaft = buildZone(nominalMm, spec.shaft, shaftCum);
  const maxC = holeUpper - shaftCum.lower;
  const minC = holeLower - shaftCum.upper;
  return {
    fit: spec.text,
    nominalMm,
    hole,
    shaft,
    maxClearanceUm: maxC / CUM_PER_UM,
    minClearanceUm: minC / CUM_PER_UM,
    maxClearanceMm: maxC / (CUM_PER_UM * 1000),
    minClearanceMm: minC / (CUM_PER_UM * 1000),
    kind: fitKind(maxC, minC),
  };
}
