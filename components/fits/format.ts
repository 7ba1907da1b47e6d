// Display helpers for the fits page: every length in mm and in inches, 25.4 mm to the inch.
import type { FitAnalysis, FitKind, ToleranceZone } from '@/lib/fits';
import { formatMmAs, formatUmAs } from '@/lib/units/format';
import type { SizeUnit } from '@/lib/validations/fits-words';
import type { Nominal } from './read-entry';

/** A limit size, nominal + deviation, summed in µm before rounding. */
export function limitSize(nominalMm: number, deviationUm: number): { mm: string; in: string } {
  const um = nominalMm * 1000 + deviationUm;
  return { mm: formatUmAs(um, 'mm'), in: formatUmAs(um, 'in') };
}

/** "25 mm" as typed, and the same size in the other unit. */
export function nominalText(n: Nominal): { typed: string; other: string } {
  if (n.unit === 'in') return { typed: `${n.text} in`, other: `${formatMmAs(n.mm, 'mm')} mm` };
  return { typed: `${n.text} mm`, other: `${formatMmAs(n.mm, 'in')} in` };
}

export const KIND_WORDS: Record<FitKind, { title: string; explain: string }> = {
  clearance: {
    title: 'Clearance fit',
    explain: 'The shaft always comes out smaller than the hole: the parts go together by hand.',
  },
  transition: {
    title: 'Transition fit',
    explain: 'Depending on the sizes you actually make, the parts slide together or need a light press.',
  },
  interference: {
    title: 'Interference fit',
    explain: 'The shaft always comes out larger than the hole: the parts are pressed or shrunk together.',
  },
};

/** The play of a fit said in words, in one unit: "clearance 0.007 to 0.041 mm", "interference up to 0.035 mm". */
export function clearanceWords(fit: Pick<FitAnalysis, 'maxClearanceUm' | 'minClearanceUm' | 'kind'>, unit: SizeUnit): string {
  const f = (um: number) => formatUmAs(um, unit);
  const u = unit === 'mm' ? 'mm' : 'in';
  const { maxClearanceUm: max, minClearanceUm: min } = fit;
  if (fit.kind === 'clearance') return `clearance ${f(min)} to ${f(max)} ${u}`;
  if (fit.kind === 'interference') return `interference ${f(-max)} to ${f(-min)} ${u}`;
  return `clearance up to ${f(max)} ${u}, interference up to ${f(-min)} ${u}`;
}

export function deviationNames(zone: ToleranceZone): { upper: string; lower: string } {
  return zone.kind === 'hole' ? { upper: 'ES', lower: 'EI' } : { upper: 'es', lower: 'ei' };
}

export const zoneTitle = (zone: ToleranceZone) => `${zone.kind === 'hole' ? 'Hole' : 'Shaft'} ${zone.zone}`;
