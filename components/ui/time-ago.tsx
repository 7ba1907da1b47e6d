'use client';

import { useSyncExternalStore } from 'react';
import { formatDateTime, formatDay } from '@/lib/format';

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

// One clock for every TimeAgo on the page, read when the first one mounts and again each minute.
let now: number | null = null;
let timer: number | undefined;
const listeners = new Set<() => void>();

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  if (timer === undefined) {
    timer = window.setInterval(() => {
      now = Date.now();
      for (const l of listeners) l();
    }, 60_000);
  }
  return () => {
    listeners.delete(listener);
    if (!listeners.size) {
      window.clearInterval(timer);
      timer = undefined;
      now = null;
    }
  };
}

const clock = () => (now ??= Date.now());
const noClock = () => null;

/**
 * "just now", "3 days ago", worked out in the browser: a page kept in the cache for everyone would otherwise
 * say what was true when it was built, and Next refuses a clock read while a page is prerendered. Before
 * that (and in the HTML) the day itself, by its UTC date so the server and the browser agree; the exact
 * time is in the title.
 */
export function TimeAgo({ iso, className }: { iso: string; className?: string }) {
  const at = useSyncExternalStore(subscribe, clock, noClock);
  const ms = new Date(iso).getTime();
  // Something written since the clock was last read (a new comment) is "just now" too.
  const text = at === null ? formatDay(iso.slice(0, 10)) : at - ms < 45_000 ? 'just now' : timeAgo(iso, at);
  return (
    <time dateTime={iso} title={formatDateTime(iso)} className={className} suppressHydrationWarning>
      {text}
    </time>
  );
}
