import { format, parseISO } from 'date-fns';

/** "3 h 30 min", "45 min". */
export function formatDuration(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (!h) return `${m} min`;
  return m ? `${h} h ${m} min` : `${h} h`;
}

/** A session's day, e.g. "Sat 3 Oct 2026". */
export function formatDay(isoDate: string): string {
  return format(parseISO(isoDate), 'EEE d MMM yyyy');
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}
