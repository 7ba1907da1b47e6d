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
 *
 * The server and the tests read the engine through this file. The calculator pages in the browser import the
 * engine files they use (threads.ts, holes.ts…) and their runners (THREAD_RUNNERS…), so a page loads no other
 * calculator's code.
 */

export { CalculatorError, isCalculatorError } from './errors';
export { TABLES_VERSION } from './version';
export { SOURCES } from './sources';
export { formatAngle, type Length } from './units';
export { DRILL_CHART, DRILL_KINDS, INCH_DRILL_KINDS, METRIC_DRILL_KINDS, drillSize, nearestDrills, drillsOfKinds, type DrillKind } from './drills';
export { threadSpec, listThreads, threadPercent, tapDrill } from './threads';
export { screwSize, clearanceHole, counterbore } from './holes';
export { boltCircle, type BoltCircleResult } from './bolt-circle';
export { simpleIndexing, directIndexing, DEFAULT_HOLE_CIRCLES, DEFAULT_CHANGE_GEARS } from './indexing';
export { spurGear, cutterFor } from './gears';
export { spindleSpeed, speedRange, CUTTING_SPEEDS } from './speeds';
export { CAUTIONS, CAUTION_DEFER, type CautionTopic } from './cautions';
export { runCalculator, isCalculatorKind, CALCULATOR_KINDS, type CalculatorKind, type CalculatorInputs } from './registry';
