/**
 * Spindle speed from cutting speed and diameter, and starting cutting speeds.
 *
 *   spindleSpeed({ cuttingSpeed: 30, unit: 'm/min', diameterMm: 8 }) → 1194 rev/min
 *   spindleSpeed({ cuttingSpeed: 100, unit: 'sfm', diameterMm: 25.4 }) → 382 rev/min
 */
import { CalculatorError } from './errors';
import { SOURCES } from './sources';
import { lengthFromMm, MM_PER_INCH, type Length } from './units';
import { requireChoice, requireNumber } from './validate';
import type { Runners } from './registry';

export type CuttingSpeedUnit = 'm/min' | 'sfm';
export const CUTTING_SPEED_UNITS: readonly CuttingSpeedUnit[] = ['m/min', 'sfm'];
/** Metres in a foot: 1 ft/min = 0.3048 m/min. */
export const M_PER_FT = 0.3048;

export interface SpindleSpeedInput {
  cuttingSpeed: number;
  unit: CuttingSpeedUnit;
  /** Diameter of the work (turning) or of the cutter (drilling, milling), mm. */
  diameterMm: number;
}

export interface SpindleSpeedResult {
  rpm: number;
  cuttingSpeed: { mPerMin: number; sfm: number };
  diameter: Length;
  formula: string;
  source: string;
}

/** rev/min = 1000·v / (π·d) for v in m/min and d in mm (the same as 12·v / (π·d) in ft/min and inches). */
export function spindleSpeed(input: SpindleSpeedInput): SpindleSpeedResult {
  const unit = requireChoice(input?.unit, 'unit', CUTTING_SPEED_UNITS, 'the unit of cutting speed');
  const v = requireNumber(input?.cuttingSpeed, 'cuttingSpeed', {
    label: 'the cutting speed', min: 0, minExclusive: true, max: unit === 'sfm' ? 10000 : 3000, unit: ` ${unit}`,
  });
  const d = requireNumber(input?.diameterMm, 'diameterMm', { label: 'the diameter', min: 0, minExclusive: true, max: 5000, unit: ' mm' });
  const mPerMin = unit === 'm/min' ? v : v * M_PER_FT;
  const rpm = unit === 'm/min' ? (1000 * v) / (Math.PI * d) : (12 * v) / (Math.PI * (d / MM_PER_INCH));
  return {
    rpm,
    cuttingSpeed: { mPerMin, sfm: unit === 'sfm' ? v : v / M_PER_FT },
    diameter: lengthFromMm(d),
    formula: unit === 'm/min' ? 'rev/min = 1000 × v / (π × d), v in m/min, d in mm' : 'rev/min = 12 × v / (π × d), v in ft/min, d in inches',
    source: SOURCES.spindleSpeed,
  };
}

export type WorkMaterial = 'aluminium' | 'brass' | 'cast-iron' | 'mild-steel' | 'medium-carbon-steel' | 'stainless-steel' | 'tool-steel';
export type ToolMaterial = 'hss' | 'carbide';
export const TOOL_MATERIALS: readonly ToolMaterial[] = ['hss', 'carbide'];
export const TOOL_MATERIAL_NAMES: Readonly<Record<ToolMaterial, string>> = { hss: 'High-speed steel', carbide: 'Carbide' };

export interface SpeedRange {
  sfm: readonly [number, number];
  mPerMin: readonly [number, number];
}

export interface CuttingSpeedRow {
  material: WorkMaterial;
  name: string;
  hss: SpeedRange;
  carbide: SpeedRange;
  note: string;
  source: string;
}

/** m/min to the nearest 5, as the tables round them. */
function toMetric(sfm: readonly [number, number]): readonly [number, number] {
  return [Math.round((sfm[0] * M_PER_FT) / 5) * 5, Math.round((sfm[1] * M_PER_FT) / 5) * 5];
}

function row(material: WorkMaterial, name: string, hss: [number, number], carbide: [number, number], note: string): CuttingSpeedRow {
  return {
    material, name, note, source: SOURCES.cuttingSpeeds,
    hss: { sfm: hss, mPerMin: toMetric(hss) },
    carbide: { sfm: carbide, mPerMin: toMetric(carbide) },
  };
}

/**
 * Starting cutting speeds for turning, in ft/min with m/min beside them
 * (common practice, from memory). Start at the low end on a light machine,
 * with long overhang, in interrupted cuts or without coolant; drills and
 * reamers usually run slower than a turning tool.
 */
export const CUTTING_SPEEDS: readonly CuttingSpeedRow[] = [
  row('mild-steel', 'Mild (low-carbon) steel', [80, 110], [300, 600], 'Free-machining grades take the top of the range.'),
  row('medium-carbon-steel', 'Medium-carbon steel', [60, 80], [250, 450], 'Harder grades at the bottom of the range.'),
  row('tool-steel', 'Tool steel, annealed', [40, 60], [150, 300], 'Only annealed stock; hardened steel needs other tools and speeds.'),
  row('stainless-steel', 'Stainless steel (austenitic)', [30, 60], [150, 350], 'Keep the tool cutting: rubbing work-hardens it.'),
  row('cast-iron', 'Grey cast iron', [50, 80], [200, 400], 'Cut dry; get under the hard skin on the first pass. Wear a mask against the dust.'),
  row('brass', 'Brass (free-cutting)', [150, 300], [400, 800], 'Zero or slightly negative top rake, or the tool can grab, especially when drilling.'),
  row('aluminium', 'Aluminium alloys', [250, 500], [600, 1500], 'Often limited by the machine\'s top speed rather than the tool.'),
];

export interface SpeedRangeInput {
  material: WorkMaterial;
  tool: ToolMaterial;
  diameterMm: number;
}

export interface SpeedRangeResult {
  row: CuttingSpeedRow;
  tool: ToolMaterial;
  cuttingSpeed: SpeedRange;
  /** Spindle speeds for the low and high end of the cutting-speed range. */
  rpm: readonly [number, number];
  diameter: Length;
  source: string;
}

/** The spindle-speed range for a material, tool and diameter, from CUTTING_SPEEDS. */
export function speedRange(input: SpeedRangeInput): SpeedRangeResult {
  const found = CUTTING_SPEEDS.find((r) => r.material === input?.material);
  if (!found) {
    throw new CalculatorError('UNKNOWN_CHOICE', 'material', `Choose a material: ${CUTTING_SPEEDS.map((r) => r.name.toLowerCase()).join(', ')}.`);
  }
  const tool = requireChoice(input.tool, 'tool', TOOL_MATERIALS, 'a tool: hss or carbide');
  const range = found[tool];
  const lo = spindleSpeed({ cuttingSpeed: range.sfm[0], unit: 'sfm', diameterMm: input.diameterMm });
  const hi = spindleSpeed({ cuttingSpeed: range.sfm[1], unit: 'sfm', diameterMm: input.diameterMm });
  return { row: found, tool, cuttingSpeed: range, rpm: [lo.rpm, hi.rpm], diameter: lo.diameter, source: found.source };
}

/** This file's calculators by name, for runCalculator and for a page that works out only these (lib/calculators/pages/compute.ts). */
export const SPEED_RUNNERS: Runners<'spindle-speed' | 'speed-range'> = {
  'spindle-speed': (i) => spindleSpeed(i),
  'speed-range': (i) => speedRange(i),
};
