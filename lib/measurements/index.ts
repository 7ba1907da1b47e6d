/**
 * Measurement records judged against their specifications: pure functions, no I/O, shared by the
 * server (which stores only the inputs) and the browser (live previews).
 *
 *   recordLimits({ kind: 'outside', nominal: 130, unit: 'mm', spec: { type: 'zone', zone: 'k6' } })
 *     → upper +28 µm, lower +3 µm
 *   judgeReading(limits, 130.03, 'mm') → over by 2 µm
 */
export { MeasurementError, isMeasurementError } from './errors';
export {
  LENGTH_UNITS, MAX_DECIMALS, cleanUm, toUm, fromUm, toMm, decimalsOf, numberText, asEntered, signedAsEntered, sizeText, deviationText, amountText, dialText, umText, thou, thouText,
  otherUnit, UNIT_WORD, type LengthUnit,
} from './units';
export {
  GENERAL_CLASSES, GENERAL_CLASS_NAMES, GENERAL_RANGES_MM, GENERAL_MIN_MM, generalTolerance, type GeneralClass, type GeneralTolerance,
} from './general-tolerance';
export { FEATURE_KINDS, SPEC_TYPES, SPEC_TYPE_WORDS, recordLimits, limitSizesUm, type FeatureKind, type SpecType, type Spec, type RecordSpecInput, type Limits } from './limits';
export {
  INSTRUMENTS, INSTRUMENT_VALUES, instrumentLabel, REFERENCE_TEMPERATURE_C, TIGHT_BAND_UM, TEMPERATURE_SLACK_C, GROWTH_PER_METRE_PER_C_UM, RESOLUTION_RATIO,
  judgeReading, resolutionCheck, temperatureCheck, nearnessLimitMm, checkNearNominal,
  type Instrument, type ReadingState, type ReadingJudgement, type ResolutionCheck, type TemperatureCheck,
} from './readings';
export { USUAL_FINISH_DEPTH, approachToSize, type Approach, type ApproachState } from './approach';
export { sameNominal, checkPairable, analysePair, type PairSide, type PairAnalysis } from './pair';
export { validateRecord, analyseRecord, type ReadingInput, type RecordInput, type ReadingAnalysis, type Verdict, type RecordAnalysis, type AnalyseOptions } from './record';
export { STATE_WORDS, sideWords, verdictShort, judgementSentence, FIT_KIND_WORDS, clearanceText, clearanceRangeText, actualPairWords } from './words';
export { csvField, toCsv, textCell, parseCsv, type CsvCell } from './csv';
