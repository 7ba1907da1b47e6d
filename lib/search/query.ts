// Reading what someone types in the search box: trade words for a fit ("k6 spigot 130 mm", "H7 bores between
// 100 and 150 mm") become filters, the rest are words for the full-text index. Pure: no I/O.
import { looksLikeInchClass, normaliseInchClass } from '../fits/inch';
import { parseZoneText } from '../fits/letters';

type SizeRange = { min: number; max: number; unit: 'mm' | 'in' };
export type FeatureKind = 'inside' | 'outside';

type ReadQuery = {
  /** Single words for the index, in the order typed (lower case). */
  words: string[];
  /** "Quoted phrases", each as its words. */
  phrases: string[][];
  /** ISO 286 zones as written ("k6", "H7"): capitals are holes, small letters shafts. */
  zones: string[];
  /** ANSI B4.1 inch classes ("RC4"). */
  inchClasses: string[];
  size: SizeRange | null;
  /** From a word such as "bore" or "spigot", taken as a filter only when the query is about a fit. */
  kind: FeatureKind | null;
};

const NUM = String.raw`(\d+(?:[.,]\d+)?|[.,]\d+)`;
const UNIT = String.raw`(mm|millimet(?:er|re)s?|in(?:ch(?:es)?)?|")(?![\p{L}\p{N}])`;
const RANGES: RegExp[] = [
  new RegExp(String.raw`\b(?:between|from)\s+${NUM}\s*(?:mm|in)?\s+(?:and|to)\s+${NUM}\s*${UNIT}`, 'iu'),
  new RegExp(String.raw`(?<![\p{L}\p{N}.,])${NUM}\s*(?:mm|in)?\s*(?:-|–|to|\.\.)\s*${NUM}\s*${UNIT}`, 'iu'),
];
const SINGLE = new RegExp(String.raw`(?:Ø|ø|⌀)?(?<![\p{L}\p{N}.,])${NUM}\s*${UNIT}`, 'iu');

// Words that name the feature's side in the trade, read as a filter in a fit query.
const KIND_WORDS: Record<string, FeatureKind> = {
  bore: 'inside', bores: 'inside', hole: 'inside', holes: 'inside', recess: 'inside', recesses: 'inside', socket: 'inside',
  spigot: 'outside', spigots: 'outside', shaft: 'outside', shafts: 'outside', pin: 'outside', pins: 'outside',
  journal: 'outside', journals: 'outside', arbor: 'outside', arbors: 'outside',
};

const num = (s: string) => Number(s.replace(',', '.'));
const unitOf = (s: string): 'mm' | 'in' => (/^m/i.test(s) ? 'mm' : 'in');

/** An ISO zone as written, or null. "M8" and the like read as a metric thread, not a zone, unless beside a size. */
export function readZone(token: string): string | null {
  if (!/^[A-Za-z]{1,2}\d{1,2}$/.test(token)) return null;
  try {
    return parseZoneText(token).text;
  } catch {
    return null;
  }
}

function readInchClass(token: string): string | null {
  if (!looksLikeInchClass(token)) return null;
  try {
    return normaliseInchClass(token);
  } catch {
    return null;
  }
}

export function readSearchQuery(raw: string): ReadQuery {
  let text = ` ${raw.normalize('NFKC')} `;
  const phrases: string[][] = [];
  text = text.replace(/"([^"]*)"/g, (_m, inner: string) => {
    const words = (inner.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []);
    if (words.length) phrases.push(words);
    return ' ';
  });

  let size: SizeRange | null = null;
  for (const re of RANGES) {
    const m = re.exec(text);
    if (m) {
      const a = num(m[1]!), b = num(m[2]!);
      size = { min: Math.min(a, b), max: Math.max(a, b), unit: unitOf(m[3]!) };
      text = text.replace(m[0], ' ');
      break;
    }
  }
  if (!size) {
    const m = SINGLE.exec(text);
    if (m) {
      size = { min: num(m[1]!), max: num(m[1]!), unit: unitOf(m[2]!) };
      text = text.replace(m[0], ' ');
    }
  }

  const zones: string[] = [];
  const inchClasses: string[] = [];
  const rest: string[] = [];
  const tokens = text.split(/\s+/).filter(Boolean);
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!.replace(/^[(\[,;]+|[)\],;.:!?]+$/g, '');
    // "LC 11", "RC 4": a class written with a space.
    const joined = /^(RC|LC|LT|LN|FN)$/i.test(token) && /^\d{1,2}$/.test(tokens[i + 1] ?? '') ? `${token}${tokens[i + 1]}` : null;
    const inch = readInchClass(joined ?? token);
    if (inch) {
      inchClasses.push(inch);
      if (joined) i++;
      continue;
    }
    const pair = /^([A-Za-z]{1,2}\d{1,2})\/([A-Za-z]{1,2}\d{1,2})$/.exec(token);
    if (pair && readZone(pair[1]!) && readZone(pair[2]!)) {
      zones.push(readZone(pair[1]!)!, readZone(pair[2]!)!);
      continue;
    }
    const zone = readZone(token);
    if (zone && (!/^M\d+$/.test(zone) || size)) {
      zones.push(zone);
      continue;
    }
    rest.push(token);
  }

  const fit = zones.length > 0 || inchClasses.length > 0 || size !== null;
  const words: string[] = [];
  let kind: FeatureKind | null = null;
  for (const token of rest) {
    for (const w of token.toLowerCase().match(/[\p{L}\p{N}]+/gu) ?? []) {
      if (fit && KIND_WORDS[w] && (kind === null || kind === KIND_WORDS[w])) {
        kind = KIND_WORDS[w]!;
        continue;
      }
      words.push(w);
    }
  }
  return { words, phrases, zones: [...new Set(zones)], inchClasses: [...new Set(inchClasses)], size, kind };
}
