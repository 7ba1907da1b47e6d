/**
 * The bench view's queue of writes, the parts that need no browser: what each queued write sends, what an
 * answer means for it, the order they go in, and what a reading says when the record changed meanwhile.
 * Pure: no React, no IndexedDB, no fetch (components/bench holds those).
 */
import { analyseRecord, asEntered, instrumentLabel, verdictShort, type FeatureKind, type LengthUnit, type Spec } from '../measurements';

export type WriteKind = 'reading' | 'note' | 'media' | 'time';

/** waiting: to be sent; conflict / refused: set aside until the builder decides (never dropped on their own). */
export type WriteState = 'waiting' | 'conflict' | 'refused';

/** The record as the phone judged a reading against it. */
export type JudgedAgainst = { id: number; version: number; feature: string; kind: FeatureKind; nominal: number; unit: LengthUnit; spec: Spec };

export type ReadingWrite = {
  recordId: number;
  /** Sent as recordVersion unless the builder chose to save it against the record as it is now. */
  judgedAgainst: JudgedAgainst;
  checkVersion: boolean;
  value: number;
  valueText: string;
  unit: LengthUnit;
  instrument: string;
  resolution: number;
  measuredAt: string;
};

export type NoteWrite = { text: string; clock: string };
export type TimeWrite = { minutes: number };
export type MediaWrite = { entryId: number; kind: 'photo' | 'clip'; name: string; mime: string; caption: string; takenAt: string; blob: Blob };

export type QueuedWrite = {
  /** Made on the phone (crypto.randomUUID()) when the write is queued, and sent with every try. */
  clientId: string;
  /** The member who made it: only they send it (after signing in again if need be). */
  memberId: number;
  sessionId: number;
  /** Order of making; writes go in this order. */
  seq: number;
  createdAt: string;
  state: WriteState;
  /** Why it was set aside, in words to show. */
  message?: string;
  /** For a reading set aside: the record changed, or it is gone. */
  conflict?: 'changed' | 'gone';
  attempts: number;
  kind: WriteKind;
  reading?: ReadingWrite;
  note?: NoteWrite;
  time?: TimeWrite;
  media?: MediaWrite;
};

/** The member's writes still to send, oldest first. */
export function toSend(writes: readonly QueuedWrite[], memberId: number): QueuedWrite[] {
  return writes.filter((w) => w.memberId === memberId && w.state === 'waiting').sort((a, b) => a.seq - b.seq);
}

/** The next order number after those already queued (times alone could tie within a millisecond). */
export function nextSeq(writes: readonly QueuedWrite[], now = Date.now()): number {
  const last = writes.reduce((m, w) => Math.max(m, w.seq), 0);
  return Math.max(last + 1, now);
}

/** The JSON request a write makes (a photo or clip goes through the upload SDK instead). */
export function requestFor(w: QueuedWrite): { url: string; body: Record<string, unknown> } | null {
  if (w.kind === 'reading' && w.reading) {
    const r = w.reading;
    return {
      url: `/api/measurements/${r.recordId}/readings`,
      body: {
        clientId: w.clientId,
        value: r.value,
        unit: r.unit,
        instrument: r.instrument,
        resolution: r.resolution,
        measuredAt: r.measuredAt,
        ...(r.checkVersion ? { recordVersion: r.judgedAgainst.version } : {}),
      },
    };
  }
  if (w.kind === 'note' && w.note) return { url: `/api/sessions/${w.sessionId}/bench-notes`, body: { clientId: w.clientId, text: w.note.text, clock: w.note.clock } };
  if (w.kind === 'time' && w.time) return { url: `/api/sessions/${w.sessionId}/time`, body: { clientId: w.clientId, minutes: w.time.minutes } };
  return null;
}

/**
 * What an answer means for the write that got it:
 * - sent: the server has it (201 new, 200 already there from an earlier try);
 * - sign-in: 401, the whole queue waits for the member to sign in again;
 * - retry: no answer, or one that says "later" (408, 429, 5xx); the write stays first in line;
 * - changed: a reading judged against a record that was changed since (409 naming recordVersion);
 * - gone: a reading whose record was deleted (404);
 * - refused: any other refusal, set aside with the server's message.
 */
export type Outcome = 'sent' | 'sign-in' | 'retry' | 'changed' | 'gone' | 'refused';

export function outcomeOf(kind: WriteKind, status: number | null, body?: { fieldErrors?: Record<string, string[]> } | null): Outcome {
  if (status === null || status === 0) return 'retry';
  if (status === 200 || status === 201) return 'sent';
  if (status === 401) return 'sign-in';
  if (status === 408 || status === 429 || status >= 500) return 'retry';
  if (kind === 'reading' && status === 409 && body?.fieldErrors?.recordVersion) return 'changed';
  if (kind === 'reading' && status === 404) return 'gone';
  return 'refused';
}

/** Pause before trying again after the n-th failed try (1, 2, …): 2 s doubling, at most a minute. */
export function retryDelayMs(attempt: number): number {
  return Math.min(60_000, 2000 * 2 ** Math.max(0, attempt - 1));
}

/** A queued reading judged against the record as it was when taken, or as it is now. */
export function judgeQueued(r: ReadingWrite, against: Pick<JudgedAgainst, 'kind' | 'nominal' | 'unit' | 'spec'> = r.judgedAgainst): string {
  const a = analyseRecord({ ...against, readings: [{ value: r.value, unit: r.unit, resolution: r.resolution }] });
  return verdictShort(a.verdict, against.unit);
}

/** The words of a reading kept as a note of the session when it cannot go on its record. */
export function readingAsNote(r: ReadingWrite, clock: string, why: 'changed' | 'gone'): NoteWrite {
  const reason = why === 'gone' ? 'its record was deleted' : 'its record was changed';
  return {
    clock,
    text: `Reading of ${r.judgedAgainst.feature}: ${r.valueText} ${r.unit} (${instrumentLabel(r.instrument)}), ${judgeQueued(r)} as judged at the bench; kept as a note because ${reason}.`,
  };
}

/** How a write is listed while it waits: "Reading 25.012 mm, spigot", "Photo", "Note", "12 min on the timer". */
export function describeWrite(w: QueuedWrite): string {
  if (w.kind === 'reading' && w.reading) return `Reading ${w.reading.valueText} ${w.reading.unit} · ${w.reading.judgedAgainst.feature}`;
  if (w.kind === 'note' && w.note) return `Note · ${w.note.text.length > 60 ? `${w.note.text.slice(0, 59)}…` : w.note.text}`;
  if (w.kind === 'time' && w.time) return `${w.time.minutes} min on the timer`;
  if (w.kind === 'media' && w.media) return `${w.media.kind === 'clip' ? 'Clip' : 'Photo'}${w.media.caption ? ` · ${w.media.caption}` : ''}`;
  return 'Write';
}

/** A reading typed on the pad, as a number, or why not. */
export function padValue(text: string): { value: number } | { error: string } {
  if (!text || text === '-' || text === '.') return { error: 'Type the reading first.' };
  if (!/^-?\d*\.?\d*$/.test(text)) return { error: 'That is not a number.' };
  const value = Number(text);
  if (!Number.isFinite(value)) return { error: 'That is not a number.' };
  if (value <= 0) return { error: 'A reading must be a size greater than zero.' };
  const decimals = text.includes('.') ? text.length - text.indexOf('.') - 1 : 0;
  if (decimals > 5) return { error: 'Give the reading to at most 5 decimal places.' };
  return { value };
}

/** One key of the pad applied to what is typed so far. */
export function padPress(text: string, key: string): string {
  if (key === 'back') return text.slice(0, -1);
  if (key === 'clear') return '';
  if (key === '-') return text.startsWith('-') ? text.slice(1) : `-${text}`;
  if (key === '.') return text.includes('.') ? text : `${text === '' || text === '-' ? `${text}0` : text}.`;
  if (/^\d$/.test(key)) {
    if (text.replace('-', '').length >= 12) return text;
    return text === '0' ? key : text === '-0' ? `-${key}` : text + key;
  }
  return text;
}

/** A value as typed on the pad, written with the instrument's decimals: "25.01" on a 0.001 mm micrometer is "25.010". */
export const padText = (value: number, resolution: number): string => asEntered(value, resolution);
