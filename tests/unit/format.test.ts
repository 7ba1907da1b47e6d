import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { format, parseISO } from 'date-fns';
import { formatDate, formatDateTime, formatDay, formatTimeOfDay, formatTimeSpent, plural, pluralWord } from '@/lib/format';

describe('plural', () => {
  // English cardinal plural rules: "one" only for the integer 1 (Unicode CLDR plural rules, en — from memory).
  test.each([
    [0, 'session', '0 sessions'],
    [1, 'session', '1 session'],
    [2, 'session', '2 sessions'],
    [21, 'session', '21 sessions'],
    [1.5, 'turn', '1.5 turns'],
    [1, 'entry', '1 entry'],
    [3, 'entry', '3 entries'],
  ])('%s %s → %s', (n, one, said) => {
    expect(plural(n, one, one === 'entry' ? 'entries' : undefined)).toBe(said);
  });
  test('the word alone follows the same rule', () => {
    expect(pluralWord(1, 'reading')).toBe('reading');
    expect(pluralWord(0, 'reading')).toBe('readings');
  });
});

describe('clock and time spent', () => {
  // ISO 8601: hours 00–23, no AM/PM.
  test.each([
    [6, 16, '06:16'],
    [18, 5, '18:05'],
    [0, 0, '00:00'],
  ])('%i:%i → %s', (h, m, said) => {
    expect(formatTimeOfDay(new Date(2026, 11, 2, h, m))).toBe(said);
  });
  test('a session with no time noted says so instead of "0 min"', () => {
    expect(formatTimeSpent(0)).toBe('time not noted');
    expect(formatTimeSpent(150)).toBe('2 h 30 min at the machines');
  });
});

// The site writes dates with Intl.DateTimeFormat; the words must be those of date-fns's format() (a reference library
// on npm) for the same patterns, in this process's time zone, for any moment from 1970 to 2100.
describe('days and times, the same words as date-fns', () => {
  const moments = fc.date({ min: new Date(0), max: new Date(Date.UTC(2100, 0, 1)), noInvalidDate: true });
  test("'d MMM yyyy'", () => {
    fc.assert(fc.property(moments, (at) => {
        expect(formatDate(at)).toBe(format(at, 'd MMM yyyy'));
      }), { numRuns: 2000 });
  });
  test("'d MMM yyyy, HH:mm', given a Date or its ISO string", () => {
    fc.assert(
      fc.property(moments, (at) => {
        expect(formatDateTime(at)).toBe(format(at, 'd MMM yyyy, HH:mm'));
        expect(formatDateTime(at.toISOString())).toBe(format(at, 'd MMM yyyy, HH:mm'));
      }),
      { numRuns: 2000 },
    );
  });
  test("'HH:mm'", () => {
    fc.assert(fc.property(moments, (at) => {
        expect(formatTimeOfDay(at)).toBe(format(at, 'HH:mm'));
      }), { numRuns: 2000 });
  });
  test("a calendar day, 'EEE d MMM yyyy', whatever the time zone", () => {
    fc.assert(
      fc.property(moments, (at) => {
        const day = at.toISOString().slice(0, 10);
        expect(formatDay(day)).toBe(format(parseISO(day), 'EEE d MMM yyyy'));
      }),
      { numRuns: 2000 },
    );
  });
  test('worked examples', () => {
    // 3 October 2026 is a Saturday; September is "Sep" (date-fns's English names, which the site has always shown).
    expect(formatDay('2026-10-03')).toBe('Sat 3 Oct 2026');
    expect(formatDay('2026-09-14')).toBe('Mon 14 Sep 2026');
    expect(formatDate(new Date(2026, 8, 4, 23, 59))).toBe('4 Sep 2026');
    expect(formatDateTime(new Date(2026, 11, 2, 0, 5))).toBe('2 Dec 2026, 00:05');
  });
});
