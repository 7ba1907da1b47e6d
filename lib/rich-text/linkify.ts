// Plain text with web addresses in it, cut into pieces a renderer can show as text nodes and links.
// Pure: no React, no DOM. Only http(s) addresses become links; everything else stays text, so
// markup, "javascript:" and "data:" addresses are shown as the characters they are.

export type TextSegment = { kind: 'text'; text: string } | { kind: 'link'; text: string; href: string };

/** Longer than any address a person pastes into a comment; past it, the text is left alone. */
export const LINK_MAX_LENGTH = 2048;

// A candidate runs from the scheme to the first character no address carries raw in running text (control characters included).
// eslint-disable-next-line no-control-regex
const CANDIDATE = /\bhttps?:\/\/[^\s<>"'`{}|\\^\u0000-\u001f\u007f]+/gi;

// Punctuation that ends a sentence rather than an address: "see https://example.test/page."
const TRAILING = /[.,;:!?*~]+$/;

const PAIRS: Record<string, string> = { ')': '(', ']': '[' };

/** Drops trailing sentence punctuation, and closing brackets that have no partner inside the address. */
function trimCandidate(raw: string): string {
  let s = raw;
  for (;;) {
    const before = s;
    s = s.replace(TRAILING, '');
    const last = s.at(-1);
    if (last && PAIRS[last]) {
      const opens = s.split(PAIRS[last]).length - 1;
      const closes = s.split(last).length - 1;
      if (closes > opens) s = s.slice(0, -1);
    }
    if (s === before) return s;
  }
}

/** The address to put in href, or null when it is not a plain http(s) address. */
export function safeWebHref(candidate: string): string | null {
  if (!candidate || candidate.length > LINK_MAX_LENGTH) return null;
  if (!/^https?:\/\//i.test(candidate)) return null;
  let url: URL;
  try {
    url = new URL(candidate);
  } catch {
    return null;
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') return null;
  if (!url.hostname) return null;
  // "https://trusted.test@elsewhere.test" reads as one site and goes to another.
  if (url.username || url.password) return null;
  return url.href;
}

/** Splits text into text and link segments; joining every segment's text gives back the input exactly. */
export function linkify(input: string): TextSegment[] {
  const text = typeof input === 'string' ? input : '';
  const out: TextSegment[] = [];
  let at = 0;
  const pushText = (t: string) => {
    if (!t) return;
    const prev = out.at(-1);
    if (prev?.kind === 'text') prev.text += t;
    else out.push({ kind: 'text', text: t });
  };
  for (const match of text.matchAll(CANDIDATE)) {
    const start = match.index ?? 0;
    const candidate = trimCandidate(match[0]);
    const href = safeWebHref(candidate);
    if (!href) continue;
    pushText(text.slice(at, start));
    out.push({ kind: 'link', text: candidate, href });
    at = start + candidate.length;
  }
  pushText(text.slice(at));
  return out;
}
