import { z } from 'zod';
import { OPERATIONS, type Operation } from './log';
import { parseNumber } from '../units/parse';
import { readZone } from '../search/query';
import { looksLikeInchClass, normaliseInchClass } from '../fits/inch';

export const SEARCH_KINDS = [
  { value: 'entry', label: 'Entries' },
  { value: 'session', label: 'Sessions' },
  { value: 'note', label: 'Clip notes' },
  { value: 'comment', label: 'Comments' },
  { value: 'record', label: 'Measurements' },
] as const;
export type SearchKind = (typeof SEARCH_KINDS)[number]['value'];

/** Results a page; pages past SEARCH_MAX_PAGE are refused (a search is refined, not walked to its end). */
export const SEARCH_PAGE_SIZE = 20;
export const SEARCH_MAX_PAGE = 10;
export const SEARCH_QUERY_MAX = 200;

const operationValues = OPERATIONS.map((o) => o.value) as [Operation, ...Operation[]];
const kindValues = SEARCH_KINDS.map((k) => k.value) as [SearchKind, ...SearchKind[]];

/** Empty text, a missing field and "all" mean no filter. */
const blank = (v: unknown) => (v === undefined || v === null || (typeof v === 'string' && (v.trim() === '' || v === 'all')) ? undefined : v);

const size = (field: string) =>
  z.preprocess(blank, z.string().max(20).optional()).transform((v, ctx) => {
    if (v === undefined) return undefined;
    const n = parseNumber(v, { fractions: true });
    if (n === undefined || !Number.isFinite(n) || n <= 0 || n > 10_000) {
      ctx.addIssue({ code: 'custom', message: `${field === 'min' ? 'From' : 'To'}: type a size above 0, e.g. 100 or 1-1/2.` });
      return z.NEVER;
    }
    return n;
  });

/** A zone ("k6", "H7"), a fit ("H7/g6") or an ANSI B4.1 inch class ("RC4"), as a list of zones or classes. */
const zoneField = z.preprocess(blank, z.string().max(20).optional()).transform((v, ctx) => {
  if (v === undefined) return undefined;
  const text = v.trim();
  if (looksLikeInchClass(text)) {
    try {
      return { zones: [] as string[], inchClasses: [normaliseInchClass(text)] };
    } catch {
      /* falls through to the message below */
    }
  }
  const parts = text.split('/').map((s) => s.trim());
  const zones = parts.map(readZone);
  if (parts.length > 2 || zones.some((z) => z === null)) {
    ctx.addIssue({ code: 'custom', message: 'Zone or fit: write an ISO 286 zone such as "k6" or "H7", a fit such as "H7/g6", or an inch class such as "RC4".' });
    return z.NEVER;
  }
  return { zones: zones as string[], inchClasses: [] as string[] };
});

export const searchQuerySchema = z
  .object({
    q: z.preprocess((v) => v ?? '', z.string().max(SEARCH_QUERY_MAX, `Search words: at most ${SEARCH_QUERY_MAX} characters.`)).transform((s) => s.trim()),
    kind: z.preprocess(blank, z.enum(kindValues, { error: 'Look in: pick entries, sessions, clip notes, comments or measurements.' }).optional()),
    operation: z.preprocess(blank, z.enum(operationValues, { error: 'Operation: pick one from the list.' }).optional()),
    zone: zoneField,
    min: size('min'),
    max: size('max'),
    unit: z.preprocess(blank, z.enum(['mm', 'in'], { error: 'Unit: mm or in.' }).default('mm')),
    page: z.preprocess(
      (v) => blank(v) ?? '1',
      z.string().regex(/^\d{1,3}$/, 'Page: a whole number.').transform(Number).pipe(
        z.number().int().min(1, 'Page: 1 or more.').max(SEARCH_MAX_PAGE, `Page: at most ${SEARCH_MAX_PAGE}; add words or filters to narrow the search.`),
      ),
    ),
  })
  .superRefine((v, ctx) => {
    if (v.min !== undefined && v.max !== undefined && v.min > v.max) ctx.addIssue({ code: 'custom', path: ['max'], message: 'To: at least the From size.' });
  });

export type SearchQuery = z.output<typeof searchQuerySchema>;
