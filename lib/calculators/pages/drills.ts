import { readoutMm } from '../../units/format';
import { mmBox, mmLabel, readLengthMm } from './numbers';
import type { LengthUnit } from '@/lib/types/units';
import { choiceParam, definedOnly, queryOf, storedText, textParam, unitParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { firstOf, len, mmLength } from './summary';

export type DrillSide = 'any' | 'above' | 'below';
export interface DrillsState {
  mode: 'name' | 'size';
  name: string;
  d: string;
  unit: LengthUnit;
  side: DrillSide;
}

export const DRILLS_FIELDS = { name: 'name', diameterMm: 'd', side: 'side' } as const;
export const NEAREST_COUNT = 8;
const DEFAULTS: DrillsState = { mode: 'name', name: '', d: '', unit: 'mm', side: 'any' };

export function drillsFromSearch(p: SearchLike): DrillsState {
  return {
    mode: p.get('mode') === 'size' ? 'size' : 'name',
    name: textParam(p, 'name'),
    d: textParam(p, 'd', 20),
    unit: unitParam(p),
    side: choiceParam<DrillSide>(p, 'side', ['any', 'above', 'below'], 'any'),
  };
}

export function drillsQuery(s: DrillsState): string {
  return queryOf([
    ['mode', s.mode === 'size' && 'size'],
    ['name', s.name || null],
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['side', s.side !== 'any' && s.side],
  ]);
}

export function drillsRequest(s: DrillsState): CalcRequest | null {
  if (s.mode === 'name') return s.name.trim() ? { kind: 'drill-size', input: { name: s.name } } : null;
  if (!s.d.trim()) return null;
  return { kind: 'nearest-drills', input: definedOnly({ diameterMm: readLengthMm(s.d, s.unit) as number, count: NEAREST_COUNT, side: s.side === 'any' ? undefined : s.side }) };
}

export const drillsCalculator = defineCalculatorPage<DrillsState>({
  slug: 'drills',
  title: 'Drill chart',
  blurb: 'Any fractional, number, letter or metric drill in both units, or the drills nearest to a size.',
  note: 'Number and letter drills are inch sizes; a bare number is refused, since #7 and 7 mm differ by 1.9 mm.',
  icon: '⌀',
  cautions: ['drilling'],
  fromSearch: drillsFromSearch,
  toQuery: drillsQuery,
  requests: (s) => [drillsRequest(s)].filter((r) => r !== null),
  fields: DRILLS_FIELDS,
  kinds: {
    'drill-size': {
      name: 'Drill size',
      label: (i) => `Drill ${storedText(i.name).trim()}`,
      reopen: (i) => ({ ...DEFAULTS, name: storedText(i.name) }),
      summary: (_i, o) => ({
        inputs: [{ label: 'Drill', value: { text: o.name } }],
        results: [{ label: 'Diameter', value: len(o.diameter, firstOf(o)), strong: true }],
        warnings: [],
      }),
    },
    'nearest-drills': {
      name: 'Nearest drills',
      label: (i) => `Drills nearest ${mmLabel(i.diameterMm)}`,
      reopen: (i) => ({ ...DEFAULTS, mode: 'size', d: mmBox(i.diameterMm), side: i.side === 'above' || i.side === 'below' ? i.side : 'any' }),
      summary: (input, o) => ({
        inputs: [{ label: 'Diameter', value: len(mmLength(input.diameterMm)) }],
        results: o.slice(0, 3).map((m, i) => ({
          label: i === 0 ? 'Nearest drill' : 'Next',
          value: { text: m.drill.name, len: m.drill.diameter, first: firstOf(m.drill), note: `${m.difference.mm >= 0 ? '+' : '−'}${readoutMm(Math.abs(m.difference.mm))} mm` },
          strong: i === 0,
        })),
        warnings: [],
      }),
    },
  },
});
