import { describe, expect, test } from 'vitest';
import {
  analysePair, analyseRecord, approachToSize, asEntered, checkNearNominal, generalTolerance, judgeReading, MeasurementError, parseCsv, recordLimits,
  resolutionCheck, temperatureCheck, textCell, thouText, toCsv, toUm, verdictShort, judgementSentence, clearanceRangeText, type GeneralClass, type Limits,
  type RecordSpecInput,
} from '@/lib/measurements';
import { analyseFit } from '@/lib/fits';
import { measurementInputSchema } from '@/lib/validations/measurements';

const ISO2768 = 'ISO 2768-1:1989 table 1, permissible deviations for linear sizes — from memory';
const ISO286 = 'ISO 286-2:2010 limit deviation tables — from memory';
const ANSI_FITS = 'ANSI B4.2-1978 preferred metric fits table — from memory';
const INCH = 'international inch: 1 in = 25.4 mm exactly (25 400 µm); worked by hand';
const TEN_TO_ONE = 'common practice: the instrument resolves a tenth of the tolerance band or finer';
const ISO1 = 'ISO 1: reference temperature 20 °C; expansion of steel about 11 µm per metre per °C — common practice';
const HAND = 'worked by hand from the limits above';
const RFC4180 = 'RFC 4180 (CSV): CRLF line breaks, fields with comma, quote or line break in double quotes, quotes doubled';

const zone = (kind: 'outside' | 'inside', nominal: number, z: string): RecordSpecInput => ({ kind, nominal, unit: 'mm', spec: { type: 'zone', zone: z } });

function refusal(fn: () => unknown): MeasurementError {
  try {
    fn();
  } catch (err) {
    if (err instanceof MeasurementError) return err;
    throw err;
  }
  throw new Error('expected a refusal');
}

describe('ISO 2768-1 general tolerances for linear sizes', () => {
  // [class, nominal mm, ± µm, source]
  test.each<[GeneralClass, number, number, string]>([
    ['f', 0.5, 50, ISO2768], // 0.5 up to 3 mm, fine: ±0.05
    ['f', 3, 50, ISO2768], // a size that ends a range belongs to it
    ['m', 3, 100, ISO2768],
    ['c', 3, 200, ISO2768],
    ['c', 3.5, 300, ISO2768], // over 3 up to 6, coarse: ±0.3
    ['c', 6, 300, ISO2768],
    ['c', 6.01, 500, ISO2768], // over 6 up to 30, coarse: ±0.5
    ['m', 16, 200, ISO2768], // over 6 up to 30, medium: ±0.2 (the demo's tapped-hole depth)
    ['m', 50, 300, ISO2768], // over 30 up to 120, medium: ±0.3
    ['f', 120, 150, ISO2768],
    ['m', 200, 500, ISO2768], // over 120 up to 400, medium: ±0.5
    ['c', 200, 1200, ISO2768],
    ['v', 5, 500, ISO2768], // over 3 up to 6, very coarse: ±0.5
    ['v', 1000, 4000, ISO2768],
    ['m', 1500, 1200, ISO2768], // over 1000 up to 2000, medium: ±1.2
    ['c', 3000, 4000, ISO2768], // over 2000 up to 4000, coarse: ±4
    ['v', 4000, 8000, ISO2768],
  ])('class %s at %s mm is ±%s µm', (cls, mm, um, source) => {
    expect(generalTolerance(mm, cls).plusMinusUm, source).toBe(um);
  });

  test.each<[GeneralClass, number, string, string]>([
    ['v', 2, 'spec.generalClass', ISO2768], // very coarse has no value from 0.5 up to 3 mm
    ['f', 3000, 'spec.generalClass', ISO2768], // fine has no value over 2000 mm
    ['m', 0.4, 'nominal', ISO2768], // below 0.5 mm the tolerance goes beside the size
    ['m', 4001, 'nominal', ISO2768], // the table stops at 4000 mm
  ])('class %s at %s mm is refused on %s', (cls, mm, field, source) => {
    expect(refusal(() => generalTolerance(mm, cls)).field, source).toBe(field);
  });

  test('an inch size finds its range through millimetres', () => {
    // 1.575 in = 40.005 mm → over 30 up to 120, class m: ±0.3 mm = ±300 µm
    const l = recordLimits({ kind: 'outside', nominal: 1.575, unit: 'in', spec: { type: 'general', generalClass: 'm' } });
    expect(l.upperUm, `${ISO2768}; ${INCH}`).toBe(300);
    expect(l.lowerUm).toBe(-300);
    expect(l.label).toBe('ISO 2768-m');
  });
});

describe('limits from each kind of specification', () => {
  test.each<[string, number, 'outside' | 'inside', number, number, string]>([
    ['k6', 130, 'outside', 28, 3, ISO286], // 130 k6 = +28 / +3 µm
    ['H7', 130, 'inside', 40, 0, ISO286], // 130 H7 = +40 / 0 µm
    ['H7', 25, 'inside', 21, 0, ANSI_FITS], // 25 H7 = 25.000 / 25.021
    ['g6', 25, 'outside', -7, -20, ANSI_FITS], // 25 g6 = 24.980 / 24.993
    ['h6', 40, 'outside', 0, -16, ISO286], // 40 h6 = 0 / −16 µm
  ])('%s at %s mm (%s) is %s / %s µm', (z, mm, kind, upper, lower, source) => {
    const l = recordLimits(zone(kind, mm, z));
    expect([l.upperUm, l.lowerUm], source).toEqual([upper, lower]);
    expect(l.bandUm).toBe(upper - lower);
  });

  test('explicit deviations: 36.9 mm +0.1 / 0', () => {
    const l = recordLimits({ kind: 'inside', nominal: 36.9, unit: 'mm', spec: { type: 'limits', upper: 0.1, lower: 0 } });
    expect([l.upperUm, l.lowerUm, l.bandUm], HAND).toEqual([100, 0, 100]);
    expect(l.label).toBe('+0.1 / 0 mm');
  });

  test('± a tolerance in inches: 1.575 in ± 0.002 in', () => {
    const l = recordLimits({ kind: 'outside', nominal: 1.575, unit: 'in', spec: { type: 'plusMinus', tolerance: 0.002 } });
    expect(l.nominalMm, INCH).toBe(40.005); // 1.575 × 25.4
    expect(l.upperUm, INCH).toBe(50.8); // 0.002 × 25 400
    expect(l.lowerUm, INCH).toBe(-50.8);
    expect(l.label).toBe('±0.002 in');
  });

  test('inch conversions are exact at 25.4 mm', () => {
    expect(toUm(1, 'in'), INCH).toBe(25400);
    expect(toUm(0.0001, 'in'), INCH).toBe(2.54); // a "tenth"
    expect(toUm(0.001, 'in'), INCH).toBe(25.4); // a "thou"
    expect(toUm(1.5745, 'in'), INCH).toBe(39992.3);
  });

  test.each<[RecordSpecInput, string, RegExp]>([
    [zone('outside', 130, 'H7'), 'spec.zone', /hole zone.*outside feature.*h7/],
    [zone('inside', 130, 'k6'), 'spec.zone', /shaft zone.*inside feature.*K6/],
    [zone('outside', 10, 't6'), 'spec.zone', /t only above 24 mm/], // ISO 286-2: t starts above 24 mm — from memory
    [zone('outside', 10, 'q6'), 'spec.zone', /q/],
    [zone('outside', 4000, 'h6'), 'nominal', /3150 mm/], // ISO 286 stops at 3150 mm — from memory
    [zone('outside', -5, 'h6'), 'nominal', /greater than zero/],
    [{ kind: 'outside', nominal: 10, unit: 'mm', spec: { type: 'limits', upper: 0, lower: 0.1 } }, 'spec.upper', /larger than the lower/],
    [{ kind: 'outside', nominal: 10, unit: 'mm', spec: { type: 'plusMinus', tolerance: 0 } }, 'spec.tolerance', /greater than zero/],
  ])('refuses %j on %s', (input, field, message) => {
    const err = refusal(() => recordLimits(input));
    expect(err.field).toBe(field);
    expect(err.message).toMatch(message);
  });
});

describe('judging a reading', () => {
  const k6 = recordLimits(zone('outside', 130, 'k6')); // +28 / +3 µm, ISO 286-2 — from memory

  test.each<[number, 'inside' | 'over' | 'under', number, number, string]>([
    // [reading mm, state, outside by µm, margin µm, source]
    [130.012, 'inside', 0, 9, HAND], // 12 µm over nominal: 9 above the lower limit (+3), 16 below the upper (+28)
    [130.03, 'over', 2, -2, HAND], // 30 µm: 2 µm past +28
    [130.028, 'inside', 0, 0, HAND], // on the upper limit: still inside
    [130.003, 'inside', 0, 0, HAND], // on the lower limit
    [130.002, 'under', 1, -1, HAND],
    [130.4, 'over', 372, -372, HAND],
  ])('%s mm against 130 k6 is %s', (mm, state, by, margin, source) => {
    const j = judgeReading(k6, mm, 'mm');
    expect(j.state, source).toBe(state);
    expect(j.outsideByUm, source).toBe(by);
    expect(j.marginUm, source).toBe(margin);
  });

  test('deviation in µm and thousandths of an inch', () => {
    const j = judgeReading(k6, 130.03, 'mm');
    expect(j.deviationUm, HAND).toBe(30);
    expect(thouText(j.outsideByUm), INCH).toBe('0.08'); // 2 µm / 25.4 = 0.0787 thou
    expect(thouText(j.deviationUm, true), INCH).toBe('+1.18'); // 30 / 25.4 = 1.181
  });

  test('a reading in inches against a metric record', () => {
    // 5.1186 in = 130.01244 mm → +12.44 µm, inside 130 k6
    const j = judgeReading(k6, 5.1186, 'in');
    expect(j.deviationUm, INCH).toBeCloseTo(12.44, 4);
    expect(j.state).toBe('inside');
  });

  test('verdicts are said in words', () => {
    expect(verdictShort({ state: 'over', outsideByUm: 2 }, 'mm')).toBe('Outside by 0.002 mm');
    expect(verdictShort({ state: 'over', outsideByUm: 2 }, 'in')).toBe('Outside by 0.0001 in'); // 2 µm = 0.0000787 in → 0.0001
    expect(verdictShort({ state: 'inside', outsideByUm: 0 }, 'mm')).toBe('Inside');
    expect(judgementSentence(judgeReading(k6, 130.03, 'mm'), 'mm')).toBe('Outside by 0.002 mm (2 µm, 0.08 thou), over the upper limit.');
  });

  test.each<[number, 'mm' | 'in', boolean, string]>([
    [0.001, 'mm', true, TEN_TO_ONE], // 1 µm ≤ 25 / 10
    [0.002, 'mm', true, TEN_TO_ONE], // 2 µm ≤ 2.5
    [0.01, 'mm', false, TEN_TO_ONE], // a caliper's 10 µm is too coarse for a 25 µm band
    [0.0001, 'in', false, `${TEN_TO_ONE}; ${INCH}`], // a tenth is 2.54 µm, just over 2.5
  ])('resolution %s %s for 130 k6 (band 25 µm) fine enough: %s', (res, unit, ok, source) => {
    const r = resolutionCheck(k6, res, unit);
    expect(r.ok, source).toBe(ok);
    expect(r.neededUm).toBe(2.5);
  });

  test('temperature far from 20 °C on a tight band warns, with the rough growth', () => {
    const warm = temperatureCheck(k6, 27)!;
    expect(warm.warn, ISO1).toBe(true);
    expect(warm.growthUm, ISO1).toBeCloseTo(10.01, 2); // 0.130 m × 11 µm/m/°C × 7 °C
    expect(temperatureCheck(k6, 21)!.warn, ISO1).toBe(false);
    expect(temperatureCheck(k6, 14)!.warn, ISO1).toBe(true);
    expect(temperatureCheck(k6, null)).toBeNull();
    const wide = recordLimits({ kind: 'inside', nominal: 16, unit: 'mm', spec: { type: 'general', generalClass: 'm' } });
    expect(temperatureCheck(wide, 30)!.warn, ISO1).toBe(false); // a ±0.2 mm band does not care
  });

  test('a reading nowhere near the nominal is refused on its field', () => {
    expect(() => checkNearNominal(16, 'mm', 17.5, 'mm', 'readings.0.value')).not.toThrow(); // within 10 % + 1 mm = 2.6 mm
    const err = refusal(() => checkNearNominal(130, 'mm', 13.0, 'mm', 'readings.1.value'));
    expect(err.field).toBe('readings.1.value');
    expect(err.message).toMatch(/nowhere near the nominal 130 mm/);
    expect(refusal(() => checkNearNominal(1.575, 'in', 1.575, 'mm', 'value')).field).toBe('value'); // wrong unit: 1.575 mm against 40 mm
  });
});

describe('approach to size', () => {
  const k6 = recordLimits(zone('outside', 130, 'k6'));
  const bore: Limits = recordLimits({ kind: 'inside', nominal: 36.9, unit: 'mm', spec: { type: 'limits', upper: 0.1, lower: 0 } });

  test('spigot at 130.03 mm (pass 3): 2 µm to the upper limit; a 0.05 mm finishing cut would overshoot', () => {
    const a = approachToSize('outside', k6, 30, 0.05, 'mm');
    expect(a.state).toBe('stock-left');
    expect(a.toNearLimitUm, HAND).toBe(2); // 30 − 28
    expect(a.toMiddleUm, HAND).toBe(14.5); // 30 − 15.5 (middle of +3…+28)
    expect(a.cutPerSideToMiddleUm, HAND).toBe(7.25);
    expect(a.afterFinishUm, HAND).toBe(-70); // 130.03 − 2 × 0.05 = 129.93
    expect(a.finishOvershoots, 'common practice: finishing depth 0.05 mm per side').toBe(true);
    expect(a.overshootUm, HAND).toBe(73); // 129.930 is 73 µm under 130.003
  });

  test('from 130.10 mm the usual finishing cut lands 3 µm under', () => {
    const a = approachToSize('outside', k6, 100, 0.05, 'mm');
    expect(a.finishOvershoots).toBe(true);
    expect(a.overshootUm, HAND).toBe(3); // 130.000 against 130.003
  });

  test('the plate bore at 36.86 mm: 0.04 mm to open up; a finishing cut stays inside', () => {
    const a = approachToSize('inside', bore, -40, 0.05, 'mm');
    expect(a.state).toBe('stock-left');
    expect(a.toNearLimitUm, HAND).toBe(40);
    expect(a.toMiddleUm, HAND).toBe(90);
    expect(a.cutPerSideToNearLimitUm, HAND).toBe(20);
    expect(a.afterFinishUm, HAND).toBe(60); // 36.86 + 0.1 = 36.96
    expect(a.finishOvershoots).toBe(false);
  });

  test('in size and past the limit', () => {
    expect(approachToSize('outside', k6, 12, 0.05, 'mm').state).toBe('in-size');
    expect(approachToSize('outside', k6, -10, 0.05, 'mm').state).toBe('past-limit');
    expect(approachToSize('inside', bore, 120, 0.05, 'mm').state).toBe('past-limit');
  });

  test('a whole record pass by pass', () => {
    const r = analyseRecord({
      ...zone('outside', 130, 'k6'),
      readings: [
        { value: 130.4, unit: 'mm', resolution: 0.01, pass: 1 },
        { value: 130.1, unit: 'mm', resolution: 0.001, pass: 2, temperatureC: 27 },
        { value: 130.03, unit: 'mm', resolution: 0.001, pass: 3 },
        { value: 130.012, unit: 'mm', resolution: 0.001, pass: 4, temperatureC: 21 },
      ],
    });
    expect(r.verdict.state).toBe('inside');
    expect(r.verdict.outsideCount).toBe(3);
    expect(r.byPasses).toBe(true);
    expect(r.readings.map((x) => x.resolution.ok), TEN_TO_ONE).toEqual([false, true, true, true]);
    expect(r.readings.map((x) => x.temperature?.warn ?? null), ISO1).toEqual([null, true, null, false]);
    expect(r.approach?.state).toBe('in-size');
  });
});

describe('pairs', () => {
  const hole = recordLimits(zone('inside', 130, 'H7'));
  const shaft = recordLimits(zone('outside', 130, 'k6'));

  test('130 H7/k6: transition, clearance +37 µm to interference 28 µm', () => {
    const p = analysePair({ kind: 'inside', limits: hole, latestSizeUm: 130015 }, { kind: 'outside', limits: shaft, latestSizeUm: 130012 });
    expect(p.kind, ISO286).toBe('transition');
    expect([p.maxClearanceUm, p.minClearanceUm], `${ISO286}: 40 − 3 and 0 − 28`).toEqual([37, -28]);
    const engine = analyseFit(130, 'H7/k6');
    expect([p.maxClearanceUm, p.minClearanceUm]).toEqual([engine.maxClearanceUm, engine.minClearanceUm]);
    expect(p.fit).toBe('H7/k6');
    expect(p.actualClearanceUm, HAND).toBe(3); // 130.015 − 130.012
    expect(p.actualState).toBe('within');
    expect(clearanceRangeText(p, 'mm')).toBe('from interference 0.028 mm to clearance 0.037 mm');
  });

  test('25 H7/g6 clearance 7 to 41 µm, as the preferred-fits table gives', () => {
    const p = analysePair(
      { kind: 'inside', limits: recordLimits(zone('inside', 25, 'H7')), latestSizeUm: null },
      { kind: 'outside', limits: recordLimits(zone('outside', 25, 'g6')), latestSizeUm: null },
    );
    expect([p.minClearanceUm, p.maxClearanceUm], ANSI_FITS).toEqual([7, 41]);
    expect(p.kind).toBe('clearance');
    expect(p.actualState).toBe('unknown');
  });

  test('made tighter than the specifications allow is flagged', () => {
    const p = analysePair({ kind: 'inside', limits: hole, latestSizeUm: 130000 }, { kind: 'outside', limits: shaft, latestSizeUm: 130030 });
    expect(p.actualClearanceUm, HAND).toBe(-30);
    expect(p.actualState).toBe('too-tight');
    expect(p.outsideByUm, HAND).toBe(2); // −30 against −28
  });

  test('different nominal sizes, or two holes, are refused naming the field', () => {
    const other = recordLimits(zone('outside', 129, 'k6'));
    expect(refusal(() => analysePair({ kind: 'inside', limits: hole, latestSizeUm: null }, { kind: 'outside', limits: other, latestSizeUm: null })).field).toBe('shaftRecordId');
    expect(refusal(() => analysePair({ kind: 'outside', limits: shaft, latestSizeUm: null }, { kind: 'outside', limits: shaft, latestSizeUm: null })).field).toBe('holeRecordId');
  });
});

describe('the form and API schema', () => {
  const good = {
    feature: 'Spigot diameter',
    kind: 'outside',
    nominal: '130',
    unit: 'mm',
    spec: { type: 'zone', zone: 'k6' },
    timeNoteId: '',
    readings: [{ value: '130,012', unit: 'mm', instrument: 'micrometer', resolution: '0.001', measuredBy: '', measuredAt: '', temperatureC: '21', pass: '', note: '' }],
  };
  const issues = (input: unknown) => {
    const r = measurementInputSchema.safeParse(input);
    return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
  };

  test('accepts form text, decimal comma included', () => {
    const r = measurementInputSchema.parse(good);
    expect(r.nominal).toBe(130);
    expect(r.readings[0]!.value).toBe(130.012);
    expect(r.readings[0]!.temperatureC).toBe(21);
    expect(r.readings[0]!.pass).toBeNull();
  });

  test('names every field at fault', () => {
    const bad = issues({ ...good, nominal: '-3', readings: [{ ...good.readings[0], resolution: '0', instrument: 'laser' }, { ...good.readings[0], value: 'abc' }] });
    expect(Object.keys(bad).sort()).toEqual(['nominal', 'readings.0.instrument', 'readings.0.resolution', 'readings.1.value']);
    expect(bad['readings.0.resolution']).toMatch(/cannot be zero/);
    expect(issues({ ...good, spec: { type: 'zone', zone: 'H7' } })['spec.zone']).toMatch(/hole zone/);
    expect(issues({ ...good, readings: [] }).readings).toMatch(/at least one reading/);
    expect(issues({ ...good, readings: [{ ...good.readings[0], value: '13.012' }] })['readings.0.value']).toMatch(/nowhere near/);
  });
});

describe('CSV', () => {
  test('quotes what needs quoting and reads back', () => {
    const text = toCsv([
      ['Feature', 'Note'],
      ['Spigot, Ø130', 'said "firm push"\nno shake'],
      [textCell('=SUM(A1)'), 12.5],
    ]);
    expect(text, RFC4180).toBe('Feature,Note\r\n"Spigot, Ø130","said ""firm push""\nno shake"\r\n\'=SUM(A1),12.5\r\n');
    expect(parseCsv(text), RFC4180).toEqual([
      ['Feature', 'Note'],
      ['Spigot, Ø130', 'said "firm push"\nno shake'],
      ["'=SUM(A1)", '12.5'],
    ]);
  });

  test('values keep the decimals the instrument reads', () => {
    expect(asEntered(130.4, 0.01)).toBe('130.40');
    expect(asEntered(1.5745, 0.0001)).toBe('1.5745');
    expect(asEntered(16, 0.01)).toBe('16.00');
  });
});
