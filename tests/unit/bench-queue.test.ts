import { describe, expect, test } from 'vitest';
import {
  describeWrite, judgeQueued, nextSeq, outcomeOf, padPress, padValue, readingAsNote, requestFor, retryDelayMs, toSend, type Outcome, type QueuedWrite, type ReadingWrite, type WriteKind,
} from '@/lib/bench/queue';
import { benchWords } from '@/lib/bench/judge';

// Sources named beside each check.
const RFC9110 = 'RFC 9110 (HTTP semantics) §15 status codes — from memory';
const ISO286 = 'ISO 286-2:2010 limit deviation tables — from memory';

const spigot = { id: 7, version: 3, feature: 'Spigot diameter', kind: 'outside' as const, nominal: 25, unit: 'mm' as const, spec: { type: 'zone' as const, zone: 'g6' } };

const readingWrite = (value: number, extra: Partial<ReadingWrite> = {}): ReadingWrite => ({
  recordId: 7, judgedAgainst: spigot, checkVersion: true, value, valueText: String(value), unit: 'mm', instrument: 'micrometer', resolution: 0.001, measuredAt: '2026-03-14T14:05:00.000Z', ...extra,
});

let n = 0;
const write = (extra: Partial<QueuedWrite>): QueuedWrite => ({
  clientId: `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`, memberId: 1, sessionId: 5, seq: n, createdAt: '2026-03-14T14:05:00.000Z', state: 'waiting', attempts: 0, kind: 'note', note: { text: 'x', clock: '14:05' }, ...extra,
});

describe('what an answer means for a queued write', () => {
  test.each([
    ['reading', 201, null, 'sent', `${RFC9110}: 201 Created`],
    ['reading', 200, null, 'sent', `${RFC9110}: 200 OK (already there from an earlier try)`],
    ['note', 401, null, 'sign-in', `${RFC9110}: 401 Unauthorized`],
    ['reading', null, null, 'retry', 'no answer at all (offline): common practice, try again later'],
    ['time', 503, null, 'retry', `${RFC9110}: 503 Service Unavailable`],
    ['reading', 429, null, 'retry', 'RFC 6585 §4: 429 Too Many Requests — from memory'],
    ['reading', 408, null, 'retry', `${RFC9110}: 408 Request Timeout`],
    ['reading', 409, { fieldErrors: { recordVersion: ['changed'] } }, 'changed', `${RFC9110}: 409 Conflict`],
    ['reading', 409, { fieldErrors: { clientId: ['used'] } }, 'refused', `${RFC9110}: 409 Conflict, not about the record`],
    ['reading', 404, null, 'gone', `${RFC9110}: 404 Not Found`],
    ['note', 404, null, 'refused', `${RFC9110}: 404 Not Found (the session itself is gone)`],
    ['reading', 400, { fieldErrors: { value: ['x'] } }, 'refused', `${RFC9110}: 400 Bad Request`],
    ['media', 403, null, 'refused', `${RFC9110}: 403 Forbidden`],
  ] as [WriteKind, number | null, { fieldErrors: Record<string, string[]> } | null, Outcome, string][])('%s answered %s → %s (%s)', (kind, status, body, outcome) => {
    expect(outcomeOf(kind, status, body)).toBe(outcome);
  });

  test('retries wait 2 s, doubling, at most a minute (common practice: capped exponential back-off)', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 10].map(retryDelayMs)).toEqual([2000, 4000, 8000, 16000, 32000, 60000, 60000, 60000]);
  });
});

describe('the order writes go in', () => {
  test('only the member’s own waiting writes, oldest first; set-aside ones wait for a decision', () => {
    const a = write({ seq: 30 });
    const b = write({ seq: 10 });
    const other = write({ seq: 5, memberId: 2 });
    const aside = write({ seq: 1, state: 'conflict' });
    expect(toSend([a, b, other, aside], 1).map((w) => w.seq)).toEqual([10, 30]);
    expect(toSend([a, b, other, aside], 2).map((w) => w.seq)).toEqual([5]);
  });

  test('a new write always comes after every queued one, even when made within the same millisecond', () => {
    expect(nextSeq([write({ seq: 1000 })], 1000)).toBe(1001);
    expect(nextSeq([write({ seq: 5 })], 1000)).toBe(1000);
    expect(nextSeq([], 42)).toBe(42);
  });
});

describe('what each write sends', () => {
  test('a reading names its clientId and the record version it was judged against', () => {
    const w = write({ kind: 'reading', reading: readingWrite(24.99), note: undefined });
    expect(requestFor(w)).toEqual({
      url: '/api/measurements/7/readings',
      body: { clientId: w.clientId, value: 24.99, unit: 'mm', instrument: 'micrometer', resolution: 0.001, measuredAt: '2026-03-14T14:05:00.000Z', recordVersion: 3 },
    });
    expect(requestFor({ ...w, reading: readingWrite(24.99, { checkVersion: false }) })!.body).not.toHaveProperty('recordVersion');
  });

  test('notes and minutes go to the session; a photo goes through the upload SDK instead', () => {
    const noteW = write({ note: { text: 'Spring pass', clock: '14:05' } });
    expect(requestFor(noteW)).toEqual({ url: '/api/sessions/5/bench-notes', body: { clientId: noteW.clientId, text: 'Spring pass', clock: '14:05' } });
    const timeW = write({ kind: 'time', time: { minutes: 12 }, note: undefined });
    expect(requestFor(timeW)).toEqual({ url: '/api/sessions/5/time', body: { clientId: timeW.clientId, minutes: 12 } });
    expect(requestFor(write({ kind: 'media', note: undefined }))).toBeNull();
    expect(describeWrite(timeW)).toBe('12 min on the timer');
  });
});

describe('a queued reading when its record changed', () => {
  // 25 g6: es −7 µm, ei −20 µm; 25 k6: +15 / +2 µm (over 18 up to 30 mm).
  test('judged as it was and as it is now', () => {
    const r = readingWrite(24.99);
    expect(judgeQueued(r), ISO286).toBe('Inside');
    expect(judgeQueued(r, { ...spigot, spec: { type: 'zone', zone: 'k6' } }), ISO286).toBe('Outside by 0.012 mm');
  });

  test('kept as a note, it says what was read, how it was judged and why it is a note', () => {
    expect(readingAsNote(readingWrite(24.99, { valueText: '24.990' }), '14:05', 'gone')).toEqual({
      clock: '14:05',
      text: 'Reading of Spigot diameter: 24.990 mm (Micrometer), Inside as judged at the bench; kept as a note because its record was deleted.',
    });
  });
});

describe('the bench view’s words for a record', () => {
  const g6 = { kind: 'outside' as const, nominal: 25, unit: 'mm' as const, spec: { type: 'zone' as const, zone: 'g6' } };
  test('limits of 25 g6 as sizes, and no readings yet', () => {
    const w = benchWords({ ...g6, readings: [] });
    expect(w, ISO286).toMatchObject({ specLabel: 'g6', sizes: '24.980 to 24.993 mm', state: 'none', verdict: 'No readings yet', nextCut: null });
  });

  test('0.1 mm oversize: stock to the middle of the band and the cut per side (half the change in diameter)', () => {
    // Middle of 25 g6 is −13.5 µm: from +100 µm that is 113.5 µm on the diameter, 56.75 µm a side, set as 0.057 mm.
    const w = benchWords({ ...g6, readings: [{ value: 25.1, unit: 'mm', resolution: 0.001 }] });
    expect(w, ISO286).toMatchObject({ state: 'over', verdict: 'Outside by 0.107 mm', nextCut: 'Take off 0.057 mm per side' });
    expect('error' in w ? '' : w.stock).toMatch(/^0\.114 mm on the diameter/);
  });

  test('in size, and past the far limit', () => {
    expect(benchWords({ ...g6, readings: [{ value: 24.985, unit: 'mm', resolution: 0.001 }] })).toMatchObject({ state: 'inside', verdict: 'Inside', stock: 'None: in size', nextCut: null });
    const past = benchWords({ ...g6, readings: [{ value: 24.97, unit: 'mm', resolution: 0.001 }] });
    expect(past, ISO286).toMatchObject({ state: 'under', stock: 'None: 0.010 mm past the lower limit' });
  });

  test('an inside feature opens up: 52 H7 read at 51.95', () => {
    // 52 H7: +30 / 0 µm (over 50 up to 65 mm); middle +15 µm; from −50 µm: 65 µm on the diameter, 32.5 µm a side.
    const w = benchWords({ kind: 'inside', nominal: 52, unit: 'mm', spec: { type: 'zone', zone: 'H7' }, readings: [{ value: 51.95, unit: 'mm', resolution: 0.001 }] });
    expect(w, ISO286).toMatchObject({ sizes: '52.000 to 52.030 mm', nextCut: 'Open up 0.033 mm per side' });
  });
});

describe('the number pad', () => {
  const type = (keys: string[]) => keys.reduce(padPress, '');
  test.each([
    [['2', '5', '.', '0', '1', '2'], '25.012'],
    [['.', '5'], '0.5'],
    [['0', '7'], '7'],
    [['1', '.', '.', '2'], '1.2'],
    [['2', '5', 'back'], '2'],
    [['2', '-'], '-2'],
    [['2', '-', '-'], '2'],
    [['9', 'clear', '3'], '3'],
  ])('%j → %s (common practice for a calculator keypad)', (keys, shown) => {
    expect(type(keys)).toBe(shown);
  });

  test('what it reads, and what it refuses', () => {
    expect(padValue('25.012')).toEqual({ value: 25.012 });
    expect(padValue('')).toEqual({ error: 'Type the reading first.' });
    expect(padValue('-2')).toEqual({ error: 'A reading must be a size greater than zero.' });
    expect(padValue('1.123456')).toEqual({ error: 'Give the reading to at most 5 decimal places.' });
  });
});
