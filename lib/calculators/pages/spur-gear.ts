import { parseNumber } from '../../units/parse';
import { formatNumber } from '../../units/format';
import { BOX_NUMBER, numberBox } from './numbers';
import { queryOf, textParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { len, warningsOf } from './summary';

export interface SpurGearState {
  teeth: string;
  by: 'module' | 'dp';
  m: string;
  dp: string;
  pa: '20' | '14.5';
}

export const SPUR_GEAR_FIELDS = { teeth: 'teeth', module: 'm', diametralPitch: 'dp', pressureAngleDeg: 'pa' } as const;

export function spurGearFromSearch(p: SearchLike): SpurGearState {
  return {
    teeth: textParam(p, 'teeth', 10),
    by: p.get('by') === 'dp' ? 'dp' : 'module',
    m: textParam(p, 'm', 20),
    dp: textParam(p, 'dp', 20),
    pa: p.get('pa') === '14.5' ? '14.5' : '20',
  };
}

export function spurGearQuery(s: SpurGearState): string {
  return queryOf([
    ['teeth', s.teeth || null],
    ['by', s.by === 'dp' && 'dp'],
    ['m', s.by === 'module' && (s.m || null)],
    ['dp', s.by === 'dp' && (s.dp || null)],
    ['pa', s.pa !== '20' && s.pa],
  ]);
}

export function spurGearRequest(s: SpurGearState): CalcRequest | null {
  if (!s.teeth.trim() && !(s.by === 'module' ? s.m : s.dp).trim()) return null;
  const teeth = parseNumber(s.teeth, BOX_NUMBER) as number;
  const pressureAngleDeg = s.pa === '14.5' ? 14.5 : 20;
  return s.by === 'module'
    ? { kind: 'spur-gear', input: { teeth, module: parseNumber(s.m, BOX_NUMBER) as number, pressureAngleDeg } }
    : { kind: 'spur-gear', input: { teeth, diametralPitch: parseNumber(s.dp, BOX_NUMBER) as number, pressureAngleDeg } };
}

export const spurGearCalculator = defineCalculatorPage<SpurGearState>({
  slug: 'spur-gear',
  title: 'Spur gear blank',
  blurb: 'Blank diameter, pitch diameter, depth of cut and the involute cutter number for a spur gear by module or diametral pitch.',
  note: 'For cutting with a form cutter on the dividing head.',
  icon: '⚙',
  cautions: ['rotatingWork'],
  fromSearch: spurGearFromSearch,
  toQuery: spurGearQuery,
  requests: (s) => [spurGearRequest(s)].filter((r) => r !== null),
  fields: SPUR_GEAR_FIELDS,
  kinds: {
    'spur-gear': {
      name: 'Spur gear blank',
      label: (i) =>
        i.module !== undefined
          ? `Spur gear blank: ${i.teeth} teeth, module ${formatNumber(Number(i.module), { maxDecimals: 4 })}`
          : `Spur gear blank: ${i.teeth} teeth, ${formatNumber(Number(i.diametralPitch), { maxDecimals: 4 })} DP`,
      reopen: (i) => {
        const byDp = i.module === undefined && i.diametralPitch !== undefined;
        return { teeth: numberBox(i.teeth), by: byDp ? 'dp' : 'module', m: numberBox(i.module), dp: numberBox(i.diametralPitch), pa: i.pressureAngleDeg === 14.5 ? '14.5' : '20' };
      },
      summary: (_i, o) => {
        const first = o.system === 'module' ? 'mm' : 'in';
        return {
          inputs: [
            { label: 'Teeth', value: { text: String(o.teeth) } },
            { label: o.system === 'module' ? 'Module' : 'Diametral pitch', value: { text: o.system === 'module' ? formatNumber(o.module, { maxDecimals: 4 }) : formatNumber(o.diametralPitch, { maxDecimals: 4 }) } },
            { label: 'Pressure angle', value: { text: `${o.pressureAngleDeg}°` } },
          ],
          results: [
            { label: 'Blank (outside) Ø', value: len(o.outsideDiameter, first), strong: true },
            { label: 'Pitch Ø', value: len(o.pitchDiameter, first) },
            { label: 'Whole depth', value: len(o.wholeDepth, first) },
            ...(o.cutter ? [{ label: 'Involute cutter', value: { text: o.cutter.label } }] : []),
          ],
          warnings: warningsOf(o),
        };
      },
    },
  },
});
