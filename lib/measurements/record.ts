/** Everything the product says about one measurement record, computed from its stored inputs. */
import { approachToSize, USUAL_FINISH_DEPTH, type Approach } from './approach';
import { recordLimits, type Limits, type RecordSpecInput } from './limits';
import { judgeReading, resolutionCheck, temperatureCheck, type ReadingJudgement, type ReadingState, type ResolutionCheck, type TemperatureCheck } from './readings';
import type { LengthUnit } from './units';

export type ReadingInput = {
  value: number;
  unit: LengthUnit;
  resolution: number;
  temperatureC?: number | null;
  pass?: number | null;
};

export type RecordInput = RecordSpecInput & { readings: ReadingInput[] };

export type ReadingAnalysis = {
  judgement: ReadingJudgement;
  resolution: ResolutionCheck;
  temperature: TemperatureCheck | null;
};

export type Verdict = {
  /** The latest reading's state, or 'none' without readings. */
  state: ReadingState | 'none';
  outsideByUm: number;
  /** Index of the latest reading (the last one), or −1. */
  latestIndex: number;
  /** How many readings fall outside the limits. */
  outsideCount: number;
};

export type RecordAnalysis = {
  limits: Limits;
  readings: ReadingAnalysis[];
  verdict: Verdict;
  /** From the latest reading; null without readings. */
  approach: Approach | null;
  /** True when the readings were taken pass by pass (at least one carries a pass number). */
  byPasses: boolean;
};

export type AnalyseOptions = {
  /** Finishing depth of cut per side, in the record's unit; common practice 0.05 mm / 0.002 in. */
  finishDepth?: number;
};

export function analyseRecord(input: RecordInput, options: AnalyseOptions = {}): RecordAnalysis {
  const limits = recordLimits(input);
  const readings = input.readings.map((r) => ({
    judgement: judgeReading(limits, r.value, r.unit),
    resolution: resolutionCheck(limits, r.resolution, r.unit),
    temperature: temperatureCheck(limits, r.temperatureC),
  }));
  const latestIndex = readings.length - 1;
  const latest = readings[latestIndex];
  const verdict: Verdict = {
    state: latest ? latest.judgement.state : 'none',
    outsideByUm: latest ? latest.judgement.outsideByUm : 0,
    latestIndex,
    outsideCount: readings.filter((r) => r.judgement.state !== 'inside').length,
  };
  const finishDepth = options.finishDepth ?? USUAL_FINISH_DEPTH[input.unit];
  const approach = latest ? approachToSize(input.kind, limits, latest.judgement.deviationUm, finishDepth, input.unit) : null;
  return { limits, readings, verdict, approach, byPasses: input.readings.some((r) => r.pass != null) };
}
