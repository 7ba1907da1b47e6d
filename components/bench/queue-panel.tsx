'use client';

import { useEffect, useState } from 'react';
import { describeWrite, judgeQueued, readingAsNote, type QueuedWrite } from '@/lib/bench/queue';
import { judgedAgainst, toBenchRecord } from '@/lib/bench/records';
import { benchWords } from '@/lib/bench/judge';
import { formatTimeOfDay } from '@/lib/format';
import type { BenchRecord } from '@/lib/types/bench';
import type { MeasurementPageData } from '@/lib/types/measurements';
import type { QueueStatus } from './use-bench-queue';

type Settle = (clientId: string, change: ((w: QueuedWrite) => QueuedWrite) | 'drop') => Promise<void>;

const small = 'min-h-12 rounded-md px-3 text-sm font-semibold';

/** A reading kept as a line of the session's "What got done" instead. */
const asNote = (w: QueuedWrite, why: 'changed' | 'gone'): QueuedWrite => ({
  ...w,
  clientId: crypto.randomUUID(),
  kind: 'note',
  note: readingAsNote(w.reading!, formatTimeOfDay(new Date(w.reading!.measuredAt)), why),
  reading: undefined,
});

function RecordSide({ title, record, w }: { title: string; record: Pick<BenchRecord, 'kind' | 'nominal' | 'unit' | 'spec' | 'feature'> & { nominalText?: string }; w: QueuedWrite }) {
  const words = benchWords({ ...record, readings: [] });
  return (
    <div className="rounded border border-rule p-2">
      <p className="text-xs font-bold uppercase tracking-wide text-graphite-2">{title}</p>
      <p className="text-sm font-semibold">{record.feature}</p>
      {'error' in words ? <p className="text-sm">{words.error}</p> : <p className="dim text-sm">{record.nominal} {record.unit} {words.specLabel}: {words.sizes}</p>}
      <p className="text-sm">
        Your reading: <strong>{judgeQueued(w.reading!, record)}</strong>
      </p>
    </div>
  );
}

/** A reading set aside because its record changed (both versions shown) or is gone, or any refusal: the builder decides. */
function SetAside({ w, settle }: { w: QueuedWrite; settle: Settle }) {
  const [now, setNow] = useState<BenchRecord | null>(null);
  const [gone, setGone] = useState(w.conflict === 'gone');
  useEffect(() => {
    if (w.conflict !== 'changed' || !w.reading) return;
    let live = true;
    void fetch(`/api/measurements/${w.reading.recordId}`, { headers: { accept: 'application/json' } })
      .then(async (res) => {
        if (!live) return;
        if (res.status === 404) return setGone(true);
        if (res.ok) setNow(toBenchRecord(((await res.json()) as MeasurementPageData).record));
      })
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, [w.conflict, w.reading]);

  const r = w.reading;
  return (
    <li className="space-y-2 rounded-md border-2 border-scribe bg-scribe-soft p-3" data-testid="set-aside">
      <p className="font-semibold">
        <span aria-hidden="true">⚠ </span>
        {describeWrite(w)}: {r && gone ? 'its record was deleted.' : r && w.conflict === 'changed' ? 'its record was changed meanwhile.' : 'not accepted.'}
      </p>
      {w.message && !(r && (gone || w.conflict === 'changed')) ? <p className="text-sm">{w.message}</p> : null}
      {r && w.conflict === 'changed' && !gone ? (
        <div className="grid gap-2 sm:grid-cols-2">
          <RecordSide title="As you measured against it" record={r.judgedAgainst} w={w} />
          {now ? <RecordSide title="As it is now" record={now} w={w} /> : <p className="text-sm">Reading the record as it is now…</p>}
        </div>
      ) : null}
      <div className="flex flex-wrap gap-2">
        {r && now && !gone ? (
          <button
            type="button"
            className={`${small} bg-dye text-on-accent`}
            onClick={() => settle(w.clientId, (x) => ({ ...x, reading: { ...x.reading!, judgedAgainst: judgedAgainst(now), checkVersion: true } }))}
          >
            Save against it as it is now
          </button>
        ) : null}
        {r ? (
          <button type="button" className={`${small} border border-rule bg-card`} onClick={() => settle(w.clientId, (x) => asNote(x, gone ? 'gone' : 'changed'))}>
            Keep as a session note
          </button>
        ) : null}
        <button
          type="button"
          className={`${small} border border-bad bg-card text-bad`}
          onClick={() => {
            if (window.confirm(`Let “${describeWrite(w)}” go? It is not on the server and will be gone from this phone too.`)) void settle(w.clientId, 'drop');
          }}
        >
          Let it go
        </button>
      </div>
    </li>
  );
}

const STATUS_WORDS: Record<QueueStatus, string> = {
  ready: 'Everything is sent.',
  sending: 'Sending…',
  offline: 'No connection: kept on this phone, sent when the connection is back.',
  'sign-in': 'Signed out: sign in to send. Nothing kept on this phone is lost.',
  later: 'The server did not answer: trying again shortly.',
};

/** What is not sent yet, and what waits for the builder's decision. */
export function QueuePanel({ writes, status, settle, retryNow, signInHref }: { writes: QueuedWrite[]; status: QueueStatus; settle: Settle; retryNow: () => void; signInHref: string }) {
  const waiting = writes.filter((w) => w.state === 'waiting');
  const aside = writes.filter((w) => w.state !== 'waiting');
  const decide = aside.length ? `${aside.length === 1 ? 'One write waits' : `${aside.length} writes wait`} for your decision below.` : '';
  // A write back in line a moment before the sender picks it up is "sending", never "everything is sent".
  const shown: QueueStatus = waiting.length && status === 'ready' ? 'sending' : status;
  const words = waiting.length || status === 'sign-in' ? STATUS_WORDS[shown] : decide || STATUS_WORDS.ready;
  return (
    <section aria-label="Not sent yet" className="space-y-2">
      <p role="status" className="text-sm" data-queue-status={shown}>
        {waiting.length ? <strong>{waiting.length} not sent yet. </strong> : null}
        {words}{' '}
        {status === 'sign-in' ? (
          <a href={signInHref} className="font-semibold">
            Sign in to send
          </a>
        ) : null}
        {status === 'later' ? (
          <button type="button" className="font-semibold underline" onClick={retryNow}>
            Try now
          </button>
        ) : null}
      </p>
      {waiting.length ? (
        <ul className="space-y-1 text-sm" aria-label="Waiting to be sent">
          {waiting.map((w) => (
            <li key={w.clientId} className="flex items-center justify-between gap-2 rounded border border-dashed border-graphite-2 px-2 py-1" data-testid="not-sent">
              <span>{describeWrite(w)}</span>
              <span className="shrink-0 text-xs font-semibold uppercase">Not sent yet</span>
            </li>
          ))}
        </ul>
      ) : null}
      {aside.length ? (
        <ul className="space-y-2" aria-label="Waiting for your decision">
          {aside.map((w) => (
            <SetAside key={w.clientId} w={w} settle={settle} />
          ))}
        </ul>
      ) : null}
    </section>
  );
}
