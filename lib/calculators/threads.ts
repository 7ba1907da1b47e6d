/**
 * Screw threads, tap drills and percentage of thread.
 *
 *   threadSpec('5/16-18 UNC')    → major 7.9375 mm, pitch 1.4111 mm, 18 TPI
 *   threadPercent('1/4-20', 5.1054) → 75.4 % (a #7 drill)
 *   tapDrill('M8')               → 6.8 mm, 73.9 %
 */
import { CalculatorError, type CalculatorWarning } from './errors';
import {
  checkKinds, drillsOfKinds, drillWithDiameter, INCH_DRILL_KINDS, METRIC_DRILL_KINDS,
  type DrillKind, type DrillSize,
} from './drills';
import { SOURCES } from './sources';
import { formatNumber } from '../units/format';
import { lengthFromMm, MM_PER_INCH, type Length } from './units';
import { gcd, requireNumber, requireText } from './validate';
import type { Runners } from './registry';

export type ThreadSystem = 'unified' | 'metric';
export type ThreadSeries = 'UNC' | 'UNF' | 'coarse' | 'fine';

interface UnifiedSize {
  size: string;
  majorIn: number;
  unc?: number;
  unf?: number;
}

/** ASME B1.1 UNC and UNF, #0 to 1-1/2 in (from memory). #0 has no coarse thread. */
const UNIFIED: readonly UnifiedSize[] = [
  { size: '#0', majorIn: 0.060, unf: 80 },
  { size: '#1', majorIn: 0.073, unc: 64, unf: 72 },
  { size: '#2', majorIn: 0.086, unc: 56, unf: 64 },
  { size: '#3', majorIn: 0.099, unc: 48, unf: 56 },
  { size: '#4', majorIn: 0.112, unc: 40, unf: 48 },
  { size: '#5', majorIn: 0.125, unc: 40, unf: 44 },
  { size: '#6', majorIn: 0.138, unc: 32, unf: 40 },
  { size: '#8', majorIn: 0.164, unc: 32, unf: 36 },
  { size: '#10', majorIn: 0.190, unc: 24, unf: 32 },
  { size: '#12', majorIn: 0.216, unc: 24, unf: 28 },
  { size: '1/4', majorIn: 0.25, unc: 20, unf: 28 },
  { size: '5/16', majorIn: 0.3125, unc: 18, unf: 24 },
  { size: '3/8', majorIn: 0.375, unc: 16, unf: 24 },
  { size: '7/16', majorIn: 0.4375, unc: 14, unf: 20 },
  { size: '1/2', majorIn: 0.5, unc: 13, unf: 20 },
  { size: '9/16', majorIn: 0.5625, unc: 12, unf: 18 },
  { size: '5/8', majorIn: 0.625, unc: 11, unf: 18 },
  { size: '3/4', majorIn: 0.75, unc: 10, unf: 16 },
  { size: '7/8', majorIn: 0.875, unc: 9, unf: 14 },
  { size: '1', majorIn: 1, unc: 8, unf: 12 },
  { size: '1-1/8', majorIn: 1.125, unc: 7, unf: 12 },
  { size: '1-1/4', majorIn: 1.25, unc: 7, unf: 12 },
  { size: '1-3/8', majorIn: 1.375, unc: 6, unf: 12 },
  { size: '1-1/2', majorIn: 1.5, unc: 6, unf: 12 },
];

interface MetricSize {
  size: number;
  coarse: number;
  fine: readonly number[];
}

/**
 * ISO 261 / ISO 262 metric threads M1.6 to M64 (from memory): the coarse pitch
 * and the fine pitches in common use for each size.
 */
const METRIC: readonly MetricSize[] = [
  { size: 1.6, coarse: 0.35, fine: [] },
  { size: 1.8, coarse: 0.35, fine: [] },
  { size: 2, coarse: 0.4, fine: [] },
  { size: 2.5, coarse: 0.45, fine: [] },
  { size: 3, coarse: 0.5, fine: [0.35] },
  { size: 3.5, coarse: 0.6, fine: [] },
  { size: 4, coarse: 0.7, fine: [0.5] },
  { size: 4.5, coarse: 0.75, fine: [] },
  { size: 5, coarse: 0.8, fine: [0.5] },
  { size: 6, coarse: 1, fine: [0.75] },
  { size: 7, coarse: 1, fine: [] },
  { size: 8, coarse: 1.25, fine: [1, 0.75] },
  { size: 10, coarse: 1.5, fine: [1.25, 1, 0.75] },
  { size: 12, coarse: 1.75, fine: [1.5, 1.25, 1] },
  { size: 14, coarse: 2, fine: [1.5] },
  { size: 16, coarse: 2, fine: [1.5, 1] },
  { size: 18, coarse: 2.5, fine: [1.5] },
  { size: 20, coarse: 2.5, fine: [1.5, 1] },
  { size: 22, coarse: 2.5, fine: [1.5] },
  { size: 24, coarse: 3, fine: [2, 1.5] },
  { size: 27, coarse: 3, fine: [2] },
  { size: 30, coarse: 3.5, fine: [2, 1.5] },
  { size: 33, coarse: 3.5, fine: [2] },
  { size: 36, coarse: 4, fine: [3] },
  { size: 39, coarse: 4, fine: [3] },
  { size: 42, coarse: 4.5, fine: [3] },
  { size: 45, coarse: 4.5, fine: [3] },
  { size: 48, coarse: 5, fine: [3] },
  { size: 52, coarse: 5, fine: [4] },
  { size: 56, coarse: 5.5, fine: [4] },
  { size: 60, coarse: 5.5, fine: [4] },
  { size: 64, coarse: 6, fine: [4] },
];

/** Height of the fundamental triangle, H = (√3 / 2)·P. */
const H_PER_P = Math.sqrt(3) / 2;
/** Basic depth of the nut's thread, 5H/8 per side (D1 = D − 2 × 5H/8). */
const BASIC_DEPTH_PER_P = (5 / 8) * H_PER_P;
/**
 * The percentage-of-thread relation counts a full thread as a double depth of
 * 3H/4, i.e. 1.299·P (the handbook's 0.01299 in × TPI constant). By it the
 * nut's basic minor diameter is about 83 %, so 100 % is never drilled.
 */
export const FULL_THREAD_DOUBLE_DEPTH_PER_P = 2 * (3 / 4) * H_PER_P;

/** Engagement above this is hard to tap (common practice). */
export const HIGH_ENGAGEMENT_PERCENT = 85;
/** Engagement below this makes a weak thread (common practice). */
export const LOW_ENGAGEMENT_PERCENT = 60;
/** The shop's usual target. */
export const DEFAULT_TARGET_PERCENT = 75;

export interface ThreadPitchOption {
  designation: string;
  series: ThreadSeries;
  pitchMm: number;
  tpi: number | null;
}

export interface ThreadSpec {
  system: ThreadSystem;
  /** Normalised: "5/16-18 UNC", "#10-32 UNF", "M8" (coarse), "M8x1" (fine). */
  designation: string;
  /** The same with the pitch always written: "M8x1.25". */
  designationWithPitch: string;
  /** The size alone: "5/16", "#10", "M8". */
  size: string;
  series: ThreadSeries;
  majorDiameterMm: number;
  pitchMm: number;
  /** Threads per inch for unified threads; null for metric. */
  tpi: number | null;
  major: Length;
  pitch: Length;
  /** Height of the fundamental triangle H. */
  fundamentalHeight: Length;
  /** Basic thread depth of the nut (5H/8 per side). */
  basicThreadDepth: Length;
  /** Basic pitch diameter D2 = D − 0.649519·P. */
  pitchDiameter: Length;
  /** Basic minor diameter of the internal thread D1 = D − 1.082532·P. */
  minorDiameterInternal: Length;
  /** Class or tolerance written after the designation ("2B", "6H"), as typed; not used in the sums. */
  classOrTolerance: string | null;
  /** The other pitches the tables hold for the same size. */
  otherPitches: ThreadPitchOption[];
  source: string;
}

const HELP = 'Write a thread as 5/16-18 UNC, 1/4-20, #10-32, M8 or M8x1.25.';

const fmtNumber = (n: number): string => formatNumber(n, { maxDecimals: 4 });

function unifiedDesignation(u: UnifiedSize, series: 'UNC' | 'UNF'): string {
  return `${u.size}-${series === 'UNC' ? u.unc : u.unf} ${series}`;
}

function metricDesignation(m: MetricSize, pitch: number, withPitch: boolean): string {
  return pitch === m.coarse && !withPitch ? `M${fmtNumber(m.size)}` : `M${fmtNumber(m.size)}x${fmtNumber(pitch)}`;
}

function buildSpec(args: {
  system: ThreadSystem; designation: string; designationWithPitch: string; size: string; series: ThreadSeries;
  majorMm: number; pitchMm: number; tpi: number | null; classOrTolerance: string | null; otherPitches: ThreadPitchOption[];
}): ThreadSpec {
  const { majorMm, pitchMm } = args;
  return {
    system: args.system,
    designation: args.designation,
    designationWithPitch: args.designationWithPitch,
    size: args.size,
    series: args.series,
    majorDiameterMm: majorMm,
    pitchMm,
    tpi: args.tpi,
    major: lengthFromMm(majorMm),
    pitch: lengthFromMm(pitchMm),
    fundamentalHeight: lengthFromMm(H_PER_P * pitchMm),
    basicThreadDepth: lengthFromMm(BASIC_DEPTH_PER_P * pitchMm),
    pitchDiameter: lengthFromMm(majorMm - 0.75 * H_PER_P * pitchMm),
    minorDiameterInternal: lengthFromMm(majorMm - 2 * BASIC_DEPTH_PER_P * pitchMm),
    classOrTolerance: args.classOrTolerance,
    otherPitches: args.otherPitches,
    source: args.system === 'unified' ? SOURCES.unifiedThreads : SOURCES.metricThreads,
  };
}

function clean(raw: string): string {
  return raw
    .trim()
    .replace(/[×*]/g, 'x')
    .replace(/[‐‑‒–—−]/g, '-')
    .replace(/,/g, '.')
    .replace(/\s+/g, ' ');
}

function readMetric(s: string, field: string): ThreadSpec | null {
  const m = /^m ?(\d{1,3}(?:\.\d+)?)(?: ?x ?(\d{1,2}(?:\.\d+)?))?(?: ?-? ?(\d[a-h](?:\d[a-h])?(?: ?\/ ?\d[a-h](?:\d[a-h])?)?))?$/i.exec(s);
  if (!m) return null;
  const size = Number(m[1]);
  const row = METRIC.find((r) => Math.abs(r.size - size) < 1e-9);
  if (!row) {
    throw new CalculatorError(
      'UNKNOWN_THREAD', field,
      `M${fmtNumber(size)} is not among the metric threads here (ISO 262 sizes M1.6 to M64: ${METRIC.map((r) => `M${fmtNumber(r.size)}`).join(', ')}).`,
    );
  }
  const pitch = m[2] === undefined ? row.coarse : Number(m[2]);
  const pitches = [row.coarse, ...row.fine];
  if (!pitches.some((p) => Math.abs(p - pitch) < 1e-9)) {
    const fine = row.fine.length ? ` or ${row.fine.map((p) => `${fmtNumber(p)} mm`).join(', ')} (fine)` : '';
    throw new CalculatorError(
      'UNKNOWN_THREAD', field,
      `M${fmtNumber(size)} comes in ${fmtNumber(row.coarse)} mm (coarse)${fine} pitch here; ${fmtNumber(pitch)} mm is not one of them.`,
    );
  }
  const exact = pitches.find((p) => Math.abs(p - pitch) < 1e-9)!;
  const series: ThreadSeries = exact === row.coarse ? 'coarse' : 'fine';
  return buildSpec({
    system: 'metric',
    designation: metricDesignation(row, exact, false),
    designationWithPitch: metricDesignation(row, exact, true),
    size: `M${fmtNumber(row.size)}`,
    series,
    majorMm: row.size,
    pitchMm: exact,
    tpi: null,
    classOrTolerance: m[3] ? m[3].replace(/\s/g, '') : null,
    otherPitches: pitches.filter((p) => p !== exact).map((p) => ({
      designation: metricDesignation(row, p, false), series: p === row.coarse ? 'coarse' : 'fine', pitchMm: p, tpi: null,
    })),
  });
}

/** Candidate size names for the text before the TPI ("1" could be 1 in or #1). */
function unifiedSizeCandidates(text: string): string[] {
  const t = text.replace(/\s+/g, ' ').trim();
  const numbered = /^# ?(\d{1,2})$/.exec(t);
  if (numbered) return [`#${Number(numbered[1])}`];
  const bare = /^(\d{1,2})$/.exec(t);
  if (bare) {
    const n = Number(bare[1]);
    return n === 1 ? ['1', '#1'] : [`#${n}`, String(n)];
  }
  const frac = /^(?:(\d{1,2})(?: ?- ?| ))?(\d{1,2}) ?\/ ?(\d{1,2})$/.exec(t);
  if (frac) {
    const whole = frac[1] ? Number(frac[1]) : 0;
    const top = Number(frac[2]);
    const bottom = Number(frac[3]);
    if (bottom === 0) return [];
    const sixtyFourths = whole * 64 + (top * 64) / bottom;
    if (!Number.isInteger(sixtyFourths)) return [t];
    const w = Math.floor(sixtyFourths / 64);
    const r = sixtyFourths % 64;
    if (r === 0) return [String(w)];
    const g = gcd(r, 64);
    return [w ? `${w}-${r / g}/${64 / g}` : `${r / g}/${64 / g}`];
  }
  return [t];
}

function readUnified(s: string, field: string): ThreadSpec | null {
  const m = /^(\d{1,2}(?: ?- ?| )\d{1,2} ?\/ ?\d{1,2}|\d{1,2} ?\/ ?\d{1,2}|# ?\d{1,2}|\d{1,2})(?: ?(?:"|in))? ?- ?(\d{1,3})(?: ?(unc|unf|unef|un))?(?: ?-? ?([123][ab]))?$/i.exec(s);
  if (!m) return null;
  const tpi = Number(m[2]);
  const written = m[3]?.toUpperCase();
  if (written === 'UNEF') {
    throw new CalculatorError('UNKNOWN_THREAD', field, 'Extra-fine (UNEF) threads are not in the tables here: only UNC and UNF.');
  }
  const candidates = unifiedSizeCandidates(m[1]);
  const rows = candidates.map((c) => UNIFIED.find((u) => u.size === c)).filter((u): u is UnifiedSize => !!u);
  if (rows.length === 0) {
    throw new CalculatorError(
      'UNKNOWN_THREAD', field,
      `${candidates[0] ?? m[1]} is not among the unified thread sizes here (#0 to #12, then 1/4 to 1-1/2 in).`,
    );
  }
  for (const row of rows) {
    const series = row.unc === tpi ? 'UNC' : row.unf === tpi ? 'UNF' : null;
    if (!series) continue;
    if (written && written !== 'UN' && written !== series) {
      throw new CalculatorError('UNKNOWN_THREAD', field, `${row.size}-${tpi} is ${series}, not ${written}.`);
    }
    const other: 'UNC' | 'UNF' = series === 'UNC' ? 'UNF' : 'UNC';
    const otherTpi = other === 'UNC' ? row.unc : row.unf;
    return buildSpec({
      system: 'unified',
      designation: unifiedDesignation(row, series),
      designationWithPitch: unifiedDesignation(row, series),
      size: row.size,
      series,
      majorMm: row.majorIn * MM_PER_INCH,
      pitchMm: MM_PER_INCH / tpi,
      tpi,
      classOrTolerance: m[4] ? m[4].toUpperCase() : null,
      otherPitches: otherTpi
        ? [{ designation: unifiedDesignation(row, other), series: other, pitchMm: MM_PER_INCH / otherTpi, tpi: otherTpi }]
        : [],
    });
  }
  const row = rows[0];
  const choices = [row.unc ? `${row.unc} (UNC)` : null, row.unf ? `${row.unf} (UNF)` : null].filter(Boolean).join(' or ');
  const label = row.size.startsWith('#') ? `${row.size} threads` : `${row.size} in threads`;
  throw new CalculatorError('UNKNOWN_THREAD', field, `${label} here are ${choices} threads per inch; ${tpi} is not one of them.`);
}

/**
 * Reads a thread designation. Spacing, case and the series are lenient
 * ("1/4-20", "1/4 - 20 unc", "10-24 UNC", "#10-32", " m8 x 1.25 ", "M10x1");
 * a class or tolerance after it ("-2B", "-6H") is kept but not used. A size or
 * pitch the tables do not hold is refused, with the ones they do.
 */
export function threadSpec(designation: string, field = 'designation'): ThreadSpec {
  const raw = requireText(designation, field, 'a thread, such as M8 or 1/4-20');
  const s = clean(raw);
  const spec = readMetric(s, field) ?? readUnified(s, field);
  if (spec) return spec;
  if (/^m/i.test(s)) {
    throw new CalculatorError('UNREADABLE', field, `"${raw.trim()}" is not a metric thread. Write it as M8 or M8x1.25.`);
  }
  if (/^(?:#? ?\d+|\d+ ?\/ ?\d+|\d+(?: ?- ?| )\d+ ?\/ ?\d+)$/.test(s)) {
    throw new CalculatorError('UNREADABLE', field, `Give the threads per inch too, as in ${s.startsWith('#') ? '#10-32' : '1/4-20'}.`);
  }
  throw new CalculatorError('UNREADABLE', field, `"${raw.trim()}" is not a thread. ${HELP}`);
}

/** Every thread in the tables, unified first (UNC before UNF), then metric coarse before fine. */
export function listThreads(): ThreadPitchOption[] {
  const out: ThreadPitchOption[] = [];
  for (const u of UNIFIED) {
    if (u.unc) out.push({ designation: unifiedDesignation(u, 'UNC'), series: 'UNC', pitchMm: MM_PER_INCH / u.unc, tpi: u.unc });
    if (u.unf) out.push({ designation: unifiedDesignation(u, 'UNF'), series: 'UNF', pitchMm: MM_PER_INCH / u.unf, tpi: u.unf });
  }
  for (const m of METRIC) {
    out.push({ designation: metricDesignation(m, m.coarse, false), series: 'coarse', pitchMm: m.coarse, tpi: null });
    for (const p of m.fine) out.push({ designation: metricDesignation(m, p, false), series: 'fine', pitchMm: p, tpi: null });
  }
  return out;
}

export type ThreadWarningCode = 'HIGH_ENGAGEMENT' | 'LOW_ENGAGEMENT' | 'FAR_FROM_TARGET';

function percentFor(spec: ThreadSpec, drillMm: number): number {
  return ((spec.majorDiameterMm - drillMm) / (FULL_THREAD_DOUBLE_DEPTH_PER_P * spec.pitchMm)) * 100;
}

function drillForPercent(spec: ThreadSpec, percent: number): number {
  return spec.majorDiameterMm - (percent / 100) * FULL_THREAD_DOUBLE_DEPTH_PER_P * spec.pitchMm;
}

function engagementWarnings(percent: number): CalculatorWarning<ThreadWarningCode>[] {
  const p = Math.round(percent);
  if (percent > HIGH_ENGAGEMENT_PERCENT) {
    return [{
      code: 'HIGH_ENGAGEMENT',
      message: `About ${p} % of thread is hard to tap: the tap works much harder and may bind and break, above all in small sizes and tough steel. The thread gains little strength past about 75 %. Common practice.`,
    }];
  }
  if (percent < LOW_ENGAGEMENT_PERCENT) {
    return [{
      code: 'LOW_ENGAGEMENT',
      message: `Only about ${p} % of thread: a weak thread that may strip under load. Use a smaller drill or a longer engagement. Common practice.`,
    }];
  }
  return [];
}

export interface ThreadPercentResult {
  thread: ThreadSpec;
  drill: Length;
  /** The chart drill with exactly this diameter, if there is one. */
  drillSize: DrillSize | null;
  /** Percentage of thread by the handbook relation. */
  percent: number;
  /** Radial depth of thread left to the tap, (major − drill) / 2. */
  threadDepth: Length;
  warnings: CalculatorWarning<ThreadWarningCode>[];
  /** The relation used, in words. */
  relation: string;
  source: string;
}

export const THREAD_PERCENT_RELATION = '% of thread = (major diameter − drill) / (1.299 × pitch) × 100 (inch: TPI × (major − drill) / 0.01299)';

/**
 * Percentage of thread a drill leaves for the tap:
 * % = (major − drill) / (1.299·P) × 100, the handbook relation that counts a
 * full thread as a double depth of 3H/4. 1/4-20 with a #7 drill gives 75.4 %.
 */
export function threadPercent(designation: string, drillDiameterMm: number): ThreadPercentResult {
  const thread = threadSpec(designation);
  const drill = requireNumber(drillDiameterMm, 'drillDiameterMm', { label: 'the drill diameter', min: 0, minExclusive: true, max: 1000, unit: ' mm' });
  const percent = percentFor(thread, drill);
  if (percent <= 0) {
    throw new CalculatorError(
      'NOT_POSSIBLE', 'drillDiameterMm',
      `A ${fmtNumber(drill)} mm drill is as large as the ${thread.designation} thread's major diameter (${fmtNumber(thread.majorDiameterMm)} mm): it leaves nothing to tap.`,
    );
  }
  // A hair over 100 % is floating-point noise from a drill computed for exactly a full thread.
  if (percent > 100 + 1e-9) {
    throw new CalculatorError(
      'NOT_POSSIBLE', 'drillDiameterMm',
      `A ${fmtNumber(drill)} mm drill is too small for ${thread.designation}: the tap would have to cut more than a full thread (${Math.round(percent)} %).`,
    );
  }
  return {
    thread,
    drill: lengthFromMm(drill),
    drillSize: drillWithDiameter(drill),
    percent,
    threadDepth: lengthFromMm((thread.majorDiameterMm - drill) / 2),
    warnings: engagementWarnings(percent),
    relation: THREAD_PERCENT_RELATION,
    source: SOURCES.threadPercent,
  };
}

export type TapKind = 'taper' | 'plug' | 'bottoming';

export interface BlindHoleAllowance {
  tap: TapKind;
  /** Length of the tap's chamfer in threads (pitches), as usually made. */
  chamferPitches: readonly [number, number];
  /** Extra drill depth beyond the last full thread to clear that chamfer. */
  extraDepth: { min: Length; max: Length };
  note: string;
}

export interface BlindHoleGuide {
  allowances: BlindHoleAllowance[];
  /** Length of a 118° drill point on the chosen drill (about 0.3 × diameter), to add beyond the drilled depth. */
  drillPoint: Length;
  note: string;
  source: string;
}

const TAP_CHAMFERS: ReadonlyArray<readonly [TapKind, number, number, string]> = [
  ['taper', 7, 10, 'Starts the thread easily and cuts gently; needs the deepest hole. Best for through holes and hard material.'],
  ['plug', 3, 5, 'The usual tap for most holes; follow a taper tap in tough material.'],
  ['bottoming', 1, 2, 'Finishes the thread close to the bottom of a blind hole, after a plug tap has started it.'],
];

function blindHoleGuide(spec: ThreadSpec, drillMm: number): BlindHoleGuide {
  return {
    allowances: TAP_CHAMFERS.map(([tap, lo, hi, note]) => ({
      tap,
      chamferPitches: [lo, hi] as const,
      extraDepth: { min: lengthFromMm(lo * spec.pitchMm), max: lengthFromMm(hi * spec.pitchMm) },
      note,
    })),
    drillPoint: lengthFromMm(0.3 * drillMm),
    note: 'In a blind hole, drill deeper than the full thread needed by at least the chamfer of the tap that goes deepest, plus the drill point, and leave room for chips. Common practice: check the chamfer on your own taps.',
    source: SOURCES.tapDepth,
  };
}

export interface TapDrillChoice {
  drill: DrillSize;
  percent: number;
  /** percent − target, in percentage points. */
  offTarget: number;
}

export interface TapDrillOptions {
  /** Kinds of drill to choose from; default all four. */
  kinds?: readonly DrillKind[];
}

export interface TapDrillResult {
  thread: ThreadSpec;
  targetPercent: number;
  /** The exact diameter that would give the target. */
  idealDrill: Length;
  /** The chart drill nearest the target among the kinds asked for. */
  choice: TapDrillChoice;
  /** The best inch drill (fractional, number or letter) and the best metric drill, whatever the kinds asked for. */
  bestInch: TapDrillChoice | null;
  bestMetric: TapDrillChoice | null;
  /** The next closest drills among the kinds asked for, closest first. */
  alternatives: TapDrillChoice[];
  warnings: CalculatorWarning<ThreadWarningCode>[];
  blindHole: BlindHoleGuide;
  relation: string;
  tieRule: string;
  sources: string[];
}

export const TAP_DRILL_TIE_RULE = 'Drills equally close to the target (within 0.01 percentage point) give way to the larger one: it is easier on the tap.';

function rankChoices(spec: ThreadSpec, target: number, kinds: readonly DrillKind[]): TapDrillChoice[] {
  return drillsOfKinds(kinds)
    .map((drill) => {
      const percent = percentFor(spec, drill.diameterMm);
      return { drill, percent, offTarget: percent - target };
    })
    .filter((c) => c.percent > 0 && c.percent <= 100)
    .sort((a, b) => {
      const da = Math.round(Math.abs(a.offTarget) * 100);
      const db = Math.round(Math.abs(b.offTarget) * 100);
      return da - db || b.drill.diameterMm - a.drill.diameterMm;
    });
}

/**
 * The chart drill that comes closest to the target percentage of thread,
 * with the percentage it really gives, the nearest alternatives, the best inch
 * and metric drill, warnings and the blind-hole allowances for each tap.
 */
export function tapDrill(designation: string, targetPercent: number = DEFAULT_TARGET_PERCENT, options: TapDrillOptions = {}): TapDrillResult {
  const thread = threadSpec(designation);
  const target = requireNumber(targetPercent, 'targetPercent', { label: 'the target percentage of thread', min: 30, max: 100, unit: ' %' });
  const kinds = checkKinds(options.kinds);
  const ranked = rankChoices(thread, target, kinds);
  if (ranked.length === 0) {
    throw new CalculatorError('NOT_POSSIBLE', 'kinds', `No drill of the kinds chosen can tap ${thread.designation}.`);
  }
  const choice = ranked[0];
  const warnings = engagementWarnings(choice.percent);
  if (Math.abs(choice.offTarget) > 5) {
    warnings.push({
      code: 'FAR_FROM_TARGET',
      message: `The nearest drill gives ${Math.round(choice.percent)} %, more than 5 points from the ${fmtNumber(target)} % asked for. Another kind of drill may come closer.`,
    });
  }
  return {
    thread,
    targetPercent: target,
    idealDrill: lengthFromMm(drillForPercent(thread, target)),
    choice,
    bestInch: rankChoices(thread, target, INCH_DRILL_KINDS)[0] ?? null,
    bestMetric: rankChoices(thread, target, METRIC_DRILL_KINDS)[0] ?? null,
    alternatives: ranked.slice(1, 5),
    warnings,
    blindHole: blindHoleGuide(thread, choice.drill.diameterMm),
    relation: THREAD_PERCENT_RELATION,
    tieRule: TAP_DRILL_TIE_RULE,
    sources: [thread.source, SOURCES.threadPercent, SOURCES.drills, SOURCES.tapDepth],
  };
}

/** Unified size name → major diameter in inches, for the hole tables. */
export function unifiedMajorIn(size: string): number | null {
  return UNIFIED.find((u) => u.size === size)?.majorIn ?? null;
}


/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const THREAD_RUNNERS: Runners<'thread-spec' | 'thread-percent' | 'tap-drill'> = {
  'thread-spec': (i) => threadSpec(i.designation),
  'thread-percent': (i) => threadPercent(i.designation, i.drillDiameterMm),
  'tap-drill': (i) => tapDrill(i.designation, i.targetPercent, { kinds: i.kinds }),
};
