import { formatAngle } from '../units';
import { parseNumber } from '../../units/parse';
import { BOX_NUMBER, mmBox, mmLabel, numberBox, readLengthMm } from './numbers';
import type { LengthUnit } from '@/lib/types/units';
import { definedOnly, queryOf, textParam, unitParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { len, SUMMARY_TABLE_ROWS } from './summary';

export interface BoltCircleState {
  d: string;
  unit: LengthUnit;
  holes: string;
  start: string;
  midway: boolean;
}

export const BOLT_CIRCLE_FIELDS = { diameterMm: 'd', holes: 'holes', startAngleDeg: 'start' } as const;

export function boltCircleFromSearch(p: SearchLike): BoltCircleState {
  return { d: textParam(p, 'd', 20), unit: unitParam(p), holes: textParam(p, 'holes', 10), start: textParam(p, 'start', 20), midway: p.get('midway') === '1' };
}

export function boltCircleQuery(s: BoltCircleState): string {
  return queryOf([
    ['d', s.d || null],
    ['unit', s.unit !== 'mm' && s.unit],
    ['holes', s.holes || null],
    ['start', s.start && s.start !== '0' ? s.start : null],
    ['midway', s.midway && '1'],
  ]);
}

export function boltCircleRequest(s: BoltCircleState): CalcRequest | null {
  if (!s.d.trim() && !s.holes.trim()) return null;
  return {
    kind: 'bolt-circle',
    input: definedOnly({
      diameterMm: readLengthMm(s.d, s.unit) as number,
      holes: parseNumber(s.holes, BOX_NUMBER) as number,
      startAngleDeg: parseNumber(s.start, BOX_NUMBER),
      midway: s.midway || undefined,
    }),
  };
}

export const boltCircleCalculator = defineCalculatorPage<BoltCircleState>({
  slug: 'bolt-circle',
  title: 'Bolt circle',
  blurb: 'X/Y coordinates and rotary-table angles for holes on a pitch circle, drawn, with a second pattern midway if you need one.',
  note: 'X to the right, Y up, angles counter-clockwise from +X, as on a drawing.',
  icon: '⁘',
  cautions: ['drilling', 'rotatingWork'],
  fromSearch: boltCircleFromSearch,
  toQuery: boltCircleQuery,
  requests: (s) => [boltCircleRequest(s)].filter((r) => r !== null),
  fields: BOLT_CIRCLE_FIELDS,
  kinds: {
    'bolt-circle': {
      name: 'Bolt circle',
      label: (i) => `Bolt circle: ${i.holes} holes on ${mmLabel(i.diameterMm)}${i.midway ? ', with midway holes' : ''}`,
      reopen: (i) => ({ d: mmBox(i.diameterMm), unit: 'mm', holes: numberBox(i.holes), start: numberBox(i.startAngleDeg ?? 0), midway: i.midway === true }),
      summary: (_i, o) => {
        const holes = [...o.holes.map((h) => ({ h, mark: '' })), ...(o.midwayHoles ?? []).map((h) => ({ h, mark: '′' }))];
        return {
          inputs: [
            { label: 'Diameter', value: len(o.diameter) },
            { label: 'Holes', value: { text: `${o.holeCount}${o.midwayHoles ? ` + ${o.midwayHoles.length} midway` : ''}` } },
            { label: 'Hole 1 at', value: { text: formatAngle(o.startAngleDeg) } },
          ],
          results: [
            { label: 'Between holes', value: { text: formatAngle(o.stepDeg) } },
            { label: 'Chord', value: len(o.chord) },
          ],
          table: {
            caption: 'Hole positions from the centre',
            head: ['Hole', 'Angle', 'X', 'Y'],
            rows: holes.slice(0, SUMMARY_TABLE_ROWS).map(({ h, mark }) => ({ key: `${h.index}${mark}`, cells: [`${h.index}${mark}`, formatAngle(h.angleDeg), h.x, h.y] })),
            more: Math.max(0, holes.length - SUMMARY_TABLE_ROWS),
          },
          warnings: [],
        };
      },
    },
  },
});
