/**
 * Reading a number as someone typed it: the one parser for calculator boxes, measurement forms and
 * query strings. A decimal point or a decimal comma; with `fractions`, a fraction or mixed number of
 * an inch ("3/8", "4-1/2", "4 1/2"); with `exponent`, "1e-3".
 */
export interface ParseNumberOptions {
  /** Accept "3/8", "4-1/2" and "4 1/2". Default false. */
  fractions?: boolean;
  /** Accept an exponent ("2.5e-3"). Default false. */
  exponent?: boolean;
}

const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)$/;
const DECIMAL_WITH_EXPONENT = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;
const FRACTION = /^(?:(\d+)(?:\s*-\s*|\s+))?(\d+)\s*\/\s*(\d+)$/;

/** undefined for empty text, NaN for text that is not a number in the accepted forms. */
export function parseNumber(text: string | null | undefined, { fractions = false, exponent = false }: ParseNumberOptions = {}): number | undefined {
  const s = (text ?? '').trim().replace(',', '.');
  if (s === '') return undefined;
  if (fractions) {
    const frac = FRACTION.exec(s);
    if (frac) {
      const bottom = Number(frac[3]);
      if (bottom === 0) return Number.NaN;
      return (frac[1] ? Number(frac[1]) : 0) + Number(frac[2]) / bottom;
    }
  }
  if (!(exponent ? DECIMAL_WITH_EXPONENT : DECIMAL).test(s)) return Number.NaN;
  return Number(s);
}
