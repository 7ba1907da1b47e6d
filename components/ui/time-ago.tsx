'use client';

import { useEffect, useState } from 'react';
import { formatDay } from '@/lib/format';

const UNITS: [Intl.RelativeTimeFormatUnit, number][] = [
  ['year', 365 * 24 * 3600],
  ['month', 30 * 24 * 3600],
  ['day', 24 * 3600],
  ['hour', 3600],
  ['minute', 60],
  ['second', 1],
];

let words: Intl.RelativeTimeFormat | undefined;

/**
 * "3 days ago", "in 2 hours": the largest unit the distance reaches, rounded,
 * said by the browser's own formatter (no library).
 */
export function timeAgo(iso: string, now: number): string {
  const seconds = (new Date(iso).getTime() - now) / 1000;
  const distance = Math.abs(seconds);
  const [reached, size] = UNITS.find(([, s]) => distance >= s) ?? UNITS[UNITS.length - 1]!;
  // Twelve rounded months read as a year.
  const [unit, count]: [Intl.RelativeTimeFormatUnit, number] = reached === 'month' && Math.round(distance / size) === 12 ? ['year', 1] : [reached, Math.round(distance / size)];
  words ??= new Intl.RelativeTimeFormat('en', { numeric: 'always' });
  return words.format(seconds < 0 ? -count : count, unit);
}

/**
 * "3 days ago", worked out in the browser: a page kept in the cache for everyone would otherwise say what was
 * true when it was built. Before that (and in the HTML) the day itself, by its UTC date so the server and
 * the browser agree.
 */
export function TimeAgo({ iso }: { iso: string }) {
  const [now, setNow] = useState<number | null>(null);
  useEffect(() => {
    setNow(Date.now());
    const timer = window.setInterval(() => setNow(Date.now()), 60_000);
    return () => window.clearInterval(timer);
  }, []);
  const day = formatDay(iso.slice(0, 10));
  return (
    <time dateTime={iso} title={day}>
      {now === null ? day : timeAgo(iso, now)}
    </time>
  );
}
