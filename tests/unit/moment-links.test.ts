import { describe, expect, test } from 'vitest';
import { legacyMomentMs, momentHref, parseMomentFragment } from '@/lib/chapters';

// Temporal fragments: W3C "Media Fragments URI 1.0 (basic)", 2012, section 4.2.1 (npt: seconds, with an
// optional "npt:" prefix and an optional ",end"; hh:mm:ss[.frac] also allowed) — from memory.
describe('parseMomentFragment', () => {
  test.each([
    ['#t=8', 8000, 'W3C MF 1.0 §4.2.1: npt seconds'],
    ['#t=8.5', 8500, 'W3C MF 1.0 §4.2.1: fractional seconds'],
    ['#t=npt:12', 12000, 'W3C MF 1.0 §4.2.1: npt: prefix'],
    ['#t=10,20', 10000, 'W3C MF 1.0 §4.2.1: start,end — start is the moment'],
    ['#t=0:01:05', 65000, 'W3C MF 1.0 §4.2.1: hh:mm:ss'],
    ['#t=1:05', 65000, 'W3C MF 1.0 §4.2.1: mm:ss'],
    ['#xywh=0,0,10,10&t=3', 3000, 'W3C MF 1.0 §4.1: name=value pairs joined by &'],
    ['t=4', 4000, 'without the leading #'],
  ])('%s → %d ms (%s)', (hash, ms) => {
    expect(parseMomentFragment(hash)).toBe(ms);
  });
  test.each(['', '#', '#comments', '#t=', '#t=abc', '#t=1:75', '#tt=5'])('%s is no moment', (hash) => {
    expect(parseMomentFragment(hash)).toBeNull();
  });
});

describe('momentHref', () => {
  test('clip in the query, whole seconds in the fragment', () => {
    expect(momentHref('/logs/x/entries/4', 12, 8999)).toBe('/logs/x/entries/4?clip=12#t=8');
  });
  test('round trip through the fragment reader', () => {
    const href = momentHref('/logs/x/entries/4', 3, 65_000);
    expect(parseMomentFragment(href.slice(href.indexOf('#')))).toBe(65_000);
  });
  test('without a clip, no query', () => {
    expect(momentHref('/logs/x/entries/4', null, 0)).toBe('/logs/x/entries/4#t=0');
  });
});

describe('legacyMomentMs (old ?t= links)', () => {
  test.each([
    ['6', 6000],
    ['6.5', 6500],
    [['7', '9'], 7000],
  ] as const)('%s → %d', (t, ms) => expect(legacyMomentMs(t as string | string[])).toBe(ms));
  test.each([undefined, '', '-1', 'x'])('%s → null', (t) => expect(legacyMomentMs(t)).toBeNull());
});
