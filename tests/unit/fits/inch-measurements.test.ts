/**
 * A measurement record specified by an ANSI B4.1 inch class: the hole side for an inside feature,
 * the shaft side for an outside one; verdicts, margins, approach to size and pairs as with ISO 286.
 */
import { describe, expect, test } from 'vitest';
import {
  analysePair, analyseRecord, isMeasurementError, judgeReading, recordLimits, type RecordSpecInput,
} from '../../../lib/measurements/index';
import { measurementInputSchema } from '../../../lib/validations/measurements';

const RC4 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Running and Sliding Fits, RC4 over 1.19 to 1.97 in: hole +1.6 / 0, shaft −1.0 / −2.0 thou, clearance 1.0 / 3.6 — from memory";
const FN2 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Force and Shrink Fits, FN2 over 0.71 to 0.95 in: hole +0.8 / 0, shaft +1.9 / +1.4 thou — from memory";
const INCH = '1 thou = 25.4 µm exactly (international inch); sums by hand';

const hole: RecordSpecInput = { kind: 'inside', nominal: 1.5, unit: 'in', spec: { type: 'inchClass', fitClass: 'RC4' } };
const shaft: RecordSpecInput = { kind: 'outside', nominal: 1.5, unit: 'in', spec: { type: 'inchClass', fitClass: 'rc4' } };
const um = (n: number) => Math.round(n * 1000) / 1000;

describe('limits from an inch class', () => {
  test(`inside 1.500 in RC4 is the hole: +40.64 / 0 µm — ${RC4}; ${INCH}`, () => {
    const l = recordLimits(hole);
    expect(um(l.upperUm)).toBe(40.64);
    expect(l.lowerUm).toBe(0);
    expect(l.label).toBe('RC4 hole');
    expect(l.inchClass).toBe('RC4');
    expect(l.source).toMatch(/ANSI B4\.1 RC4, hole, over 1\.19 to 1\.97 in: \+1\.6 \/ 0 thou/);
  });

  test(`outside 1.500 in RC4 is the shaft: −25.4 / −50.8 µm — ${RC4}; ${INCH}`, () => {
    const l = recordLimits(shaft);
    expect(um(l.upperUm)).toBe(-25.4);
    expect(um(l.lowerUm)).toBe(-50.8);
    expect(l.label).toBe('RC4 shaft');
  });

  test(`outside 0.875 in FN2 is the shaft: +48.26 / +35.56 µm — ${FN2}; ${INCH}`, () => {
    const l = recordLimits({ kind: 'outside', nominal: 0.875, unit: 'in', spec: { type: 'inchClass', fitClass: 'FN2' } });
    expect(um(l.upperUm)).toBe(48.26);
    expect(um(l.lowerUm)).toBe(35.56);
  });
});

describe('verdicts, margins and approach', () => {
  test(`a shaft read at 1.4985 in is inside, 0.5 thou from each limit — ${RC4}`, () => {
    const j = judgeReading(recordLimits(shaft), 1.4985, 'in');
    expect(j.state).toBe('inside');
    expect(um(j.marginUm)).toBe(12.7); // 0.5 thou
  });

  test(`a shaft read at 1.4993 in is over by 0.3 thou and still has stock to come off — ${RC4}`, () => {
    const a = analyseRecord({ ...shaft, readings: [{ value: 1.4993, unit: 'in', resolution: 0.0001 }] });
    expect(a.verdict.state).toBe('over');
    expect(um(a.verdict.outsideByUm)).toBe(7.62); // 0.3 thou
    expect(a.approach?.state).toBe('stock-left');
    expect(um(a.approach!.toNearLimitUm)).toBe(7.62);
  });

  test(`a hole read at 1.4999 in is under (too small) — ${RC4}`, () => {
    const a = analyseRecord({ ...hole, readings: [{ value: 1.4999, unit: 'in', resolution: 0.0001 }] });
    expect(a.verdict.state).toBe('under');
  });
});

describe('pairs', () => {
  test(`the hole and shaft of 1.500 RC4 pair as the fit RC4, clearance 1.0 to 3.6 thou — ${RC4}; ${INCH}`, () => {
    const p = analysePair(
      { kind: 'inside', limits: recordLimits(hole), latestSizeUm: 1.5008 * 25_400 },
      { kind: 'outside', limits: recordLimits(shaft), latestSizeUm: 1.4985 * 25_400 },
    );
    expect(p.fit).toBe('RC4');
    expect(p.kind).toBe('clearance');
    expect(um(p.maxClearanceUm)).toBe(91.44);
    expect(um(p.minClearanceUm)).toBe(25.4);
    expect(p.actualState).toBe('within');
    expect(um(p.actualClearanceUm!)).toBe(58.42); // 2.3 thou
  });
});

describe('refusals name the field', () => {
  const fieldOf = (input: RecordSpecInput) => {
    try {
      recordLimits(input);
    } catch (err) {
      if (isMeasurementError(err)) return err.field;
      throw err;
    }
    return null;
  };
  test.each([
    [{ ...hole, unit: 'mm' as const, nominal: 38.1 }, 'unit'],
    [{ ...hole, spec: { type: 'inchClass' as const, fitClass: 'RC10' } }, 'spec.fitClass'],
    [{ ...hole, spec: { type: 'inchClass' as const, fitClass: 'H7' } }, 'spec.fitClass'],
    [{ ...shaft, nominal: 0.5, spec: { type: 'inchClass' as const, fitClass: 'FN3' } }, 'nominal'], // FN3 begins over 0.95 in — from memory
    [{ ...shaft, nominal: 25, spec: { type: 'inchClass' as const, fitClass: 'LT1' } }, 'nominal'], // LT to 19.69 in — from memory
  ])('%o → %s', (input, field) => {
    expect(fieldOf(input)).toBe(field);
  });

  test('the record schema reports an inch class given with a millimetre nominal on the unit', () => {
    const r = measurementInputSchema.safeParse({
      feature: 'Pilot bore', kind: 'inside', nominal: '38.1', unit: 'mm', spec: { type: 'inchClass', fitClass: 'RC4' }, timeNoteId: null,
      readings: [{ value: '38.12', unit: 'mm', instrument: 'caliper', resolution: '0.01', measuredBy: '', temperatureC: '', pass: '', note: '' }],
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path.join('.'))).toContain('unit');
  });

  test('the record schema takes 1.500 in RC4', () => {
    const r = measurementInputSchema.safeParse({
      feature: 'Pilot bore', kind: 'inside', nominal: '1.500', unit: 'in', spec: { type: 'inchClass', fitClass: 'RC4' }, timeNoteId: null,
      readings: [{ value: '1.5008', unit: 'in', instrument: 'bore-gauge', resolution: '0.0001', measuredBy: '', temperatureC: '', pass: '', note: '' }],
    });
    expect(r.error?.issues ?? []).toEqual([]);
  });
});
