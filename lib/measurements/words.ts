/** The verdicts in words, for pages, tables and the CSV alike (never colour alone). */
import type { FitKind } from '../fits';
import type { PairAnalysis } from './pair';
import type { ReadingJudgement, ReadingState } from './readings';
import type { Verdict } from './record';
import { amountText, thouText, umText, type LengthUnit } from './units';

export const STATE_WORDS: Record<ReadingState | 'none', string> = {
  inside: 'Inside',
  over: 'Outside',
  under: 'Outside',
  none: 'No readings',
};

/** "over the upper limit" / "under the lower limit". */
export function sideWords(state: ReadingState): string {
  return state === 'over' ? 'over the upper limit' : state === 'under' ? 'under the lower limit' : 'within the limits';
}

/** "Inside", "Outside by 0.002 mm", "No readings yet". */
export function verdictShort(v: Pick<Verdict, 'state' | 'outsideByUm'>, unit: LengthUnit): string {
  if (v.state === 'none') return 'No readings yet';
  if (v.state === 'inside') return 'Inside';
  return `Outside by ${amountText(v.outsideByUm, unit)} ${unit}`;
}

/** A sentence a reader can act on: "Outside by 0.002 mm (2 µm, 0.08 thou), over the upper limit." */
export function judgementSentence(j: Pick<ReadingJudgement, 'state' | 'outsideByUm' | 'marginUm' | 'nearest'>, unit: LengthUnit): string {
  if (j.state === 'inside') {
    return `Inside the limits, ${amountText(j.marginUm, unit)} ${unit} (${umText(j.marginUm)} µm) from the ${j.nearest} limit.`;
  }
  return `Outside by ${amountText(j.outsideByUm, unit)} ${unit} (${umText(j.outsideByUm)} µm, ${thouText(j.outsideByUm)} thou), ${sideWords(j.state)}.`;
}

export const FIT_KIND_WORDS: Record<FitKind, string> = {
  clearance: 'Clearance fit',
  transition: 'Transition fit',
  interference: 'Interference fit',
};

/** "clearance 0.003 mm" / "interference 0.005 mm". */
export function clearanceText(um: number, unit: LengthUnit): string {
  if (um === 0) return `line to line (0 ${unit})`;
  return um > 0 ? `clearance ${amountText(um, unit)} ${unit}` : `interference ${amountText(-um, unit)} ${unit}`;
}

export function clearanceRangeText(p: Pick<PairAnalysis, 'maxClearanceUm' | 'minClearanceUm'>, unit: LengthUnit): string {
  return `from ${clearanceText(p.minClearanceUm, unit)} to ${clearanceText(p.maxClearanceUm, unit)}`;
}

export function actualPairWords(p: PairAnalysis, unit: LengthUnit): string {
  if (p.actualClearanceUm === null) return 'Not yet measured: both records need a reading.';
  const made = clearanceText(p.actualClearanceUm, unit);
  if (p.actualState === 'within') return `Made: ${made}, within the range the specifications give.`;
  const how = p.actualState === 'too-loose' ? 'looser' : 'tighter';
  return `Made: ${made}, ${amountText(p.outsideByUm, unit)} ${unit} ${how} than the specifications allow.`;
}
