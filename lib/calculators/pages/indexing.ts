import { CalculatorError } from '../errors';
import { parseNumber } from '../../units/parse';
import { BOX_NUMBER, numberBox } from './numbers';
import { definedOnly, queryOf, textParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import type { SummaryRow } from './summary';

export interface IndexingState {
  n: string;
  ratio: string;
  /** The user's own hole circles, comma separated; empty for the commonly supplied set. */
  circles: string;
  plate: string;
}

export const INDEXING_FIELDS = { divisions: 'n', ratio: 'ratio', circles: 'circles', plateHoles: 'plate', gears: 'circles' } as const;
const DEFAULTS: IndexingState = { n: '', ratio: '40', circles: '', plate: '24' };

export function indexingFromSearch(p: SearchLike): IndexingState {
  return { n: textParam(p, 'n', 10), ratio: p.get('ratio') ?? '40', circles: textParam(p, 'circles', 400), plate: p.get('plate') ?? '24' };
}

export function indexingQuery(s: IndexingState): string {
  return queryOf([
    ['n', s.n || null],
    ['ratio', s.ratio !== '40' && s.ratio],
    ['circles', s.circles || null],
    ['plate', s.plate !== '24' && s.plate],
  ]);
}

/** "15, 16, 17" → [15, 16, 17]; undefined for an empty box. Throws CalculatorError (field 'circles'). */
export function readCircles(textValue: string): number[] | undefined {
  const parts = textValue.split(/[\s,;]+/).filter(Boolean);
  if (!parts.length) return undefined;
  return parts.map((part) => {
    const n = parseNumber(part, BOX_NUMBER);
    if (n === undefined || !Number.isInteger(n)) {
      throw new CalculatorError('NOT_WHOLE', 'circles', `Write the hole circles as whole numbers separated by commas: "${part}" is not one.`);
    }
    return n;
  });
}

const boxNumber = (s: string) => (s.trim() === '' ? undefined : parseNumber(s, BOX_NUMBER));

export function indexingRequests(s: IndexingState): { simple: CalcRequest; direct: CalcRequest } | null {
  if (!s.n.trim()) return null;
  const divisions = parseNumber(s.n, BOX_NUMBER) as number;
  return {
    simple: { kind: 'simple-indexing', input: definedOnly({ divisions, ratio: boxNumber(s.ratio), circles: readCircles(s.circles) }) },
    direct: { kind: 'direct-indexing', input: definedOnly({ divisions, plateHoles: boxNumber(s.plate) }) },
  };
}

export const indexingCalculator = defineCalculatorPage<IndexingState>({
  slug: 'indexing',
  title: 'Dividing head indexing',
  blurb: 'Crank turns and holes on your own index plates, the sector-arm setting, direct indexing, and a differential set-up when no plate serves.',
  note: 'Enter the hole circles of your own plates, or start from the commonly supplied set.',
  icon: '✺',
  cautions: ['rotatingWork'],
  fromSearch: indexingFromSearch,
  toQuery: indexingQuery,
  requests: (s) => {
    const r = indexingRequests(s);
    return r ? [r.simple, r.direct] : [];
  },
  fields: INDEXING_FIELDS,
  kinds: {
    'simple-indexing': {
      name: 'Indexing',
      label: (i) => `Indexing ${i.divisions} divisions on a ${i.ratio ?? 40}:1 head`,
      reopen: (i) => ({
        ...DEFAULTS,
        n: numberBox(i.divisions),
        ratio: i.ratio === undefined ? '40' : numberBox(i.ratio),
        circles: Array.isArray(i.circles) ? i.circles.join(', ') : '',
      }),
      summary: (input, o) => {
        const results: SummaryRow[] = [];
        if (o.move) {
          results.push({ label: 'Each division', value: { text: o.move.description }, strong: true });
          if (o.move.sector) results.push({ label: 'Sector arms', value: { text: `take in ${o.move.sector.holesBetweenArms} holes (${o.move.sector.spaces} spaces)` } });
        } else if (o.differential) {
          results.push({ label: 'Differential', value: { text: o.differential.description }, strong: true });
        } else {
          results.push({ label: 'Not possible', value: { text: o.message } });
        }
        return {
          inputs: [
            { label: 'Divisions', value: { text: String(o.divisions) } },
            { label: 'Head', value: { text: `${o.ratio}:1` } },
            { label: 'Hole circles', value: { text: Array.isArray(input.circles) ? (input.circles as number[]).join(', ') : 'commonly supplied plates' } },
          ],
          results,
          warnings: o.possible ? [] : [o.message],
        };
      },
    },
    'direct-indexing': {
      name: 'Direct indexing',
      label: (i) => `Direct indexing ${i.divisions} divisions on a ${i.plateHoles ?? 24}-hole plate`,
      reopen: (i) => ({ ...DEFAULTS, n: numberBox(i.divisions), plate: i.plateHoles === undefined ? '24' : numberBox(i.plateHoles) }),
      summary: (_i, o) => ({
        inputs: [
          { label: 'Divisions', value: { text: String(o.divisions) } },
          { label: 'Spindle plate', value: { text: `${o.plateHoles} holes` } },
        ],
        results: [{ label: 'Each division', value: { text: `${o.holesToMove} ${o.holesToMove === 1 ? 'hole' : 'holes'}` }, strong: true }],
        warnings: [],
      }),
    },
  },
});
