// A short piece of a found text around the first matching word, with the matching words marked. Pure.

export type ExcerptPart = { text: string; mark: boolean };

const WORD_CHAR = String.raw`[\p{L}\p{N}]`;
const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** A regex that finds any of the terms at the start of a word, the rest of that word included (prefix search). */
function termsPattern(terms: string[]): RegExp | null {
  const clean = [...new Set(terms.map((t) => t.trim()).filter(Boolean))].sort((a, b) => b.length - a.length);
  if (!clean.length) return null;
  return new RegExp(`(?<!${WORD_CHAR})(?:${clean.map(escapeRe).join('|')})${WORD_CHAR}*`, 'giu');
}

/** Up to about `length` characters of `text` around the first match, cut at spaces, with "…" where cut. */
export function excerptOf(text: string, terms: string[], length = 200): ExcerptPart[] {
  const flat = text.replace(/\s+/g, ' ').trim();
  if (!flat) return [];
  const re = termsPattern(terms);
  const first = re ? flat.search(re) : -1;
  let start = 0;
  if (first > length / 3) {
    start = flat.lastIndexOf(' ', first - Math.floor(length / 3));
    start = start < 0 ? 0 : start + 1;
  }
  let end = Math.min(flat.length, start + length);
  if (end < flat.length) {
    const space = flat.lastIndexOf(' ', end);
    if (space > start + length / 2) end = space;
  }
  const piece = flat.slice(start, end);
  const parts: ExcerptPart[] = [];
  if (start > 0) parts.push({ text: '…', mark: false });
  let at = 0;
  if (re) {
    for (const m of piece.matchAll(re)) {
      if (m.index! > at) parts.push({ text: piece.slice(at, m.index), mark: false });
      parts.push({ text: m[0], mark: true });
      at = m.index! + m[0].length;
    }
  }
  if (at < piece.length) parts.push({ text: piece.slice(at), mark: false });
  if (end < flat.length) parts.push({ text: '…', mark: false });
  return parts;
}

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ESCAPES[c]!);

/** The excerpt as HTML for clients of the JSON API: every character of the text escaped, matches in <mark>. */
export function excerptHtml(parts: ExcerptPart[]): string {
  return parts.map((p) => (p.mark ? `<mark>${escapeHtml(p.text)}</mark>` : escapeHtml(p.text))).join('');
}
