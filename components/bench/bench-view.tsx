'use client';

import { useCallback, useEffect, useMemo, useState } from 'react';
import Link from 'next/link';
import { checkNearNominal, INSTRUMENTS, instrumentLabel, isMeasurementError, recordLimits } from '@/lib/measurements';
import { instrumentFor } from '@/lib/measurements/shop-sheet';
import { benchWords, type BenchWords } from '@/lib/bench/judge';
import { padText, padValue, type QueuedWrite } from '@/lib/bench/queue';
import { judgedAgainst, toBenchRecord } from '@/lib/bench/records';
import { formatTimeOfDay, formatTimeSpent } from '@/lib/format';
import type { BenchData, BenchRecord } from '@/lib/types/bench';
import { NumberPad } from './number-pad';
import { SessionTimer } from './session-timer';
import { CapturePanel, type Kept } from './capture-panel';
import { QueuePanel } from './queue-panel';
import { useBenchQueue } from './use-bench-queue';
import { useOfflineShell } from './use-offline-shell';
import { readSnapshot, saveSnapshot, snapshotKey } from './bench-store';

type Shown = { value: number; valueText: string; unit: BenchRecord['unit']; resolution: number; instrument: string; pending: boolean };

const instrumentKey = (memberId: number, recordId: number) => `scribeline-bench:instrument:${memberId}:${recordId}`;

function useOnline(): boolean {
  const [online, setOnline] = useState(true);
  useEffect(() => {
    setOnline(navigator.onLine);
    const on = () => setOnline(true);
    const off = () => setOnline(false);
    window.addEventListener('online', on);
    window.addEventListener('offline', off);
    return () => {
      window.removeEventListener('online', on);
      window.removeEventListener('offline', off);
    };
  }, []);
  return online;
}

/** The usual instrument for a record: the one last used on it, else the one the ten-to-one rule asks for. */
function defaultInstrument(r: BenchRecord): string {
  const last = r.readings[r.readings.length - 1];
  if (last) return last.instrument;
  try {
    return instrumentFor(recordLimits(r), r.kind, r.unit).instrument;
  } catch {
    return 'caliper';
  }
}

const resolutionOf = (instrument: string, unit: BenchRecord['unit']) => (INSTRUMENTS.find((i) => i.value === instrument) ?? INSTRUMENTS[0])[unit];

function VerdictLine({ words }: { words: BenchWords }) {
  const icon = words.state === 'inside' ? '✓' : words.state === 'none' ? '•' : '✕';
  const tone = words.state === 'inside' ? 'text-ok' : words.state === 'none' ? 'text-graphite-2' : 'text-bad';
  return (
    <p className={`text-lg font-bold ${tone}`} data-testid="verdict">
      <span aria-hidden="true">{icon} </span>
      {words.verdict}
    </p>
  );
}

function RecordCard({ record, shown, active, onPick }: { record: BenchRecord; shown: Shown[]; active: boolean; onPick: () => void }) {
  const words = benchWords({ ...record, readings: shown });
  const last = shown[shown.length - 1];
  return (
    <li>
      <button
        type="button"
        onClick={onPick}
        aria-pressed={active}
        aria-label={`${record.feature}, ${'error' in words ? '' : words.verdict}`}
        className={`block w-full rounded-lg border-2 p-3 text-left ${active ? 'border-dye bg-dye-soft' : 'border-rule bg-card'}`}
        data-record={record.id}
      >
        <span className="flex items-baseline justify-between gap-2">
          <span className="text-lg font-bold">{record.feature}</span>
          <span className="shrink-0 text-xs text-graphite-2">{record.kind === 'outside' ? 'Outside' : 'Inside'}</span>
        </span>
        {'error' in words ? (
          <span className="block text-sm">{words.error}</span>
        ) : (
          <span className="block space-y-1">
            <span className="dim block text-base">
              {record.nominalText} {record.unit} {words.specLabel} · {words.sizes}
            </span>
            <span className="block text-sm">
              Last reading:{' '}
              {last ? (
                <strong className="dim">
                  {last.valueText} {last.unit}
                </strong>
              ) : (
                'none yet'
              )}
              {last?.pending ? <span className="ml-1 rounded border border-graphite-2 px-1 text-xs font-semibold uppercase">not sent yet</span> : null}
            </span>
            <VerdictLine words={words} />
            {words.stock ? <span className="block text-sm">Stock left: {words.stock}</span> : null}
            {words.nextCut ? (
              <span className="block text-base font-semibold" data-testid="next-cut">
                Next cut: {words.nextCut}
              </span>
            ) : null}
            {words.overshoot ? (
              <span className="block text-sm font-semibold text-scribe">
                <span aria-hidden="true">⚠ </span>
                {words.overshoot}
              </span>
            ) : null}
          </span>
        )}
      </button>
    </li>
  );
}

/**
 * The bench view: a session's records in working order with their verdicts and next cuts, a number pad for
 * readings, the camera, notes and the session timer. Everything written goes through the phone's queue, so it
 * works the same with or without a connection.
 */
export function BenchView({ data, signInHref }: { data: BenchData; signInHref: string }) {
  const memberId = data.member.id;
  const [records, setRecords] = useState<BenchRecord[]>(data.records);
  const [minutes, setMinutes] = useState(data.session.minutesSpent);
  const [snapshotAt, setSnapshotAt] = useState(data.loadedAt);
  const [activeId, setActiveId] = useState<number | null>(() => {
    const open = data.records.find((r) => {
      const w = benchWords({ ...r, readings: r.readings });
      return !('error' in w) && w.state !== 'inside';
    });
    return (open ?? data.records[0])?.id ?? null;
  });
  const [typed, setTyped] = useState('');
  const [instruments, setInstruments] = useState<Record<number, string>>({});
  const [problem, setProblem] = useState('');
  const [saved, setSaved] = useState('');
  const online = useOnline();
  const shell = useOfflineShell(memberId);
  const key = snapshotKey(memberId, data.session.id);

  const onRecord = useCallback((view: Parameters<NonNullable<Parameters<typeof useBenchQueue>[0]['onRecord']>>[0]) => {
    setRecords((list) => list.map((r) => (r.id === view.id ? toBenchRecord(view) : r)));
    setSnapshotAt(new Date().toISOString());
  }, []);
  const onSessionMinutes = useCallback(
    (sessionId: number, m: number) => {
      if (sessionId !== data.session.id) return;
      setMinutes(m);
      setSnapshotAt(new Date().toISOString());
    },
    [data.session.id],
  );
  const queue = useBenchQueue({ memberId, onRecord, onSessionMinutes });

  // Opened from the phone's copy of the page (no connection): the phone's own later copy of the records wins.
  useEffect(() => {
    void readSnapshot(key).then((s) => {
      if (s && s.savedAt > data.loadedAt) {
        setRecords(s.records);
        setMinutes(s.minutesSpent);
        setSnapshotAt(s.savedAt);
      }
    });
  }, [key, data.loadedAt]);
  useEffect(() => {
    void saveSnapshot({ key, savedAt: snapshotAt, records, minutesSpent: minutes });
  }, [key, snapshotAt, records, minutes]);

  // The instrument last chosen for each record, kept on the phone.
  useEffect(() => {
    const found: Record<number, string> = {};
    for (const r of data.records) {
      const v = localStorage.getItem(instrumentKey(memberId, r.id));
      if (v && INSTRUMENTS.some((i) => i.value === v)) found[r.id] = v;
    }
    setInstruments(found);
  }, [data.records, memberId]);

  const sessionWrites = queue.writes.filter((w) => w.sessionId === data.session.id);
  const pendingFor = useMemo(() => {
    const by = new Map<number, QueuedWrite[]>();
    for (const w of queue.writes) {
      if (w.kind !== 'reading' || !w.reading || w.state !== 'waiting') continue;
      by.set(w.reading.recordId, [...(by.get(w.reading.recordId) ?? []), w]);
    }
    return by;
  }, [queue.writes]);

  const shownFor = (r: BenchRecord): Shown[] => [
    ...r.readings.map((x) => ({ ...x, pending: false })),
    ...(pendingFor.get(r.id) ?? []).map((w) => ({ value: w.reading!.value, valueText: w.reading!.valueText, unit: w.reading!.unit, resolution: w.reading!.resolution, instrument: w.reading!.instrument, pending: true })),
  ];

  const active = records.find((r) => r.id === activeId) ?? null;
  const instrument = active ? (instruments[active.id] ?? defaultInstrument(active)) : 'caliper';
  const pendingMinutes = sessionWrites.filter((w) => w.kind === 'time' && w.state === 'waiting').reduce((n, w) => n + (w.time?.minutes ?? 0), 0);

  async function saveReading() {
    if (!active) return;
    setSaved('');
    const parsed = padValue(typed);
    if ('error' in parsed) return setProblem(parsed.error);
    try {
      checkNearNominal(active.nominal, active.unit, parsed.value, active.unit, 'value');
    } catch (err) {
      if (isMeasurementError(err)) return setProblem(err.message);
      throw err;
    }
    const resolution = resolutionOf(instrument, active.unit);
    const valueText = padText(parsed.value, resolution);
    setProblem('');
    setTyped('');
    await queue.enqueue({
      sessionId: data.session.id,
      kind: 'reading',
      reading: {
        recordId: active.id,
        judgedAgainst: judgedAgainst(active),
        checkVersion: true,
        value: parsed.value,
        valueText,
        unit: active.unit,
        instrument,
        resolution,
        measuredAt: new Date().toISOString(),
      },
    });
    setSaved(`${valueText} ${active.unit} kept for ${active.feature}.`);
  }

  async function keepPhoto(k: Kept) {
    if (!data.entry) return;
    const clock = formatTimeOfDay(k.takenAt);
    await queue.enqueue({
      sessionId: data.session.id,
      kind: 'media',
      media: { entryId: data.entry.id, kind: k.kind, name: k.name, mime: k.mime, caption: k.note ? `${clock} — ${k.note}` : `Taken at ${clock}`, takenAt: k.takenAt.toISOString(), blob: k.blob },
    });
  }

  const readOnly = !data.canWrite;
  const sessionHref = `/logs/${data.project.slug}/sessions/${data.session.id}`;

  return (
    <div className="fixed inset-0 z-40 flex flex-col bg-paper text-graphite" data-bench data-shell={shell} data-queue-loaded={queue.loaded ? 'yes' : 'no'}>
      <header className="flex items-center justify-between gap-2 border-b border-rule bg-card px-3 py-2">
        <div className="min-w-0">
          <h1 className="truncate text-lg font-bold">
            <span className="sr-only">Bench view: </span>
            {data.session.title}
          </h1>
          <p className="truncate text-xs text-graphite-2">
            {data.project.title} · Session {data.session.position + 1} · {formatTimeSpent(minutes)}
            {pendingMinutes ? ` (+${pendingMinutes} min not sent yet)` : ''}
          </p>
        </div>
        <div className="flex shrink-0 items-center gap-2">
          <span className={`rounded-full border px-2 py-1 text-xs font-bold ${online ? 'border-ok text-ok' : 'border-scribe text-scribe'}`} data-testid="connection">
            <span aria-hidden="true">{online ? '● ' : '○ '}</span>
            {online ? 'Online' : 'Offline'}
          </span>
          <Link href={sessionHref} className="flex min-h-12 items-center rounded-md border border-rule px-3 text-sm font-semibold no-underline">
            Session
          </Link>
        </div>
      </header>

      <div className="flex-1 space-y-3 overflow-y-auto px-3 py-3">
        {readOnly ? <p className="rounded-md border border-rule bg-card p-2 text-sm">Only the builder writes here; you see the records as the bench does.</p> : null}
        {!readOnly ? <SessionTimer storageKey={`scribeline-bench:timer:${memberId}:${data.session.id}`} onStop={(m) => void queue.enqueue({ sessionId: data.session.id, kind: 'time', time: { minutes: m } })} /> : null}
        <QueuePanel writes={sessionWrites} status={queue.status} settle={queue.settle} retryNow={queue.retryNow} signInHref={signInHref} />
        {records.length ? (
          <ol className="space-y-2" aria-label="Records in working order">
            {records.map((r) => (
              <RecordCard key={r.id} record={r} shown={shownFor(r)} active={r.id === activeId} onPick={() => { setActiveId(r.id); setTyped(''); setProblem(''); setSaved(''); }} />
            ))}
          </ol>
        ) : (
          <p className="rounded-md border border-rule bg-card p-3">This session has no measurement records yet. Add them to an entry of the session, then measure them here.</p>
        )}
        {!readOnly ? (
          <CapturePanel
            entryTitle={data.entry?.title ?? null}
            onPhoto={keepPhoto}
            onNote={(text) => queue.enqueue({ sessionId: data.session.id, kind: 'note', note: { text, clock: formatTimeOfDay(new Date()) } }).then(() => undefined)}
          />
        ) : null}
        <p className="text-xs text-graphite-2">
          Stop the spindle and let it come to rest before you measure; take the chuck key out and keep hands clear of the chuck and the tool. Follow your machine&apos;s manual, local rules and qualified instruction.
          {shell === 'ready' ? ' This page now opens on this phone without a connection.' : ''}
        </p>
      </div>

      {active && !readOnly ? (
        <section aria-label="Enter a reading" className="border-t-2 border-dye bg-paper-2 px-3 pb-3 pt-2">
          <div className="mb-1 flex items-center justify-between gap-2">
            <p className="min-w-0 truncate text-sm font-semibold" id="pad-for">
              {active.feature}
            </p>
            <label className="flex items-center gap-1 text-sm">
              <span className="sr-only">Instrument</span>
              <select
                value={instrument}
                onChange={(e) => {
                  const v = e.target.value;
                  localStorage.setItem(instrumentKey(memberId, active.id), v);
                  setInstruments((m) => ({ ...m, [active.id]: v }));
                }}
                className="min-h-12 rounded-md border border-rule bg-card px-2 text-sm"
              >
                {INSTRUMENTS.map((i) => (
                  <option key={i.value} value={i.value}>
                    {instrumentLabel(i.value)} ({i[active.unit]} {active.unit})
                  </option>
                ))}
              </select>
            </label>
          </div>
          <output
            aria-labelledby="pad-for"
            aria-live="polite"
            className="mb-2 flex min-h-14 items-center justify-end rounded-md border-2 border-graphite bg-card px-3 font-mono text-3xl font-bold tabular-nums"
            data-testid="pad-display"
          >
            {typed || <span className="text-graphite-2">0</span>}
            <span className="ml-2 text-lg text-graphite-2">{active.unit}</span>
          </output>
          {problem ? (
            <p role="alert" className="mb-1 text-sm font-semibold text-bad">
              <span aria-hidden="true">✕ </span>
              {problem}
            </p>
          ) : saved ? (
            <p role="status" className="mb-1 text-sm font-semibold">
              <span aria-hidden="true">✓ </span>
              {saved}
            </p>
          ) : null}
          <NumberPad value={typed} onChange={setTyped} onSave={() => void saveReading()} saveLabel="Save reading" />
        </section>
      ) : null}
    </div>
  );
}
