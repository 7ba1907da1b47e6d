// Writing a clip's notes out: a WebVTT chapters file, or a neutral timestamp list (one line per note).
import { formatClock, formatVttTimestamp } from './clock';

/** What the writers need of a note. */
export type ChapterNote = { startMs: number; endMs?: number | null; text: string };

/** Without the clip's length, the last chapter runs this long (players stop at the media's end anyway). */
export const LAST_CHAPTER_FALLBACK_MS = 60_000;

/** A note's text as one chapter title: one line, single spaces. */
export function chapterTitle(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

function byStart<T extends ChapterNote>(notes: readonly T[]): T[] {
  return [...notes].sort((a, b) => a.startMs - b.startMs);
}

/**
 * Each chapter ends at the next later note's start, or at its own end time, whichever comes first,
 * or at the clip's end; chapters never overlap.
 */
export function chapterSpans(notes: readonly ChapterNote[], durationMs?: number | null): { startMs: number; endMs: number; title: string }[] {
  const sorted = byStart(notes);
  return sorted.map((n, i) => {
    const next = sorted.slice(i + 1).find((o) => o.startMs > n.startMs);
    const candidates = [n.endMs ?? Infinity, next?.startMs ?? Infinity, durationMs ?? Infinity].filter((v) => v > n.startMs);
    let endMs = Math.min(...candidates);
    if (!Number.isFinite(endMs)) endMs = n.startMs + LAST_CHAPTER_FALLBACK_MS;
    return { startMs: n.startMs, endMs, title: chapterTitle(n.text) };
  });
}

/** Cue text may not hold "<", "&" or "-->" as such: write them as character references. */
function escapeCueText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/** A WebVTT chapters file: the header, then one cue per note, HH:MM:SS.mmm --> HH:MM:SS.mmm. */
export function toWebVtt(notes: readonly ChapterNote[], options: { durationMs?: number | null } = {}): string {
  const cues = chapterSpans(notes, options.durationMs).map(
    (c, i) => `${i + 1}\n${formatVttTimestamp(c.startMs)} --> ${formatVttTimestamp(c.endMs)}\n${escapeCueText(c.title)}`,
  );
  return ['WEBVTT', ...cues].join('\n\n') + '\n';
}

/** The timestamp list: one line per note, "0:00 Facing the spigot", in time order, exactly as written. */
export function toTimestampList(notes: readonly ChapterNote[]): string {
  return byStart(notes)
    .map((n) => `${formatClock(n.startMs)} ${chapterTitle(n.text)}`)
    .join('\n');
}

