/**
 * Measurement records judged against their specifications: pure functions, no I/O, shared by the
 * server (which stores only the inputs) and the browser (live previews).
 *
 *   recordLimits({ kind: 'outside', nominal: 130, unit: 'mm', spec: { type: 'zone', zone: 'k6' } })
 *     → upper +28 µm, lower +3 µm
 *   judgeReading(limits, 130.03, 'mm') → over by 2 µm
 *
 * A component that runs in the browser imports the file it needs (units, words, readings, approach), not this
 * index: the index also brings limits.ts, and with it the ISO 286 and inch fit tables.
 */
export { MeasurementError, isMeasurementError } from './errors';
export {
  LENGTH_UNITS, MAX_DECIMALS, toUm, decimalsOf, asEntered, sizeText, deviationText, amountText, dialText, umText, thouText,
  otherUnit, type LengthUnit,
} from './units';
export {
  GENERAL_CLASSES, GENERAL_CLASS_NAMES, generalTolerance, type GeneralClass,
} from './general-tolerance';
export { FEATURE_KINDS, SPEC_TYPE_WORDS, recordLimits, type FeatureKind, type Spec, type RecordSpecInput, type Limits } from './limits';
export {
  INSTRUMENTS, INSTRUMENT_VALUES, instrumentLabel,
  judgeReading, resolutionCheck, temperatureCheck, checkNearNominal,
  type ReadingState, type ReadingJudgement, type ResolutionCheck, type TemperatureCheck,
} from './readings';
export { approachToSize, type Approach } from './approach';
export { sameNominal, checkPairable, analysePair, type PairAnalysis } from './pair';
export { analyseRecord, type RecordInput, type Verdict } from './record';
export { verdictShort, judgementSentence, clearanceRangeText } from './words';
export { toCsv, textCell, parseCsv } from './csv';
