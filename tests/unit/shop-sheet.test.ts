// The shop sheet's sizes in both units and its choice of instrument, against published tables and
// hand conversion (each row names where its numbers come from).
import { describe, expect, test } from 'vitest';
import { recordLimits, type RecordSpecInput } from '@/lib/measurements';
import { instrumentFor, sheetLimits } from '@/lib/measurements/shop-sheet';

const ISO286 = 'ISO 286-2:2010 limit deviation tables — from memory';
const ISO2768 = 'ISO 2768-1:1989 table 1 — from memory';
const INWARD = 'IEEE/ASTM SI 10, converted limits rounded inward — from memory; 1 in = 25.4 mm exactly, worked by hand';
const TEN_TO_ONE = 'common practice: resolve a tenth of the band; caliper 0.01 mm / 0.001 in, micrometer 0.001 mm / 0.0001 in';

const mm = (kind: 'outside' | 'inside', nominal: number, zone: string): RecordSpecInput => ({ kind, nominal, unit: 'mm', spec: { type: 'zone', zone } });

describe('sizes to hit, in both units', () => {
  test.each([
    // 130 k6: +3 / +28 µm (ISO 286-2, over 120 up to 180 mm); 130.003 / 25.4 = 5.118228…, 130.028 / 25.4 = 5.119212…
    { source: `${ISO286}; ${INWARD}`, spec: mm('outside', 130, 'k6'), own: ['130.003', '130.028', '+0.003', '+0.028'], other: ['5.1183', '5.1192'] },
    // 130 H7: 0 / +40 µm; 130 / 25.4 = 5.118110…, 130.040 / 25.4 = 5.119685…
    { source: `${ISO286}; ${INWARD}`, spec: mm('inside', 130, 'H7'), own: ['130.000', '130.040', '0.000', '+0.040'], other: ['5.1182', '5.1196'] },
    // 25 g6: −7 / −20 µm (over 18 up to 30 mm); 24.980 / 25.4 = 0.983464…, 24.993 / 25.4 = 0.983976…
    { source: `${ISO286}; ${INWARD}`, spec: mm('outside', 25, 'g6'), own: ['24.980', '24.993', '-0.020', '-0.007'], other: ['0.9835', '0.9839'] },
    // 1.575 in ± 0.002 in → 39.9542 … 40.0558 mm, rounded inward to 39.955 … 40.055 mm.
    { source: INWARD, spec: { kind: 'outside', nominal: 1.575, unit: 'in', spec: { type: 'plusMinus', tolerance: 0.002 } } as RecordSpecInput, own: ['1.5730', '1.5770', '-0.0020', '+0.0020'], other: ['39.955', '40.055'] },
    // 16 mm ISO 2768-m: ±0.2 mm (over 6 up to 30 mm); 15.8 / 25.4 = 0.622047…, 16.2 / 25.4 = 0.637795…
    { source: `${ISO2768}; ${INWARD}`, spec: { kind: 'inside', nominal: 16, unit: 'mm', spec: { type: 'general', generalClass: 'm' } } as RecordSpecInput, own: ['15.800', '16.200', '-0.200', '+0.200'], other: ['0.6221', '0.6377'] },
  ])('$spec.nominal $spec.unit: $own.0 … $own.1 ($source)', ({ spec, own, other }) => {
    const [a, b] = sheetLimits(recordLimits(spec), spec.unit);
    expect(a.unit).toBe(spec.unit);
    expect([a.min, a.max, a.lower, a.upper]).toEqual(own);
    expect(a.exact).toBe(true);
    expect([b.min, b.max]).toEqual(other);
    expect(b.exact).toBe(false);
  });

  test('a converted size that falls on the step is written exactly (25.4 mm = 1 in; worked by hand)', () => {
    const limits = recordLimits({ kind: 'outside', nominal: 25.4, unit: 'mm', spec: { type: 'limits', upper: 0.0254, lower: -0.0254 } });
    const [, inch] = sheetLimits(limits, 'mm');
    expect([inch.min, inch.max, inch.exact]).toEqual(['0.9990', '1.0010', true]);
  });

  test('converted limits never lie outside the original ones (property over many zones; worked by hand)', () => {
    for (const nominal of [3, 6.5, 12, 25, 40, 63, 100, 130, 250, 400]) {
      for (const z of ['h6', 'k6', 'g6', 'js7', 'H7', 'F8', 'P7']) {
        const kind = z === z.toUpperCase() ? 'inside' : 'outside';
        const limits = recordLimits(mm(kind, nominal, z));
        const [, inch] = sheetLimits(limits, 'mm');
        const minUm = Number(inch.min) * 25_400;
        const maxUm = Number(inch.max) * 25_400;
        expect(minUm, `${nominal} ${z}`).toBeGreaterThanOrEqual(limits.nominalUm + limits.lowerUm - 1e-6);
        expect(maxUm, `${nominal} ${z}`).toBeLessThanOrEqual(limits.nominalUm + limits.upperUm + 1e-6);
      }
    }
  });
});

describe('the instrument to use', () => {
  test.each([
    { what: '130 k6, band 25 µm → a tenth is 2.5 µm', spec: mm('outside', 130, 'k6'), instrument: 'micrometer', text: '0.001 mm', meets: true },
    { what: '130 H7, band 40 µm → 4 µm, inside', spec: mm('inside', 130, 'H7'), instrument: 'bore-gauge', text: '0.001 mm', meets: true },
    { what: '36.9 +0.1/0 mm, band 100 µm → 10 µm', spec: { kind: 'inside', nominal: 36.9, unit: 'mm', spec: { type: 'limits', upper: 0.1, lower: 0 } } as RecordSpecInput, instrument: 'caliper', text: '0.01 mm', meets: true },
    { what: '1.575 ± 0.002 in, band 0.004 in → 0.0004 in, finer than a caliper', spec: { kind: 'outside', nominal: 1.575, unit: 'in', spec: { type: 'plusMinus', tolerance: 0.002 } } as RecordSpecInput, instrument: 'micrometer', text: '0.0001 in', meets: true },
    { what: '1 in ± 0.005 in, band 0.010 in → 0.001 in, a caliper will do', spec: { kind: 'outside', nominal: 1, unit: 'in', spec: { type: 'plusMinus', tolerance: 0.005 } } as RecordSpecInput, instrument: 'caliper', text: '0.001 in', meets: true },
    // 10 h3: IT3 = 2.5 µm over 6 up to 10 mm (ISO 286-1 Table 1 — from memory) → a tenth is 0.25 µm.
    { what: '10 h3, band 2.5 µm: finer than a micrometer reads', spec: mm('outside', 10, 'h3'), instrument: 'micrometer', text: '0.001 mm', meets: false },
  ])('$what ($instrument; ' + TEN_TO_ONE + ')', ({ spec, instrument, text, meets }) => {
    const advice = instrumentFor(recordLimits(spec), spec.kind, spec.unit);
    expect(advice.instrument).toBe(instrument);
    expect(advice.resolutionText).toBe(text);
    expect(advice.meetsRule).toBe(meets);
  });
});
