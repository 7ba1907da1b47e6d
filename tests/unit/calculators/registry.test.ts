import { describe, expect, test } from 'vitest';
import {
  CALCULATOR_KINDS, CAUTIONS, CalculatorError, clearanceHole, isCalculatorError, runCalculator, SOURCES, TABLES_VERSION, tapDrill,
} from '../../../lib/calculators/index';

describe('running calculators by name', () => {
  test('runCalculator gives what the function gives — issue check: M8 tap drill and ISO 273 clearance (from memory)', () => {
    expect(runCalculator('tap-drill', { designation: 'M8' })).toEqual(tapDrill('M8'));
    expect(runCalculator('clearance-hole', { size: 'M8', fit: 'close' }).diameter.mm).toBe(8.4);
    expect(runCalculator('clearance-hole', { size: 'M8' })).toEqual(clearanceHole('M8', 'normal'));
    expect(runCalculator('simple-indexing', { divisions: 36 }).move?.description).toBe('1 turn and 2 holes on the 18-hole circle');
    expect(runCalculator('spur-gear', { teeth: 36, module: 1.5 }).outsideDiameter.mm).toBe(57);
    expect(runCalculator('bolt-circle', { diameterMm: 100, holes: 3, startAngleDeg: 90 }).holes).toHaveLength(3);
  });

  test('every kind has a runner', () => {
    expect(CALCULATOR_KINDS).toHaveLength(13);
  });

  test('an unknown kind or missing inputs are refused', () => {
    const e1 = (() => { try { runCalculator('sine-bar' as 'tap-drill', { designation: 'M8' }); } catch (e) { return e; } })();
    expect(isCalculatorError(e1) && e1.field).toBe('kind');
    const e2 = (() => { try { runCalculator('tap-drill', null as never); } catch (e) { return e; } })();
    expect(e2).toBeInstanceOf(CalculatorError);
    expect((e2 as CalculatorError).field).toBe('input');
  });

  test('the tables carry a version for saved results', () => {
    expect(TABLES_VERSION).toMatch(/^\d{4}\.\d+$/);
  });

  test('sources say "from memory" or "common practice" where they are', () => {
    for (const [key, text] of Object.entries(SOURCES)) {
      if (key === 'spindleSpeed') continue; // a formula, not a table
      expect(text, key).toMatch(/from memory|common practice/);
    }
  });

  test('every caution defers to the manual, local rules and qualified instruction', () => {
    for (const c of Object.values(CAUTIONS)) {
      expect(c.points.length).toBeGreaterThan(1);
      expect(c.defer).toMatch(/manual/);
      expect(c.defer).toMatch(/local rules/);
      expect(c.defer).toMatch(/qualified instruction/);
    }
    expect(Object.keys(CAUTIONS).sort()).toEqual(['drilling', 'rotatingWork', 'tapping', 'thinWalls']);
  });
});
