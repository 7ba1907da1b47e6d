// Display helpers for the ANSI B4.1 inch classes: thousandths first, then inches and millimetres.
import type { InchFit, ToleranceZone } from '@/lib/fits';
import { formatIn, formatMm, formatThou } from '@/lib/units/format';

/** Thousandths written in inches and in millimetres. Take thou. */
export const thouIn = (t: number, signed = false) => formatIn(t / 1000, { signed });
export const thouMm = (t: number, signed = false) => formatMm((t * 254) / 10_000, { signed });

/** One side of a class as a tolerance zone, in µm, so the zone drawing draws it like an ISO 286 zone. */
export function inchSideZone(fit: InchFit, side: 'hole' | 'shaft'): ToleranceZone {
  const s = fit[side];
  const um = (t: number) => (t === 0 ? 0 : (t * 254) / 10);
  const upperUm = um(s.upperThou);
  const lowerUm = um(s.lowerThou);
  return {
    zone: fit.fitClass,
    kind: side,
    letter: '',
    grade: `grade ${s.grade}`,
    nominalMm: fit.nominalMm,
    upperUm,
    lowerUm,
    upperMm: upperUm / 1000,
    lowerMm: lowerUm / 1000,
    itUm: upperUm - lowerUm,
    fundamentalUm: Math.abs(upperUm) < Math.abs(lowerUm) ? upperUm : lowerUm,
  };
}

/** The play of a class in thousandths, said in words. */
export function inchClearanceWords(fit: Pick<InchFit, 'maxClearanceThou' | 'minClearanceThou' | 'kind'>): string {
  const { maxClearanceThou: max, minClearanceThou: min } = fit;
  if (fit.kind === 'clearance') return `clearance ${formatThou(min)} to ${formatThou(max)} thou`;
  if (fit.kind === 'interference') return `interference ${formatThou(-max)} to ${formatThou(-min)} thou`;
  return `clearance up to ${formatThou(max)} thou, interference up to ${formatThou(-min)} thou`;
}

/** The same in inches and in millimetres. */
export function inchClearanceOther(fit: InchFit, unit: 'in' | 'mm'): string {
  const f = unit === 'in' ? (t: number) => thouIn(t) : (t: number) => thouMm(t);
  const { maxClearanceThou: max, minClearanceThou: min } = fit;
  if (fit.kind === 'clearance') return `clearance ${f(min)} to ${f(max)} ${unit}`;
  if (fit.kind === 'interference') return `interference ${f(-max)} to ${f(-min)} ${unit}`;
  return `clearance up to ${f(max)} ${unit}, interference up to ${f(-min)} ${unit}`;
}
