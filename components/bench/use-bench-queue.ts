'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { genUploader } from 'uploadthing/client';
import type { OurFileRouter } from '@/app/api/uploadthing/core';
import { sendJson } from '@/lib/client/api-client';
import { nextSeq, outcomeOf, requestFor, retryDelayMs, toSend, type Outcome, type QueuedWrite } from '@/lib/bench/queue';
import type { MeasurementView } from '@/lib/types/measurements';
import { memberWrites, putWrite, removeWrite } from './bench-store';

const { uploadFiles } = genUploader<OurFileRouter>();

/** ready: nothing to send; sending; offline; sign-in: a 401 paused the queue; later: the server said "later". */
export type QueueStatus = 'ready' | 'sending' | 'offline' | 'sign-in' | 'later';

type Sent = { outcome: Outcome; message?: string; record?: MeasurementView; minutesSpent?: number };

type SessionAnswer = { session: { id: number; minutesSpent: number } };

async function signedIn(): Promise<boolean | null> {
  try {
    const res = await fetch('/api/auth/session', { headers: { accept: 'application/json' }, cache: 'no-store' });
    if (!res.ok) return null;
    const json = (await res.json()) as { user?: unknown } | null;
    return Boolean(json?.user);
  } catch {
    return null;
  }
}

async function sendMedia(w: QueuedWrite): Promise<Sent> {
  const m = w.media!;
  // The upload route answers a signed-out phone with a refusal, not a 401: ask first, so the queue waits instead.
  const who = await signedIn();
  if (who === null) return { outcome: 'retry' };
  if (!who) return { outcome: 'sign-in' };
  try {
    const file = new File([m.blob], m.name, { type: m.mime, lastModified: Date.parse(m.takenAt) || Date.now() });
    const [result] = await uploadFiles(m.kind === 'photo' ? 'entryPhoto' : 'entryClip', {
      files: [file],
      input: { entryId: m.entryId, clientId: w.clientId, caption: m.caption || undefined },
    });
    const outcome = result?.serverData as { ok: boolean; message?: string } | null | undefined;
    if (outcome?.ok) return { outcome: 'sent' };
    return { outcome: 'refused', message: outcome?.message ?? 'The upload service did not keep the file.' };
  } catch (err) {
    const code = (err as { code?: string } | null)?.code;
    const message = (err as { message?: string } | null)?.message;
    if (code === 'BAD_REQUEST' || code === 'TOO_LARGE' || code === 'NOT_FOUND' || code === 'FORBIDDEN') return { outcome: 'refused', message: message ?? 'Not accepted.' };
    return { outcome: 'retry' };
  }
}

async function sendOne(w: QueuedWrite): Promise<Sent> {
  if (w.kind === 'media') return sendMedia(w);
  const request = requestFor(w);
  if (!request) return { outcome: 'refused', message: 'This write could not be read on the phone.' };
  const answer = await sendJson<{ record?: MeasurementView } & Partial<SessionAnswer>>(request.url, 'POST', request.body);
  if (answer.ok) return { outcome: 'sent', record: answer.data.record, minutesSpent: answer.data.session?.minutesSpent };
  const outcome = outcomeOf(w.kind, answer.error.status, answer.error);
  return { outcome, message: answer.error.message };
}

type Options = {
  memberId: number;
  /** A reading went through: the record as the server now has it. */
  onRecord?: (record: MeasurementView) => void;
  /** A time or note went through: the session's time as the server now has it. */
  onSessionMinutes?: (sessionId: number, minutes: number) => void;
};

export type NewWrite = Omit<QueuedWrite, 'clientId' | 'memberId' | 'seq' | 'createdAt' | 'state' | 'attempts'> & { clientId?: string };

/**
 * The member's queue of writes on this phone: kept in IndexedDB, sent one at a time in the order they were
 * made whenever there is a connection, each with its own clientId so a retry is never a second write. A 401
 * pauses the whole queue until the member signs in again; a refusal or a changed record sets that one write
 * aside for the builder to decide, and the rest go on.
 */
export function useBenchQueue({ memberId, onRecord, onSessionMinutes }: Options) {
  const [writes, setWrites] = useState<QueuedWrite[]>([]);
  const [status, setStatus] = useState<QueueStatus>('ready');
  const [loaded, setLoaded] = useState(false);
  const current = useRef<QueuedWrite[]>([]);
  const running = useRef(false);
  const again = useRef(false);
  const notBefore = useRef(0);
  const callbacks = useRef({ onRecord, onSessionMinutes });
  callbacks.current = { onRecord, onSessionMinutes };

  const publish = useCallback((list: QueuedWrite[]) => {
    current.current = list;
    setWrites(list);
  }, []);
  const replace = useCallback(
    async (w: QueuedWrite) => {
      await putWrite(w);
      publish([...current.current.filter((x) => x.clientId !== w.clientId), w].sort((a, b) => a.seq - b.seq));
    },
    [publish],
  );

  const flush = useCallback(async () => {
    if (running.current) {
      again.current = true;
      return;
    }
    running.current = true;
    try {
      do {
        again.current = false;
        for (;;) {
          const next = toSend(current.current, memberId)[0];
          if (!next) {
            setStatus('ready');
            break;
          }
          if (!navigator.onLine) {
            setStatus('offline');
            break;
          }
          if (Date.now() < notBefore.current) {
            setStatus('later');
            break;
          }
          setStatus('sending');
          const sent = await sendOne(next);
          if (sent.outcome === 'sent') {
            await removeWrite(next.clientId);
            publish(current.current.filter((x) => x.clientId !== next.clientId));
            if (sent.record) callbacks.current.onRecord?.(sent.record);
            if (sent.minutesSpent !== undefined) callbacks.current.onSessionMinutes?.(next.sessionId, sent.minutesSpent);
            continue;
          }
          if (sent.outcome === 'sign-in') {
            setStatus('sign-in');
            return;
          }
          if (sent.outcome === 'retry') {
            const attempts = next.attempts + 1;
            await replace({ ...next, attempts });
            notBefore.current = Date.now() + retryDelayMs(attempts);
            setStatus(navigator.onLine ? 'later' : 'offline');
            break;
          }
          await replace({
            ...next,
            state: sent.outcome === 'refused' ? 'refused' : 'conflict',
            conflict: sent.outcome === 'changed' || sent.outcome === 'gone' ? sent.outcome : undefined,
            message: sent.message,
          });
        }
      } while (again.current);
    } finally {
      running.current = false;
    }
  }, [memberId, publish, replace]);

  useEffect(() => {
    let live = true;
    void memberWrites(memberId).then((list) => {
      if (!live) return;
      publish(list.sort((a, b) => a.seq - b.seq));
      setLoaded(true);
      void flush();
    });
    const online = () => {
      notBefore.current = 0;
      void flush();
    };
    const offline = () => setStatus('offline');
    window.addEventListener('online', online);
    window.addEventListener('offline', offline);
    // Catches the end of a pause after "later", and a connection that came back without an event.
    const tick = window.setInterval(() => {
      if (toSend(current.current, memberId).length && Date.now() >= notBefore.current) void flush();
    }, 3000);
    return () => {
      live = false;
      window.removeEventListener('online', online);
      window.removeEventListener('offline', offline);
      window.clearInterval(tick);
    };
  }, [memberId, flush, publish]);

  /** Queues a write (kept on the phone at once) and starts sending. */
  const enqueue = useCallback(
    async (w: NewWrite): Promise<QueuedWrite> => {
      const full: QueuedWrite = {
        ...w,
        clientId: w.clientId ?? crypto.randomUUID(),
        memberId,
        seq: nextSeq(current.current),
        createdAt: new Date().toISOString(),
        state: 'waiting',
        attempts: 0,
      };
      await replace(full);
      void flush();
      return full;
    },
    [memberId, flush, replace],
  );

  /** Puts a set-aside write back in line as changed by the builder's choice (or drops it). */
  const settle = useCallback(
    async (clientId: string, change: ((w: QueuedWrite) => QueuedWrite) | 'drop') => {
      const w = current.current.find((x) => x.clientId === clientId);
      if (!w) return;
      if (change === 'drop') {
        await removeWrite(clientId);
        publish(current.current.filter((x) => x.clientId !== clientId));
        return;
      }
      const changed = change(w);
      // Back in line before anything is taken away: the write is never missing from the phone or the list.
      await replace({ ...changed, state: 'waiting', message: undefined, conflict: undefined, attempts: 0 });
      if (changed.clientId !== clientId) {
        await removeWrite(clientId);
        publish(current.current.filter((x) => x.clientId !== clientId));
      }
      void flush();
    },
    [flush, publish, replace],
  );

  const retryNow = useCallback(() => {
    notBefore.current = 0;
    void flush();
  }, [flush]);

  return { writes: writes.filter((w) => w.memberId === memberId), status, loaded, enqueue, settle, retryNow };
}
