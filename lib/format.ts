import { format, parseISO } from 'date-fns';

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

/** A session's day, e.g. "Sat 3 Oct 2026". */
export function formatDay(isoDate: string): string {
  return format(parseISO(isoDate), 'EEE d MMM yyyy');
}

/** The site's clock: 24-hour, e.g. "06:16" or "18:05", in the viewer's time zone. */
export function formatTimeOfDay(at: Date): string {
  return format(at, 'HH:mm');
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
