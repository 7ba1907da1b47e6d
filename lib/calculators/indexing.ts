/**
 * Dividing-head indexing: simple, differential and direct.
 *
 *   simpleIndexing(36) → 1 turn and 2 holes on the 18-hole circle
 *   simpleIndexing(7)  → 5 turns and 15 holes on the 21-hole circle
 *   simpleIndexing(127) → not possible with the plates; differential: index 120, gears 56/24, plate opposite
 *   directIndexing(6)  → 4 holes on a 24-hole spindle plate
 */
import { CalculatorError } from './errors';
import { SOURCES } from './sources';
import { gcd, requireNumber } from './validate';
import type { Runners } from './registry';

export interface IndexPlate {
  name: string;
  circles: readonly number[];
}

/** Three plates commonly supplied with a 40:1 head (common practice). */
export const DEFAULT_INDEX_PLATES: readonly IndexPlate[] = [
  { name: 'Plate 1', circles: [15, 16, 17, 18, 19, 20] },
  { name: 'Plate 2', circles: [21, 23, 27, 29, 31, 33] },
  { name: 'Plate 3', circles: [37, 39, 41, 43, 47, 49] },
];
export const DEFAULT_HOLE_CIRCLES: readonly number[] = DEFAULT_INDEX_PLATES.flatMap((p) => p.circles).sort((a, b) => a - b);
export const DEFAULT_INDEX_PLATES_SOURCE = SOURCES.indexPlates;

/** Change gears commonly supplied for differential indexing (two of 24 teeth). */
export const DEFAULT_CHANGE_GEARS: readonly number[] = [24, 24, 28, 32, 40, 44, 48, 56, 64, 72, 86];
export const DEFAULT_CHANGE_GEARS_SOURCE = SOURCES.changeGears;

export const DEFAULT_WORM_RATIO = 40;
export const MAX_DIVISIONS = 1000;
/** How far from the wanted number an approximate division for differential indexing is looked for. */
export const DIFFERENTIAL_SEARCH_SPAN = 30;

export interface SectorSetting {
  /** Spaces to move the pin, i.e. the holes to count past the one it sits in. */
  spaces: number;
  /** Holes taken in between the sector arms, counting the hole the pin sits in. */
  holesBetweenArms: number;
}

export interface IndexMove {
  wholeTurns: number;
  /** Holes beyond the whole turns; 0 when whole turns alone do it. */
  holes: number;
  /** The hole circle used; null when only whole turns are needed. */
  circle: number | null;
  sector: SectorSetting | null;
  /** "1 turn and 2 holes on the 18-hole circle". */
  description: string;
}

export type GearTrain =
  | { kind: 'simple'; driver: number; driven: number }
  | { kind: 'compound'; driver1: number; driven1: number; driver2: number; driven2: number };

export interface DifferentialSetup {
  /** The number the crank is indexed for (A), near the one wanted. */
  approximateDivisions: number;
  /** Simple indexing for A, done on the plate while the gears turn the plate. */
  index: IndexMove;
  /** Driver (on the spindle) to driven (on the plate's shaft): |A − N| × ratio / A, in lowest terms. */
  gearRatio: { numerator: number; denominator: number; value: number };
  train: GearTrain;
  /** 'same': the plate turns the way the crank does (A more than N); 'opposite': A less than N. */
  plateDirection: 'same' | 'opposite';
  description: string;
  notes: string[];
  source: string;
}

export interface SimpleIndexingOptions {
  /** Worm ratio of the head (turns of the crank per turn of the spindle); default 40. */
  ratio?: number;
  /** The hole circles on hand; default the three commonly supplied plates. */
  circles?: readonly number[];
  /** Change gears on hand for differential indexing; default the commonly supplied set. */
  gears?: readonly number[];
}

export interface SimpleIndexingResult {
  divisions: number;
  ratio: number;
  /** Crank turns per division, ratio / divisions = whole + numerator / denominator (lowest terms). */
  turnsPerDivision: { whole: number; numerator: number; denominator: number; value: number };
  degreesPerDivision: number;
  circles: number[];
  circlesSource: string;
  /** True when simple indexing works with the circles given. */
  possible: boolean;
  /** The move on the smallest hole circle that works (fewest holes to count). */
  move: IndexMove | null;
  /** Every hole circle that works, smallest first. */
  options: IndexMove[];
  /** When simple indexing cannot do it: a differential set-up, or null if none was found with these plates and gears. */
  differential: DifferentialSetup | null;
  message: string;
  source: string;
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

function moveFor(whole: number, holes: number, circle: number | null): IndexMove {
  const turns = plural(whole, 'turn');
  const description = circle === null || holes === 0
    ? turns
    : whole === 0
      ? `${plural(holes, 'hole')} on the ${circle}-hole circle`
      : `${turns} and ${plural(holes, 'hole')} on the ${circle}-hole circle`;
  return {
    wholeTurns: whole,
    holes: circle === null ? 0 : holes,
    circle,
    sector: circle === null || holes === 0 ? null : { spaces: holes, holesBetweenArms: holes + 1 },
    description,
  };
}

function readWholeList(value: unknown, field: string, label: string, min: number, max: number, maxCount: number): number[] {
  if (!Array.isArray(value) || value.length === 0) {
    throw new CalculatorError('NOT_A_NUMBER', field, `Give at least one ${label}.`);
  }
  if (value.length > maxCount) {
    throw new CalculatorError('OUT_OF_RANGE', field, `Give at most ${maxCount} ${label}s.`);
  }
  for (const v of value) {
    if (typeof v !== 'number' || !Number.isInteger(v) || v < min || v > max) {
      throw new CalculatorError('OUT_OF_RANGE', field, `Each ${label} must be a whole number from ${min} to ${max}; ${String(v)} is not.`);
    }
  }
  return value as number[];
}

/** Simple-indexing moves for `divisions`, on every circle that works. */
function simpleMoves(divisions: number, ratio: number, circles: readonly number[]): { moves: IndexMove[]; turns: SimpleIndexingResult['turnsPerDivision'] } {
  const whole = Math.floor(ratio / divisions);
  const rem = ratio % divisions;
  const g = gcd(rem, divisions) || divisions;
  const numerator = rem / g;
  const denominator = divisions / g;
  const turns = { whole, numerator, denominator, value: ratio / divisions };
  if (rem === 0) return { moves: [moveFor(whole, 0, null)], turns };
  const moves = circles
    .filter((c) => c % denominator === 0)
    .map((c) => moveFor(whole, (numerator * c) / denominator, c));
  return { moves, turns };
}

function gearTrain(numerator: number, denominator: number, gears: readonly number[]): GearTrain | null {
  const n = gears.length;
  let best: { train: GearTrain; size: number } | null = null;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      if (gears[i] * denominator === gears[j] * numerator) {
        const size = gears[i] + gears[j];
        if (!best || size < best.size) best = { train: { kind: 'simple', driver: gears[i], driven: gears[j] }, size };
      }
    }
  }
  return best?.train ?? null;
}

function compoundTrain(numerator: number, denominator: number, gears: readonly number[]): GearTrain | null {
  const n = gears.length;
  let best: { train: GearTrain; size: number } | null = null;
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      if (b === a) continue;
      for (let c = 0; c < n; c++) {
        if (c === a || c === b) continue;
        for (let d = 0; d < n; d++) {
          if (d === a || d === b || d === c) continue;
          if (gears[a] * gears[c] * denominator !== gears[b] * gears[d] * numerator) continue;
          const size = gears[a] + gears[b] + gears[c] + gears[d];
          if (!best || size < best.size) {
            best = { train: { kind: 'compound', driver1: gears[a], driven1: gears[b], driver2: gears[c], driven2: gears[d] }, size };
          }
        }
      }
    }
  }
  return best?.train ?? null;
}

function trainWords(t: GearTrain): string {
  return t.kind === 'simple'
    ? `driver ${t.driver} teeth on the spindle, driven ${t.driven} teeth on the plate's shaft`
    : `driver ${t.driver1} to driven ${t.driven1}, then driver ${t.driver2} to driven ${t.driven2} (spindle to the plate's shaft)`;
}

function differentialSetup(divisions: number, ratio: number, circles: readonly number[], gears: readonly number[]): DifferentialSetup | null {
  const candidates: Array<{ a: number; move: IndexMove; num: number; den: number }> = [];
  for (let delta = 1; delta <= DIFFERENTIAL_SEARCH_SPAN; delta++) {
    for (const a of [divisions - delta, divisions + delta]) {
      if (a < 2 || a > MAX_DIVISIONS) continue;
      const { moves } = simpleMoves(a, ratio, circles);
      if (moves.length === 0) continue;
      const top = Math.abs(a - divisions) * ratio;
      const g = gcd(top, a);
      candidates.push({ a, move: moves[0], num: top / g, den: a / g });
    }
  }
  // Nearest A with a simple train; failing that, nearest with a compound one.
  // Among equally near A, the smaller gear ratio.
  const order = (x: { num: number; den: number }, y: { num: number; den: number }) => x.num / x.den - y.num / y.den;
  const byNearness = [...candidates].sort((x, y) => Math.abs(x.a - divisions) - Math.abs(y.a - divisions) || order(x, y));
  let found: { c: (typeof candidates)[number]; train: GearTrain } | null = null;
  for (const c of byNearness) {
    const train = gearTrain(c.num, c.den, gears);
    if (train) { found = { c, train }; break; }
  }
  if (!found) {
    for (const c of byNearness) {
      const train = compoundTrain(c.num, c.den, gears);
      if (train) { found = { c, train }; break; }
    }
  }
  if (!found) return null;
  const { c, train } = found;
  const plateDirection = c.a > divisions ? 'same' : 'opposite';
  return {
    approximateDivisions: c.a,
    index: c.move,
    gearRatio: { numerator: c.num, denominator: c.den, value: c.num / c.den },
    train,
    plateDirection,
    description: `Index as for ${c.a} divisions (${c.move.description}) with the plate unlocked and geared to the spindle, ${trainWords(train)}; the plate turns ${plateDirection === 'same' ? 'the same way as' : 'against'} the crank.`,
    notes: [
      'Withdraw the plate\'s stop pin so the plate can turn; the crank pin stays in the plate.',
      'Add idler gears to get the plate turning the right way; how many depends on the head — see its manual.',
      'Check the gears mesh and clear each other on your head before cutting.',
    ],
    source: SOURCES.differentialIndexing,
  };
}

/**
 * Simple indexing on a dividing head: ratio / divisions crank turns, the
 * fraction taken on a hole circle. Every circle that works is listed; the
 * smallest is proposed (fewest holes to count). When none works the result
 * says so and gives a differential set-up from the handbook method: index
 * for a number A near N, and gear the plate to the spindle at
 * (A − N) × ratio / A, plate turning with the crank when A > N.
 */
export function simpleIndexing(divisions: number, options: SimpleIndexingOptions = {}): SimpleIndexingResult {
  const n = requireNumber(divisions, 'divisions', { label: 'the number of divisions', min: 2, max: MAX_DIVISIONS, whole: true });
  const ratio = requireNumber(options.ratio ?? DEFAULT_WORM_RATIO, 'ratio', { label: 'the head\'s ratio', min: 1, max: 360, whole: true });
  const own = options.circles !== undefined;
  const circles = own
    ? [...new Set(readWholeList(options.circles, 'circles', 'hole circle', 2, 500, 60))].sort((a, b) => a - b)
    : [...DEFAULT_HOLE_CIRCLES];
  const gears = options.gears !== undefined
    ? readWholeList(options.gears, 'gears', 'change gear', 12, 200, 40)
    : [...DEFAULT_CHANGE_GEARS];
  const { moves, turns } = simpleMoves(n, ratio, circles);
  const possible = moves.length > 0;
  const differential = possible ? null : differentialSetup(n, ratio, circles, gears);
  const needed = turns.denominator;
  const message = possible
    ? `${moves[0].description} for each of ${n} divisions.`
    : differential
      ? `No hole circle given is a multiple of ${needed}, so simple indexing cannot give ${n} divisions. Use differential indexing as below, or a plate with a ${needed}-hole circle (or a multiple of it).`
      : `No hole circle given is a multiple of ${needed}, and no differential set-up was found with these plates and gears. A plate with a ${needed}-hole circle (or a multiple of it) would do it.`;
  return {
    divisions: n,
    ratio,
    turnsPerDivision: turns,
    degreesPerDivision: 360 / n,
    circles,
    circlesSource: own ? 'Your own hole circles' : SOURCES.indexPlates,
    possible,
    move: moves[0] ?? null,
    options: moves.filter((m) => m.circle !== null),
    differential,
    message,
    source: SOURCES.simpleIndexing,
  };
}

export interface DirectIndexingResult {
  divisions: number;
  plateHoles: number;
  holesToMove: number;
  degreesPerDivision: number;
  /** Every number of divisions this plate gives directly. */
  workableDivisions: number[];
  source: string;
}

function divisorsOf(n: number): number[] {
  const out: number[] = [];
  for (let d = 2; d <= n; d++) if (n % d === 0) out.push(d);
  return out;
}

/** Direct indexing with a plate on the spindle: plateHoles / divisions holes a move, or a refusal. */
export function directIndexing(divisions: number, plateHoles = 24): DirectIndexingResult {
  const holes = requireNumber(plateHoles, 'plateHoles', { label: 'the holes in the spindle plate', min: 2, max: 500, whole: true });
  const n = requireNumber(divisions, 'divisions', { label: 'the number of divisions', min: 2, max: holes, whole: true });
  const workable = divisorsOf(holes);
  if (holes % n !== 0) {
    throw new CalculatorError(
      'NOT_POSSIBLE', 'divisions',
      `A ${holes}-hole plate cannot give ${n} divisions directly: it gives ${workable.join(', ')}. Use the dividing head's crank (simple indexing) instead.`,
    );
  }
  return {
    divisions: n,
    plateHoles: holes,
    holesToMove: holes / n,
    degreesPerDivision: 360 / n,
    workableDivisions: workable,
    source: SOURCES.directIndexing,
  };
}

/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const INDEXING_RUNNERS: Runners<'simple-indexing' | 'direct-indexing'> = {
  'simple-indexing': (i) => simpleIndexing(i.divisions, { ratio: i.ratio, circles: i.circles, gears: i.gears }),
  'direct-indexing': (i) => directIndexing(i.divisions, i.plateHoles),
};
