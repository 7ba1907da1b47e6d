import { CLEARANCE_FITS, type ClearanceFit } from '../holes';
import { mmBox, readLengthMm } from './numbers';
import type { LengthUnit } from '@/lib/types/units';
import { choiceParam, definedOnly, queryOf, storedText, textParam, unitParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { firstOf, len, mmLength, warningsOf, type Summary } from './summary';

export interface ClearanceState {
  size: string;
  fit: ClearanceFit;
  edge: string;
  spacing: string;
  unit: LengthUnit;
}

export const CLEARANCE_FIELDS = { size: 'size', fit: 'fit', holeCentreToEdgeMm: 'edge', holeSpacingMm: 'spacing' } as const;

export function clearanceFromSearch(p: SearchLike): ClearanceState {
  return {
    size: textParam(p, 'size'),
    fit: choiceParam<ClearanceFit>(p, 'fit', CLEARANCE_FITS, 'normal'),
    edge: textParam(p, 'edge', 20),
    spacing: textParam(p, 'spacing', 20),
    unit: unitParam(p),
  };
}

export function clearanceQuery(s: ClearanceState): string {
  return queryOf([
    ['size', s.size || null],
    ['fit', s.fit !== 'normal' && s.fit],
    ['edge', s.edge || null],
    ['spacing', s.spacing || null],
    ['unit', s.unit !== 'mm' && s.unit],
  ]);
}

export function clearanceRequests(s: ClearanceState): { clearance: CalcRequest; counterbore: CalcRequest } | null {
  if (!s.size.trim()) return null;
  return {
    clearance: { kind: 'clearance-hole', input: { size: s.size, fit: s.fit } },
    counterbore: {
      kind: 'counterbore',
      input: definedOnly({ size: s.size, fit: s.fit, holeCentreToEdgeMm: readLengthMm(s.edge, s.unit), holeSpacingMm: readLengthMm(s.spacing, s.unit) }),
    },
  };
}

/** The boxes that work a stored clearance hole or counterbore out again. */
const reopen = (i: Record<string, unknown>): ClearanceState => ({
  size: storedText(i.size),
  fit: (CLEARANCE_FITS as readonly unknown[]).includes(i.fit) ? (i.fit as ClearanceFit) : 'normal',
  edge: mmBox(i.holeCentreToEdgeMm),
  spacing: mmBox(i.holeSpacingMm),
  unit: 'mm',
});

export const clearanceHolesCalculator = defineCalculatorPage<ClearanceState>({
  slug: 'clearance-holes',
  title: 'Clearance holes and counterbores',
  blurb: 'Close, normal and loose clearance holes for a screw, and the counterbore for a socket head cap screw with the wall it leaves.',
  note: 'Metric holes from ISO 273; inch holes from the usual shop tables.',
  icon: '◎',
  cautions: ['drilling', 'thinWalls'],
  fromSearch: clearanceFromSearch,
  toQuery: clearanceQuery,
  requests: (s) => {
    const r = clearanceRequests(s);
    return r ? [r.clearance, r.counterbore] : [];
  },
  fields: CLEARANCE_FIELDS,
  kinds: {
    'clearance-hole': {
      name: 'Clearance hole',
      label: (i) => `Clearance hole for ${storedText(i.size).trim()} (${String(i.fit ?? 'normal')})`,
      reopen,
      summary: (_i, o) => ({
        inputs: [
          { label: 'Screw', value: { text: o.screw.size } },
          { label: 'Class', value: { text: `${o.fit}${o.isoSeries ? ` (ISO 273 ${o.isoSeries})` : ''}` } },
        ],
        results: [
          { label: 'Clearance hole', value: { text: o.drill.kind === 'metric' ? undefined : o.drill.name, len: o.diameter, first: firstOf(o.drill) }, strong: true },
          ...(o.drillOtherSystem ? [{ label: 'Other system, not smaller', value: { text: o.drillOtherSystem.name, len: o.drillOtherSystem.diameter, first: firstOf(o.drillOtherSystem) } }] : []),
        ],
        warnings: [],
      }),
    },
    counterbore: {
      name: 'Counterbore',
      label: (i) => `Counterbore for ${storedText(i.size).trim()} socket head cap screw`,
      reopen,
      summary: (input, o) => {
        const first = o.screw.system === 'metric' ? 'mm' : 'in';
        const inputs: Summary['inputs'] = [
          { label: 'Screw', value: { text: `${o.screw.size} socket head cap screw` } },
          { label: 'Through hole', value: { text: o.throughHole.fit } },
        ];
        if (typeof input.holeCentreToEdgeMm === 'number') inputs.push({ label: 'Centre to edge', value: len(mmLength(input.holeCentreToEdgeMm)) });
        if (typeof input.holeSpacingMm === 'number') inputs.push({ label: 'Hole spacing', value: len(mmLength(input.holeSpacingMm)) });
        return {
          inputs,
          results: [
            { label: 'Counterbore Ø', value: len(o.counterbore.diameter, first), strong: true },
            { label: 'Counterbore depth', value: len(o.counterbore.depth, first), strong: true },
            { label: 'Through hole', value: { text: o.throughHole.drill.kind === 'metric' ? undefined : o.throughHole.drill.name, len: o.throughHole.diameter, first } },
            ...(o.wall.toEdge ? [{ label: 'Wall to the edge', value: len(o.wall.toEdge, first) }] : []),
            ...(o.wall.betweenHoles ? [{ label: 'Wall between holes', value: len(o.wall.betweenHoles, first) }] : []),
          ],
          warnings: warningsOf(o),
        };
      },
    },
  },
});
