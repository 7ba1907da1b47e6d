import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { formatDistanceStrict } from 'date-fns';
import { timeAgo } from '@/components/ui/time-ago';

// "3 days ago" on cards of the pages cached for everyone is worked out in the browser with its own
// Intl.RelativeTimeFormat; checked against date-fns's formatDistanceStrict (a reference library on npm),
// which the cards used before, so the words do not change.
const NOW = Date.UTC(2026, 11, 3, 12, 0, 0);
const ago = (seconds: number) => new Date(NOW - seconds * 1000).toISOString();
const reference = (iso: string) => formatDistanceStrict(new Date(iso), NOW, { addSuffix: true });

describe('timeAgo', () => {
  test.each([
    ['20 seconds', 20],
    ['a minute', 60],
    ['59.6 minutes', 3576],
    ['an hour and a half', 5400],
    ['a day', 86_400],
    ['29 days', 29 * 86_400],
    ['45 days', 45 * 86_400],
    ['a year and a bit', 400 * 86_400],
  ])('%s ago says what date-fns says', (_name, seconds) => {
    const iso = ago(seconds);
    expect(timeAgo(iso, NOW)).toBe(reference(iso));
  });

  test('any moment in the last ten years reads the same as date-fns', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10 * 365 * 86_400 }), (seconds) => {
        const iso = ago(seconds);
        expect(timeAgo(iso, NOW)).toBe(reference(iso));
      }),
      { numRuns: 2000 },
    );
  });
});
