// What the fits page shows for one entry, computed in the browser (the engine is pure TypeScript).
import {
  analyseFit, inchFit, INCH_CLASS_NAMES, isFitError, PREFERRED_HOLE_BASIS_FITS, toleranceZone,
  type FitAnalysis, type FitErrorCode, type InchFit, type PreferredFit, type ToleranceZone,
} from '@/lib/fits';
import { readDesignationText } from '@/lib/validations/fits-text';
import type { SizeUnit } from '@/lib/validations/fits-words';

export type EntryState = { text: string; unit: SizeUnit; round: boolean };

export type Nominal = { mm: number; unit: SizeUnit; input: number; text: string };

export type EntryResult =
  | { status: 'empty' }
  | { status: 'error'; message: string; code?: FitErrorCode; nominal?: Nominal }
  | { status: 'size'; nominal: Nominal }
  | { status: 'zone'; nominal: Nominal; zone: ToleranceZone }
  | { status: 'fit'; nominal: Nominal; fit: FitAnalysis }
  | { status: 'inch'; nominal: Nominal; inch: InchFit };

export function readEntry({ text, unit, round }: EntryState): EntryResult {
  if (text.trim() === '') return { status: 'empty' };
  const read = readDesignationText(text, unit);
  if (!read.ok) return { status: 'error', message: read.message };
  const d = read.value;
  const nominal: Nominal = { mm: d.nominalMm, unit: d.unit, input: d.nominalInput, text: d.nominalText };
  try {
    if (d.inchClass) return { status: 'inch', nominal, inch: inchFit(d.nominalInput, d.inchClass) };
    if (d.fit) return { status: 'fit', nominal, fit: analyseFit(d.nominalMm, `${d.fit.hole}/${d.fit.shaft}`, { roundJs: round }) };
    if (d.zone) return { status: 'zone', nominal, zone: toleranceZone(d.nominalMm, d.zone, { roundJs: round }) };
    return { status: 'size', nominal };
  } catch (err) {
    if (isFitError(err)) return { status: 'error', message: err.message, code: err.code, nominal };
    throw err;
  }
}

export type PreferredRow = { preferred: PreferredFit } & ({ ok: true; fit: FitAnalysis } | { ok: false; message: string });

export function preferredFitsAt(nominalMm: number, round: boolean): PreferredRow[] {
  return PREFERRED_HOLE_BASIS_FITS.map((preferred) => {
    try {
      return { preferred, ok: true as const, fit: analyseFit(nominalMm, preferred.fit, { roundJs: round }) };
    } catch (err) {
      if (isFitError(err)) return { preferred, ok: false as const, message: err.message };
      throw err;
    }
  });
}

export type InchClassRow = { fitClass: string } & ({ ok: true; fit: InchFit } | { ok: false; message: string });

/** Every ANSI B4.1 class at an inch size, or why the class has no value there. */
export function inchClassesAt(nominalIn: number): InchClassRow[] {
  return INCH_CLASS_NAMES.map((fitClass) => {
    try {
      return { fitClass, ok: true as const, fit: inchFit(nominalIn, fitClass) };
    } catch (err) {
      if (isFitError(err)) return { fitClass, ok: false as const, message: err.message };
      throw err;
    }
  });
}

/** The page's query string: ?q=25+H7%2Fg6 (&unit=in when sizes are in inches, &round=1 when JS/js is rounded). */
export function entryQuery({ text, unit, round }: EntryState): string {
  const params = new URLSearchParams();
  if (text.trim() !== '') params.set('q', text.trim());
  if (unit === 'in') params.set('unit', 'in');
  if (round) params.set('round', '1');
  const s = params.toString();
  return s ? `?${s}` : '';
}

type Search = Record<string, string | string[] | undefined> | URLSearchParams;

function pick(search: Search, key: string): string | undefined {
  const v = search instanceof URLSearchParams ? search.get(key) ?? undefined : search[key];
  return Array.isArray(v) ? v[0] : v;
}

/** Reads the page's query: ?q=… or the API's spelling ?size=…&fit=… / &zone=…, plus unit and round. */
export function entryFromSearch(search: Search): EntryState {
  const unit: SizeUnit = pick(search, 'unit') === 'in' ? 'in' : 'mm';
  const roundText = pick(search, 'round');
  const round = roundText === '1' || roundText === 'true';
  const q = pick(search, 'q');
  if (q !== undefined) return { text: q.slice(0, 60), unit, round };
  const parts = [pick(search, 'size'), pick(search, 'fit') ?? pick(search, 'zone')].filter((p): p is string => !!p && p.trim() !== '');
  return { text: parts.join(' ').slice(0, 60), unit, round };
}
