import { z } from 'zod';
import { looksLikeInchClass, normaliseInchClass } from '@/lib/fits';
import { SIZE_UNITS, type SizeUnit } from './fits-words';
import { readDesignationText, readSizeText } from './fits-text';

/** What the fits page and GET /api/fits agree on once the input has been read. */
export type FitsEntry = {
  /** Which input the size and zone came from, so an engine refusal can be pinned to the right field. */
  source: 'q' | 'fields';
  nominalMm: number;
  /** Unit the size was given in. */
  unit: SizeUnit;
  /** The size in that unit (1 for "1 in"). */
  nominalInput: number;
  /** The size as typed, decimal comma turned into a point ("25", "1-1/4"). */
  nominalText: string;
  zone?: string;
  /** "H7/g6", hole first. */
  fit?: string;
  /** ANSI B4.1 inch class ("RC4"); the size is then in inches. */
  inchClass?: string;
  roundJs: boolean;
};

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

const text = (field: string, max: number, example: string) =>
  z.preprocess(
    blankToUndefined,
    z
      .string({ error: `${field} must be text, e.g. ${example}.` })
      .trim()
      .max(max, `${field} is too long: write it like ${example}.`)
      .optional(),
  );

/**
 * The query of GET /api/fits: either q ("25 H7/g6", read like the page's one box), or size with
 * zone or fit. unit says what the size is in (mm by default; 25.4 mm to the inch, exactly);
 * round=1 rounds JS/js of grades 7–11 as ISO 286-1 allows.
 */
export const fitsQuerySchema = z
  .object({
    q: text('q', 60, '"25 H7/g6"'),
    size: text('size', 20, '25'),
    zone: text('zone', 12, 'H7 or g6'),
    fit: text('fit', 24, 'H7/g6 or RC4'),
    unit: z.preprocess(blankToUndefined, z.enum(SIZE_UNITS, { error: 'unit must be mm or in.' }).optional()),
    round: z.preprocess(
      blankToUndefined,
      z.enum(['0', '1', 'true', 'false'], { error: 'round must be 1 (round JS/js as ISO 286-1 allows) or 0.' }).default('0'),
    ),
  })
  .transform((query, ctx): FitsEntry => {
    const roundJs = query.round === '1' || query.round === 'true';
    if (query.q !== undefined) {
      if (query.size !== undefined || query.zone !== undefined || query.fit !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['q'], message: 'Send either q (e.g. "25 H7/g6") or size with zone or fit, not both.' });
        return z.NEVER;
      }
      const read = readDesignationText(query.q, query.unit ?? 'mm');
      if (!read.ok) {
        ctx.addIssue({ code: 'custom', path: ['q'], message: read.message });
        return z.NEVER;
      }
      const d = read.value;
      if (d.inchClass !== undefined) {
        return { source: 'q', nominalMm: d.nominalMm, unit: d.unit, nominalInput: d.nominalInput, nominalText: d.nominalText, inchClass: d.inchClass, roundJs };
      }
      if (d.zone === undefined && d.fit === undefined) {
        ctx.addIssue({
          code: 'custom',
          path: ['q'],
          message: `Read the size ${d.nominalText} ${d.unit}; add a zone such as "H7" or a fit such as "H7/g6" after it.`,
        });
        return z.NEVER;
      }
      return {
        source: 'q',
        nominalMm: d.nominalMm,
        unit: d.unit,
        nominalInput: d.nominalInput,
        nominalText: d.nominalText,
        zone: d.zone,
        fit: d.fit ? `${d.fit.hole}/${d.fit.shaft}` : undefined,
        roundJs,
      };
    }

    if (query.fit !== undefined && query.zone === undefined && looksLikeInchClass(query.fit)) {
      let inchClass: string | undefined;
      try {
        inchClass = normaliseInchClass(query.fit);
      } catch (err) {
        ctx.addIssue({ code: 'custom', path: ['fit'], message: err instanceof Error ? err.message : 'Not an inch class.' });
      }
      if (query.unit === 'mm') {
        ctx.addIssue({ code: 'custom', path: ['unit'], message: `${inchClass ?? 'An inch class'} is tabulated in inches: send unit=in (or leave unit out).` });
      }
      let inches: { nominalMm: number; nominalInput: number; nominalText: string } | undefined;
      if (query.size === undefined) {
        ctx.addIssue({ code: 'custom', path: ['size'], message: 'Give the nominal size in inches, e.g. size=1.5.' });
      } else {
        // The class's own table says how far it goes (to 200 in for RC and LC): the engine decides.
        const read = readSizeText(query.size, 'in', { isoRange: false });
        if (read.ok) inches = read.value;
        else ctx.addIssue({ code: 'custom', path: ['size'], message: read.message });
      }
      if (inchClass === undefined || inches === undefined || query.unit === 'mm') return z.NEVER;
      return { source: 'fields', ...inches, unit: 'in', inchClass, roundJs };
    }

    const unit = query.unit ?? 'mm';
    let size: { nominalMm: number; nominalInput: number; nominalText: string } | undefined;
    if (query.size === undefined) {
      ctx.addIssue({ code: 'custom', path: ['size'], message: 'Give the nominal size, e.g. size=25 (mm) or size=1&unit=in.' });
    } else {
      const read = readSizeText(query.size, unit);
      if (read.ok) size = read.value;
      else ctx.addIssue({ code: 'custom', path: ['size'], message: read.message });
    }
    if (query.zone === undefined && query.fit === undefined) {
      const message = 'Give a tolerance zone (zone=H7) or a fit, hole first (fit=H7/g6).';
      ctx.addIssue({ code: 'custom', path: ['zone'], message });
      ctx.addIssue({ code: 'custom', path: ['fit'], message });
    } else if (query.zone !== undefined && query.fit !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['fit'], message: 'Give either zone or fit, not both.' });
    }
    if (!size || (query.zone === undefined) === (query.fit === undefined)) return z.NEVER;
    return { source: 'fields', ...size, unit, zone: query.zone, fit: query.fit, roundJs };
  });
