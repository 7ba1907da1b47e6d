/** A time on a clip as people read it: "3:41", "1:02:03". Seconds are truncated, never rounded up past the moment. */
export function formatClock(ms: number): string {
  const total = Math.max(0, Math.floor((Number.isFinite(ms) ? ms : 0) / 1000));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const ss = String(s).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${ss}` : `${m}:${ss}`;
}

/**
 * Reads a time someone typed: "3:41", "1:02:03", "221" (seconds), "3:41.5", "0:07.250".
 * Returns milliseconds, or null when it is not a time. Minutes and seconds after a colon must be 0–59.
 */
export function parseClock(text: string): number | null {
  const t = text.trim();
  const m = /^(?:(?:(\d+):)?(\d{1,2}):)?(\d+)(?:[.,](\d{1,3}))?$/.exec(t);
  if (!m) return null;
  const [, hours, minutes, seconds, fraction] = m;
  const h = hours ? Number(hours) : 0;
  const min = minutes ? Number(minutes) : 0;
  const s = Number(seconds);
  // With a colon before them, seconds are a clock field; alone they may be any count ("221").
  if (minutes !== undefined && s > 59) return null;
  if (hours !== undefined && min > 59) return null;
  const ms = fraction ? Number(fraction.padEnd(3, '0')) : 0;
  return ((h * 60 + min) * 60 + s) * 1000 + ms;
}

/** HH:MM:SS.mmm, the form a WebVTT file is written in (hours always present, at least two digits). */
export function formatVttTimestamp(ms: number): string {
  return formatTimestamp(ms, '.');
}

/** HH:MM:SS,mmm, the form an SRT file is written in. */
export function formatSrtTimestamp(ms: number): string {
  return formatTimestamp(ms, ',');
}

function formatTimestamp(ms: number, mark: '.' | ','): string {
  const total = Math.max(0, Math.round(ms));
  const h = Math.floor(total / 3_600_000);
  const m = Math.floor((total % 3_600_000) / 60_000);
  const s = Math.floor((total % 60_000) / 1000);
  const f = total % 1000;
  const two = (n: number) => String(n).padStart(2, '0');
  return `${two(h)}:${two(m)}:${two(s)}${mark}${String(f).padStart(3, '0')}`;
}
