/**
 * Links to a moment of a clip. The moment travels in the URL's fragment in the W3C Media Fragments
 * form (`#t=<seconds>`); the clip, when an entry has several, in `?clip=<id>`. One helper builds every
 * such link so the form is the same wherever a moment is linked from.
 */

/** `/logs/<slug>/entries/<id>?clip=<clipId>#t=<whole seconds>` */
export function momentHref(entryPath: string, clipId: number | null | undefined, ms: number): string {
  const seconds = Math.max(0, Math.floor((Number.isFinite(ms) ? ms : 0) / 1000));
  const query = clipId != null ? `?clip=${clipId}` : '';
  return `${entryPath}${query}#t=${seconds}`;
}

/**
 * The start of a temporal media fragment, in milliseconds: `#t=8`, `#t=8.5`, `#t=npt:8`, `#t=0:08`,
 * `#t=8,12` (the end is ignored), also among other name=value pairs (`#clip&t=8`). Null when there is none.
 */
export function parseMomentFragment(hash: string): number | null {
  const body = hash.startsWith('#') ? hash.slice(1) : hash;
  for (const pair of body.split('&')) {
    const eq = pair.indexOf('=');
    if (eq < 0 || decodeURIComponent(pair.slice(0, eq)) !== 't') continue;
    let value = decodeURIComponent(pair.slice(eq + 1));
    if (value.startsWith('npt:')) value = value.slice(4);
    const start = value.split(',')[0];
    const ms = parseNpt(start);
    if (ms !== null) return ms;
  }
  return null;
}

/** Normal play time: seconds ("8", "8.5") or a clock ("0:08", "1:02:03.5"). */
function parseNpt(text: string): number | null {
  const m = /^(?:(?:(\d+):)?(\d{1,2}):)?(\d+)(?:\.(\d+))?$/.exec(text);
  if (!m) return null;
  const [, h, min, s, frac] = m;
  if (min !== undefined && Number(s) > 59) return null;
  if (h !== undefined && Number(min) > 59) return null;
  const seconds = (Number(h ?? 0) * 60 + Number(min ?? 0)) * 60 + Number(s) + (frac ? Number(`0.${frac}`) : 0);
  return Math.round(seconds * 1000);
}

/** An old-style `?t=<seconds>` value, as milliseconds, or null when it is not a time. */
export function legacyMomentMs(t: string | string[] | undefined): number | null {
  const value = Array.isArray(t) ? t[0] : t;
  if (value === undefined || value === '') return null;
  const seconds = Number(value);
  return Number.isFinite(seconds) && seconds >= 0 ? Math.round(seconds * 1000) : null;
}
