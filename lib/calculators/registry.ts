/**
 * Every calculator by a stable name, with its input as one plain object, so
 * a saved result can store { kind, input, tablesVersion } and be recomputed
 * or reopened later without a switch in every caller.
 */
import { BOLT_CIRCLE_RUNNERS, type BoltCircleInput, type BoltCircleResult } from './bolt-circle';
import { DRILL_RUNNERS, type DrillKind, type DrillMatch, type DrillSize, type NearestDrillsOptions } from './drills';
import { CalculatorError } from './errors';
import { GEAR_RUNNERS, type SpurGearInput, type SpurGearResult } from './gears';
import { HOLE_RUNNERS, type ClearanceFit, type ClearanceHoleResult, type CounterboreOptions, type CounterboreResult } from './holes';
import { INDEXING_RUNNERS, type DirectIndexingResult, type SimpleIndexingOptions, type SimpleIndexingResult } from './indexing';
import { SPEED_RUNNERS, type SpeedRangeInput, type SpeedRangeResult, type SpindleSpeedInput, type SpindleSpeedResult } from './speeds';
import { THREAD_RUNNERS, type TapDrillResult, type ThreadPercentResult, type ThreadSpec } from './threads';

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

/** Calculators by name, each taking its input object. */
export type Runners<K extends CalculatorKind> = { [P in K]: (input: CalculatorInputs[P]) => CalculatorOutputs[P] };

// Each engine file lists its own runners, so a page that works out only some of them loads only those files.
const RUNNERS: Runners<CalculatorKind> = {
  ...THREAD_RUNNERS,
  ...HOLE_RUNNERS,
  ...DRILL_RUNNERS,
  ...BOLT_CIRCLE_RUNNERS,
  ...INDEXING_RUNNERS,
  ...GEAR_RUNNERS,
  ...SPEED_RUNNERS,
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
