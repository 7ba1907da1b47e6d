/**
 * The inch tables checked against themselves and against the standard's grade structure, row by
 * row, to catch typing errors: ANSI B4.1-1967 (R2009) builds every class from a basic hole of one
 * grade and a shaft of another, the grades' tolerances taken from its standard tolerances table
 * per size step (as reproduced in Machinery's Handbook, 29th ed. — from memory).
 */
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { FitError, inchFit, inchFitIsoComparison, INCH_CLASS_NAMES } from '../../../lib/fits/index';
import {
  FAMILY_TABLES, FN_STEPS_IN, INCH_CLASSES, INCH_ROWS, MAIN_STEPS_IN, STANDARD_TOLERANCES, gradeInFitTables,
} from '../../../lib/fits/inch-tables';

const h = (n: number) => Math.round(n * 100) + 0; // hundredths of a thou, exact integers

/** The main step (of the standard tolerances) holding a step that ends at `toIn`. */
const mainStepOf = (toIn: number) => MAIN_STEPS_IN.findIndex((end) => toIn <= end);

const ALL_ROWS = Object.entries(INCH_ROWS).flatMap(([name, rows]) => rows.map((row, i) => ({ name, i, row })));

describe('the tables as printed', () => {
  test('every class of the standard has a table, and nothing else does', () => {
    expect(Object.keys(INCH_ROWS).sort()).toEqual([...INCH_CLASS_NAMES].sort());
    expect(INCH_CLASS_NAMES).toHaveLength(34);
  });

  // Extents — from memory: RC and LC 21 steps to 200 in, LT and LN 13 steps to 19.69 in, FN 25 finer steps to 19.69 in.
  test.each(Object.keys(INCH_ROWS))('%s has one row per step of its table', (name) => {
    const info = INCH_CLASSES[name]!;
    const steps = FAMILY_TABLES[info.family].steps;
    expect(INCH_ROWS[name]).toHaveLength(steps.length);
    expect(steps.at(-1)).toBe(info.family === 'RC' || info.family === 'LC' ? 200 : 19.69);
  });

  test('the empty cells are exactly those the standard leaves empty (LT3, LT4 to 0.24 in; FN3 to 0.95 in)', () => {
    const empty = ALL_ROWS.filter((r) => r.row === null).map((r) => `${r.name}@${FAMILY_TABLES[INCH_CLASSES[r.name]!.family].steps[r.i]}`);
    expect(empty.sort()).toEqual(
      ['LT3@0.12', 'LT3@0.24', 'LT4@0.12', 'LT4@0.24', 'FN3@0.12', 'FN3@0.24', 'FN3@0.4', 'FN3@0.56', 'FN3@0.71', 'FN3@0.95'].sort(),
    );
  });

  test('size steps rise, and the FN steps split the main steps without crossing them', () => {
    for (const steps of [MAIN_STEPS_IN, FN_STEPS_IN]) for (let i = 1; i < steps.length; i++) expect(steps[i]!).toBeGreaterThan(steps[i - 1]!);
    for (const end of MAIN_STEPS_IN.slice(0, 13)) expect(FN_STEPS_IN).toContain(end);
  });

  test.each(ALL_ROWS.filter((r) => r.row !== null).map((r) => [r.name, r.i, r.row!] as const))(
    '%s step %i: the clearance columns equal the hole and shaft limits combined',
    (name, _i, [a, b, holeUpper, shaftUpper, shaftLower]) => {
      const family = INCH_CLASSES[name]!.family;
      const maxClearance = holeUpper - shaftLower; // hole upper − shaft lower (hole lower is 0)
      const minClearance = 0 - shaftUpper; // hole lower − shaft upper
      if (family === 'RC' || family === 'LC') {
        expect([h(a), h(b)]).toEqual([h(minClearance), h(maxClearance)]);
      } else if (family === 'LT') {
        expect([h(a), h(b)]).toEqual([h(minClearance), h(maxClearance)]);
      } else {
        expect([h(a), h(b)]).toEqual([h(-maxClearance), h(-minClearance)]);
      }
    },
  );

  // Cells where the printed table departs from the grade structure; the standard's tables are the authority,
  // so these are kept as printed (Machinery's Handbook, ANSI B4.1 tables — from memory).
  const PRINTED_EXCEPTIONS = new Set(['RC9:1', 'LN1:3', 'LN1:4', 'LN1:5', 'FN1:22']);

  test.each(ALL_ROWS.filter((r) => r.row !== null && !PRINTED_EXCEPTIONS.has(`${r.name}:${r.i}`)).map((r) => [r.name, r.i, r.row!] as const))(
    '%s step %i: hole and shaft tolerances follow the class grades',
    (name, i, [, , holeUpper, shaftUpper, shaftLower]) => {
      const info = INCH_CLASSES[name]!;
      const toIn = FAMILY_TABLES[info.family].steps[i]!;
      const main = mainStepOf(toIn);
      expect(h(holeUpper)).toBe(h(gradeInFitTables(info.holeGrade, main)));
      const band = h(shaftUpper - shaftLower);
      const grade = h(gradeInFitTables(info.shaftGrade, main));
      if (info.symmetricShaft) {
        // LT1, LT2: limits symmetric about the basic size; where half the grade tolerance falls
        // between the table's digits the printed half-band is the next lower one (0.35 → 0.3) — from memory.
        expect(h(shaftUpper)).toBe(h(-shaftLower));
        expect(band).toBeLessThanOrEqual(grade);
        expect(band).toBeGreaterThanOrEqual(grade - 20);
      } else {
        expect(band).toBe(grade);
      }
    },
  );

  test('clearance fits: the allowance never shrinks with size; interference fits: the interference never shrinks either', () => {
    for (const [name, rows] of Object.entries(INCH_ROWS)) {
      const family = INCH_CLASSES[name]!.family;
      const filled = rows.filter((r): r is NonNullable<typeof r> => r !== null);
      for (let i = 1; i < filled.length; i++) {
        if (family === 'RC' || family === 'LC') expect(filled[i]![0], `${name} step ${i}`).toBeGreaterThanOrEqual(filled[i - 1]![0]);
        if (family === 'LN' || family === 'FN') expect(filled[i]![1], `${name} step ${i}`).toBeGreaterThanOrEqual(filled[i - 1]![1]);
      }
    }
  });

  test('standard tolerances: each grade grows with size, and each step grows with grade', () => {
    const grades = Object.keys(STANDARD_TOLERANCES).map(Number);
    for (const g of grades) {
      const row = STANDARD_TOLERANCES[g]!;
      expect(row).toHaveLength(MAIN_STEPS_IN.length);
      for (let i = 1; i < row.length; i++) expect(row[i]!).toBeGreaterThanOrEqual(row[i - 1]!);
    }
    for (let i = 0; i < MAIN_STEPS_IN.length; i++) {
      for (let k = 1; k < grades.length; k++) expect(STANDARD_TOLERANCES[grades[k]!]![i]!).toBeGreaterThan(STANDARD_TOLERANCES[grades[k - 1]!]![i]!);
    }
  });
});

// Sizes over every table, with the step ends and the points just past them drawn often.
const ENDS = [...new Set([...MAIN_STEPS_IN, ...FN_STEPS_IN])];
const size = fc.oneof(
  fc.integer({ min: 1, max: 2_000_000 }).map((n) => n / 10_000),
  fc.constantFrom(...ENDS),
  fc.constantFrom(...ENDS).map((e) => e + 0.0001),
);
const fitClass = fc.constantFrom(...INCH_CLASS_NAMES);

describe('properties over random sizes and classes', () => {
  test('hole and shaft limits always give the stated clearance limits, and the kind follows from them', () => {
    fc.assert(
      fc.property(size, fitClass, (d, c) => {
        let f;
        try {
          f = inchFit(d, c);
        } catch (err) {
          if (err instanceof FitError) return; // outside the class's table, or an empty cell
          throw err;
        }
        expect(h(f.maxClearanceThou)).toBe(h(f.hole.upperThou - f.shaft.lowerThou));
        expect(h(f.minClearanceThou)).toBe(h(f.hole.lowerThou - f.shaft.upperThou));
        expect(f.hole.upperThou).toBeGreaterThan(f.hole.lowerThou);
        expect(f.shaft.upperThou).toBeGreaterThan(f.shaft.lowerThou);
        expect(f.step.overIn < d && d <= f.step.toIn).toBe(true);
        const kind = f.minClearanceThou >= 0 ? 'clearance' : f.maxClearanceThou <= 0 ? 'interference' : 'transition';
        expect(f.kind).toBe(kind);
        // 0.0254 mm to the thou, exactly
        expect(f.mm.maxClearanceMm).toBeCloseTo(f.maxClearanceThou * 0.0254, 9);
        expect(f.mm.shaft.lowerMm).toBeCloseTo(f.shaft.lowerThou * 0.0254, 9);
      }),
      { numRuns: 3000 },
    );
  });

  test('a size is refused exactly where its class table has no row', () => {
    fc.assert(
      fc.property(size, fitClass, (d, c) => {
        const info = INCH_CLASSES[c]!;
        const steps = FAMILY_TABLES[info.family].steps;
        const i = steps.findIndex((end) => d <= end);
        const defined = i >= 0 && INCH_ROWS[c]![i] !== null;
        let answered = true;
        try {
          inchFit(d, c);
        } catch (err) {
          if (!(err instanceof FitError)) throw err;
          answered = false;
        }
        expect(answered).toBe(defined);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('the nearest ISO 286 fit, for comparison', () => {
  // Cross-check against the ISO 286 engine (ISO 286-2:2010 tables): the fit named as nearest in
  // spirit is of the same kind at 1 in, and is labelled approximate.
  test.each(INCH_CLASS_NAMES.map((c) => [c]))('%s', (c) => {
    const f = inchFit(c === 'FN3' ? 1.5 : 1, c);
    expect(f.isoNearest.approximate).toBe(true);
    const cmp = inchFitIsoComparison(f);
    expect(cmp.fit).toMatch(/^H\d+\//);
    expect(cmp.analysis?.kind).toBe(f.kind);
  });
});
