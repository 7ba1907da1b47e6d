import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  boltCircle, CalculatorError, DRILL_CHART, DRILL_KINDS, drillSize, drillsOfKinds, listThreads, nearestDrills,
  simpleIndexing, spindleSpeed, spurGear, tapDrill, threadPercent, type DrillKind,
} from '../../../lib/calculators/index';

/** The value, or undefined when the calculator refuses it (any other error fails the property). */
function orRefusal<T>(fn: () => T): T | undefined {
  try {
    return fn();
  } catch (error) {
    if (error instanceof CalculatorError) return undefined;
    throw error;
  }
}

const threads = listThreads().map((t) => t.designation);
const kindSets: DrillKind[][] = [[...DRILL_KINDS], ['fractional', 'number', 'letter'], ['metric'], ['fractional'], ['number', 'letter']];

describe('properties', () => {
  test('every bolt-circle hole lies on the circle, evenly spaced — plane trigonometry', () => {
    fc.assert(fc.property(
      fc.double({ min: 0.1, max: 5000, noNaN: true }),
      fc.integer({ min: 2, max: 360 }),
      fc.double({ min: -360, max: 360, noNaN: true }),
      fc.boolean(),
      (d, n, start, midway) => {
        const r = boltCircle({ diameterMm: d, holes: n, startAngleDeg: start, midway });
        const all = [...r.holes, ...(r.midwayHoles ?? [])];
        for (const h of all) {
          expect(Math.hypot(h.x.mm, h.y.mm)).toBeCloseTo(d / 2, 6);
          expect(h.x.in * 25.4).toBeCloseTo(h.x.mm, 6);
          expect(h.angleDeg).toBeGreaterThanOrEqual(0);
          expect(h.angleDeg).toBeLessThan(360);
        }
        for (let i = 0; i < n; i++) {
          const a = r.holes[i];
          const b = r.holes[(i + 1) % n];
          expect(Math.hypot(a.x.mm - b.x.mm, a.y.mm - b.y.mm)).toBeCloseTo(r.chord.mm, 6);
        }
        // The holes balance about the centre.
        expect(r.holes.reduce((s, h) => s + h.x.mm, 0) / d).toBeCloseTo(0, 6);
        expect(r.holes.reduce((s, h) => s + h.y.mm, 0) / d).toBeCloseTo(0, 6);
      },
    ));
  });

  test('simple indexing: (turns + holes / circle) × divisions = ratio, on every circle offered', () => {
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 1000 }),
      fc.constantFrom(40, 40, 60, 72, 90),
      fc.option(fc.uniqueArray(fc.integer({ min: 2, max: 200 }), { minLength: 1, maxLength: 12 }), { nil: undefined }),
      (n, ratio, circles) => {
        const r = simpleIndexing(n, { ratio, circles });
        expect(r.possible).toBe(r.move !== null);
        for (const m of r.move ? [r.move, ...r.options] : []) {
          const circle = m.circle ?? 1;
          expect(m.holes).toBeLessThan(circle);
          expect((m.wholeTurns * circle + m.holes) * n).toBe(ratio * circle);
          if (m.circle !== null) expect(r.circles).toContain(m.circle);
        }
        if (!r.possible) {
          // No circle offered is a multiple of the fraction's denominator.
          expect(r.circles.some((c) => c % r.turnsPerDivision.denominator === 0)).toBe(false);
        }
      },
    ));
  });

  test("differential set-ups index exactly: ratio/A + (signed gear ratio)/N = ratio/N — Machinery's Handbook, differential indexing, from memory", () => {
    fc.assert(fc.property(fc.integer({ min: 50, max: 400 }), (n) => {
      const r = simpleIndexing(n);
      if (r.possible || !r.differential) return;
      const d = r.differential;
      const a = d.approximateDivisions;
      const sign = d.plateDirection === 'same' ? 1 : -1;
      expect(sign).toBe(Math.sign(a - n));
      // In integers: 40·N·den + sign·num·A·den… scaled by A·N·den.
      expect(40 * n * d.gearRatio.denominator + sign * d.gearRatio.numerator * a).toBe(40 * a * d.gearRatio.denominator);
      const t = d.train;
      const value = t.kind === 'simple' ? t.driver / t.driven : (t.driver1 * t.driver2) / (t.driven1 * t.driven2);
      expect(value).toBeCloseTo(d.gearRatio.value, 12);
      const move = d.index;
      const circle = move.circle ?? 1;
      expect((move.wholeTurns * circle + move.holes) * a).toBe(40 * circle);
    }), { numRuns: 150 });
  });

  test('tapDrill gives the chart drill closest to the target: no drill of those kinds comes nearer', () => {
    fc.assert(fc.property(
      fc.constantFrom(...threads),
      fc.integer({ min: 300, max: 1000 }).map((t) => t / 10),
      fc.constantFrom(...kindSets),
      (thread, target, kinds) => {
        const r = orRefusal(() => tapDrill(thread, target, { kinds }));
        if (!r) return;
        expect(r.choice.percent).toBeGreaterThan(0);
        expect(r.choice.percent).toBeLessThanOrEqual(100);
        expect(kinds).toContain(r.choice.drill.kind);
        const best = Math.abs(r.choice.offTarget);
        for (const d of drillsOfKinds(kinds)) {
          const p = orRefusal(() => threadPercent(thread, d.diameterMm))?.percent;
          if (p === undefined) continue;
          expect(Math.abs(p - target)).toBeGreaterThanOrEqual(best - 0.01);
        }
      },
    ), { numRuns: 200 });
  });

  test('threadPercent and the ideal drill invert each other', () => {
    fc.assert(fc.property(fc.constantFrom(...threads), fc.integer({ min: 300, max: 1000 }).map((t) => t / 10), (thread, target) => {
      const r = tapDrill(thread, target);
      expect(threadPercent(thread, r.idealDrill.mm).percent).toBeCloseTo(target, 9);
    }));
  });

  test('every drill in the chart reads back by its name', () => {
    for (const d of DRILL_CHART) {
      const back = drillSize(d.name);
      expect(back.diameterMm).toBe(d.diameterMm);
      expect(back.kind).toBe(d.kind);
    }
  });

  test('nearestDrills comes back closest first', () => {
    fc.assert(fc.property(fc.double({ min: 0.3, max: 80, noNaN: true }), fc.integer({ min: 1, max: 30 }), (d, count) => {
      const m = nearestDrills(d, { count });
      expect(m).toHaveLength(count);
      for (let i = 1; i < m.length; i++) {
        expect(Math.abs(m[i].difference.mm)).toBeGreaterThanOrEqual(Math.abs(m[i - 1].difference.mm));
      }
    }));
  });

  test('spindle speed is the same in m/min and in sfm', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 1000, noNaN: true }), fc.double({ min: 0.5, max: 1000, noNaN: true }), (v, d) => {
      const metric = spindleSpeed({ cuttingSpeed: v, unit: 'm/min', diameterMm: d });
      const inch = spindleSpeed({ cuttingSpeed: v / 0.3048, unit: 'sfm', diameterMm: d });
      expect(inch.rpm / metric.rpm).toBeCloseTo(1, 9);
      expect((metric.rpm * Math.PI * d) / 1000).toBeCloseTo(v, 6);
    }));
  });

  test('gear blank: outside = pitch + 2 addenda, outside − root = 2 × whole depth', () => {
    fc.assert(fc.property(
      fc.integer({ min: 6, max: 1000 }),
      fc.oneof(
        fc.double({ min: 0.1, max: 20, noNaN: true }).map((module) => ({ module })),
        fc.double({ min: 1, max: 120, noNaN: true }).map((diametralPitch) => ({ diametralPitch })),
      ),
      (teeth, size) => {
        const g = spurGear({ teeth, ...size } as never);
        expect(g.outsideDiameter.mm - g.pitchDiameter.mm).toBeCloseTo(2 * g.addendum.mm, 9);
        expect(g.outsideDiameter.mm - g.rootDiameter.mm).toBeCloseTo(2 * g.wholeDepth.mm, 9);
        expect(g.pitchDiameter.mm).toBeCloseTo(g.module * teeth, 6);
      },
    ));
  });

  test('no calculator answers a wrong number with anything but a CalculatorError', () => {
    const junk = fc.oneof(fc.constant(Number.NaN), fc.constant(Number.POSITIVE_INFINITY), fc.double(), fc.integer(), fc.string(), fc.constant(undefined), fc.constant(null));
    fc.assert(fc.property(junk, junk, (a, b) => {
      const calls: Array<() => unknown> = [
        () => boltCircle({ diameterMm: a as number, holes: b as number }),
        () => simpleIndexing(a as number, { ratio: b as number }),
        () => spurGear({ teeth: a as number, module: b as number }),
        () => spindleSpeed({ cuttingSpeed: a as number, unit: 'm/min', diameterMm: b as number }),
        () => threadPercent('M8', a as number),
        () => tapDrill('M8', a as number),
        () => nearestDrills(a as number, { count: b as number }),
        () => drillSize(a as string),
      ];
      for (const call of calls) orRefusal(call);
    }), { numRuns: 300 });
  });
});
