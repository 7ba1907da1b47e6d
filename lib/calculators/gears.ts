/**
 * Spur gear blanks and cutters, by module or by diametral pitch.
 *
 *   spurGear({ teeth: 36, module: 1.5 }) → pitch Ø54 mm, outside Ø57 mm, whole depth 3.375 mm, cutter No. 3
 *   spurGear({ teeth: 40, diametralPitch: 16 }) → pitch Ø2.500 in, outside Ø2.625 in
 */
import { CalculatorError, type CalculatorWarning } from './errors';
import { SOURCES } from './sources';
import { lengthFromIn, lengthFromMm, MM_PER_INCH, type Length } from './units';
import { requireChoice, requireNumber } from './validate';
import type { Runners } from './registry';

export type PressureAngle = 20 | 14.5;
export const PRESSURE_ANGLES: readonly PressureAngle[] = [20, 14.5];

export type SpurGearInput =
  | { teeth: number; module: number; diametralPitch?: undefined; pressureAngleDeg?: PressureAngle }
  | { teeth: number; diametralPitch: number; module?: undefined; pressureAngleDeg?: PressureAngle };

export interface SpurGearOptions {
  /** 20° (default) or 14.5°. */
  pressureAngleDeg?: PressureAngle;
}

export interface CutterRange {
  /** Cutter number as the tables number them: No. 1 for 135 teeth to a rack … No. 8 for 12–13 teeth. */
  number: number;
  minTeeth: number;
  /** null: up to a rack. */
  maxTeeth: number | null;
}

/** The eight involute cutters and the tooth counts each covers (from memory). */
export const INVOLUTE_CUTTERS: readonly CutterRange[] = [
  { number: 1, minTeeth: 135, maxTeeth: null },
  { number: 2, minTeeth: 55, maxTeeth: 134 },
  { number: 3, minTeeth: 35, maxTeeth: 54 },
  { number: 4, minTeeth: 26, maxTeeth: 34 },
  { number: 5, minTeeth: 21, maxTeeth: 25 },
  { number: 6, minTeeth: 17, maxTeeth: 20 },
  { number: 7, minTeeth: 14, maxTeeth: 16 },
  { number: 8, minTeeth: 12, maxTeeth: 13 },
];

export const MAX_TEETH = 1000;

export interface GearCutter extends CutterRange {
  /** "No. 3 (35 to 54 teeth)". */
  label: string;
  /** Many metric module cutter sets count the other way (No. 1 for 12–13 teeth); this is that number. */
  reverseNumber: number;
  note: string;
  source: string;
}

export type GearWarningCode = 'UNDERCUT' | 'NO_CUTTER';

export interface SpurGearResult {
  teeth: number;
  /** Module in mm (given, or 25.4 / DP). */
  module: number;
  /** Diametral pitch in teeth per inch of pitch diameter (given, or 25.4 / m). */
  diametralPitch: number;
  /** Which of the two the gear was given by; the standard for the tooth depth follows it. */
  system: 'module' | 'diametral-pitch';
  pressureAngleDeg: PressureAngle;
  pitchDiameter: Length;
  /** The blank to turn. */
  outsideDiameter: Length;
  rootDiameter: Length;
  addendum: Length;
  dedendum: Length;
  wholeDepth: Length;
  circularPitch: Length;
  /** Tooth thickness on the pitch circle, half the circular pitch. */
  toothThickness: Length;
  baseDiameter: Length;
  /** null below 12 teeth, which no cutter of the set covers. */
  cutter: GearCutter | null;
  warnings: CalculatorWarning<GearWarningCode>[];
  standard: string;
  sources: string[];
}

export function cutterFor(teeth: number): GearCutter | null {
  const range = INVOLUTE_CUTTERS.find((c) => teeth >= c.minTeeth && (c.maxTeeth === null || teeth <= c.maxTeeth));
  if (!range) return null;
  return {
    ...range,
    label: `No. ${range.number} (${range.minTeeth} ${range.maxTeeth === null ? 'teeth to a rack' : `to ${range.maxTeeth} teeth`})`,
    reverseNumber: 9 - range.number,
    note: `Some metric module cutter sets number the other way round, where this cutter is No. ${9 - range.number}: go by the tooth range printed on the cutter.`,
    source: SOURCES.gearCutters,
  };
}

/**
 * Sizes of a spur gear. By module: ISO 53 teeth (addendum m, whole depth
 * 2.25·m). By diametral pitch: full-depth teeth as cut by the usual involute
 * cutters (addendum 1/P, whole depth 2.157/P). The pressure angle changes the
 * base circle and which set of cutters to use, not the blank.
 */
export function spurGear(input: SpurGearInput, options: SpurGearOptions = {}): SpurGearResult {
  const teeth = requireNumber(input?.teeth, 'teeth', { label: 'the number of teeth', min: 6, max: MAX_TEETH, whole: true });
  const hasModule = input?.module !== undefined;
  const hasDp = input?.diametralPitch !== undefined;
  if (hasModule === hasDp) {
    throw hasModule
      ? new CalculatorError('NOT_POSSIBLE', 'diametralPitch', 'Give either the module or the diametral pitch, not both.')
      : new CalculatorError('NOT_A_NUMBER', 'module', 'Give the module (mm) or the diametral pitch.');
  }
  const pa = requireChoice(options.pressureAngleDeg ?? input?.pressureAngleDeg ?? 20, 'pressureAngleDeg', PRESSURE_ANGLES, 'a pressure angle of 20° or 14.5°');

  let moduleMm: number;
  let dp: number;
  let addendumMm: number;
  let dedendumMm: number;
  let standard: string;
  if (hasModule) {
    moduleMm = requireNumber(input.module, 'module', { label: 'the module', min: 0, minExclusive: true, max: 100, unit: ' mm' });
    dp = MM_PER_INCH / moduleMm;
    addendumMm = moduleMm;
    dedendumMm = 1.25 * moduleMm;
    standard = SOURCES.gearsModule;
  } else {
    dp = requireNumber(input.diametralPitch, 'diametralPitch', { label: 'the diametral pitch', min: 0, minExclusive: true, max: 200 });
    moduleMm = MM_PER_INCH / dp;
    addendumMm = MM_PER_INCH / dp;
    dedendumMm = (1.157 * MM_PER_INCH) / dp;
    standard = SOURCES.gearsDiametralPitch;
  }
  const pitchMm = hasModule ? moduleMm * teeth : (teeth / dp) * MM_PER_INCH;
  const circularPitchMm = Math.PI * moduleMm;
  const warnings: CalculatorWarning<GearWarningCode>[] = [];
  // Fewest teeth cut by a rack-form tool without undercut: 2 / sin²(α), the usual 17 at 20° and 32 at 14.5°.
  const minTeeth = Math.round(2 / Math.sin((pa * Math.PI) / 180) ** 2);
  if (teeth < minTeeth) {
    warnings.push({
      code: 'UNDERCUT',
      message: `Under ${minTeeth} teeth at ${pa}°, full-depth teeth are undercut at the root and weaker. Common practice.`,
    });
  }
  const cutter = cutterFor(teeth);
  if (!cutter) {
    warnings.push({ code: 'NO_CUTTER', message: 'The eight-cutter set starts at 12 teeth: fewer need a special cutter or a generating method.' });
  }
  const len = (mm: number) => (hasModule ? lengthFromMm(mm) : lengthFromIn(mm / MM_PER_INCH));
  return {
    teeth,
    module: moduleMm,
    diametralPitch: dp,
    system: hasModule ? 'module' : 'diametral-pitch',
    pressureAngleDeg: pa,
    pitchDiameter: len(pitchMm),
    outsideDiameter: len(pitchMm + 2 * addendumMm),
    rootDiameter: len(pitchMm - 2 * dedendumMm),
    addendum: len(addendumMm),
    dedendum: len(dedendumMm),
    wholeDepth: len(addendumMm + dedendumMm),
    circularPitch: len(circularPitchMm),
    toothThickness: len(circularPitchMm / 2),
    baseDiameter: len(pitchMm * Math.cos((pa * Math.PI) / 180)),
    cutter,
    warnings,
    standard,
    sources: [standard, SOURCES.gearCutters],
  };
}

/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const GEAR_RUNNERS: Runners<'spur-gear'> = {
  'spur-gear': (i) => spurGear(i),
};
