import { CUTTING_SPEEDS, TOOL_MATERIAL_NAMES, type CuttingSpeedUnit, type ToolMaterial, type WorkMaterial } from '../speeds';
import { formatRpm } from '../units';
import { parseNumber } from '../../units/parse';
import { formatNumber } from '../../units/format';
import { BOX_NUMBER, mmBox, mmLabel, numberBox, readLengthMm } from './numbers';
import type { LengthUnit } from '@/lib/types/units';
import { choiceParam, queryOf, textParam, unitParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { len } from './summary';

export interface SpeedsState {
  d: string;
  unit: LengthUnit;
  v: string;
  vunit: CuttingSpeedUnit;
  material: WorkMaterial | '';
  tool: ToolMaterial;
}

export const SPEEDS_FIELDS = { diameterMm: 'd', cuttingSpeed: 'v', unit: 'vunit', material: 'material', tool: 'tool' } as const;
const MATERIALS = CUTTING_SPEEDS.map((r) => r.material);
const DEFAULTS: SpeedsState = { d: '', unit: 'mm', v: '', vunit: 'm/min', material: '', tool: 'hss' };

export function speedsFromSearch(p: SearchLike): SpeedsState {
  return {
    d: textParam(p, 'd', 20),
    unit: unitParam(p),
    v: textParam(p, 'v', 20),
    vunit: choiceParam<CuttingSpeedUnit>(p, 'vunit', ['m/min', 'sfm'], 'm/min'),
    material: choiceParam<WorkMaterial | ''>(p, 'material', MATERIALS, ''),
    tool: choiceParam<ToolMaterial>(p, 'tool', ['hss', 'carbide'], 'hss'),
  };
}

export function speedsQuery(s: SpeedsState): string {
  return queryOf([
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['v', s.v || null],
    ['vunit', s.vunit !== 'm/min' && s.vunit],
    ['material', s.material || null],
    ['tool', s.tool !== 'hss' && s.tool],
  ]);
}

export function speedsRequests(s: SpeedsState): { speed: CalcRequest | null; range: CalcRequest | null } {
  const diameterMm = readLengthMm(s.d, s.unit) as number;
  if (!s.d.trim()) return { speed: null, range: null };
  return {
    speed: s.v.trim() ? { kind: 'spindle-speed', input: { cuttingSpeed: parseNumber(s.v, BOX_NUMBER) as number, unit: s.vunit, diameterMm } } : null,
    range: s.material ? { kind: 'speed-range', input: { material: s.material, tool: s.tool, diameterMm } } : null,
  };
}

export const speedsCalculator = defineCalculatorPage<SpeedsState>({
  slug: 'speeds',
  title: 'Spindle speeds',
  blurb: 'Spindle speed from cutting speed and diameter, with starting cutting speeds for common materials and tools.',
  note: 'Starting points to adjust by ear and by the chips, not limits.',
  icon: '↻',
  cautions: ['rotatingWork', 'drilling'],
  fromSearch: speedsFromSearch,
  toQuery: speedsQuery,
  requests: (s) => {
    const r = speedsRequests(s);
    return [r.speed, r.range].filter((x) => x !== null);
  },
  fields: SPEEDS_FIELDS,
  kinds: {
    'spindle-speed': {
      name: 'Spindle speed',
      label: (i) => `Spindle speed at ${formatNumber(Number(i.cuttingSpeed), { maxDecimals: 1 })} ${String(i.unit)} on ${mmLabel(i.diameterMm)}`,
      reopen: (i) => ({ ...DEFAULTS, d: mmBox(i.diameterMm), v: numberBox(i.cuttingSpeed), vunit: i.unit === 'sfm' ? 'sfm' : 'm/min' }),
      summary: (_i, o) => ({
        inputs: [
          { label: 'Cutting speed', value: { text: `${formatNumber(o.cuttingSpeed.mPerMin, { maxDecimals: 1 })} m/min (${formatNumber(o.cuttingSpeed.sfm, { maxDecimals: 0 })} ft/min)` } },
          { label: 'Diameter', value: len(o.diameter) },
        ],
        results: [{ label: 'Spindle speed', value: { text: formatRpm(o.rpm) }, strong: true }],
        warnings: [],
      }),
    },
    'speed-range': {
      name: 'Starting speeds',
      label: (i, o) => `Starting speeds: ${o?.row?.name ?? String(i.material)}, ${i.tool === 'carbide' ? 'carbide' : 'HSS'}, ${mmLabel(i.diameterMm)}`,
      reopen: (i) => ({
        ...DEFAULTS,
        d: mmBox(i.diameterMm),
        material: (MATERIALS as readonly unknown[]).includes(i.material) ? (i.material as WorkMaterial) : '',
        tool: i.tool === 'carbide' ? 'carbide' : 'hss',
      }),
      summary: (_i, o) => ({
        inputs: [
          { label: 'Material', value: { text: o.row.name } },
          { label: 'Tool', value: { text: TOOL_MATERIAL_NAMES[o.tool] } },
          { label: 'Diameter', value: len(o.diameter) },
        ],
        results: [
          { label: 'Start at', value: { text: `${Math.round(o.rpm[0])}–${Math.round(o.rpm[1])} rev/min` }, strong: true },
          { label: 'Cutting speed', value: { text: `${o.cuttingSpeed.mPerMin[0]}–${o.cuttingSpeed.mPerMin[1]} m/min (${o.cuttingSpeed.sfm[0]}–${o.cuttingSpeed.sfm[1]} ft/min)` } },
        ],
        warnings: [],
      }),
    },
  },
});
