import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import {
  chapterSpans,
  formatClock,
  formatSrtTimestamp,
  formatVttTimestamp,
  parseCaptionFile,
  parseClock,
  parseSrt,
  parseWebVtt,
  toTimestampList,
  toWebVtt,
  LAST_CHAPTER_FALLBACK_MS,
} from '@/lib/chapters';

const VTT = 'W3C WebVTT: Web Video Text Tracks Format — from memory';
const SRT = 'SubRip format, common practice';
const CLOCK = 'common practice (how video players show a position)';

describe('formatClock / parseClock', () => {
  test.each([
    [0, '0:00', CLOCK],
    [999, '0:00', `${CLOCK}: seconds are not rounded up`],
    [221_000, '3:41', CLOCK],
    [599_999, '9:59', CLOCK],
    [3_600_000, '1:00:00', CLOCK],
    [3_723_000, '1:02:03', CLOCK],
    [36_000_000 + 61_000, '10:01:01', CLOCK],
  ])('formatClock(%i) = %s (%s)', (ms, text) => {
    expect(formatClock(ms)).toBe(text);
  });

  test.each([
    ['3:41', 221_000, CLOCK],
    ['0:00', 0, CLOCK],
    ['1:02:03', 3_723_000, CLOCK],
    ['221', 221_000, `${CLOCK}: bare seconds`],
    ['3:41.5', 221_500, `${CLOCK}: tenths`],
    ['0:07.250', 7_250, CLOCK],
    [' 12:00 ', 720_000, CLOCK],
  ])('parseClock(%j) = %i (%s)', (text, ms) => {
    expect(parseClock(text)).toBe(ms);
  });

  test.each(['', 'abc', '3:61', '1:60:00', '3:', ':41', '-1:00', '3:41:'])('parseClock(%j) is not a time', (text) => {
    expect(parseClock(text)).toBeNull();
  });

  test('formatClock and parseClock agree on whole seconds', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99 * 3600 }), (s) => {
        expect(parseClock(formatClock(s * 1000))).toBe(s * 1000);
      }),
    );
  });

  test.each([
    [0, '00:00:00.000', '00:00:00,000'],
    [61_005, '00:01:01.005', '00:01:01,005'],
    [3_723_450, '01:02:03.450', '01:02:03,450'],
    [100 * 3_600_000, '100:00:00.000', '100:00:00,000'],
  ])('timestamps of %i ms: WebVTT %s (%s), SRT %s', (ms, vtt, srt) => {
    // W3C WebVTT: hours at least two digits, "." before milliseconds — from memory. SubRip: "," before milliseconds — common practice.
    expect(formatVttTimestamp(ms)).toBe(vtt);
    expect(formatSrtTimestamp(ms)).toBe(srt);
  });
});

describe('parseWebVtt', () => {
  test(`timestamps with and without hours (${VTT})`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:01.000 --> 00:02.500\nNo hours\n\n01:00:01.000 --> 01:00:02.000\nWith hours\n\n1:00:03.000 --> 1:00:04.000\nOne-digit hours\n');
    expect(r.problems).toEqual([]);
    expect(r.cues.map((c) => [c.startMs, c.endMs, c.text])).toEqual([
      [1000, 2500, 'No hours'],
      [3_601_000, 3_602_000, 'With hours'],
      [3_603_000, 3_604_000, 'One-digit hours'],
    ]);
  });

  test(`a comma before the milliseconds is SRT, not WebVTT: reported with its line (${VTT})`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:01,000 --> 00:00:02,000\nComma\n\n00:00:03.000 --> 00:00:04.000\nStop\n');
    expect(r.cues.map((c) => c.text)).toEqual(['Stop']);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].line).toBe(3);
    expect(r.problems[0].reason).toMatch(/full stop/);
  });

  test.each([
    ['00:00:01.00 --> 00:00:02.000', 'milliseconds must be exactly three digits'],
    ['00:00:61.000 --> 00:01:02.000', 'seconds 59 or less'],
    ['00:60:00.000 --> 01:01:00.000', 'minutes 59 or less'],
    ['0:01.000 --> 0:02.000', 'two-field form needs two-digit minutes'],
  ])(`bad timing %j is reported (${VTT}: %s)`, (timing) => {
    const r = parseWebVtt(`WEBVTT\n\n${timing}\nText\n`);
    expect(r.cues).toEqual([]);
    expect(r.problems.map((p) => p.line)).toEqual([3]);
  });

  test(`cue settings after the end time are ignored (${VTT})`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:05.000 --> 00:00:09.000 align:start position:10% line:0\nSettings\n');
    expect(r.problems).toEqual([]);
    expect(r.cues).toEqual([{ startMs: 5000, endMs: 9000, text: 'Settings', line: 3 }]);
  });

  test(`NOTE, STYLE and REGION blocks are skipped; a cue identifier is not text (${VTT})`, () => {
    const r = parseWebVtt(
      [
        'WEBVTT - spigot pass',
        'Kind: chapters',
        '',
        'NOTE written by hand',
        'across two lines',
        '',
        'STYLE',
        '::cue { color: red }',
        '',
        'REGION',
        'id:fred width:40%',
        '',
        'intro',
        '00:00:00.000 --> 00:00:10.000',
        'Facing',
        '',
      ].join('\n'),
    );
    expect(r.problems).toEqual([]);
    expect(r.cues).toEqual([{ startMs: 0, endMs: 10_000, text: 'Facing', line: 14 }]);
  });

  test(`a byte-order mark and CRLF line ends are read (${VTT})`, () => {
    const r = parseWebVtt('\uFEFFWEBVTT\r\n\r\n00:00:01.000 --> 00:00:02.000\r\nFirst\r\n\r\n00:00:03.000 --> 00:00:04.000\r\nSecond\r\n');
    expect(r.problems).toEqual([]);
    expect(r.cues.map((c) => [c.line, c.text])).toEqual([
      [3, 'First'],
      [6, 'Second'],
    ]);
  });

  test(`multi-line cue text is joined into one line; markup and character references become plain text (${VTT})`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:01.000 --> 00:00:02.000\n<v Rowan>Check the <b>spigot</b></v>\nagainst 80 &lt; Ø &amp; H7\n');
    expect(r.cues[0].text).toBe('Check the spigot against 80 < Ø & H7');
  });

  test(`a cue that ends before it starts is reported, with its line (${VTT}: the end must be greater than the start)`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:05.000 --> 00:00:04.000\nBackwards\n\n00:00:06.000 --> 00:00:06.000\nZero length\n');
    expect(r.cues).toEqual([]);
    expect(r.problems.map((p) => p.line)).toEqual([3, 6]);
    expect(r.problems[0].reason).toMatch(/before its start/);
  });

  test(`garbage lines are reported with their line numbers, good cues still read (${VTT})`, () => {
    const text = [
      'WEBVTT', //                           1
      '', //                                 2
      '00:00:01.000 --> 00:00:02.000', //    3
      'Good one', //                         4
      '', //                                 5
      'this is not a cue', //                6
      '', //                                 7
      '00:00:03.000 --> 00:00:04.000', //    8
      'Good two', //                         9
      '', //                                10
      'neither is this', //                 11
      'nor this', //                        12
      '', //                                13
      '00:00:05.000 --> soon', //           14
      'Bad end', //                         15
    ].join('\n');
    const r = parseWebVtt(text);
    expect(r.cues.map((c) => c.text)).toEqual(['Good one', 'Good two']);
    expect(r.problems.map((p) => p.line)).toEqual([6, 11, 14]);
    expect(r.problems[2].reason).toMatch(/end time/);
  });

  test(`a text line holding "-->" starts the next cue (${VTT})`, () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:01.000 --> 00:00:02.000\nOne\n00:00:03.000 --> 00:00:04.000\nTwo\n');
    expect(r.cues.map((c) => [c.startMs, c.text])).toEqual([
      [1000, 'One'],
      [3000, 'Two'],
    ]);
  });

  test(`a missing WEBVTT header is reported at line 1 (${VTT})`, () => {
    const r = parseWebVtt('00:00:01.000 --> 00:00:02.000\nHeaderless\n');
    expect(r.problems).toEqual([{ line: 1, reason: expect.stringMatching(/WEBVTT/) }]);
    expect(r.cues.map((c) => c.text)).toEqual(['Headerless']);
  });

  test('a cue with no text is reported', () => {
    const r = parseWebVtt('WEBVTT\n\n00:00:01.000 --> 00:00:02.000\n\n');
    expect(r.cues).toEqual([]);
    expect(r.problems).toEqual([{ line: 3, reason: 'The cue has no text.' }]);
  });
});

describe('parseSrt', () => {
  test(`numbered blocks with comma milliseconds, CRLF and a BOM (${SRT})`, () => {
    const r = parseSrt('\uFEFF1\r\n00:00:01,000 --> 00:00:02,500\r\nFacing\r\n\r\n2\r\n01:02:03,004 --> 01:02:05,000\r\nTurning\r\nthe spigot\r\n');
    expect(r.problems).toEqual([]);
    expect(r.cues).toEqual([
      { startMs: 1000, endMs: 2500, text: 'Facing', line: 2 },
      { startMs: 3_723_004, endMs: 3_725_000, text: 'Turning the spigot', line: 6 },
    ]);
  });

  test(`a full stop before the milliseconds is accepted (${SRT}: many writers produce it)`, () => {
    expect(parseSrt('1\n00:00:01.250 --> 00:00:02.000\nDot\n').cues[0].startMs).toBe(1250);
  });

  test(`formatting tags and position hints are dropped (${SRT})`, () => {
    const r = parseSrt('1\n00:00:01,000 --> 00:00:02,000 X1:100 X2:600 Y1:50 Y2:80\n{\\an8}<i>Check</i> <font color="#ff0000">the key</font>\n');
    expect(r.problems).toEqual([]);
    expect(r.cues[0].text).toBe('Check the key');
  });

  test(`blocks run together without a blank line still split at the next index and timing (${SRT})`, () => {
    const r = parseSrt('1\n00:00:01,000 --> 00:00:02,000\nOne\n2\n00:00:03,000 --> 00:00:04,000\nTwo\n');
    expect(r.cues.map((c) => c.text)).toEqual(['One', 'Two']);
  });

  test(`a backwards cue and garbage are reported with line numbers (${SRT})`, () => {
    const r = parseSrt('1\n00:00:05,000 --> 00:00:04,000\nBackwards\n\nnonsense\n\n3\n00:00:06,000 --> 00:00:07,000\nFine\n');
    expect(r.cues.map((c) => c.text)).toEqual(['Fine']);
    expect(r.problems.map((p) => p.line)).toEqual([2, 5]);
  });
});

describe('parseCaptionFile', () => {
  test('a WEBVTT first line wins over the extension', () => {
    expect(parseCaptionFile('chapters.srt', 'WEBVTT\n\n00:01.000 --> 00:02.000\nA\n').format).toBe('vtt');
  });
  test('a BOM before WEBVTT still counts as WebVTT', () => {
    expect(parseCaptionFile('x', '\uFEFFWEBVTT\n\n00:01.000 --> 00:02.000\nA\n').format).toBe('vtt');
  });
  test('then the extension decides', () => {
    expect(parseCaptionFile('Chapters.VTT', '00:01.000 --> 00:02.000\nA\n').format).toBe('vtt');
    expect(parseCaptionFile('pass.srt', '1\n00:00:01,000 --> 00:00:02,000\nA\n').format).toBe('srt');
  });
  test('anything else is read as SRT, and reports what it could not read', () => {
    const r = parseCaptionFile('notes.txt', 'just some words\n\nmore words\n');
    expect(r.format).toBe('srt');
    expect(r.cues).toEqual([]);
    expect(r.problems.map((p) => p.line)).toEqual([1, 3]);
  });
});

describe('toWebVtt / toTimestampList', () => {
  const notes = [
    { startMs: 221_000, endMs: null, text: 'Measure the spigot' },
    { startMs: 0, endMs: null, text: 'Facing the spigot' },
    { startMs: 300_000, endMs: 320_000, text: 'Chuck key out!' },
  ];

  test(`writes the header and HH:MM:SS.mmm --> HH:MM:SS.mmm cues in time order (${VTT})`, () => {
    expect(toWebVtt(notes, { durationMs: 400_000 })).toBe(
      'WEBVTT\n\n1\n00:00:00.000 --> 00:03:41.000\nFacing the spigot\n\n2\n00:03:41.000 --> 00:05:00.000\nMeasure the spigot\n\n3\n00:05:00.000 --> 00:05:20.000\nChuck key out!\n',
    );
  });

  test('each chapter ends at the next note, its own end, or the clip end — whichever comes first', () => {
    expect(chapterSpans([{ startMs: 0, endMs: 5000, text: 'a' }, { startMs: 10_000, text: 'b' }], 12_000).map((s) => [s.startMs, s.endMs])).toEqual([
      [0, 5000],
      [10_000, 12_000],
    ]);
    expect(chapterSpans([{ startMs: 0, endMs: 50_000, text: 'a' }, { startMs: 10_000, text: 'b' }]).map((s) => s.endMs)).toEqual([10_000, 10_000 + LAST_CHAPTER_FALLBACK_MS]);
  });

  test(`"<", "&" and "-->" in a note are written as character references and read back as written (${VTT})`, () => {
    const vtt = toWebVtt([{ startMs: 0, text: 'Bore < 80 & check --> then face' }], { durationMs: 1000 });
    expect(vtt).toContain('Bore &lt; 80 &amp; check --&gt; then face');
    expect(parseWebVtt(vtt).cues[0].text).toBe('Bore < 80 & check --> then face');
  });

  test('the timestamp list is one "m:ss title" line per note in time order, as-is (m:ss as people read clocks — common practice)', () => {
    expect(toTimestampList(notes)).toBe('0:00 Facing the spigot\n3:41 Measure the spigot\n5:00 Chuck key out!');
    expect(toTimestampList([{ startMs: 3_723_000, text: 'Line\ntwo' }])).toBe('1:02:03 Line two');
  });

  test(`round trip: notes → WebVTT → parse gives the same times and texts (${VTT})`, () => {
    const r = parseWebVtt(toWebVtt(notes, { durationMs: 400_000 }));
    expect(r.problems).toEqual([]);
    expect(r.cues.map((c) => [c.startMs, c.text])).toEqual([
      [0, 'Facing the spigot'],
      [221_000, 'Measure the spigot'],
      [300_000, 'Chuck key out!'],
    ]);
  });

  // Words without whitespace (any characters, markup-like ones included) joined by single spaces:
  // a title is one run of words, which is what the writer keeps.
  const word = fc.string({ minLength: 1, maxLength: 12, unit: 'grapheme' }).filter((w) => !/\s/.test(w) && w.trim() === w);
  const title = fc.array(word, { minLength: 1, maxLength: 6 }).map((ws) => ws.join(' '));

  test('property: for notes with increasing starts, parseWebVtt(toWebVtt(notes)) keeps every start and text', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 10 * 3_600_000 }), { minLength: 1, maxLength: 20 }),
        fc.array(title, { minLength: 20, maxLength: 20 }),
        fc.option(fc.integer({ min: 1, max: 2 * 3_600_000 }), { nil: undefined }),
        (starts, titles, extra) => {
          const sorted = [...starts].sort((a, b) => a - b);
          const list = sorted.map((startMs, i) => ({ startMs, text: titles[i] }));
          const durationMs = extra === undefined ? undefined : sorted[sorted.length - 1] + extra;
          const r = parseWebVtt(toWebVtt(list, { durationMs }));
          expect(r.problems).toEqual([]);
          expect(r.cues.map((c) => c.startMs)).toEqual(sorted);
          expect(r.cues.map((c) => c.text)).toEqual(list.map((n) => n.text));
        },
      ),
      { numRuns: 300 },
    );
  });
});
