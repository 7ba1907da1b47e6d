import { describe, expect, test } from 'vitest';
import { NextRequest } from 'next/server';
import { GET } from '@/app/api/fits/route';
import { parseDesignation } from '../../../lib/fits/index';

// No session cookie is sent, so the route wrapper never touches the database.
process.env.NEXTAUTH_SECRET ??= 'integration-test-secret-0123456789';

const RC4 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Running and Sliding Fits, RC4 over 1.19 to 1.97 in: 1.0 / 3.6, hole +1.6 / 0, shaft −1.0 / −2.0 — from memory";
const FN2 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Force and Shrink Fits, FN2 over 0.71 to 0.95 in: 0.6 / 1.9, hole +0.8 / 0, shaft +1.9 / +1.4 — from memory";
const INCH = 'international inch: 1 in = 25.4 mm exactly; a thou is 0.0254 mm; divided by hand';

async function get(query: string) {
  const res = await GET(new NextRequest(`http://127.0.0.1/api/fits?${query}`), { params: Promise.resolve({}) });
  return { status: res.status, body: await res.json() };
}

describe('reading an inch class', () => {
  test.each([
    ['1.5 RC4', 1.5, 'RC4'],
    ['1-1/2 in RC4', 1.5, 'RC4'],
    ['1.500" rc 4', 1.5, 'RC4'],
    ['Ø0.75 FN2', 0.75, 'FN2'],
  ])('%s', (text, inches, cls) => {
    const d = parseDesignation(text);
    expect(d.unit).toBe('in');
    expect(d.nominalInput).toBe(inches);
    expect(d.inchClass).toBe(cls);
  });

  test('an inch class with a size in millimetres is refused, naming the remedy', () => {
    expect(() => parseDesignation('25 mm RC4')).toThrow(/inch class .*inches/);
  });
});

describe('GET /api/fits with an inch class', () => {
  test(`q=1.5 RC4 — ${RC4}; ${INCH}`, async () => {
    const { status, body } = await get(`q=${encodeURIComponent('1.5 RC4')}`);
    expect(status).toBe(200);
    expect(body.input).toMatchObject({ size: '1.5', unit: 'in', fit: 'RC4', nominal: { mm: 38.1, in: 1.5 } });
    const f = body.inchFit;
    expect(f).toMatchObject({ fitClass: 'RC4', family: 'RC', kind: 'clearance' });
    expect(f.hole.upperDeviation).toEqual({ thou: 1.6, in: 0.0016, mm: 0.04064 }); // 1.6 × 0.0254 = 0.04064 mm (INCH)
    expect(f.shaft.upperDeviation).toEqual({ thou: -1, in: -0.001, mm: -0.0254 }); // 0.0254 mm (INCH)
    expect(f.shaft.lowerDeviation).toEqual({ thou: -2, in: -0.002, mm: -0.0508 }); // 0.0508 mm (INCH)
    expect(f.maxClearance.thou).toBe(3.6);
    expect(f.minClearance.thou).toBe(1);
    expect(f.hole.maxSize).toEqual({ in: 1.5016, mm: 38.14064 }); // 38.1 + 0.04064 (INCH)
    expect(f.shaft.minSize).toEqual({ in: 1.498, mm: 38.0492 }); // 38.1 − 0.0508 (INCH)
    expect(f.isoNearest).toMatchObject({ fit: 'H8/f7', approximate: true, kind: 'clearance' });
  });

  test(`size=0.75&fit=FN2, no unit: inches — ${FN2}`, async () => {
    const { status, body } = await get('size=0.75&fit=FN2');
    expect(status).toBe(200);
    expect(body.inchFit.kind).toBe('interference');
    expect(body.inchFit.minClearance.thou).toBe(-1.9);
    expect(body.inchFit.maxClearance.thou).toBe(-0.6);
  });

  test('RC and LC go past ISO 286\u2019s 3150 mm, to 200 in (ANSI B4.1-1967 (R2009) table extents — from memory)', async () => {
    const { status, body } = await get('size=150&fit=RC1');
    expect(status).toBe(200);
    expect(body.inchFit.step.text).toBe('over 131.9 to 171.9 in');
  });

  test.each([
    ['size=1&fit=RC10', 'fit', /RC1 to RC9/],
    ['size=20&fit=LT1', 'size', /19\.69 in/],
    ['size=0.5&fit=FN3', 'size', /begins over 0\.95 in/],
    ['size=1.5&fit=RC4&unit=mm', 'unit', /inches/],
    [`q=${encodeURIComponent('201 RC4')}`, 'q', /200 in/],
    [`q=${encodeURIComponent('25 mm LC2')}`, 'q', /inch class/],
  ])('%s is a 400 naming %s', async (query, field, message) => {
    const { status, body } = await get(query);
    expect(status).toBe(400);
    expect(body.fieldErrors[field]?.[0]).toMatch(message);
  });
});
