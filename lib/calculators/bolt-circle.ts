/**
 * Holes on a bolt circle (pitch circle), as X/Y coordinates from its centre
 * and as angles for a rotary table.
 *
 * Convention: X to the right, Y up; angles are measured from +X and run
 * counter-clockwise, as on a drawing and in the handbook's hole-coordinate
 * tables. Hole 1 sits at the start angle; the rest follow counter-clockwise.
 *
 *   boltCircle({ diameterMm: 25.4, holes: 3, startAngleDeg: 90 })
 *     → (0, 12.7), (−10.998, −6.35), (10.998, −6.35) mm
 */
import { SOURCES } from './sources';
import { clean, lengthFromMm, type Length } from './units';
import { requireNumber } from './validate';
import type { Runners } from './registry';

export const MAX_BOLT_CIRCLE_HOLES = 360;

export interface BoltCircleInput {
  /** Pitch circle diameter, mm. */
  diameterMm: number;
  /** Number of holes, 2–360. */
  holes: number;
  /** Angle of hole 1 from +X, counter-clockwise, degrees; default 0. */
  startAngleDeg?: number;
  /** Also place a second pattern midway between the holes of the first. */
  midway?: boolean;
}

export interface BoltHole {
  /** 1, 2, 3… counter-clockwise from the start angle. */
  index: number;
  /** Angle from +X, counter-clockwise, 0 ≤ angle < 360. */
  angleDeg: number;
  /** Angle turned from hole 1, 0 ≤ turn < 360 (what a rotary table set to 0 at hole 1 reads). */
  turnFromFirstDeg: number;
  x: Length;
  y: Length;
}

export interface BoltCircleResult {
  diameter: Length;
  radius: Length;
  holeCount: number;
  startAngleDeg: number;
  /** Angle between neighbouring holes. */
  stepDeg: number;
  /** Straight-line distance between neighbouring holes, d·sin(180°/n). */
  chord: Length;
  holes: BoltHole[];
  /** The second pattern, each hole midway between two of the first; null unless asked for. */
  midwayHoles: BoltHole[] | null;
  /** Distance from a hole of the first pattern to its neighbour in the second, d·sin(90°/n); null unless asked for. */
  midwayChord: Length | null;
  convention: string;
  source: string;
}

export const BOLT_CIRCLE_CONVENTION = 'X to the right, Y up, from the circle centre; angles from +X, counter-clockwise; hole 1 at the start angle.';

function normaliseDeg(deg: number): number {
  const d = ((deg % 360) + 360) % 360;
  // 359.9999999999 from binary noise is 0.
  return Math.abs(d - 360) < 1e-9 || Math.abs(d) < 1e-9 ? 0 : d;
}

function pattern(radiusMm: number, n: number, firstDeg: number, patternStartDeg: number): BoltHole[] {
  const out: BoltHole[] = [];
  for (let i = 0; i < n; i++) {
    const turn = (360 * i) / n;
    const angle = normaliseDeg(firstDeg + turn);
    const rad = ((firstDeg + turn) * Math.PI) / 180;
    out.push({
      index: i + 1,
      angleDeg: angle,
      turnFromFirstDeg: normaliseDeg(firstDeg + turn - patternStartDeg),
      x: lengthFromMm(clean(radiusMm * Math.cos(rad))),
      y: lengthFromMm(clean(radiusMm * Math.sin(rad))),
    });
  }
  return out;
}

export function boltCircle(input: BoltCircleInput): BoltCircleResult {
  const d = requireNumber(input?.diameterMm, 'diameterMm', { label: 'the bolt circle diameter', min: 0, minExclusive: true, max: 10000, unit: ' mm' });
  const n = requireNumber(input?.holes, 'holes', { label: 'the number of holes', min: 2, max: MAX_BOLT_CIRCLE_HOLES, whole: true });
  const start = requireNumber(input?.startAngleDeg ?? 0, 'startAngleDeg', { label: 'the start angle', min: -360, max: 360, unit: '°' });
  const r = d / 2;
  const holes = pattern(r, n, start, start);
  const midway = input?.midway === true;
  return {
    diameter: lengthFromMm(d),
    radius: lengthFromMm(r),
    holeCount: n,
    startAngleDeg: normaliseDeg(start),
    stepDeg: 360 / n,
    chord: lengthFromMm(d * Math.sin(Math.PI / n)),
    holes,
    // Measured from the first pattern's hole 1, so one table setting serves both.
    midwayHoles: midway ? pattern(r, n, start + 180 / n, start) : null,
    midwayChord: midway ? lengthFromMm(d * Math.sin(Math.PI / (2 * n))) : null,
    convention: BOLT_CIRCLE_CONVENTION,
    source: SOURCES.boltCircle,
  };
}

/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const BOLT_CIRCLE_RUNNERS: Runners<'bolt-circle'> = {
  'bolt-circle': (i) => boltCircle(i),
};
