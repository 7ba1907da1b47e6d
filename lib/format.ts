// Days and times are written with the platform's own formatter (Intl.DateTimeFormat) in the site's order: "Sat 3 Oct
// 2026", "3 Oct 2026, 18:05", a 24-hour clock, English month and day names. The words are date-fns's 'EEE d MMM yyyy',
// 'd MMM yyyy' and 'HH:mm' exactly (tests/unit/format.test.ts checks them against it), but these helpers run in the
// browser too, and date-fns's formatter would add about 6 KB (gzip) to every page that shows a date.
const dateWords = (timeZone?: string) =>
  new Intl.DateTimeFormat('en-US', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone });
let local: Intl.DateTimeFormat | undefined;
let utc: Intl.DateTimeFormat | undefined;

function partsOf(words: Intl.DateTimeFormat, at: Date): Record<Intl.DateTimeFormatPartTypes, string> {
  const out = {} as Record<Intl.DateTimeFormatPartTypes, string>;
  for (const p of words.formatToParts(at)) out[p.type] = p.value;
  return out;
}

/** A moment in the viewer's time zone: "3 Oct 2026". */
export function formatDate(at: Date | string): string {
  const p = partsOf((local ??= dateWords()), new Date(at));
  return `${p.day} ${p.month} ${p.year}`;
}

/** A moment in the viewer's time zone, to the minute: "3 Oct 2026, 18:05". */
export function formatDateTime(at: Date | string): string {
  const p = partsOf((local ??= dateWords()), new Date(at));
  return `${p.day} ${p.month} ${p.year}, ${p.hour}:${p.minute}`;
}

/** "3 h 30 min", "45 min". */
export function formatDuration(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (!h) return `${m} min`;
  return m ? `${h} h ${m} min` : `${h} h`;
}

/** A session's time at the machines, or that it has not been noted yet (0 counts as not noted). */
export function formatTimeSpent(minutes: number): string {
  return minutes > 0 ? `${formatDuration(minutes)} at the machines` : 'time not noted';
}

/** A session's day (a calendar date, yyyy-mm-dd, the same in every time zone), e.g. "Sat 3 Oct 2026". */
export function formatDay(isoDate: string): string {
  const p = partsOf((utc ??= dateWords('UTC')), new Date(`${isoDate.slice(0, 10)}T00:00:00Z`));
  return `${p.weekday} ${p.day} ${p.month} ${p.year}`;
}

/** The site's clock: 24-hour, e.g. "06:16" or "18:05", in the viewer's time zone. */
export function formatTimeOfDay(at: Date): string {
  const p = partsOf((local ??= dateWords()), at);
  return `${p.hour}:${p.minute}`;
}

const pluralRules = new Intl.PluralRules('en');

/**
 * "1 session", "2 sessions", "0 sessions": the form is chosen by the language's plural rules
 * (Intl.PluralRules), so every count on the site agrees.
 */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${pluralWord(n, one, many)}`;
}

/** Just the word for a count, when the number is written elsewhere. */
export function pluralWord(n: number, one: string, many = `${one}s`): string {
  return pluralRules.select(n) === 'one' ? one : many;
}
