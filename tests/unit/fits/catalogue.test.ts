import { describe, expect, test } from 'vitest';
import {
  analyseFit, GRADES, HOLE_LETTERS, IT_GRADES, PREFERRED_HOLE_BASIS_FITS, SHAFT_LETTERS, toleranceZone,
} from '../../../lib/fits/index';

const SYMBOLS = 'ISO 286-1:2010, fundamental deviation letters and standard tolerance grades — from memory';
const PREFERRED = 'ISO 286-1:2010 preferred fits / ANSI B4.2-1978 preferred hole-basis metric fits — from memory';

describe('letters and grades', () => {
  test('28 letters each way, in the standard\'s order', () => {
    // ISO 286-1:2010 — from memory
    expect(HOLE_LETTERS).toEqual(['A', 'B', 'C', 'CD', 'D', 'E', 'EF', 'F', 'FG', 'G', 'H', 'JS', 'J', 'K', 'M', 'N', 'P', 'R', 'S', 'T', 'U', 'V', 'X', 'Y', 'Z', 'ZA', 'ZB', 'ZC']);
    expect(SHAFT_LETTERS).toEqual(HOLE_LETTERS.map((l) => l.toLowerCase()));
    expect(GRADES).toHaveLength(20);
    expect(IT_GRADES[0]).toBe('IT01');
    expect(IT_GRADES[1]).toBe('IT0');
    expect(IT_GRADES[19]).toBe('IT18');
  });

  test.each(SHAFT_LETTERS.map((l) => [l, SYMBOLS] as const))('every shaft letter answers somewhere: %s — %s', (letter) => {
    const size = letter === 'cd' || letter === 'ef' || letter === 'fg' ? 8 : 40;
    const grade = letter === 'j' ? 6 : 7;
    const z = toleranceZone(size, `${letter}${grade}`);
    expect(z.kind).toBe('shaft');
    expect(z.letter).toBe(letter);
  });

  test.each(HOLE_LETTERS.map((l) => [l, SYMBOLS] as const))('every hole letter answers somewhere: %s — %s', (letter) => {
    const size = letter === 'CD' || letter === 'EF' || letter === 'FG' ? 8 : 40;
    const z = toleranceZone(size, `${letter}7`);
    expect(z.kind).toBe('hole');
    expect(z.letter).toBe(letter);
  });

  test.each(GRADES.map((g) => [g, SYMBOLS] as const))('every grade answers on h and H at 100 mm: %s — %s', (grade) => {
    expect(toleranceZone(100, `h${grade}`).grade).toBe(`IT${grade}`);
    expect(toleranceZone(100, `H${grade}`).lowerUm).toBe(0);
  });
});

describe('preferred hole-basis fits', () => {
  test('the ten preferred fits, loosest first', () => {
    expect(PREFERRED_HOLE_BASIS_FITS.map((f) => f.fit)).toEqual([
      'H11/c11', 'H9/d9', 'H8/f7', 'H7/g6', 'H7/h6', 'H7/k6', 'H7/n6', 'H7/p6', 'H7/s6', 'H7/u6',
    ]);
  });

  test.each(PREFERRED_HOLE_BASIS_FITS.map((f) => [f.fit, f.family, PREFERRED] as const))('%s (%s) reads and is described — %s', (fit) => {
    const entry = PREFERRED_HOLE_BASIS_FITS.find((f) => f.fit === fit)!;
    expect(`${entry.hole}/${entry.shaft}`).toBe(fit);
    expect(entry.use.length).toBeGreaterThan(30);
    expect(analyseFit(25, fit).fit).toBe(fit);
  });

  test('families follow the kind of fit at 25 mm', () => {
    // ANSI B4.2-1978 — from memory: c11…g6 clearance, h6 clearance with zero minimum,
    // k6 and n6 transition, p6…u6 interference at 25 mm
    for (const f of PREFERRED_HOLE_BASIS_FITS) {
      const kind = analyseFit(25, f.fit).kind;
      if (f.family === 'running' || f.family === 'sliding') expect(kind).toBe('clearance');
      if (f.family === 'press') expect(kind).toBe('interference');
    }
  });
});
