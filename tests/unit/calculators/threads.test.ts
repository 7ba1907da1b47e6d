import { describe, expect, test } from 'vitest';
import {
  drillSize, INCH_DRILL_KINDS, listThreads, METRIC_DRILL_KINDS, tapDrill, threadPercent, threadSpec,
} from '../../../lib/calculators/index';
import { refusal } from './refusal';

const B11 = 'ASME B1.1 unified inch screw threads, UNC/UNF series table — from memory';
const ISO262 = 'ISO 262 selected sizes, coarse and fine pitches — from memory';
const ISO68 = 'ISO 68-1 basic profile, D1 = D − 1.082532·P — from memory';
const MH_TAP = "Machinery's Handbook, tap drill sizes and percentage of thread — from memory";
const COMMON = 'common practice';

describe('threadSpec reads designations', () => {
  // [typed, normalised designation, major mm, pitch mm, TPI, series, source]
  const ROWS: ReadonlyArray<readonly [string, string, number, number, number | null, string, string]> = [
    ['5/16-18 UNC', '5/16-18 UNC', 7.9375, 25.4 / 18, 18, 'UNC', B11],
    ['1/4-20', '1/4-20 UNC', 6.35, 1.27, 20, 'UNC', B11],
    ['1/4-28', '1/4-28 UNF', 6.35, 25.4 / 28, 28, 'UNF', B11],
    ['#10-32', '#10-32 UNF', 4.826, 25.4 / 32, 32, 'UNF', B11],
    ['10-24 UNC', '#10-24 UNC', 4.826, 25.4 / 24, 24, 'UNC', B11],
    ['#0-80', '#0-80 UNF', 1.524, 25.4 / 80, 80, 'UNF', B11],
    ['#4-40', '#4-40 UNC', 2.8448, 0.635, 40, 'UNC', B11],
    ['#6-32 unc', '#6-32 UNC', 3.5052, 0.79375, 32, 'UNC', B11],
    ['1/2-13', '1/2-13 UNC', 12.7, 25.4 / 13, 13, 'UNC', B11],
    ['3/4 - 16 UNF', '3/4-16 UNF', 19.05, 1.5875, 16, 'UNF', B11],
    ['1-8', '1-8 UNC', 25.4, 3.175, 8, 'UNC', B11],
    ['1-1/2-6', '1-1/2-6 UNC', 38.1, 25.4 / 6, 6, 'UNC', B11],
    ['1 1/2-12 UNF', '1-1/2-12 UNF', 38.1, 25.4 / 12, 12, 'UNF', B11],
    ['1-1/8-7', '1-1/8-7 UNC', 28.575, 25.4 / 7, 7, 'UNC', B11],
    ['M8', 'M8', 8, 1.25, null, 'coarse', ISO262],
    ['M8x1.25', 'M8', 8, 1.25, null, 'coarse', ISO262],
    [' m8 x 1.25 ', 'M8', 8, 1.25, null, 'coarse', ISO262],
    ['M10x1', 'M10x1', 10, 1, null, 'fine', ISO262],
    ['M10 × 1,25', 'M10x1.25', 10, 1.25, null, 'fine', ISO262],
    ['M12x1.5', 'M12x1.5', 12, 1.5, null, 'fine', ISO262],
    ['M1.6', 'M1.6', 1.6, 0.35, null, 'coarse', ISO262],
    ['M3', 'M3', 3, 0.5, null, 'coarse', ISO262],
    ['M5', 'M5', 5, 0.8, null, 'coarse', ISO262],
    ['M6', 'M6', 6, 1, null, 'coarse', ISO262],
    ['M12', 'M12', 12, 1.75, null, 'coarse', ISO262],
    ['M16', 'M16', 16, 2, null, 'coarse', ISO262],
    ['M20', 'M20', 20, 2.5, null, 'coarse', ISO262],
    ['M24', 'M24', 24, 3, null, 'coarse', ISO262],
    ['M30', 'M30', 30, 3.5, null, 'coarse', ISO262],
    ['M36', 'M36', 36, 4, null, 'coarse', ISO262],
    ['M48', 'M48', 48, 5, null, 'coarse', ISO262],
    ['M64', 'M64', 64, 6, null, 'coarse', ISO262],
    ['M64x4', 'M64x4', 64, 4, null, 'fine', ISO262],
  ];

  test.each(ROWS)('%s → %s — %s', (typed, designation, major, pitch, tpi, series) => {
    const s = threadSpec(typed);
    expect(s.designation).toBe(designation);
    expect(s.majorDiameterMm).toBeCloseTo(major, 6);
    expect(s.pitchMm).toBeCloseTo(pitch, 6);
    expect(s.tpi).toBe(tpi);
    expect(s.series).toBe(series);
    expect(s.major.in).toBeCloseTo(major / 25.4, 9);
  });

  test('a class or tolerance after the designation is kept, not used — common practice', () => {
    expect(threadSpec('1/4-20 UNC-2B').classOrTolerance).toBe('2B');
    expect(threadSpec('M8x1.25-6H').classOrTolerance).toBe('6H');
    expect(threadSpec('M8-6H').designation).toBe('M8');
  });

  // [designation, D1 basic minor of the nut, mm]
  const MINOR: ReadonlyArray<readonly [string, number, string]> = [
    ['M8', 6.647, ISO68],
    ['M10', 8.376, ISO68],
    ['M6', 4.917, ISO68],
    ['1/4-20', 0.1959 * 25.4, `${ISO68}; ASME B1.1 basic minor diameter 0.1959 in`],
  ];
  test.each(MINOR)('%s basic minor diameter of the nut = %s mm — %s', (d, minor) => {
    expect(threadSpec(d).minorDiameterInternal.mm).toBeCloseTo(minor, 2);
  });

  test('M8 lists its fine pitches beside it — ISO 261, from memory', () => {
    expect(threadSpec('M8').otherPitches.map((p) => p.designation)).toEqual(['M8x1', 'M8x0.75']);
    expect(threadSpec('1/4-20').otherPitches.map((p) => p.designation)).toEqual(['1/4-28 UNF']);
  });
});

describe('threadSpec refuses what the tables do not hold', () => {
  // [typed, code, words in the message]
  const ROWS: ReadonlyArray<readonly [string, string, RegExp, string]> = [
    ['1/4-19', 'UNKNOWN_THREAD', /20 \(UNC\) or 28 \(UNF\)/, B11],
    ['M8x3', 'UNKNOWN_THREAD', /1\.25 mm \(coarse\)/, ISO262],
    ['M9', 'UNKNOWN_THREAD', /not among the metric threads/, ISO262],
    ['9/32-32', 'UNKNOWN_THREAD', /not among the unified thread sizes/, B11],
    ['#14-20', 'UNKNOWN_THREAD', /not among the unified/, B11],
    ['1/4-20 UNF', 'UNKNOWN_THREAD', /is UNC, not UNF/, B11],
    ['#0-72', 'UNKNOWN_THREAD', /80 \(UNF\)/, `${B11}: #0 has no coarse thread`],
    ['1/4-32 UNEF', 'UNKNOWN_THREAD', /UNEF/, COMMON],
    ['1/4', 'UNREADABLE', /threads per inch/, COMMON],
    ['M8x', 'UNREADABLE', /metric thread/, COMMON],
    ['quarter twenty', 'UNREADABLE', /not a thread/, COMMON],
    ['', 'UNREADABLE', /Enter a thread/, COMMON],
  ];
  test.each(ROWS)('%s is refused (%s) — %s', (typed, code, words) => {
    const e = refusal(() => threadSpec(typed));
    expect(e.code).toBe(code);
    expect(e.field).toBe('designation');
    expect(e.message).toMatch(words);
  });

  test('not text at all is refused, not thrown as a TypeError', () => {
    expect(refusal(() => threadSpec(42 as unknown as string)).field).toBe('designation');
  });
});

describe('threadPercent by the handbook relation', () => {
  // [thread, drill, expected %, tolerance in points, source]
  const ROWS: ReadonlyArray<readonly [string, string, number, number, string]> = [
    ['1/4-20', '#7', 75, 1, MH_TAP],
    ['M8x1.25', '6.8 mm', 74, 0.5, MH_TAP],
    ['5/16-18', '1/4', 87, 0.5, `${MH_TAP} (harder to tap, common practice)`],
    ['5/16-18', 'F', 77, 0.5, MH_TAP],
    ['#10-24', '#25', 75, 0.5, MH_TAP],
    ['#10-32', '#21', 76, 0.5, MH_TAP],
    ['#8-32', '#29', 69, 0.5, MH_TAP],
    ['#6-32', '#36', 78, 0.5, MH_TAP],
    ['#4-40', '#43', 71, 0.5, MH_TAP],
    ['1/4-28', '#3', 80, 0.5, MH_TAP],
    ['3/8-16', '5/16', 77, 0.5, MH_TAP],
    ['3/8-24', 'Q', 79, 0.5, MH_TAP],
    ['1/2-13', '27/64', 78, 0.5, MH_TAP],
    ['1/2-20', '29/64', 72, 0.5, MH_TAP],
    ['3/4-10', '21/32', 72, 0.5, MH_TAP],
    ['1-8', '7/8', 77, 0.5, MH_TAP],
    ['M6', '5 mm', 77, 0.5, `${MH_TAP}: tap drill = major − pitch gives about 77 %`],
    ['M10', '8.5 mm', 77, 0.5, MH_TAP],
    ['M12', '10.2 mm', 79, 0.5, MH_TAP],
  ];
  test.each(ROWS)('%s with %s ≈ %s %% — %s', (thread, drill, percent, tol) => {
    const r = threadPercent(thread, drillSize(drill).diameterMm);
    expect(Math.abs(r.percent - percent)).toBeLessThanOrEqual(tol);
    expect(r.threadDepth.mm).toBeCloseTo((r.thread.majorDiameterMm - r.drill.mm) / 2, 9);
  });

  test('the inch form TPI × (major − drill) / 0.01299 agrees — Machinery\'s Handbook, from memory', () => {
    const r = threadPercent('1/4-20', 0.201 * 25.4);
    expect(r.percent).toBeCloseTo((20 * (0.25 - 0.201)) / 0.01299, 1);
  });

  test('the basic minor diameter of the nut is about 83 % — ISO 68-1 with the handbook relation, from memory', () => {
    const s = threadSpec('M8');
    expect(threadPercent('M8', s.minorDiameterInternal.mm).percent).toBeCloseTo(83.33, 1);
  });

  // [thread, drill mm, warning code, source]
  const WARN: ReadonlyArray<readonly [string, number, string | null, string]> = [
    ['5/16-18', 6.35, 'HIGH_ENGAGEMENT', `${MH_TAP}: above about 85 % is hard to tap`],
    ['M8', 7.1, 'LOW_ENGAGEMENT', `${COMMON}: below about 60 % is a weak thread`],
    ['M8', 6.8, null, COMMON],
  ];
  test.each(WARN)('%s with %s mm warns %s — %s', (thread, drill, code) => {
    const r = threadPercent(thread, drill);
    expect(r.warnings.map((w) => w.code)).toEqual(code ? [code] : []);
  });

  // [thread, drill, field, code]
  const BAD: ReadonlyArray<readonly [string, number, string, string]> = [
    ['M8', 8, 'drillDiameterMm', 'NOT_POSSIBLE'],
    ['M8', 9, 'drillDiameterMm', 'NOT_POSSIBLE'],
    ['M8', 5, 'drillDiameterMm', 'NOT_POSSIBLE'],
    ['M8', 0, 'drillDiameterMm', 'OUT_OF_RANGE'],
    ['M8', -6.8, 'drillDiameterMm', 'OUT_OF_RANGE'],
    ['M8', Number.NaN, 'drillDiameterMm', 'NOT_A_NUMBER'],
    ['M8x3', 6.8, 'designation', 'UNKNOWN_THREAD'],
  ];
  test.each(BAD)('%s with %s mm is refused on %s (%s)', (thread, drill, field, code) => {
    const e = refusal(() => threadPercent(thread, drill));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });
});

describe('tapDrill picks the chart drill nearest 75 %', () => {
  // [thread, kinds, drill, source]
  const INCH = INCH_DRILL_KINDS;
  const METRIC = METRIC_DRILL_KINDS;
  const ROWS: ReadonlyArray<readonly [string, readonly ('fractional' | 'number' | 'letter' | 'metric')[], string, string]> = [
    ['1/4-20', INCH, '#7', MH_TAP],
    ['5/16-18', INCH, 'F', MH_TAP],
    ['3/8-16', INCH, '5/16', MH_TAP],
    ['1/2-13', INCH, '27/64', MH_TAP],
    ['#10-24', INCH, '#25', MH_TAP],
    ['#10-32', INCH, '#21', MH_TAP],
    ['#8-32', INCH, '#29', MH_TAP],
    ['#6-32', INCH, '#36', MH_TAP],
    ['#4-40', INCH, '#43', MH_TAP],
    ['1/4-28', INCH, '#3', MH_TAP],
    ['5/16-24', INCH, 'I', MH_TAP],
    ['3/8-24', INCH, 'Q', MH_TAP],
    ['1/2-20', INCH, '29/64', MH_TAP],
    ['5/8-11', INCH, '17/32', MH_TAP],
    ['3/4-10', INCH, '21/32', MH_TAP],
    ['1-8', INCH, '7/8', MH_TAP],
    ['M8', METRIC, '6.8 mm', MH_TAP],
    ['M3', METRIC, '2.5 mm', MH_TAP],
    ['M4', METRIC, '3.3 mm', MH_TAP],
    ['M5', METRIC, '4.2 mm', MH_TAP],
    ['M6', METRIC, '5 mm', MH_TAP],
    ['M10', METRIC, '8.5 mm', MH_TAP],
    ['M16', METRIC, '14 mm', MH_TAP],
    ['M20', METRIC, '17.5 mm', MH_TAP],
    ['M24', METRIC, '21 mm', MH_TAP],
    ['M1.6', METRIC, '1.25 mm', MH_TAP],
    ['M2.5', METRIC, '2.05 mm', MH_TAP],
  ];
  test.each(ROWS)('%s → %s (from %s drills) — %s', (thread, kinds, drill) => {
    const r = tapDrill(thread, 75, { kinds });
    expect(r.choice.drill.name).toBe(drill);
    expect(r.choice.percent).toBeCloseTo(threadPercent(thread, r.choice.drill.diameterMm).percent, 9);
  });

  test('from the whole chart, M8 still gives 6.8 mm at 73.9 % and names the best inch drill — issue check', () => {
    const r = tapDrill('M8');
    expect(r.choice.drill.name).toBe('6.8 mm');
    expect(r.choice.percent).toBeCloseTo(73.9, 1);
    expect(r.bestInch?.drill.name).toBe('H');
    expect(r.bestMetric?.drill.name).toBe('6.8 mm');
    expect(r.alternatives).toHaveLength(4);
    expect(r.alternatives.every((a) => Math.abs(a.offTarget) >= Math.abs(r.choice.offTarget))).toBe(true);
    expect(r.idealDrill.mm).toBeCloseTo(8 - 0.75 * 1.299038 * 1.25, 4);
  });

  test('1/4-20 from the whole chart is #7 at about 75 % — issue check', () => {
    const r = tapDrill('1/4-20');
    expect(r.choice.drill.name).toBe('#7');
    expect(r.choice.percent).toBeCloseTo(75.4, 1);
    expect(r.warnings).toEqual([]);
  });

  test('a high target names the risk — common practice: above about 85 % is hard to tap', () => {
    const r = tapDrill('5/16-18', 87, { kinds: ['fractional'] });
    expect(r.choice.drill.name).toBe('1/4');
    expect(r.warnings.map((w) => w.code)).toContain('HIGH_ENGAGEMENT');
  });

  test('blind holes: taper, plug and bottoming taps need different extra depth — common practice', () => {
    const r = tapDrill('M8');
    const [taper, plug, bottoming] = r.blindHole.allowances;
    expect([taper.tap, plug.tap, bottoming.tap]).toEqual(['taper', 'plug', 'bottoming']);
    expect(taper.extraDepth.min.mm).toBeGreaterThan(plug.extraDepth.max.mm);
    expect(plug.extraDepth.min.mm).toBeGreaterThan(bottoming.extraDepth.max.mm);
    expect(plug.extraDepth.min.mm).toBeCloseTo(3 * 1.25, 9);
    expect(r.blindHole.drillPoint.mm).toBeCloseTo(0.3 * 6.8, 9);
    expect(r.tieRule).toMatch(/larger/);
  });

  // [thread, target, field, code]
  const BAD: ReadonlyArray<readonly [string, unknown, string, string]> = [
    ['M8', 20, 'targetPercent', 'OUT_OF_RANGE'],
    ['M8', 101, 'targetPercent', 'OUT_OF_RANGE'],
    ['M8', 'lots', 'targetPercent', 'NOT_A_NUMBER'],
    ['1/4-19', 75, 'designation', 'UNKNOWN_THREAD'],
  ];
  test.each(BAD)('%s at %s %% is refused on %s', (thread, target, field, code) => {
    const e = refusal(() => tapDrill(thread, target as number));
    expect(e.field).toBe(field);
    expect(e.code).toBe(code);
  });

  test('unknown drill kinds are refused', () => {
    expect(refusal(() => tapDrill('M8', 75, { kinds: ['cobalt' as 'metric'] })).field).toBe('kinds');
    expect(refusal(() => tapDrill('M8', 75, { kinds: [] })).field).toBe('kinds');
  });

  test('every thread in the tables reads back as itself and has a tap drill within 8 points of 75 %', () => {
    for (const t of listThreads()) {
      expect(threadSpec(t.designation).designation).toBe(t.designation);
      expect(Math.abs(tapDrill(t.designation).choice.offTarget)).toBeLessThan(8);
    }
  });
});
