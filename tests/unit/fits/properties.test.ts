import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  analyseFit, FitError, GRADES, HOLE_LETTERS, SHAFT_LETTERS, toleranceZone, type ToleranceZone,
} from '../../../lib/fits/index';

// Sizes to the micrometre over the whole span, with the range ends and the
// points just above them drawn often, since that is where tables go wrong.
const ENDS = [1, 3, 6, 10, 14, 18, 24, 30, 40, 50, 65, 80, 100, 120, 140, 160, 180, 200, 225, 250, 280, 315, 355, 400, 450, 500, 560, 630, 710, 800, 900, 1000, 1120, 1250, 1400, 1600, 1800, 2000, 2240, 2500, 2800, 3150];
const size = fc.oneof(
  fc.integer({ min: 1, max: 3_150_000 }).map((n) => n / 1000),
  fc.constantFrom(...ENDS),
  fc.constantFrom(...ENDS.filter((e) => e < 3150)).map((e) => e + 0.001),
);
const grade = fc.constantFrom(...GRADES);
const letterIndex = fc.integer({ min: 0, max: SHAFT_LETTERS.length - 1 });

/** The zone, or undefined where ISO 286 refuses it (any other error fails the property). */
function zoneOrRefusal(nominal: number, zone: string): ToleranceZone | undefined {
  try {
    return toleranceZone(nominal, zone);
  } catch (error) {
    if (error instanceof FitError) return undefined;
    throw error;
  }
}

/** Compare in 0.01 µm, the finest step in the tables, so binary noise cannot decide. */
const cum = (um: number) => Math.round(um * 100) + 0; // + 0 turns a rounded −0 into 0
/** Negation without producing −0, which toBe (Object.is) tells apart from 0. */
const neg = (n: number) => 0 - n;

describe('properties over random sizes and zones', () => {
  test('upper − lower is the IT value, and upper is above lower', () => {
    fc.assert(
      fc.property(size, letterIndex, grade, fc.boolean(), (d, li, g, hole) => {
        const letter = hole ? HOLE_LETTERS[li] : SHAFT_LETTERS[li];
        const z = zoneOrRefusal(d, `${letter}${g}`);
        if (z === undefined) return;
        expect(cum(z.upperUm - z.lowerUm)).toBe(cum(z.itUm));
        expect(z.upperUm).toBeGreaterThan(z.lowerUm);
        expect(z.upperMm * 1000).toBeCloseTo(z.upperUm, 9);
        expect(z.lowerMm * 1000).toBeCloseTo(z.lowerUm, 9);
      }),
      { numRuns: 3000 },
    );
  });

  test('the IT value of a grade does not depend on the letter', () => {
    fc.assert(
      fc.property(size, letterIndex, grade, (d, li, g) => {
        const z = zoneOrRefusal(d, `${SHAFT_LETTERS[li]}${g}`);
        const h = zoneOrRefusal(d, `h${g}`);
        if (z === undefined || h === undefined) return;
        expect(z.itUm).toBe(h.itUm);
      }),
      { numRuns: 1000 },
    );
  });

  test('IT grows with the grade at a given size', () => {
    fc.assert(
      fc.property(size, fc.integer({ min: 1, max: GRADES.length - 1 }), (d, gi) => {
        const finer = zoneOrRefusal(d, `h${GRADES[gi - 1]}`);
        const coarser = zoneOrRefusal(d, `h${GRADES[gi]}`);
        if (finer === undefined || coarser === undefined) return;
        expect(coarser.itUm).toBeGreaterThan(finer.itUm);
      }),
      { numRuns: 1000 },
    );
  });

  test('h has upper deviation 0, H has lower deviation 0', () => {
    fc.assert(
      fc.property(size, grade, (d, g) => {
        const h = zoneOrRefusal(d, `h${g}`);
        const H = zoneOrRefusal(d, `H${g}`);
        if (h !== undefined) expect(h.upperUm).toBe(0);
        if (H !== undefined) expect(H.lowerUm).toBe(0);
      }),
      { numRuns: 1000 },
    );
  });

  test('A…H mirror a…h: ES = −ei and EI = −es', () => {
    fc.assert(
      fc.property(size, fc.integer({ min: 0, max: 10 }), grade, (d, li, g) => {
        const hole = zoneOrRefusal(d, `${HOLE_LETTERS[li]}${g}`);
        const shaft = zoneOrRefusal(d, `${SHAFT_LETTERS[li]}${g}`);
        expect(hole === undefined).toBe(shaft === undefined);
        if (hole === undefined || shaft === undefined) return;
        expect(cum(hole.upperUm)).toBe(neg(cum(shaft.lowerUm)));
        expect(cum(hole.lowerUm)).toBe(neg(cum(shaft.upperUm)));
      }),
      { numRuns: 2000 },
    );
  });

  test('JS mirrors js and both are centred on the size', () => {
    fc.assert(
      fc.property(size, grade, fc.boolean(), (d, g, roundJs) => {
        let hole: ToleranceZone;
        let shaft: ToleranceZone;
        try {
          hole = toleranceZone(d, `JS${g}`, { roundJs });
          shaft = toleranceZone(d, `js${g}`, { roundJs });
        } catch (error) {
          if (error instanceof FitError) return;
          throw error;
        }
        expect(hole.upperUm).toBe(shaft.upperUm);
        expect(hole.lowerUm).toBe(shaft.lowerUm);
        expect(cum(hole.upperUm)).toBe(neg(cum(hole.lowerUm)));
      }),
      { numRuns: 1000 },
    );
  });

  test('P…ZC: ES = −ei above IT7, ES = −ei + (ITn − ITn−1) up to IT7 between 3 and 500 mm', () => {
    // ISO 286-1:2010 rule for holes P to ZC, Δ = ITn − IT(n−1) — from memory
    const firstP = HOLE_LETTERS.indexOf('P');
    fc.assert(
      fc.property(size, fc.integer({ min: firstP, max: HOLE_LETTERS.length - 1 }), fc.integer({ min: 3, max: 18 }), (d, li, g) => {
        const hole = zoneOrRefusal(d, `${HOLE_LETTERS[li]}${g}`);
        const shaft = zoneOrRefusal(d, `${SHAFT_LETTERS[li]}${g}`);
        expect(hole === undefined).toBe(shaft === undefined);
        if (hole === undefined || shaft === undefined) return;
        const delta = g <= 7 && d > 3 && d <= 500
          ? toleranceZone(d, `h${g}`).itUm - toleranceZone(d, `h${g - 1}`).itUm
          : 0;
        expect(cum(hole.upperUm)).toBe(cum(delta - shaft.lowerUm));
      }),
      { numRuns: 2000 },
    );
  });

  test('N up to IT8 and M up to IT8 take Δ = ITn − ITn−1 between 3 and 500 mm (M6 at 250–315 mm excepted)', () => {
    // ISO 286-1:2010 rule for holes K, M, N — from memory
    fc.assert(
      fc.property(size, fc.constantFrom('M', 'N'), fc.integer({ min: 3, max: 8 }), (d, letter, g) => {
        if (!(d > 3 && d <= 500)) return;
        if (letter === 'M' && g === 6 && d > 250 && d <= 315) return;
        const hole = toleranceZone(d, `${letter}${g}`);
        const shaft = toleranceZone(d, `${letter.toLowerCase()}${g}`);
        const delta = toleranceZone(d, `h${g}`).itUm - toleranceZone(d, `h${g - 1}`).itUm;
        expect(cum(hole.upperUm)).toBe(cum(delta - shaft.lowerUm));
      }),
      { numRuns: 1000 },
    );
  });

  test('every answer is a zone or a FitError, never another error', () => {
    fc.assert(
      fc.property(size, fc.string({ maxLength: 6 }), (d, text) => {
        try {
          toleranceZone(d, text);
        } catch (error) {
          expect(error).toBeInstanceOf(FitError);
        }
      }),
      { numRuns: 1000 },
    );
  });
});

describe('fit properties', () => {
  const holeLetter = fc.constantFrom(...HOLE_LETTERS);
  const shaftLetter = fc.constantFrom(...SHAFT_LETTERS);

  test('clearances follow from the two zones and the kind from their signs', () => {
    fc.assert(
      fc.property(size, holeLetter, grade, shaftLetter, grade, (d, hl, hg, sl, sg) => {
        const fit = `${hl}${hg}/${sl}${sg}`;
        const hole = zoneOrRefusal(d, `${hl}${hg}`);
        const shaft = zoneOrRefusal(d, `${sl}${sg}`);
        if (hole === undefined || shaft === undefined) {
          expect(() => analyseFit(d, fit)).toThrow(FitError);
          return;
        }
        const r = analyseFit(d, fit);
        expect(r.hole).toEqual(hole);
        expect(r.shaft).toEqual(shaft);
        expect(cum(r.maxClearanceUm)).toBe(cum(hole.upperUm - shaft.lowerUm));
        expect(cum(r.minClearanceUm)).toBe(cum(hole.lowerUm - shaft.upperUm));
        expect(r.maxClearanceUm).toBeGreaterThan(r.minClearanceUm);
        if (r.minClearanceUm >= 0) expect(r.kind).toBe('clearance');
        else if (r.maxClearanceUm <= 0) expect(r.kind).toBe('interference');
        else expect(r.kind).toBe('transition');
      }),
      { numRuns: 3000 },
    );
  });

  test('H/h on the same grade is always a clearance fit with zero minimum clearance', () => {
    fc.assert(
      fc.property(size, grade, (d, g) => {
        let r;
        try {
          r = analyseFit(d, `H${g}/h${g}`);
        } catch (error) {
          if (error instanceof FitError) return;
          throw error;
        }
        expect(r.kind).toBe('clearance');
        expect(r.minClearanceUm).toBe(0);
        expect(cum(r.maxClearanceUm)).toBe(cum(2 * r.hole.itUm));
      }),
      { numRuns: 500 },
    );
  });
});
