import { describe, expect, test } from 'vitest';
import { formatTimeOfDay, formatTimeSpent, plural, pluralWord } from '@/lib/format';

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
