import { formatPercent } from '../units';
import { INCH_DRILL_KINDS, METRIC_DRILL_KINDS, type DrillKind } from '../drills';
import type { ThreadSpec } from '../threads';
import { parseNumber } from '../../units/parse';
import { formatNumber } from '../../units/format';
import { BOX_NUMBER, mmBox, mmLabel, numberBox } from './numbers';
import { readDrill } from './drill-box';
import { choiceParam, definedOnly, queryOf, storedText, textParam, type CalcRequest, type SearchLike } from './url-state';
import { defineCalculatorPage } from './definition';
import { firstOf, len, warningsOf, type SummaryRow } from './summary';

export type DrillSet = 'all' | 'inch' | 'metric';
export interface TapDrillState {
  thread: string;
  mode: 'pick' | 'check';
  target: string;
  drill: string;
  drills: DrillSet;
}

const DEFAULTS: TapDrillState = { thread: '', mode: 'pick', target: '75', drill: '', drills: 'all' };

export function tapDrillFromSearch(p: SearchLike): TapDrillState {
  return {
    thread: textParam(p, 'thread'),
    mode: p.get('mode') === 'check' ? 'check' : 'pick',
    target: p.get('target') ?? '75',
    drill: textParam(p, 'drill'),
    drills: choiceParam<DrillSet>(p, 'drills', ['all', 'inch', 'metric'], 'all'),
  };
}

export function tapDrillQuery(s: TapDrillState): string {
  return queryOf([
    ['thread', s.thread || null],
    ['mode', s.mode === 'check' && 'check'],
    ['target', s.target !== '75' && s.target],
    ['drill', s.drill || null],
    ['drills', s.drills !== 'all' && s.drills],
  ]);
}

const kindsOf = (set: DrillSet): DrillKind[] | undefined => (set === 'inch' ? [...INCH_DRILL_KINDS] : set === 'metric' ? [...METRIC_DRILL_KINDS] : undefined);
function setOf(kinds: readonly string[] | undefined): DrillSet {
  if (!kinds) return 'all';
  const k = [...kinds].sort().join(',');
  if (k === [...INCH_DRILL_KINDS].sort().join(',')) return 'inch';
  if (k === 'metric') return 'metric';
  return 'all';
}

/** null while the thread box is empty. Throws CalculatorError (field 'drill') for a drill it cannot read. */
export function tapDrillRequest(s: TapDrillState): CalcRequest | null {
  if (!s.thread.trim()) return null;
  if (s.mode === 'check') {
    if (!s.drill.trim()) return null;
    const drill = readDrill(s.drill, 'drill');
    return { kind: 'thread-percent', input: { designation: s.thread, drillDiameterMm: drill.diameterMm } };
  }
  const target = s.target.trim() === '' ? undefined : parseNumber(s.target, BOX_NUMBER);
  return { kind: 'tap-drill', input: definedOnly({ designation: s.thread, targetPercent: target, kinds: kindsOf(s.drills) }) };
}

export const TAP_DRILL_FIELDS = { designation: 'thread', targetPercent: 'target', drillDiameterMm: 'drill', kinds: 'drills' } as const;

/** The thread as the result names it (normalised), else as it was typed. */
function threadName(input: Record<string, unknown>, thread: { designationWithPitch?: string } | undefined) {
  return thread?.designationWithPitch ?? storedText(input.designation).trim();
}

function threadRows(t: ThreadSpec): SummaryRow[] {
  const first = t.system === 'unified' ? 'in' : 'mm';
  return [
    { label: 'Major diameter', value: len(t.major, first) },
    { label: t.tpi ? `Pitch (${t.tpi} TPI)` : 'Pitch', value: len(t.pitch, first) },
  ];
}

export const tapDrillCalculator = defineCalculatorPage<TapDrillState>({
  slug: 'tap-drill',
  title: 'Tap drills and thread engagement',
  blurb: 'The drill for a thread at the percentage of thread you want, or the engagement a drill you have will give.',
  note: "Percentage of thread by the usual handbook relation; about 75 % is the shop's target.",
  icon: '⊛',
  cautions: ['tapping', 'drilling'],
  fromSearch: tapDrillFromSearch,
  toQuery: tapDrillQuery,
  requests: (s) => [tapDrillRequest(s)].filter((r) => r !== null),
  fields: TAP_DRILL_FIELDS,
  kinds: {
    'tap-drill': {
      name: 'Tap drill',
      label: (i, o) => `Tap drill for ${threadName(i as never, o?.thread)}`,
      reopen: (i) => ({
        ...DEFAULTS,
        thread: storedText(i.designation),
        target: i.targetPercent === undefined ? '75' : numberBox(i.targetPercent),
        drills: setOf(Array.isArray(i.kinds) ? (i.kinds as string[]) : undefined),
      }),
      summary: (_i, o) => {
        const c = o.choice;
        const results: SummaryRow[] = [
          { label: 'Tap drill', value: { text: c.drill.name, len: c.drill.diameter, first: firstOf(c.drill), note: `${formatPercent(c.percent)} of thread` }, strong: true },
        ];
        if (o.bestInch && o.bestInch.drill.name !== c.drill.name) {
          results.push({ label: 'Best inch drill', value: { text: o.bestInch.drill.name, len: o.bestInch.drill.diameter, first: 'in', note: formatPercent(o.bestInch.percent) } });
        }
        if (o.bestMetric && o.bestMetric.drill.name !== c.drill.name) {
          results.push({ label: 'Best metric drill', value: { text: o.bestMetric.drill.name, len: o.bestMetric.drill.diameter, first: 'mm', note: formatPercent(o.bestMetric.percent) } });
        }
        return {
          inputs: [
            { label: 'Thread', value: { text: o.thread.designationWithPitch } },
            { label: 'Target', value: { text: `${formatNumber(o.targetPercent, { maxDecimals: 1 })} %` } },
          ],
          results,
          warnings: warningsOf(o),
        };
      },
    },
    'thread-percent': {
      name: 'Thread engagement',
      label: (i, o) => `Engagement of ${o?.drillSize?.name ?? mmLabel(i.drillDiameterMm)} in ${threadName(i as never, o?.thread)}`,
      reopen: (i, o) => {
        const named = o.drillSize as { name?: string; diameterMm?: number } | null | undefined;
        const exact = named?.name && typeof named.diameterMm === 'number' && Math.abs(named.diameterMm - Number(i.drillDiameterMm)) < 1e-4;
        const drill = exact ? named!.name! : i.drillDiameterMm === undefined ? '' : `${mmBox(i.drillDiameterMm)} mm`;
        return { ...DEFAULTS, thread: storedText(i.designation), mode: 'check', drill };
      },
      summary: (_i, o) => ({
        inputs: [
          { label: 'Thread', value: { text: o.thread.designationWithPitch } },
          { label: 'Drill', value: { text: o.drillSize?.name, len: o.drill } },
        ],
        results: [
          { label: 'Thread engagement', value: { text: `${formatPercent(o.percent)} of thread` }, strong: true },
          { label: 'Thread depth each side', value: len(o.threadDepth) },
        ],
        warnings: warningsOf(o),
      }),
    },
    'thread-spec': {
      name: 'Thread',
      label: (i, o) => `Thread ${threadName(i as never, o)}`,
      reopen: (i) => ({ ...DEFAULTS, thread: storedText(i.designation) }),
      summary: (_i, o) => ({
        inputs: [{ label: 'Thread', value: { text: o.designationWithPitch } }],
        results: [...threadRows(o), { label: 'Basic minor diameter of the nut', value: len(o.minorDiameterInternal, o.system === 'unified' ? 'in' : 'mm') }],
        warnings: [],
      }),
    },
  },
});
