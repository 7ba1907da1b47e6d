/**
 * Every calculator by a stable name, with its input as one plain object, so
 * a saved result can store { kind, input, tablesVersion } and be recomputed
 * or reopened later without a switch in every caller.
 */
import { boltCircle, type BoltCircleInput, type BoltCircleResult } from './bolt-circle';
import { drillSize, nearestDrills, type DrillKind, type DrillMatch, type DrillSize, type NearestDrillsOptions } from './drills';
import { CalculatorError } from './errors';
import { spurGear, type SpurGearInput, type SpurGearResult } from './gears';
import { clearanceHole, counterbore, type ClearanceFit, type ClearanceHoleResult, type CounterboreOptions, type CounterboreResult } from './holes';
import { directIndexing, simpleIndexing, type DirectIndexingResult, type SimpleIndexingOptions, type SimpleIndexingResult } from './indexing';
import { speedRange, spindleSpeed, type SpeedRangeInput, type SpeedRangeResult, type SpindleSpeedInput, type SpindleSpeedResult } from './speeds';
import { tapDrill, threadPercent, threadSpec, type TapDrillResult, type ThreadPercentResult, type ThreadSpec } from './threads';

export interface ThreadSpecInput { designation: string }
export interface ThreadPercentInput { designation: string; drillDiameterMm: number }
export interface TapDrillInput { designation: string; targetPercent?: number; kinds?: readonly DrillKind[] }
export interface ClearanceHoleInput { size: string; fit?: ClearanceFit }
export interface CounterboreInput extends CounterboreOptions { size: string }
export interface DrillSizeInput { name: string }
export interface NearestDrillsInput extends NearestDrillsOptions { diameterMm: number }
export interface SimpleIndexingInput extends SimpleIndexingOptions { divisions: number }
export interface DirectIndexingInput { divisions: number; plateHoles?: number }

export type { BoltCircleInput, SpurGearInput, SpindleSpeedInput, SpeedRangeInput };

export interface CalculatorInputs {
  'thread-spec': ThreadSpecInput;
  'thread-percent': ThreadPercentInput;
  'tap-drill': TapDrillInput;
  'clearance-hole': ClearanceHoleInput;
  counterbore: CounterboreInput;
  'drill-size': DrillSizeInput;
  'nearest-drills': NearestDrillsInput;
  'bolt-circle': BoltCircleInput;
  'simple-indexing': SimpleIndexingInput;
  'direct-indexing': DirectIndexingInput;
  'spur-gear': SpurGearInput;
  'spindle-speed': SpindleSpeedInput;
  'speed-range': SpeedRangeInput;
}

export interface CalculatorOutputs {
  'thread-spec': ThreadSpec;
  'thread-percent': ThreadPercentResult;
  'tap-drill': TapDrillResult;
  'clearance-hole': ClearanceHoleResult;
  counterbore: CounterboreResult;
  'drill-size': DrillSize;
  'nearest-drills': DrillMatch[];
  'bolt-circle': BoltCircleResult;
  'simple-indexing': SimpleIndexingResult;
  'direct-indexing': DirectIndexingResult;
  'spur-gear': SpurGearResult;
  'spindle-speed': SpindleSpeedResult;
  'speed-range': SpeedRangeResult;
}

export type CalculatorKind = keyof CalculatorInputs;

const RUNNERS: { [K in CalculatorKind]: (input: CalculatorInputs[K]) => CalculatorOutputs[K] } = {
  'thread-spec': (i) => threadSpec(i.designation),
  'thread-percent': (i) => threadPercent(i.designation, i.drillDiameterMm),
  'tap-drill': (i) => tapDrill(i.designation, i.targetPercent, { kinds: i.kinds }),
  'clearance-hole': (i) => clearanceHole(i.size, i.fit),
  counterbore: (i) => counterbore(i.size, { fit: i.fit, holeCentreToEdgeMm: i.holeCentreToEdgeMm, holeSpacingMm: i.holeSpacingMm }),
  'drill-size': (i) => drillSize(i.name),
  'nearest-drills': (i) => nearestDrills(i.diameterMm, { count: i.count, kinds: i.kinds, side: i.side }),
  'bolt-circle': (i) => boltCircle(i),
  'simple-indexing': (i) => simpleIndexing(i.divisions, { ratio: i.ratio, circles: i.circles, gears: i.gears }),
  'direct-indexing': (i) => directIndexing(i.divisions, i.plateHoles),
  'spur-gear': (i) => spurGear(i),
  'spindle-speed': (i) => spindleSpeed(i),
  'speed-range': (i) => speedRange(i),
};

export const CALCULATOR_KINDS = Object.keys(RUNNERS) as CalculatorKind[];

export function isCalculatorKind(value: unknown): value is CalculatorKind {
  return typeof value === 'string' && Object.prototype.hasOwnProperty.call(RUNNERS, value);
}

/** Runs a calculator by name. Throws CalculatorError (field 'kind' or 'input') for anything unknown or not an object. */
export function runCalculator<K extends CalculatorKind>(kind: K, input: CalculatorInputs[K]): CalculatorOutputs[K] {
  if (!isCalculatorKind(kind)) {
    throw new CalculatorError('UNKNOWN_CHOICE', 'kind', `There is no calculator called "${String(kind)}".`);
  }
  if (typeof input !== 'object' || input === null || Array.isArray(input)) {
    throw new CalculatorError('NOT_A_NUMBER', 'input', 'The calculator was given no inputs.');
  }
  return RUNNERS[kind](input);
}
