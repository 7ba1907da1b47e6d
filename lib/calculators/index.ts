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

export { CalculatorError, isCalculatorError, type CalculatorWarning } from './errors';
export { TABLES_VERSION } from './version';
export { SOURCES } from './sources';
export {
  lengthFromMm, formatPercent, formatAngle, formatRpm,
  type Length,
} from './units';

export {
  DRILL_CHART, DRILL_KINDS, INCH_DRILL_KINDS, METRIC_DRILL_KINDS,
  drillSize, nearestDrills, drillsOfKinds,
  type DrillKind, type DrillSize, type DrillMatch,
} from './drills';

export {
  threadSpec, listThreads, threadPercent, tapDrill,
  type ThreadSpec,
  type ThreadPercentResult,
  type TapDrillChoice, type TapDrillResult,
} from './threads';

export {
  screwSize, clearanceHole, counterbore, CLEARANCE_FITS,
  type ClearanceFit, type ClearanceHoleResult,
  type CounterboreResult,
} from './holes';

export {
  boltCircle,
  type BoltHole, type BoltCircleResult,
} from './bolt-circle';

export {
  simpleIndexing, directIndexing, DEFAULT_INDEX_PLATES, DEFAULT_HOLE_CIRCLES, DEFAULT_INDEX_PLATES_SOURCE,
  DEFAULT_CHANGE_GEARS, DEFAULT_CHANGE_GEARS_SOURCE,
  type IndexMove, type GearTrain, type DifferentialSetup,
  type SimpleIndexingResult, type DirectIndexingResult,
} from './indexing';

export {
  spurGear, cutterFor, INVOLUTE_CUTTERS,
  type SpurGearResult,
} from './gears';

export {
  spindleSpeed, speedRange, CUTTING_SPEEDS, TOOL_MATERIAL_NAMES,
  type CuttingSpeedUnit, type WorkMaterial, type ToolMaterial,
} from './speeds';

export { CAUTIONS, CAUTION_DEFER, type CautionTopic } from './cautions';

export {
  runCalculator, isCalculatorKind, CALCULATOR_KINDS,
  type CalculatorKind, type CalculatorInputs, type CalculatorOutputs,
} from './registry';
