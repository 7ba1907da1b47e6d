/**
 * What the bench view says about a record, in words, computed on the phone from the record's inputs and every
 * reading (those the server has and those still queued) by the same lib/measurements the server uses.
 */
import { analyseRecord, dialText, isMeasurementError, sizeText, verdictShort, type FeatureKind, type LengthUnit, type Spec } from '../measurements';

export type BenchInput = {
  kind: FeatureKind;
  nominal: number;
  unit: LengthUnit;
  spec: Spec;
  readings: { value: number; unit: LengthUnit; resolution: number }[];
};

export type BenchWords = {
  /** "k6" / "±0.05 mm". */
  specLabel: string;
  /** "Ø 25.000 to 25.021 mm": the smallest and largest size allowed, in the record's unit. */
  sizes: string;
  state: 'none' | 'inside' | 'over' | 'under';
  /** "Inside", "Outside by 0.004 mm", "No readings yet". */
  verdict: string;
  /** "0.114 mm on the diameter to the middle of the band", "None: in size", or past the far limit. */
  stock: string | null;
  /** "Take off 0.057 mm per side" / "Open up …", or what to do instead; null when there is nothing to cut. */
  nextCut: string | null;
  /** The usual finishing cut would go past the far limit. */
  overshoot: string | null;
};

export function benchWords(input: BenchInput): BenchWords | { error: string } {
  let a;
  try {
    a = analyseRecord(input);
  } catch (err) {
    if (isMeasurementError(err)) return { error: err.message };
    throw err;
  }
  const u = input.unit;
  const amt = (um: number) => `${dialText(um, u)} ${u}`;
  const sizes = `${sizeText(a.limits.nominalUm + a.limits.lowerUm, u)} to ${sizeText(a.limits.nominalUm + a.limits.upperUm, u)} ${u}`;
  const words: BenchWords = { specLabel: a.limits.label, sizes, state: a.verdict.state, verdict: verdictShort(a.verdict, u), stock: null, nextCut: null, overshoot: null };
  const ap = a.approach;
  if (!ap) return words;
  const cut = input.kind === 'outside' ? 'Take off' : 'Open up';
  const far = input.kind === 'outside' ? 'lower' : 'upper';
  if (ap.state === 'stock-left') {
    words.stock = `${amt(ap.toMiddleUm)} on the diameter to the middle of the band (${amt(ap.toNearLimitUm)} to the first limit)`;
    words.nextCut = `${cut} ${amt(ap.cutPerSideToMiddleUm)} per side`;
    if (ap.finishOvershoots) {
      words.overshoot = `The usual finishing cut would go ${amt(ap.overshootUm)} past the ${far} limit: take a light or spring pass instead.`;
    }
  } else if (ap.state === 'in-size') {
    words.stock = 'None: in size';
  } else {
    words.stock = `None: ${amt(-ap.toFarLimitUm)} past the ${far} limit`;
    words.nextCut = 'No cut brings it back: see whether the mating part can be made to suit, or make the part again.';
  }
  return words;
}
