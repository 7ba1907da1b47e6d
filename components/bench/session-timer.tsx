'use client';

import { useEffect, useState } from 'react';

type Clock = { since: number | null; elapsedMs: number };

const read = (key: string): Clock => {
  try {
    const v = JSON.parse(localStorage.getItem(key) ?? 'null') as Clock | null;
    if (v && typeof v.elapsedMs === 'number') return v;
  } catch {
    // A damaged value starts the timer afresh.
  }
  return { since: null, elapsedMs: 0 };
};

const total = (c: Clock, now: number) => c.elapsedMs + (c.since === null ? 0 : Math.max(0, now - c.since));

function clockText(ms: number): string {
  const s = Math.floor(ms / 1000);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${pad(Math.floor(s / 3600))}:${pad(Math.floor((s % 3600) / 60))}:${pad(s % 60)}`;
}

/**
 * A stopwatch for the session, kept on the phone (it runs on while the page is closed): Stop adds the whole
 * minutes to the session's time spent, through the queue.
 */
export function SessionTimer({ storageKey, onStop, disabled }: { storageKey: string; onStop: (minutes: number) => void; disabled?: boolean }) {
  const [clock, setClock] = useState<Clock>({ since: null, elapsedMs: 0 });
  const [now, setNow] = useState(0);
  const [said, setSaid] = useState('');

  useEffect(() => {
    setClock(read(storageKey));
    setNow(Date.now());
  }, [storageKey]);

  useEffect(() => {
    if (clock.since === null) return;
    const t = window.setInterval(() => setNow(Date.now()), 1000);
    return () => window.clearInterval(t);
  }, [clock.since]);

  const keep = (c: Clock) => {
    setClock(c);
    setNow(Date.now());
    localStorage.setItem(storageKey, JSON.stringify(c));
  };
  const running = clock.since !== null;
  const ms = total(clock, now);

  return (
    <section aria-label="Session timer" className="flex items-center gap-2">
      <p className="min-w-[7.5rem] font-mono text-2xl font-bold tabular-nums" aria-live="off" data-testid="timer">
        <span className="sr-only">Timer </span>
        {clockText(ms)}
      </p>
      {running ? (
        <button type="button" className="min-h-12 min-w-20 rounded-md border border-rule bg-card px-3 font-semibold" onClick={() => keep({ since: null, elapsedMs: total(clock, Date.now()) })}>
          Pause
        </button>
      ) : (
        <button
          type="button"
          disabled={disabled}
          className="min-h-12 min-w-20 rounded-md bg-dye px-3 font-semibold text-on-accent disabled:opacity-50"
          onClick={() => {
            setSaid('');
            keep({ since: Date.now(), elapsedMs: clock.elapsedMs });
          }}
        >
          {clock.elapsedMs ? 'Resume' : 'Start'}
        </button>
      )}
      <button
        type="button"
        disabled={disabled || ms === 0}
        className="min-h-12 min-w-20 rounded-md border border-rule bg-card px-3 font-semibold disabled:opacity-50"
        onClick={() => {
          const minutes = Math.round(total(clock, Date.now()) / 60_000);
          keep({ since: null, elapsedMs: 0 });
          if (minutes >= 1) {
            onStop(minutes);
            setSaid(`${minutes} min added to the session.`);
          } else setSaid('Under a minute: nothing added.');
        }}
      >
        Stop
      </button>
      <span role="status" className="text-sm text-graphite-2">
        {said}
      </span>
    </section>
  );
}
