import { describe, expect, test } from 'vitest';
import { CALCULATOR_KINDS, runCalculator, type CalculatorKind } from '@/lib/calculators';
import { calculatorHref } from '@/lib/calculators/pages/registry';
import type { CalcRequest } from '@/lib/calculators/pages/url-state';
import { CALCULATOR_NAMES, CALCULATOR_PAGES, calculatorPageBySlug, defaultLabel } from '@/lib/calculators/pages/registry';
import { BOX_NUMBER } from '@/lib/calculators/pages/numbers';
import { readDrill } from '@/lib/calculators/pages/drill-box';
import { parseNumber } from '@/lib/units/parse';
import { inputFromQuery } from '@/lib/validations/calculations';

/** What the page at a saved result's reopen link asks the calculator for. */
function reopened(kind: CalculatorKind, input: Record<string, unknown>): CalcRequest | null {
  const href = calculatorHref(kind, input as never, runCalculator(kind, input as never));
  const [path, q = ''] = href.split('?');
  const page = calculatorPageBySlug(path.replace(/^\/calculators\//, ''));
  if (!page) throw new Error(`no page for ${href}`);
  return page.requests(page.fromSearch(new URLSearchParams(q))).find((r) => r.kind === kind) ?? null;
}

describe('a saved result reopens the calculator with the same inputs', () => {
  test.each<[CalculatorKind, Record<string, unknown>]>([
    ['tap-drill', { designation: 'M8x1.25', targetPercent: 75 }],
    ['tap-drill', { designation: '1/4-20', targetPercent: 70, kinds: ['fractional', 'number', 'letter'] }],
    ['thread-percent', { designation: 'M8x1.25', drillDiameterMm: 6.8 }],
    ['thread-percent', { designation: '1/4-20', drillDiameterMm: 5.1054 }],
    ['clearance-hole', { size: 'M8', fit: 'normal' }],
    ['counterbore', { size: 'M8', fit: 'close', holeCentreToEdgeMm: 18, holeSpacingMm: 40 }],
    ['drill-size', { name: '27/64' }],
    ['nearest-drills', { diameterMm: 6.78, count: 8, side: 'above' }],
    ['bolt-circle', { diameterMm: 124, holes: 3, startAngleDeg: 90 }],
    ['bolt-circle', { diameterMm: 101.6, holes: 5, startAngleDeg: 0, midway: true }],
    ['simple-indexing', { divisions: 36, ratio: 40 }],
    ['simple-indexing', { divisions: 7, ratio: 40, circles: [21, 23, 27] }],
    ['direct-indexing', { divisions: 6, plateHoles: 24 }],
    ['spur-gear', { teeth: 36, module: 1.5, pressureAngleDeg: 20 }],
    ['spur-gear', { teeth: 40, diametralPitch: 16, pressureAngleDeg: 14.5 }],
    ['spindle-speed', { cuttingSpeed: 30, unit: 'm/min', diameterMm: 8 }],
    ['speed-range', { material: 'cast-iron', tool: 'hss', diameterMm: 130 }],
  ])('%s %j', (kind, input) => {
    const request = reopened(kind, input)!;
    expect(request.kind).toBe(kind);
    // Same result from the reopened page as from the stored input (defaults may be written out or left implicit).
    expect(runCalculator(request.kind, request.input as never)).toEqual(runCalculator(kind, input as never));
  });
});

describe('reading what is typed', () => {
  test.each([
    ['6.8', 6.8], ['6,8', 6.8], ['4-1/2', 4.5], ['4 1/2', 4.5], ['17/64', 17 / 64], ['', undefined], ['  ', undefined],
  ])('parseNumber(%j, BOX_NUMBER) → %j', (text, value) => expect(parseNumber(text, BOX_NUMBER)).toBe(value));

  test('parseNumber refuses what is not a number', () => {
    expect(parseNumber('abc', BOX_NUMBER)).toBeNaN();
    expect(parseNumber('1/0', BOX_NUMBER)).toBeNaN();
  });

  test('a drill you have: by name, or a size with its unit — ASME B94.11M, #7 = 0.2010 in (from memory)', () => {
    expect(readDrill('#7').diameterMm).toBeCloseTo(0.201 * 25.4, 9);
    expect(readDrill('6.75 mm')).toEqual({ diameterMm: 6.75, drill: null });
    expect(readDrill('0.2 in').diameterMm).toBeCloseTo(5.08, 9);
    expect(() => readDrill('7')).toThrow(/#7|7 mm/);
    expect(() => readDrill('0.201')).toThrow('Give the unit: 0.201 mm or 0.201 in.');
  });

  test('query strings for the JSON route', () => {
    expect(inputFromQuery('bolt-circle', new URLSearchParams('diameterMm=124&holes=3&midway=1'))).toEqual({ diameterMm: 124, holes: 3, midway: true });
    expect(inputFromQuery('tap-drill', new URLSearchParams('designation=1/4-20&kinds=metric'))).toEqual({ designation: '1/4-20', kinds: ['metric'] });
    expect(() => inputFromQuery('simple-indexing', new URLSearchParams('divisions=36&circles=18,x'))).toThrow(/"x" is not a number/);
  });

  test('default labels say what was worked out', () => {
    expect(defaultLabel('tap-drill', { designation: 'm8 x 1.25' }, runCalculator('tap-drill', { designation: 'm8 x 1.25' }))).toBe('Tap drill for M8x1.25');
    expect(defaultLabel('clearance-hole', { size: 'M8', fit: 'normal' })).toBe('Clearance hole for M8 (normal)');
    expect(defaultLabel('simple-indexing', { divisions: 36 })).toBe('Indexing 36 divisions on a 40:1 head');
    expect(defaultLabel('spur-gear', { teeth: 36, module: 1.5 })).toBe('Spur gear blank: 36 teeth, module 1.5');
  });
});

describe('the calculator pages', () => {
  // The addresses published in DEVELOPERS.md and linked from saved results: they never change.
  test('each page keeps its address, in the order of the index', () => {
    expect(CALCULATOR_PAGES.map((c) => c.slug)).toEqual(['tap-drill', 'clearance-holes', 'drills', 'bolt-circle', 'indexing', 'spur-gear', 'speeds']);
  });

  test('every kind of result belongs to exactly one page, and has a name', () => {
    for (const kind of CALCULATOR_KINDS) {
      const pages = CALCULATOR_PAGES.filter((c) => Object.prototype.hasOwnProperty.call(c.kinds, kind)).map((c) => c.slug);
      expect(pages, kind).toHaveLength(1);
      expect(CALCULATOR_NAMES[kind], kind).not.toBe(kind);
    }
  });

  // The query strings of links already shared (the tap-drill one is checked in the browser too).
  test.each([
    ['tap-drill', 'thread=M8x1.25'],
    ['tap-drill', 'thread=1%2F4-20&mode=check&drill=%237'],
    ['clearance-holes', 'size=M8&fit=close&edge=18&spacing=40'],
    ['drills', 'mode=size&d=0.25&unit=in&side=above'],
    ['bolt-circle', 'd=124&holes=3&start=90&midway=1'],
    ['indexing', 'n=7&circles=21%2C+23&plate=36'],
    ['spur-gear', 'teeth=40&by=dp&dp=16&pa=14.5'],
    ['speeds', 'd=130&v=30&vunit=sfm&material=cast-iron&tool=carbide'],
  ])('/calculators/%s?%s reads back to the same query', (slug, q) => {
    const page = calculatorPageBySlug(slug)!;
    expect(page.toQuery(page.fromSearch(new URLSearchParams(q)))).toBe(`?${q}`);
  });

  test('an unknown page is none', () => expect(calculatorPageBySlug('tap-drills')).toBeNull());
});
