/**
 * Approach to size: from the latest reading, how much is still to come off (an outside feature
 * shrinks as it is cut; an inside one grows), on the diameter and per side (the depth of the next
 * cut), and whether a finishing cut at the usual depth would go past the far limit.
 */
import type { FeatureKind, Limits } from './limits';
import { cleanUm, toUm, type LengthUnit } from './units';

/** Common practice for a finishing cut when turning or boring: about 0.05 mm (0.002 in) per side. */
export const USUAL_FINISH_DEPTH: Record<LengthUnit, number> = { mm: 0.05, in: 0.002 };

export type ApproachState =
  /** Material is still to come off before the size is within its limits. */
  | 'stock-left'
  /** Within its limits. */
  | 'in-size'
  /** Past the far limit: cutting cannot bring it back. */
  | 'past-limit';

export type Approach = {
  state: ApproachState;
  /** Latest reading as a deviation from nominal, µm. */
  latestUm: number;
  /** Material still to remove on the diameter to reach the near limit / the middle of the band, µm (0 when none). */
  toNearLimitUm: number;
  toMiddleUm: number;
  /** Room left before the far limit, on the diameter, µm (negative when already past it). */
  toFarLimitUm: number;
  /** Depth of cut per side for the middle of the band, µm. */
  cutPerSideToMiddleUm: number;
  cutPerSideToNearLimitUm: number;
  /** The finishing depth per side the forecast uses, µm. */
  finishDepthUm: number;
  /** Deviation a finishing cut at that depth would leave, µm. */
  afterFinishUm: number;
  /** True when that cut would go past the far limit. */
  finishOvershoots: boolean;
  /** By how much it would go past, µm. */
  overshootUm: number;
};

/**
 * `latestDeviationUm` is the latest reading minus nominal. `finishDepth` is per side, in `unit`.
 * An outside feature gets smaller by twice the depth of cut; an inside one larger.
 */
export function approachToSize(kind: FeatureKind, limits: Limits, latestDeviationUm: number, finishDepth: number, unit: LengthUnit): Approach {
  const sign = kind === 'outside' ? 1 : -1; // +1: cutting lowers the size
  const near = kind === 'outside' ? limits.upperUm : limits.lowerUm;
  const far = kind === 'outside' ? limits.lowerUm : limits.upperUm;
  // Distances measured in the direction the cut moves the size.
  const toNear = cleanUm(sign * (latestDeviationUm - near));
  const toMiddle = cleanUm(sign * (latestDeviationUm - limits.middleUm));
  const toFar = cleanUm(sign * (latestDeviationUm - far));
  const finishDepthUm = toUm(finishDepth, unit);
  const afterFinishUm = cleanUm(latestDeviationUm - sign * 2 * finishDepthUm);
  const overshootUm = cleanUm(Math.max(0, 2 * finishDepthUm - toFar));
  let state: ApproachState = 'in-size';
  if (toNear > 0.005) state = 'stock-left';
  else if (toFar < -0.005) state = 'past-limit';
  return {
    state,
    latestUm: latestDeviationUm,
    toNearLimitUm: Math.max(0, toNear),
    toMiddleUm: Math.max(0, toMiddle),
    toFarLimitUm: toFar,
    cutPerSideToMiddleUm: cleanUm(Math.max(0, toMiddle) / 2),
    cutPerSideToNearLimitUm: cleanUm(Math.max(0, toNear) / 2),
    finishDepthUm,
    afterFinishUm,
    finishOvershoots: state === 'stock-left' && overshootUm > 0.005,
    overshootUm: state === 'stock-left' ? overshootUm : 0,
  };
}
