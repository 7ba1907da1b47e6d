/**
 * Clearance holes and counterbores for socket head cap screws.
 *
 *   clearanceHole('M8', 'close')   → 8.4 mm (ISO 273 fine series)
 *   clearanceHole('1/4-20', 'normal') → letter H, 0.2660 in
 *   counterbore('M8', { holeCentreToEdgeMm: 10 }) → Ø15 × 8.5 deep, 2.5 mm wall to the edge
 */
import { CalculatorError, type CalculatorWarning } from './errors';
import { drillAtLeast, drillSize, drillWithDiameter, INCH_DRILL_KINDS, METRIC_DRILL_KINDS, type DrillSize } from './drills';
import { SOURCES } from './sources';
import { formatMm } from '../units/format';
import { threadSpec, unifiedMajorIn, type ThreadSpec, type ThreadSystem } from './threads';
import { lengthFromIn, lengthFromMm, MM_PER_INCH, type Length } from './units';
import { gcd, requireChoice, requireNumber, requireText } from './validate';
import type { Runners } from './registry';

/** A wall is said to 0.01 mm. */
const WALL = { decimals: 2, maxDecimals: 2 };

export type ClearanceFit = 'close' | 'normal' | 'loose';
export const CLEARANCE_FITS: readonly ClearanceFit[] = ['close', 'normal', 'loose'];
/** The ISO 273 series behind each class. */
export const ISO_273_SERIES: Readonly<Record<ClearanceFit, 'fine' | 'medium' | 'coarse'>> = { close: 'fine', normal: 'medium', loose: 'coarse' };

/** ISO 273 clearance holes, mm: [fine, medium, coarse] by thread size (from memory). */
const ISO_273: ReadonlyMap<number, readonly [number, number, number]> = new Map([
  [1.6, [1.7, 1.8, 2]], [1.8, [2, 2.1, 2.2]], [2, [2.2, 2.4, 2.6]], [2.5, [2.7, 2.9, 3.1]],
  [3, [3.2, 3.4, 3.6]], [3.5, [3.7, 3.9, 4.2]], [4, [4.3, 4.5, 4.8]], [4.5, [4.8, 5, 5.3]],
  [5, [5.3, 5.5, 5.8]], [6, [6.4, 6.6, 7]], [7, [7.4, 7.6, 8]], [8, [8.4, 9, 10]],
  [10, [10.5, 11, 12]], [12, [13, 13.5, 14.5]], [14, [15, 15.5, 16.5]], [16, [17, 17.5, 18.5]],
  [18, [19, 20, 21]], [20, [21, 22, 24]], [22, [23, 24, 26]], [24, [25, 26, 28]],
  [27, [28, 30, 32]], [30, [31, 33, 35]], [33, [34, 36, 38]], [36, [37, 39, 42]],
  [39, [40, 42, 45]], [42, [43, 45, 48]], [45, [46, 48, 52]], [48, [50, 52, 56]],
  [52, [54, 56, 62]], [56, [58, 62, 66]], [60, [62, 66, 70]], [64, [66, 70, 74]],
]);

/** Inch close-fit and free-fit clearance drills by screw size (common shop tables, from memory). */
const INCH_CLEARANCE: ReadonlyMap<string, readonly [string, string]> = new Map([
  ['#0', ['#52', '#48']], ['#1', ['#48', '#43']], ['#2', ['#43', '#38']], ['#3', ['#37', '#32']],
  ['#4', ['#32', '#30']], ['#5', ['#30', '#27']], ['#6', ['#27', '#18']], ['#8', ['#18', '#9']],
  ['#10', ['#9', '#2']], ['#12', ['#2', 'D']], ['1/4', ['F', 'H']], ['5/16', ['P', 'Q']],
  ['3/8', ['W', 'X']], ['7/16', ['29/64', '15/32']], ['1/2', ['33/64', '17/32']], ['9/16', ['37/64', '19/32']],
  ['5/8', ['41/64', '21/32']], ['3/4', ['49/64', '25/32']], ['7/8', ['57/64', '29/32']], ['1', ['1-1/64', '1-1/32']],
  ['1-1/8', ['1-9/64', '1-5/32']], ['1-1/4', ['1-17/64', '1-9/32']], ['1-3/8', ['1-25/64', '1-13/32']], ['1-1/2', ['1-33/64', '1-17/32']],
]);

/** Loose inch holes: about 20 % over the screw, like ISO 273's coarse series, and always past the free fit. */
const LOOSE_FACTOR = 1.2;

export interface ScrewSize {
  system: ThreadSystem;
  /** "M8", "1/4", "#10". */
  size: string;
  majorDiameterMm: number;
  major: Length;
  /** The thread, when one was given ("1/4-20 UNC"); null for a bare size. */
  thread: ThreadSpec | null;
}

/**
 * A screw size from a bare size ("M8", "1/4", "1/4 in", "#10", "1-1/2") or a
 * full thread designation ("5/16-18 UNC", "M8x1"). A bare "1" is refused: it
 * could be #1 or 1 in.
 */
export function screwSize(text: string, field = 'size'): ScrewSize {
  const raw = requireText(text, field, 'a screw size, such as M8, 1/4 or #10');
  const trimmed = raw.trim().replace(/\s+/g, ' ');
  const inchUnit = /(?:[″"]| ?in| ?inch)$/i.test(trimmed);
  const s = trimmed.replace(/(?:[″"]| ?inch| ?in)$/i, '').trim();

  const bare = /^(?:# ?(\d{1,2})|(\d{1,2})|(?:(\d)(?: ?- ?| ))?(\d{1,2}) ?\/ ?(\d{1,2}))$/.exec(s);
  if (bare) {
    let size: string;
    if (bare[1] !== undefined || bare[2] !== undefined) {
      const n = Number(bare[1] ?? bare[2]);
      if (bare[2] !== undefined && inchUnit) {
        size = String(n);
      } else if (bare[2] !== undefined && n === 1) {
        throw new CalculatorError('UNREADABLE', field, 'Write #1 for the number size or 1 in for the one-inch screw.');
      } else {
        size = `#${n}`;
      }
    } else {
      const whole = bare[3] ? Number(bare[3]) : 0;
      const top = Number(bare[4]);
      const bottom = Number(bare[5]);
      const sixtyFourths = bottom > 0 ? whole * 64 + (top * 64) / bottom : NaN;
      if (!Number.isInteger(sixtyFourths)) {
        throw new CalculatorError('UNKNOWN_THREAD', field, `${s} is not an inch screw size.`);
      }
      const w = Math.floor(sixtyFourths / 64);
      const r = sixtyFourths % 64;
      const g = r ? gcd(r, 64) : 1;
      size = r === 0 ? String(w) : w ? `${w}-${r / g}/${64 / g}` : `${r / g}/${64 / g}`;
    }
    const majorIn = unifiedMajorIn(size);
    if (majorIn === null) {
      throw new CalculatorError('UNKNOWN_THREAD', field, `${size} is not among the inch screw sizes here (#0 to #12, then 1/4 to 1-1/2 in).`);
    }
    return { system: 'unified', size, majorDiameterMm: majorIn * MM_PER_INCH, major: lengthFromIn(majorIn), thread: null };
  }
  const thread = threadSpec(raw, field);
  return { system: thread.system, size: thread.size, majorDiameterMm: thread.majorDiameterMm, major: thread.major, thread };
}

export interface ClearanceHoleResult {
  screw: ScrewSize;
  fit: ClearanceFit;
  /** ISO 273 series for a metric screw (fine, medium, coarse); null for inch. */
  isoSeries: 'fine' | 'medium' | 'coarse' | null;
  /** The hole to make. */
  diameter: Length;
  /** The drill for it: the metric drill of that size, or the inch drill the inch tables name. */
  drill: DrillSize;
  /** The smallest drill of the other system at least as large (an inch drill for a metric screw and back). */
  drillOtherSystem: DrillSize | null;
  /** Hole minus screw diameter. */
  clearance: Length;
  source: string;
}

/**
 * Clearance hole for a screw in the close, normal or loose class: ISO 273
 * fine / medium / coarse for metric screws; for inch screws the usual
 * close-fit and free-fit drills, and a loose hole about 20 % over size.
 */
export function clearanceHole(size: string, fit: ClearanceFit = 'normal'): ClearanceHoleResult {
  const screw = screwSize(size);
  const cls = requireChoice(fit, 'fit', CLEARANCE_FITS, 'a fit: close, normal or loose');
  const index = CLEARANCE_FITS.indexOf(cls);
  let drill: DrillSize;
  let source: string;
  if (screw.system === 'metric') {
    const row = ISO_273.get(screw.majorDiameterMm);
    if (!row) throw new CalculatorError('NOT_TABULATED', 'size', `ISO 273 gives no clearance hole for ${screw.size} in the tables here.`);
    const found = drillWithDiameter(row[index], METRIC_DRILL_KINDS);
    if (!found) throw new CalculatorError('NOT_TABULATED', 'size', `No metric drill of ${row[index]} mm in the chart here.`);
    drill = found;
    source = SOURCES.metricClearance;
  } else {
    const row = INCH_CLEARANCE.get(screw.size);
    if (!row) throw new CalculatorError('NOT_TABULATED', 'size', `No inch clearance hole for ${screw.size} in the tables here.`);
    if (cls === 'loose') {
      const free = drillSize(row[1]);
      const wanted = Math.max(LOOSE_FACTOR * screw.majorDiameterMm, free.diameterMm + MM_PER_INCH / 64);
      const found = drillAtLeast(wanted, INCH_DRILL_KINDS);
      if (!found) throw new CalculatorError('NOT_TABULATED', 'size', `No inch drill large enough for a loose ${screw.size} hole in the chart here.`);
      drill = found;
      source = SOURCES.inchLooseClearance;
    } else {
      drill = drillSize(row[index]);
      source = SOURCES.inchClearance;
    }
  }
  const otherKinds = screw.system === 'metric' ? INCH_DRILL_KINDS : METRIC_DRILL_KINDS;
  return {
    screw,
    fit: cls,
    isoSeries: screw.system === 'metric' ? ISO_273_SERIES[cls] : null,
    diameter: drill.diameter,
    drill,
    drillOtherSystem: drillAtLeast(drill.diameterMm, otherKinds),
    clearance: lengthFromMm(drill.diameterMm - screw.majorDiameterMm),
    source,
  };
}

/** ISO 4762 heads, mm: [dk max, k max] (from memory). M14 is a non-preferred size. */
const ISO_4762: ReadonlyMap<number, readonly [number, number]> = new Map([
  [1.6, [3, 1.6]], [2, [3.8, 2]], [2.5, [4.5, 2.5]], [3, [5.5, 3]], [4, [7, 4]], [5, [8.5, 5]],
  [6, [10, 6]], [8, [13, 8]], [10, [16, 10]], [12, [18, 12]], [14, [21, 14]], [16, [24, 16]],
  [20, [30, 20]], [24, [36, 24]], [30, [45, 30]], [36, [54, 36]], [42, [63, 42]], [48, [72, 48]],
  [56, [84, 56]], [64, [96, 64]],
]);

/** DIN 974-1 counterbore diameters for ISO 4762 heads, mm (from memory); larger sizes follow the rule. */
const METRIC_COUNTERBORE: ReadonlyMap<number, number> = new Map([
  [1.6, 3.5], [2, 4.4], [2.5, 5.5], [3, 6.5], [4, 8], [5, 10], [6, 11], [8, 15], [10, 18], [12, 20],
  [14, 24], [16, 26], [20, 33], [24, 40], [30, 50], [36, 58],
]);

/** ASME B18.3 inch heads: [head diameter A max, head height H max, counterbore diameter], inches (from memory). */
const INCH_CAP_SCREW: ReadonlyMap<string, readonly [number, number, number]> = new Map([
  ['#0', [0.096, 0.060, 1 / 8]], ['#1', [0.118, 0.073, 5 / 32]], ['#2', [0.140, 0.086, 3 / 16]],
  ['#3', [0.161, 0.099, 7 / 32]], ['#4', [0.183, 0.112, 7 / 32]], ['#5', [0.205, 0.125, 1 / 4]],
  ['#6', [0.226, 0.138, 9 / 32]], ['#8', [0.270, 0.164, 5 / 16]], ['#10', [0.312, 0.190, 3 / 8]],
  ['1/4', [0.375, 0.250, 7 / 16]], ['5/16', [0.469, 0.3125, 17 / 32]], ['3/8', [0.562, 0.375, 5 / 8]],
  ['7/16', [0.656, 0.4375, 23 / 32]], ['1/2', [0.750, 0.500, 13 / 16]], ['5/8', [0.938, 0.625, 1]],
  ['3/4', [1.125, 0.750, 1 + 3 / 16]], ['7/8', [1.312, 0.875, 1 + 3 / 8]], ['1', [1.500, 1.000, 1 + 5 / 8]],
  ['1-1/4', [1.875, 1.250, 2]], ['1-1/2', [2.250, 1.500, 2 + 3 / 8]],
]);

/** Thinnest wall advised beside a counterbore: the larger of these (common practice). */
export const MIN_WALL_MM = 1.5;
export const MIN_WALL_HEAD_FRACTION = 0.1;

export type CounterboreWarningCode = 'THIN_WALL' | 'BREAKS_OUT';

export interface CounterboreOptions {
  /** Class of the through hole under the head; default 'normal'. */
  fit?: ClearanceFit;
  /** Distance from the hole's centre to the part's edge, mm. */
  holeCentreToEdgeMm?: number;
  /** Centre distance to the nearest neighbouring counterbored hole, mm. */
  holeSpacingMm?: number;
}

export interface CounterboreWall {
  /** Metal left between the counterbore and the edge (negative: it breaks out). */
  toEdge: Length | null;
  /** Metal left between this counterbore and the next. */
  betweenHoles: Length | null;
  /** The thinnest wall advised for this head. */
  minimumAdvised: Length;
}

export interface CounterboreResult {
  screw: ScrewSize;
  head: { diameter: Length; height: Length; source: string };
  counterbore: { diameter: Length; depth: Length; diameterRule: string; depthRule: string; source: string };
  throughHole: ClearanceHoleResult;
  wall: CounterboreWall;
  warnings: CalculatorWarning<CounterboreWarningCode>[];
}

function wallWarnings(label: string, wallMm: number, minMm: number): CalculatorWarning<CounterboreWarningCode>[] {
  if (wallMm <= 0) {
    return [{ code: 'BREAKS_OUT', message: `The counterbore breaks out ${label}: move the hole or use a smaller screw.` }];
  }
  if (wallMm < minMm) {
    return [{
      code: 'THIN_WALL',
      message: `Only ${formatMm(wallMm, WALL)} mm of wall ${label}, under the ${formatMm(minMm, WALL)} mm advised: it may bulge or crack when the screw is tightened. Common practice.`,
    }];
  }
  return [];
}

/**
 * Counterbore for a socket head cap screw: head from ISO 4762 / ASME B18.3,
 * counterbore diameter from the usual tables (metric sizes past M36: head
 * + about 10 %, rounded up to a whole millimetre), depth = head height plus a
 * small allowance, and the wall left to the edge or the next hole when given.
 */
export function counterbore(size: string, options: CounterboreOptions = {}): CounterboreResult {
  const screw = screwSize(size);
  const throughHole = clearanceHole(size, options.fit ?? 'normal');
  let headDia: Length;
  let headHeight: Length;
  let cbDia: Length;
  let depth: Length;
  let headSource: string;
  let cbSource: string;
  if (screw.system === 'metric') {
    const head = ISO_4762.get(screw.majorDiameterMm);
    if (!head) {
      throw new CalculatorError(
        'NOT_TABULATED', 'size',
        `ISO 4762 has no socket head cap screw ${screw.size}; sizes here: ${[...ISO_4762.keys()].map((d) => `M${d}`).join(', ')}.`,
      );
    }
    headDia = lengthFromMm(head[0]);
    headHeight = lengthFromMm(head[1]);
    const tabulated = METRIC_COUNTERBORE.get(screw.majorDiameterMm);
    cbDia = lengthFromMm(tabulated ?? Math.ceil(head[0] * 1.1 - 1e-9));
    cbSource = tabulated ? SOURCES.metricCounterbore : SOURCES.counterboreRule;
    depth = lengthFromMm(head[1] + (screw.majorDiameterMm <= 10 ? 0.5 : 1));
    headSource = SOURCES.metricCapScrew;
  } else {
    const row = INCH_CAP_SCREW.get(screw.size);
    if (!row) {
      throw new CalculatorError(
        'NOT_TABULATED', 'size',
        `No inch socket head cap screw ${screw.size} in the tables here; sizes: ${[...INCH_CAP_SCREW.keys()].join(', ')}.`,
      );
    }
    headDia = lengthFromIn(row[0]);
    headHeight = lengthFromIn(row[1]);
    cbDia = lengthFromIn(row[2]);
    depth = lengthFromIn(row[1] + (screw.majorDiameterMm <= 0.5 * MM_PER_INCH + 1e-9 ? 1 / 32 : 1 / 16));
    headSource = SOURCES.inchCapScrew;
    cbSource = SOURCES.inchCounterbore;
  }

  const minWallMm = Math.max(MIN_WALL_MM, MIN_WALL_HEAD_FRACTION * headDia.mm);
  const warnings: CalculatorWarning<CounterboreWarningCode>[] = [];
  let toEdge: Length | null = null;
  let between: Length | null = null;
  if (options.holeCentreToEdgeMm !== undefined) {
    const e = requireNumber(options.holeCentreToEdgeMm, 'holeCentreToEdgeMm', {
      label: 'the distance from the hole centre to the edge', min: 0, minExclusive: true, max: 10000, unit: ' mm',
    });
    toEdge = lengthFromMm(e - cbDia.mm / 2);
    warnings.push(...wallWarnings('to the edge', toEdge.mm, minWallMm));
  }
  if (options.holeSpacingMm !== undefined) {
    const p = requireNumber(options.holeSpacingMm, 'holeSpacingMm', {
      label: 'the distance to the next hole', min: 0, minExclusive: true, max: 10000, unit: ' mm',
    });
    between = lengthFromMm(p - cbDia.mm);
    warnings.push(...wallWarnings('between the holes', between.mm, minWallMm));
  }

  return {
    screw,
    head: { diameter: headDia, height: headHeight, source: headSource },
    counterbore: {
      diameter: cbDia,
      depth,
      diameterRule: 'From the usual counterbore tables, about the head diameter plus 1–3 mm (1/16–1/8 in); metric sizes the tables here do not hold: head + about 10 %, rounded up to a whole millimetre.',
      depthRule: SOURCES.counterboreDepth,
      source: cbSource,
    },
    throughHole,
    wall: { toEdge, betweenHoles: between, minimumAdvised: lengthFromMm(minWallMm) },
    warnings,
  };
}

/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const HOLE_RUNNERS: Runners<'clearance-hole' | 'counterbore'> = {
  'clearance-hole': (i) => clearanceHole(i.size, i.fit),
  counterbore: (i) => counterbore(i.size, { fit: i.fit, holeCentreToEdgeMm: i.holeCentreToEdgeMm, holeSpacingMm: i.holeSpacingMm }),
};
