/**
 * Shop calculators for Scribeline: pure functions, no I/O. Everything is
 * computed in millimetres; every length shown comes back as a `Length`
 * ({ mm, in }). Bad input throws a CalculatorError naming the field.
 *
 *   threadSpec('5/16-18 UNC')            tapDrill('1/4-20') → #7, 75.4 %
 *   threadPercent('M8', 6.8) → 73.9 %     clearanceHole('M8', 'close') → 8.4 mm
 *   counterbore('M8', { holeCentreToEdgeMm: 10 })
 *   drillSize('27/64')  nearestDrills(6.78)
 *   boltCircle({ diameterMm: 100, holes: 6, startAngleDeg: 90 })
 *   simpleIndexing(36) → 1 turn + 2 holes on 18   directIndexing(6) → 4 holes on 24
 *   spurGear({ teeth: 36, module: 1.5 }) → Ø54 / Ø57, cutter No. 3
 *   spindleSpeed({ cuttingSpeed: 30, unit: 'm/min', diameterMm: 8 })
 *
 * Saved results store { kind, input, tablesVersion: TABLES_VERSION } and run
 * again through runCalculator(kind, input).
 */

export { CalculatorError, isCalculatorError, type CalculatorErrorCode, type CalculatorWarning } from './errors';
export { TABLES_VERSION } from './version';
export { SOURCES, type SourceKey } from './sources';
export {
  MM_PER_INCH, clean, lengthFromMm, lengthFromIn, formatLength, formatPercent, formatAngle, formatRpm,
  type Length, type LengthUnit, type FormatLengthOptions,
} from './units';

export {
  DRILL_CHART, DRILL_CHART_SOURCE, DRILL_KINDS, INCH_DRILL_KINDS, METRIC_DRILL_KINDS,
  drillSize, nearestDrills, drillAtLeast, drillWithDiameter, drillsOfKinds, fractionName,
  type DrillKind, type DrillSize, type DrillMatch, type NearestDrillsOptions,
} from './drills';

export {
  threadSpec, listThreads, threadPercent, tapDrill,
  UNIFIED_SIZES, METRIC_SIZES_MM, FULL_THREAD_DOUBLE_DEPTH_PER_P, HIGH_ENGAGEMENT_PERCENT, LOW_ENGAGEMENT_PERCENT,
  DEFAULT_TARGET_PERCENT, THREAD_PERCENT_RELATION, TAP_DRILL_TIE_RULE,
  type ThreadSystem, type ThreadSeries, type ThreadSpec, type ThreadPitchOption, type ThreadWarningCode,
  type ThreadPercentResult, type TapKind, type BlindHoleAllowance, type BlindHoleGuide,
  type TapDrillChoice, type TapDrillOptions, type TapDrillResult,
} from './threads';

export {
  screwSize, clearanceHole, counterbore, CLEARANCE_FITS, ISO_273_SERIES, MIN_WALL_MM, MIN_WALL_HEAD_FRACTION,
  type ClearanceFit, type ScrewSize, type ClearanceHoleResult, type CounterboreOptions, type CounterboreWall,
  type CounterboreResult, type CounterboreWarningCode,
} from './holes';

export {
  boltCircle, BOLT_CIRCLE_CONVENTION, MAX_BOLT_CIRCLE_HOLES,
  type BoltCircleInput, type BoltHole, type BoltCircleResult,
} from './bolt-circle';

export {
  simpleIndexing, directIndexing, DEFAULT_INDEX_PLATES, DEFAULT_HOLE_CIRCLES, DEFAULT_INDEX_PLATES_SOURCE,
  DEFAULT_CHANGE_GEARS, DEFAULT_CHANGE_GEARS_SOURCE, DEFAULT_WORM_RATIO, MAX_DIVISIONS, DIFFERENTIAL_SEARCH_SPAN,
  type IndexPlate, type SectorSetting, type IndexMove, type GearTrain, type DifferentialSetup,
  type SimpleIndexingOptions, type SimpleIndexingResult, type DirectIndexingResult,
} from './indexing';

export {
  spurGear, cutterFor, INVOLUTE_CUTTERS, PRESSURE_ANGLES, MAX_TEETH,
  type PressureAngle, type SpurGearInput, type SpurGearOptions, type CutterRange, type GearCutter,
  type GearWarningCode, type SpurGearResult,
} from './gears';

export {
  spindleSpeed, speedRange, CUTTING_SPEEDS, CUTTING_SPEED_UNITS, TOOL_MATERIALS, TOOL_MATERIAL_NAMES, M_PER_FT,
  type CuttingSpeedUnit, type SpindleSpeedInput, type SpindleSpeedResult, type WorkMaterial, type ToolMaterial,
  type SpeedRange, type CuttingSpeedRow, type SpeedRangeInput, type SpeedRangeResult,
} from './speeds';

export { CAUTIONS, CAUTION_DEFER, type Caution, type CautionTopic } from './cautions';

export {
  runCalculator, isCalculatorKind, CALCULATOR_KINDS,
  type CalculatorKind, type CalculatorInputs, type CalculatorOutputs,
  type ThreadSpecInput, type ThreadPercentInput, type TapDrillInput, type ClearanceHoleInput, type CounterboreInput,
  type DrillSizeInput, type NearestDrillsInput, type SimpleIndexingInput, type DirectIndexingInput,
} from './registry';
