// Reading WebVTT and SRT files into cues. Lenient where a reader can be without guessing,
// and every line it gives up on is reported with its number and the reason.
import { formatVttTimestamp } from './clock';

export type Cue = {
  startMs: number;
  endMs: number;
  text: string;
  /** The line of the file the cue's timing is on (1-based), so later checks can point at it. */
  line: number;
};
export type CaptionProblem = { line: number; reason: string };
export type CaptionFormat = 'vtt' | 'srt';
export type CaptionParse = { format: CaptionFormat; cues: Cue[]; problems: CaptionProblem[] };

type Line = { n: number; text: string };

function splitLines(text: string): Line[] {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  return body.split(/\r\n|\r|\n/).map((t, i) => ({ n: i + 1, text: t }));
}

const isBlank = (l: Line | undefined) => l !== undefined && l.text.trim() === '';

/** Consecutive non-blank lines, as the two formats group them. */
function blocks(lines: Line[], from: number): Line[][] {
  const out: Line[][] = [];
  let current: Line[] = [];
  for (let i = from; i < lines.length; i++) {
    if (isBlank(lines[i])) {
      if (current.length) out.push(current);
      current = [];
    } else current.push(lines[i]);
  }
  if (current.length) out.push(current);
  return out;
}

type Stamp = { ok: true; ms: number; rest: string } | { ok: false; reason: string };

/**
 * A WebVTT timestamp as the spec's parser collects it: optional hours (any number of digits),
 * two-digit minutes and seconds up to 59, a full stop and exactly three digits of milliseconds.
 */
function vttTimestamp(input: string): Stamp {
  const m = /^(\d+):(\d+)(?::(\d+))?([.,])(\d+)/.exec(input);
  if (!m) return { ok: false, reason: 'expected a time like 00:01:02.500' };
  const [all, a, b, c, mark, frac] = m;
  let h = 0;
  let min: number;
  let sec: number;
  if (c === undefined) {
    // Two fields: minutes and seconds. A first field that is not two digits or is over 59 means hours, which needs a third.
    if (a.length !== 2 || Number(a) > 59) return { ok: false, reason: `"${all}" has hours but no seconds` };
    min = Number(a);
    sec = Number(b);
    if (b.length !== 2) return { ok: false, reason: `seconds in "${all}" must be two digits` };
  } else {
    h = Number(a);
    min = Number(b);
    sec = Number(c);
    if (b.length !== 2 || c.length !== 2) return { ok: false, reason: `minutes and seconds in "${all}" must be two digits` };
  }
  if (min > 59 || sec > 59) return { ok: false, reason: `minutes and seconds in "${all}" must be 59 or less` };
  if (mark === ',') return { ok: false, reason: `WebVTT writes milliseconds after a full stop ("${all.replace(',', '.')}"), not a comma as SRT does` };
  if (frac.length !== 3) return { ok: false, reason: `milliseconds in "${all}" must be exactly three digits` };
  return { ok: true, ms: ((h * 60 + min) * 60 + sec) * 1000 + Number(frac), rest: input.slice(all.length) };
}

/** An SRT timestamp: HH:MM:SS,mmm by common practice; a full stop and fewer digits are accepted too. */
function srtTimestamp(input: string): Stamp {
  const m = /^(\d+):(\d{1,2}):(\d{1,2})(?:[,.](\d{1,3}))?/.exec(input);
  if (!m) return { ok: false, reason: 'expected a time like 00:01:02,500' };
  const [all, h, min, sec, frac] = m;
  if (Number(min) > 59 || Number(sec) > 59) return { ok: false, reason: `minutes and seconds in "${all}" must be 59 or less` };
  const ms = frac ? Number(frac.padEnd(3, '0')) : 0;
  return { ok: true, ms: ((Number(h) * 60 + Number(min)) * 60 + Number(sec)) * 1000 + ms, rest: input.slice(all.length) };
}

type Timing = { ok: true; startMs: number; endMs: number } | { ok: false; reason: string };

function timingLine(text: string, stamp: (s: string) => Stamp): Timing {
  const [left, ...right] = text.split('-->');
  const start = stamp(left.trim());
  if (!start.ok) return { ok: false, reason: `Unreadable start time: ${start.reason}.` };
  if (start.rest.trim()) return { ok: false, reason: `Unexpected "${start.rest.trim()}" after the start time.` };
  const after = right.join('-->').replace(/^[ \t]+/, '');
  const end = stamp(after);
  if (!end.ok) return { ok: false, reason: `Unreadable end time: ${end.reason}.` };
  // Whatever follows the end time is cue settings (WebVTT) or position hints (some SRT files): not ours to use.
  if (end.rest && !/^[ \t]/.test(end.rest)) return { ok: false, reason: `Unexpected "${end.rest.trim()}" straight after the end time.` };
  if (end.ms <= start.ms) {
    return { ok: false, reason: `The cue ends (${formatVttTimestamp(end.ms)}) at or before its start (${formatVttTimestamp(start.ms)}).` };
  }
  return { ok: true, startMs: start.ms, endMs: end.ms };
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', nbsp: ' ', lrm: '', rlm: '', quot: '"', apos: "'" };

/** Cue text markup (<b>, <c.x>, <v Name>, <00:01.000>) removed and character references decoded, to plain words. */
function plainVttText(text: string): string {
  return text
    .replace(/<[^>]*>/g, '')
    .replace(/&(#x[0-9a-f]+|#\d+|[a-z]+);/gi, (whole, ref: string) => {
      if (ref[0] === '#') {
        const code = ref[1] === 'x' || ref[1] === 'X' ? parseInt(ref.slice(2), 16) : parseInt(ref.slice(1), 10);
        return Number.isFinite(code) && code > 0 && code <= 0x10ffff ? String.fromCodePoint(code) : whole;
      }
      return ENTITIES[ref.toLowerCase()] ?? whole;
    });
}

/** SRT's common formatting tags (<i>, <b>, <u>, <font ...>) and positioning codes ({\an8}) removed. */
function plainSrtText(text: string): string {
  return text.replace(/<\/?(?:i|b|u|s|font)(?:\s[^>]*)?>/gi, '').replace(/\{\\[^}]*\}/g, '');
}

/** Multi-line cue text becomes one line: a note, like a chapter title, is one run of words. */
const joinText = (lines: Line[], clean: (s: string) => string) =>
  clean(lines.map((l) => l.text).join('\n'))
    .split('\n')
    .map((s) => s.trim())
    .filter(Boolean)
    .join(' ')
    .replace(/[ \t]+/g, ' ');

/**
 * Cue blocks of either format: an optional identifier line, a timing line, then text lines.
 * A text line containing "-->" starts the next cue, as the WebVTT parser does.
 */
function readCues(blockList: Line[][], stamp: (s: string) => Stamp, clean: (s: string) => string, skipIndexBefore: boolean) {
  const cues: Cue[] = [];
  const problems: CaptionProblem[] = [];
  const queue = blockList.map((b) => [...b]);
  while (queue.length) {
    const block = queue.shift()!;
    const t = block.findIndex((l) => l.text.includes('-->'));
    if (t === -1 || t > 1) {
      // Two lines with no timing among them: not a cue. One problem for the block, at its first line.
      const first = block[0];
      problems.push({ line: first.n, reason: `No timing line ("start --> end") where a cue should begin: "${clip(first.text)}".` });
      if (t === -1) continue;
      queue.unshift(block.slice(t));
      continue;
    }
    const timing = timingLine(block[t].text, stamp);
    const rest = block.slice(t + 1);
    const next = rest.findIndex((l) => l.text.includes('-->'));
    let textLines = next === -1 ? rest : rest.slice(0, next);
    if (next !== -1) {
      let from = next;
      // In SRT a number line just before the next timing is that cue's index, not this cue's text.
      if (skipIndexBefore && from > 0 && /^\d+$/.test(rest[from - 1].text.trim())) {
        from -= 1;
        textLines = rest.slice(0, from);
      }
      queue.unshift(rest.slice(from));
    }
    if (!timing.ok) {
      problems.push({ line: block[t].n, reason: timing.reason });
      continue;
    }
    const text = joinText(textLines, clean);
    if (!text) {
      problems.push({ line: block[t].n, reason: 'The cue has no text.' });
      continue;
    }
    cues.push({ startMs: timing.startMs, endMs: timing.endMs, text, line: block[t].n });
  }
  return { cues, problems };
}

function clip(s: string, n = 40): string {
  const t = s.trim();
  return t.length > n ? `${t.slice(0, n)}…` : t;
}

/** Reads a WebVTT file (W3C "WebVTT: The Web Video Text Tracks Format"). */
export function parseWebVtt(text: string): CaptionParse {
  const lines = splitLines(text);
  const problems: CaptionProblem[] = [];
  let from = 0;
  if (/^WEBVTT(?:[ \t]|$)/.test(lines[0]?.text ?? '')) {
    // The header runs to the first blank line; anything on it is metadata we have no use for.
    from = lines.findIndex(isBlank);
    if (from === -1) from = lines.length;
  } else {
    problems.push({ line: 1, reason: 'A WebVTT file starts with the line "WEBVTT"; reading on anyway.' });
  }
  const cueBlocks = blocks(lines, from).filter((b) => !/^(?:NOTE|STYLE|REGION)(?:[ \t]|$)/.test(b[0].text));
  const read = readCues(cueBlocks, vttTimestamp, plainVttText, false);
  return { format: 'vtt', cues: read.cues, problems: [...problems, ...read.problems].sort((a, b) => a.line - b.line) };
}

/** Reads an SRT (SubRip) file: numbered blocks of "HH:MM:SS,mmm --> HH:MM:SS,mmm" and text. */
export function parseSrt(text: string): CaptionParse {
  const lines = splitLines(text);
  const read = readCues(blocks(lines, 0), srtTimestamp, plainSrtText, true);
  return { format: 'srt', cues: read.cues, problems: read.problems.sort((a, b) => a.line - b.line) };
}

/** Picks the reader by what the file holds (a "WEBVTT" first line), then by its name's extension. */
export function parseCaptionFile(name: string, text: string): CaptionParse {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (/^WEBVTT(?:[ \t\r\n]|$)/.test(body)) return parseWebVtt(text);
  const ext = /\.([a-z0-9]+)$/i.exec(name.trim())?.[1]?.toLowerCase();
  if (ext === 'vtt') return parseWebVtt(text);
  return parseSrt(text);
}
