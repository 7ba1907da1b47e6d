// What the log accepts as photos and clips, shared by the uploader (before sending) and the server.
// Sizes count in powers of 1024, as the upload SDK's limits do.

export const MiB = 1024 * 1024;
export const PHOTO_MAX_BYTES = 20 * MiB;
export const CLIP_MAX_BYTES = 2 * 1024 * MiB;

/** How many of each the uploader sends at once. */
export const PHOTO_BATCH = 10;
export const CLIP_BATCH = 1;

export const PHOTO_ACCEPT = 'image/jpeg,image/png,image/webp,image/gif';
export const CLIP_ACCEPT = 'video/mp4,video/quicktime,video/webm,.mp4,.m4v,.mov,.webm';

/** A clip longer than this is not a shop clip but a mistake (or a lie). */
export const CLIP_MAX_DURATION_MS = 12 * 3600 * 1000;
/** Below this no video is watchable; above it no phone or camera records. */
export const CLIP_MIN_BITS_PER_SECOND = 8_000;
export const CLIP_MAX_BITS_PER_SECOND = 400_000_000;

/** One decimal below 10 of a unit, none above; a trailing ".0" is dropped. */
export function formatBytes(bytes: number): string {
  const fmt = (n: number) => (n < 10 ? n.toFixed(1) : n.toFixed(0)).replace(/\.0$/, '');
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < MiB) return `${fmt(bytes / 1024)} KB`;
  if (bytes < 1024 * MiB) return `${fmt(bytes / MiB)} MB`;
  return `${fmt(bytes / (1024 * MiB))} GB`;
}

/** m:ss, or h:mm:ss for an hour or more. */
export function formatDuration(ms: number): string {
  const total = Math.round(ms / 1000);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const ss = String(s).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${ss}` : `${m}:${ss}`;
}

export function maxBytesFor(kind: 'photo' | 'clip'): number {
  return kind === 'photo' ? PHOTO_MAX_BYTES : CLIP_MAX_BYTES;
}

/** The refusal for a file over the limit, or null. */
export function sizeRefusal(kind: 'photo' | 'clip', name: string, sizeBytes: number): string | null {
  const max = maxBytesFor(kind);
  if (sizeBytes <= max) return null;
  const [size, limit] = formatBytes(sizeBytes) === formatBytes(max) ? [`${sizeBytes} bytes`, `${max} bytes`] : [formatBytes(sizeBytes), formatBytes(max)];
  return `“${name}” is ${size}; a ${kind} can be at most ${limit}.`;
}

/**
 * Whether a clip's reported length fits its size: the browser measures the length, so the server
 * only checks that it is possible. Returns the refusal, or null.
 */
export function durationRefusal(name: string, sizeBytes: number, durationMs: number): string | null {
  if (!Number.isFinite(durationMs) || durationMs <= 0) return `The length of “${name}” could not be read as a positive time; try the clip again.`;
  if (durationMs >= CLIP_MAX_DURATION_MS) return `“${name}” is said to be ${formatDuration(durationMs)} long; clips must be shorter than 12 hours.`;
  const bitsPerSecond = (sizeBytes * 8) / (durationMs / 1000);
  if (bitsPerSecond < CLIP_MIN_BITS_PER_SECOND || bitsPerSecond > CLIP_MAX_BITS_PER_SECOND) {
    return `“${name}” is ${formatBytes(sizeBytes)} but said to be ${formatDuration(durationMs)} long, which no video can be; check that it is the right file.`;
  }
  return null;
}

/** Width and height as shown: EXIF orientations 5–8 turn the picture a quarter (Exif 2.3, tag 0x0112 — from memory). */
export function displaySize(width: number, height: number, orientation?: number): { width: number; height: number } {
  return orientation && orientation >= 5 && orientation <= 8 ? { width: height, height: width } : { width, height };
}
