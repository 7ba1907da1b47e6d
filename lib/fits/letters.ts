/**
 * The letters and grades ISO 286 knows, where each letter is defined, and
 * the reading of zone text such as "H7", "g6", "js7", "ZC10", "h01".
 */

import { FitError } from './errors';
import { IT_GRADES } from './it-table';

/** Shaft letters in the standard's order. */
export const SHAFT_LETTERS = [
  'a', 'b', 'c', 'cd', 'd', 'e', 'ef', 'f', 'fg', 'g', 'h', 'js', 'j', 'k',
  'm', 'n', 'p', 'r', 's', 't', 'u', 'v', 'x', 'y', 'z', 'za', 'zb', 'zc',
] as const;

/** Hole letters in the standard's order. */
export const HOLE_LETTERS = [
  'A', 'B', 'C', 'CD', 'D', 'E', 'EF', 'F', 'FG', 'G', 'H', 'JS', 'J', 'K',
  'M', 'N', 'P', 'R', 'S', 'T', 'U', 'V', 'X', 'Y', 'Z', 'ZA', 'ZB', 'ZC',
] as const;

export type ShaftLetter = (typeof SHAFT_LETTERS)[number];

/** Grade numbers as written in a zone: "01", "0", "1" … "18". */
export const GRADES = [
  '01', '0', '1', '2', '3', '4', '5', '6', '7', '8', '9',
  '10', '11', '12', '13', '14', '15', '16', '17', '18',
] as const;

export { IT_GRADES };

/**
 * Sizes over which each letter is defined: above `aboveMm` up to and
 * including `upToMm`. Same for a hole letter and its shaft letter.
 * J/j are limited by grade as well, see the J tables.
 */
export const LETTER_SIZE_LIMITS: Readonly<Record<ShaftLetter, { aboveMm: number; upToMm: number }>> = {
  a: { aboveMm: 1, upToMm: 500 },
  b: { aboveMm: 1, upToMm: 500 },
  c: { aboveMm: 0, upToMm: 500 },
  cd: { aboveMm: 0, upToMm: 10 },
  d: { aboveMm: 0, upToMm: 3150 },
  e: { aboveMm: 0, upToMm: 3150 },
  ef: { aboveMm: 0, upToMm: 10 },
  f: { aboveMm: 0, upToMm: 3150 },
  fg: { aboveMm: 0, upToMm: 10 },
  g: { aboveMm: 0, upToMm: 3150 },
  h: { aboveMm: 0, upToMm: 3150 },
  js: { aboveMm: 0, upToMm: 3150 },
  j: { aboveMm: 0, upToMm: 500 },
  k: { aboveMm: 0, upToMm: 3150 },
  m: { aboveMm: 0, upToMm: 3150 },
  n: { aboveMm: 0, upToMm: 3150 },
  p: { aboveMm: 0, upToMm: 3150 },
  r: { aboveMm: 0, upToMm: 3150 },
  s: { aboveMm: 0, upToMm: 3150 },
  t: { aboveMm: 24, upToMm: 3150 },
  u: { aboveMm: 0, upToMm: 3150 },
  v: { aboveMm: 14, upToMm: 500 },
  x: { aboveMm: 0, upToMm: 500 },
  y: { aboveMm: 18, upToMm: 500 },
  z: { aboveMm: 0, upToMm: 500 },
  za: { aboveMm: 0, upToMm: 500 },
  zb: { aboveMm: 0, upToMm: 500 },
  zc: { aboveMm: 0, upToMm: 500 },
};

const LETTER_INDEX = new Map<string, number>(SHAFT_LETTERS.map((l, i) => [l, i]));

/** Index of the letter in SHAFT_LETTERS / HOLE_LETTERS, by lower-case spelling. */
export const LETTER = {
  h: LETTER_INDEX.get('h') as number,
  js: LETTER_INDEX.get('js') as number,
  j: LETTER_INDEX.get('j') as number,
  k: LETTER_INDEX.get('k') as number,
  m: LETTER_INDEX.get('m') as number,
  n: LETTER_INDEX.get('n') as number,
} as const;

/** A zone as read from text; grade is -1 for IT01, 0 for IT0, n for ITn. */
export interface ZoneSpec {
  /** Normalised text: "H7", "js6", "h01". */
  readonly text: string;
  readonly isHole: boolean;
  /** Letter as written in the zone ("JS", "zc"). */
  readonly letter: string;
  /** Index into SHAFT_LETTERS / HOLE_LETTERS. */
  readonly letterIndex: number;
  readonly grade: number;
  /** Index into IT_GRADES. */
  readonly gradeIndex: number;
  readonly gradeLabel: string;
}

const GRADE_BY_TEXT = new Map<string, number>(GRADES.map((g, i) => [g, i - 1]));

function isAsciiLetter(code: number): boolean {
  return (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
}

function unknown(text: string, why: string): FitError {
  return new FitError('UNKNOWN_ZONE', `"${text}" is not an ISO 286 tolerance zone: ${why}`);
}

/** Reads zone text. Throws UNKNOWN_ZONE with the reason when it is not a zone. */
export function parseZoneText(raw: string): ZoneSpec {
  if (typeof raw !== 'string') throw new FitError('UNKNOWN_ZONE', 'A tolerance zone is written as text, e.g. "H7" or "g6".');
  const text = raw.trim();
  let i = 0;
  while (i < text.length && isAsciiLetter(text.charCodeAt(i))) i++;
  const letters = text.slice(0, i);
  const digits = text.slice(i);
  if (text === '') throw new FitError('UNKNOWN_ZONE', 'No tolerance zone given: write a letter and a grade, e.g. "H7" or "g6".');
  if (letters.toUpperCase() === 'IT') {
    throw unknown(text, `${text} is a grade, not a zone; put a letter in front, e.g. H${digits} for a hole or h${digits} for a shaft.`);
  }
  if (letters === '') throw unknown(text, 'it has no letter; write e.g. "H7" for a hole or "g6" for a shaft.');
  if (digits === '') throw unknown(text, `it has no grade; write e.g. "${letters}7".`);
  const upper = letters.toUpperCase();
  const lower = letters.toLowerCase();
  if (letters !== upper && letters !== lower) {
    throw unknown(text, `capitals mean a hole and small letters a shaft, so write "${upper}${digits}" for a hole or "${lower}${digits}" for a shaft.`);
  }
  const letterIndex = LETTER_INDEX.get(lower);
  if (letterIndex === undefined) {
    throw unknown(text, `there is no letter "${letters}"; holes use ${HOLE_LETTERS.join(', ')} and shafts the same in small letters.`);
  }
  const grade = GRADE_BY_TEXT.get(digits);
  if (grade === undefined) {
    throw unknown(text, `there is no grade "${digits}"; grades are 01, 0 and 1 to 18.`);
  }
  const isHole = letters === upper;
  return {
    text: letters + digits,
    isHole,
    letter: letters,
    letterIndex,
    grade,
    gradeIndex: grade + 1,
    gradeLabel: IT_GRADES[grade + 1] as string,
  };
}

/**
 * Zone text is short and the same few zones come back again and again, so
 * parsed zones are kept. The cache is bounded so that free text typed by
 * users cannot grow it without limit.
 */
const CACHE_LIMIT = 4096;
const zoneCache = new Map<string, ZoneSpec>();

export function readZone(raw: string): ZoneSpec {
  const hit = zoneCache.get(raw);
  if (hit !== undefined) return hit;
  const spec = parseZoneText(raw);
  if (zoneCache.size >= CACHE_LIMIT) zoneCache.clear();
  zoneCache.set(raw, spec);
  return spec;
}
