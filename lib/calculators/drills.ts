/**
 * One drill chart: fractional, number and letter drills (ASME B94.11M) and
 * metric drills, each in both units.
 *
 *   drillSize('#7')     → 0.2010 in (5.105 mm)
 *   drillSize('27/64')  → 0.4219 in (10.716 mm)
 *   nearestDrills(6.78) → 6.8 mm, H, 17/64, 6.7 mm…
 */
import { CalculatorError } from './errors';
import { formatNumber } from '../units/format';
import { parseNumber } from '../units/parse';
import { lengthFromIn, lengthFromMm, type Length } from './units';
import { gcd, requireNumber, requireText } from './validate';
import type { Runners } from './registry';

export type DrillKind = 'fractional' | 'number' | 'letter' | 'metric';

export const DRILL_KINDS: readonly DrillKind[] = ['fractional', 'number', 'letter', 'metric'];
export const INCH_DRILL_KINDS: readonly DrillKind[] = ['fractional', 'number', 'letter'];
export const METRIC_DRILL_KINDS: readonly DrillKind[] = ['metric'];

export interface DrillSize {
  /** As written on the drill and in the chart: "27/64", "1-1/4", "#7", "F", "6.8 mm". */
  name: string;
  kind: DrillKind;
  diameterMm: number;
  diameterIn: number;
  diameter: Length;
  /** Other names in the chart for the very same diameter (1/4 is also letter E). */
  alsoNamed: string[];
}

/** Number drills #1…#80, inches (ASME B94.11M — from memory). */
const NUMBER_DRILLS_IN: readonly number[] = [
  0.2280, 0.2210, 0.2130, 0.2090, 0.2055, 0.2040, 0.2010, 0.1990, 0.1960, 0.1935, // 1–10
  0.1910, 0.1890, 0.1850, 0.1820, 0.1800, 0.1770, 0.1730, 0.1695, 0.1660, 0.1610, // 11–20
  0.1590, 0.1570, 0.1540, 0.1520, 0.1495, 0.1470, 0.1440, 0.1405, 0.1360, 0.1285, // 21–30
  0.1200, 0.1160, 0.1130, 0.1110, 0.1100, 0.1065, 0.1040, 0.1015, 0.0995, 0.0980, // 31–40
  0.0960, 0.0935, 0.0890, 0.0860, 0.0820, 0.0810, 0.0785, 0.0760, 0.0730, 0.0700, // 41–50
  0.0670, 0.0635, 0.0595, 0.0550, 0.0520, 0.0465, 0.0430, 0.0420, 0.0410, 0.0400, // 51–60
  0.0390, 0.0380, 0.0370, 0.0360, 0.0350, 0.0330, 0.0320, 0.0310, 0.0292, 0.0280, // 61–70
  0.0260, 0.0250, 0.0240, 0.0225, 0.0210, 0.0200, 0.0180, 0.0160, 0.0145, 0.0135, // 71–80
];

/** Letter drills A…Z, inches (ASME B94.11M — from memory). */
const LETTER_DRILLS_IN: readonly number[] = [
  0.234, 0.238, 0.242, 0.246, 0.250, 0.257, 0.261, 0.266, 0.272, 0.277, 0.281, 0.290, 0.295, // A–M
  0.302, 0.316, 0.323, 0.332, 0.339, 0.348, 0.358, 0.368, 0.377, 0.386, 0.397, 0.404, 0.413, // N–Z
];

/** Fractional drills: 1/64 in steps to 1-3/4 in, then 1/32 in steps to 2-1/4 in. */
function fractionalSixtyFourths(): number[] {
  const steps: number[] = [];
  for (let k = 1; k <= 112; k++) steps.push(k);
  for (let k = 114; k <= 144; k += 2) steps.push(k);
  return steps;
}

/**
 * 27 → "27/64", 16 → "1/4", 80 → "1-1/4", 64 → "1 in" (a whole inch keeps its
 * unit, so that it cannot be read as drill #1 or 1 mm).
 */
export function fractionName(sixtyFourths: number): string {
  const whole = Math.floor(sixtyFourths / 64);
  const rest = sixtyFourths % 64;
  if (rest === 0) return `${whole} in`;
  const g = gcd(rest, 64);
  const frac = `${rest / g}/${64 / g}`;
  return whole ? `${whole}-${frac}` : frac;
}

/**
 * Metric drills in hundredths of a millimetre: 0.5–3 mm by 0.05 mm (the small
 * tap drills such as 1.25 and 2.05 mm), 3–13 mm by 0.1 mm, then 0.5 mm steps
 * to 76 mm.
 */
function metricHundredths(): number[] {
  const out: number[] = [];
  for (let h = 50; h < 300; h += 5) out.push(h);
  for (let h = 300; h <= 1300; h += 10) out.push(h);
  for (let h = 1350; h <= 7600; h += 50) out.push(h);
  return out;
}

/** 680 → "6.8 mm", 125 → "1.25 mm", 1000 → "10 mm". */
function metricName(hundredths: number): string {
  return `${formatNumber(hundredths / 100, { maxDecimals: 2 })} mm`;
}

function makeDrill(name: string, kind: DrillKind, diameter: Length): DrillSize {
  return { name, kind, diameterMm: diameter.mm, diameterIn: diameter.in, diameter, alsoNamed: [] };
}

function buildChart(): DrillSize[] {
  const chart: DrillSize[] = [];
  for (const k of fractionalSixtyFourths()) chart.push(makeDrill(fractionName(k), 'fractional', lengthFromIn(k / 64)));
  NUMBER_DRILLS_IN.forEach((d, i) => chart.push(makeDrill(`#${i + 1}`, 'number', lengthFromIn(d))));
  LETTER_DRILLS_IN.forEach((d, i) => chart.push(makeDrill(String.fromCharCode(65 + i), 'letter', lengthFromIn(d))));
  for (const h of metricHundredths()) chart.push(makeDrill(metricName(h), 'metric', lengthFromMm(h / 100)));
  // Same diameter under two names (1/4 and E): each names the other.
  for (const a of chart) {
    a.alsoNamed = chart.filter((b) => b !== a && Math.abs(b.diameterMm - a.diameterMm) < 1e-6).map((b) => b.name);
  }
  return chart;
}

/** The whole chart, fractional first, then number, letter and metric drills. Read-only. */
export const DRILL_CHART: readonly DrillSize[] = Object.freeze(buildChart());

const BY_NAME = new Map(DRILL_CHART.map((d) => [d.name.toLowerCase(), d]));

/**
 * The chart with each diameter once (a drill also named otherwise is kept
 * under its first name in chart order: 1/4 rather than E).
 */
function distinctDrills(kinds: readonly DrillKind[]): DrillSize[] {
  const seen: DrillSize[] = [];
  for (const d of DRILL_CHART) {
    if (!kinds.includes(d.kind)) continue;
    if (seen.some((s) => Math.abs(s.diameterMm - d.diameterMm) < 1e-6)) continue;
    seen.push(d);
  }
  return seen;
}

const DISTINCT_CACHE = new Map<string, DrillSize[]>();
export function drillsOfKinds(kinds: readonly DrillKind[] = DRILL_KINDS): readonly DrillSize[] {
  const key = [...kinds].sort().join(',');
  let list = DISTINCT_CACHE.get(key);
  if (!list) {
    list = distinctDrills(kinds);
    DISTINCT_CACHE.set(key, list);
  }
  return list;
}

const NAME_HELP = 'Write a drill as 27/64, #7 (or No. 7), F or 6.8 mm.';

/**
 * A drill by its name. Accepts fractions ("27/64", "1-1/4", "1 1/4", "1/2 in"),
 * number drills with # or No. ("#7", "No. 7"), letters ("F", "f") and metric
 * sizes with their unit ("6.8 mm", "6,8mm"). A bare number is refused: "7"
 * could be #7 or 7 mm, and the difference is 1.9 mm.
 */
export function drillSize(name: string): DrillSize {
  const raw = requireText(name, 'name', 'a drill size');
  const s = raw.trim().replace(/\s+/g, ' ').replace(/[″"]$/, ' in').trim();

  const num = /^(?:#|no\.? ?|number ?)(\d{1,3})$/i.exec(s);
  if (num) {
    const n = Number(num[1]);
    if (n >= 1 && n <= 80) return BY_NAME.get(`#${n}`)!;
    throw new CalculatorError('UNKNOWN_DRILL', 'name', `Number drills run from #1 (0.2280 in) to #80 (0.0135 in); there is no #${n}.`);
  }

  if (/^[a-z]$/i.test(s)) return BY_NAME.get(s.toLowerCase())!;

  const metric = /^(\d{1,3}(?:[.,]\d+)?) ?mm$/i.exec(s);
  if (metric) {
    const mm = parseNumber(metric[1]) as number;
    const hundredths = Math.round(mm * 100);
    const found = Math.abs(mm * 100 - hundredths) < 1e-6 ? BY_NAME.get(metricName(hundredths).toLowerCase()) : undefined;
    if (found && found.kind === 'metric') return found;
    throw new CalculatorError(
      'UNKNOWN_DRILL', 'name',
      `${mm} mm is not in the metric drill chart here: 0.5 to 3 mm in 0.05 mm steps, 3 to 13 mm in 0.1 mm steps, then 0.5 mm steps to 76 mm.`,
    );
  }

  const frac = /^(?:(\d{1,2})(?: ?- ?| ))?(\d{1,3}) ?\/ ?(\d{1,3})(?: ?(?:in|inch))?$/i.exec(s)
    ?? /^(\d{1,2})()()(?: ?(?:in|inch))$/i.exec(s);
  if (frac) {
    const whole = frac[1] ? Number(frac[1]) : 0;
    const top = frac[2] ? Number(frac[2]) : 0;
    const bottom = frac[3] ? Number(frac[3]) : 1;
    if (bottom === 0 || 64 % bottom !== 0) {
      throw new CalculatorError('UNKNOWN_DRILL', 'name', `Fractional drills go in 64ths of an inch; ${s} is not one.`);
    }
    const sixtyFourths = whole * 64 + (top * 64) / bottom;
    const found = BY_NAME.get(fractionName(sixtyFourths).toLowerCase());
    if (found && found.kind === 'fractional') return found;
    throw new CalculatorError(
      'UNKNOWN_DRILL', 'name',
      'Fractional drills here run from 1/64 in to 1-3/4 in in 1/64 in steps, then in 1/32 in steps to 2-1/4 in.',
    );
  }

  if (/^\d+$/.test(s)) {
    throw new CalculatorError('UNREADABLE', 'name', `Say which drill ${s} is: #${s} for a number drill or ${s} mm for a metric one.`);
  }
  if (/^\d*[.,]\d+$/.test(s)) {
    throw new CalculatorError('UNREADABLE', 'name', `Give the unit: write ${s} mm for a metric drill. For a size in inches, look up the nearest drills instead.`);
  }
  throw new CalculatorError('UNREADABLE', 'name', `"${raw.trim()}" is not a drill size. ${NAME_HELP}`);
}

export interface DrillMatch {
  drill: DrillSize;
  /** Drill diameter minus the asked diameter: positive when the drill is larger. */
  difference: Length;
}

export interface NearestDrillsOptions {
  /** How many drills to return, 1–30; default 5. */
  count?: number;
  /** Which kinds of drill to consider; default all four. */
  kinds?: readonly DrillKind[];
  /** 'above' only drills at least the size (clearance holes), 'below' at most; default either side. */
  side?: 'any' | 'above' | 'below';
}

export function checkKinds(kinds: unknown, field = 'kinds'): readonly DrillKind[] {
  if (kinds === undefined) return DRILL_KINDS;
  if (!Array.isArray(kinds) || kinds.length === 0 || kinds.some((k) => !DRILL_KINDS.includes(k as DrillKind))) {
    throw new CalculatorError('UNKNOWN_CHOICE', field, `Choose one or more kinds of drill: ${DRILL_KINDS.join(', ')}.`);
  }
  return kinds as DrillKind[];
}

/**
 * The drills nearest to a diameter, closest first. Equally close drills: the
 * larger first. Each diameter appears once (1/4 rather than both 1/4 and E).
 */
export function nearestDrills(diameterMm: number, options: NearestDrillsOptions = {}): DrillMatch[] {
  const d = requireNumber(diameterMm, 'diameterMm', { label: 'the diameter', min: 0, minExclusive: true, max: 1000, unit: ' mm' });
  const count = requireNumber(options.count ?? 5, 'count', { label: 'the number of drills', min: 1, max: 30, whole: true });
  const kinds = checkKinds(options.kinds);
  const side = options.side ?? 'any';
  if (!['any', 'above', 'below'].includes(side)) {
    throw new CalculatorError('UNKNOWN_CHOICE', 'side', 'Choose drills on any side, above or below the size.');
  }
  const eps = 1e-9;
  return drillsOfKinds(kinds)
    .filter((drill) => (side === 'above' ? drill.diameterMm >= d - eps : side === 'below' ? drill.diameterMm <= d + eps : true))
    .map((drill) => ({ drill, diff: drill.diameterMm - d }))
    .sort((a, b) => Math.abs(a.diff) - Math.abs(b.diff) || b.drill.diameterMm - a.drill.diameterMm)
    .slice(0, count)
    .map(({ drill, diff }) => ({ drill, difference: lengthFromMm(diff) }));
}

/** The smallest drill of the given kinds at least `diameterMm` across, or null past the chart's end. */
export function drillAtLeast(diameterMm: number, kinds: readonly DrillKind[]): DrillSize | null {
  let best: DrillSize | null = null;
  for (const d of drillsOfKinds(kinds)) {
    if (d.diameterMm >= diameterMm - 1e-9 && (!best || d.diameterMm < best.diameterMm)) best = d;
  }
  return best;
}

/** The drill of the given kinds with exactly this diameter (to 0.0001 mm), if any. */
export function drillWithDiameter(diameterMm: number, kinds: readonly DrillKind[] = DRILL_KINDS): DrillSize | null {
  return drillsOfKinds(kinds).find((d) => Math.abs(d.diameterMm - diameterMm) < 1e-4) ?? null;
}


/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const DRILL_RUNNERS: Runners<'drill-size' | 'nearest-drills'> = {
  'drill-size': (i) => drillSize(i.name),
  'nearest-drills': (i) => nearestDrills(i.diameterMm, { count: i.count, kinds: i.kinds, side: i.side }),
};
