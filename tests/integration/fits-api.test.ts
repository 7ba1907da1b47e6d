import { describe, expect, test } from 'vitest';
import { NextRequest } from 'next/server';
import { GET } from '@/app/api/fits/route';

// No session cookie is sent, so the route wrapper never touches the database.
process.env.NEXTAUTH_SECRET ??= 'integration-test-secret-0123456789';

const ANSI = 'ANSI B4.2-1978 preferred metric fits, 25 H7/g6 — from memory';
const ANSI_ALL = 'ANSI B4.2-1978 preferred metric hole-basis fits at 25 mm — from memory';
const INCH = 'international inch: 1 in = 25.4 mm exactly; inch figures divided by hand';
const IT7 = 'ISO 286-1:2010 Table 1, IT7 above 18 up to 30 mm = 21 µm — from memory';
const JS_ROUNDING = 'ISO 286-1:2010, JS/js of grades 7–11 with an odd IT may be rounded down to the even value — from memory';
const T_LETTER = 'ISO 286-2:2010, shaft deviation t is tabulated only above 24 mm — from memory';
const RANGE = 'ISO 286-1:2010 covers nominal sizes up to and including 3150 mm';

async function get(query: string) {
  const res = await GET(new NextRequest(`http://127.0.0.1/api/fits?${query}`), { params: Promise.resolve({}) });
  return { status: res.status, body: await res.json() };
}

describe('GET /api/fits — results', () => {
  test(`25 H7/g6: hole +21/0, shaft −7/−20, clearance 41…7 µm — ${ANSI}`, async () => {
    const { status, body } = await get('size=25&fit=H7/g6');
    expect(status).toBe(200);
    expect(body.input).toMatchObject({ size: '25', unit: 'mm', fit: 'H7/g6', roundJs: false, nominal: { mm: 25, in: 0.9843 } });
    const { fit } = body;
    expect(fit.fit).toBe('H7/g6');
    expect(fit.kind).toBe('clearance');
    expect(fit.hole.upperDeviation).toEqual({ um: 21, mm: 0.021, in: 0.0008 }); // ANSI; inch: 0.021 / 25.4 = 0.00083 (INCH)
    expect(fit.hole.lowerDeviation).toEqual({ um: 0, mm: 0, in: 0 }); // ANSI
    expect(fit.shaft.upperDeviation).toEqual({ um: -7, mm: -0.007, in: -0.0003 }); // ANSI; inch by hand (INCH)
    expect(fit.shaft.lowerDeviation).toEqual({ um: -20, mm: -0.02, in: -0.0008 }); // ANSI; inch by hand (INCH)
    expect(fit.maxClearance).toEqual({ um: 41, mm: 0.041, in: 0.0016 }); // ANSI; 0.041 / 25.4 = 0.00161 (INCH)
    expect(fit.minClearance).toEqual({ um: 7, mm: 0.007, in: 0.0003 }); // ANSI; 0.007 / 25.4 = 0.00028 (INCH)
    // Limit sizes: ANSI B4.2 prints hole 25.021 / 25.000 and shaft 24.993 / 24.980 — from memory
    expect(fit.hole.maxSize).toEqual({ mm: 25.021, in: 0.9851 }); // 25.021 / 25.4 = 0.98508 (INCH)
    expect(fit.hole.minSize).toEqual({ mm: 25, in: 0.9843 }); // 25 / 25.4 = 0.98425, half up (INCH)
    expect(fit.shaft.maxSize).toEqual({ mm: 24.993, in: 0.984 }); // 24.993 / 25.4 = 0.98398 (INCH)
    expect(fit.shaft.minSize).toEqual({ mm: 24.98, in: 0.9835 }); // 24.980 / 25.4 = 0.98346 (INCH)
    expect(fit.hole.tolerance.um).toBe(21); // IT7
    expect(fit.shaft.tolerance.um).toBe(13); // ISO 286-1:2010 Table 1, IT6 above 18 up to 30 mm = 13 µm — from memory
  });

  test(`q=25 H7/g6 reads the same as size and fit — ${ANSI}`, async () => {
    const { status, body } = await get(`q=${encodeURIComponent('25 H7/g6')}`);
    expect(status).toBe(200);
    expect(body.input.q).toBe('25 H7/g6');
    expect(body.fit.maxClearance.um).toBe(41);
    expect(body.fit.minClearance.um).toBe(7);
  });

  test(`zone=H7, size=1, unit=in → nominal 25.4 mm exactly, +21/0 µm — ${INCH}; ${IT7}`, async () => {
    const { status, body } = await get('size=1&unit=in&zone=H7');
    expect(status).toBe(200);
    expect(body.input.nominal).toEqual({ mm: 25.4, in: 1 });
    expect(body.input.nominal.mm).toBe(25.4); // exact: not 25.399999…
    expect(body.zone).toMatchObject({ zone: 'H7', kind: 'hole', grade: 'IT7' });
    expect(body.zone.upperDeviation).toEqual({ um: 21, mm: 0.021, in: 0.0008 }); // IT7
    expect(body.zone.maxSize).toEqual({ mm: 25.421, in: 1.0008 }); // 25.421 / 25.4 = 1.00083 (INCH)
    expect(body.zone.minSize).toEqual({ mm: 25.4, in: 1 });
  });

  test(`q=1 H7/g6 with unit=in reads one inch — ${INCH}`, async () => {
    const { status, body } = await get(`q=${encodeURIComponent('1 H7/g6')}&unit=in`);
    expect(status).toBe(200);
    expect(body.input.nominal.mm).toBe(25.4);
  });

  test(`25 js7: ±10.5 µm, and ±10 µm with round=1 — ${IT7}; ${JS_ROUNDING}`, async () => {
    const plain = await get('size=25&zone=js7');
    expect(plain.status).toBe(200);
    expect(plain.body.zone.upperDeviation).toEqual({ um: 10.5, mm: 0.0105, in: 0.0004 });
    expect(plain.body.zone.lowerDeviation.um).toBe(-10.5);
    const rounded = await get('size=25&zone=js7&round=1');
    expect(rounded.status).toBe(200);
    expect(rounded.body.input.roundJs).toBe(true);
    expect(rounded.body.zone.upperDeviation).toEqual({ um: 10, mm: 0.01, in: 0.0004 });
    expect(rounded.body.zone.lowerDeviation).toEqual({ um: -10, mm: -0.01, in: -0.0004 });
    expect(rounded.body.zone.tolerance.um).toBe(21); // the IT value itself is not rounded
  });

  test.each([
    ['H7/k6', 'transition', 19, -15, ANSI_ALL],
    ['H7/p6', 'interference', -1, -35, ANSI_ALL],
    ['H7/s6', 'interference', -14, -48, ANSI_ALL],
  ] as const)('25 %s is %s, clearance %s…%s µm — %s', async (fit, kind, max, min, _source) => {
    const { status, body } = await get(`size=25&fit=${encodeURIComponent(fit)}`);
    expect(status).toBe(200);
    expect(body.fit.kind).toBe(kind);
    expect(body.fit.maxClearance.um).toBe(max);
    expect(body.fit.minClearance.um).toBe(min);
  });
});

describe('GET /api/fits — refusals are 400s naming the field', () => {
  test.each([
    ['no size', 'fit=H7/g6', 'size', /nominal size/i],
    ['size not a number', 'size=abc&fit=H7/g6', 'size', /must be a number/i],
    ['negative size', 'size=-3&fit=H7/g6', 'size', /greater than 0/i],
    ['size zero', 'size=0&zone=H7', 'size', /greater than 0/i],
    [`size above 3150 mm — ${RANGE}`, 'size=4000&fit=H7/g6', 'size', /3150 mm/],
    [`inch size above 3150 mm — ${RANGE}`, 'size=200&unit=in&zone=H7', 'size', /3150 mm/],
    ['fraction without inches', 'size=1/2&zone=H7', 'size', /fraction of an inch/],
    ['fit written shaft first — common practice: hole first', 'size=25&fit=g6/H7', 'fit', /hole first/i],
    ['two holes', 'size=25&fit=H7/H8', 'fit', /two holes/],
    ['unknown letter Q', 'size=25&zone=Q7', 'zone', /no letter "Q"/],
    [`t6 at 20 mm — ${T_LETTER}`, 'size=20&zone=t6', 'zone', /above 24 mm/],
    [`t6 in a fit at 20 mm — ${T_LETTER}`, 'size=20&fit=H7/t6', 'fit', /above 24 mm/],
    ['neither zone nor fit', 'size=25', 'zone', /zone=H7/],
    ['both zone and fit', 'size=25&zone=H7&fit=H7/g6', 'fit', /not both/],
    ['unit not mm or in', 'size=25&zone=H7&unit=cm', 'unit', /mm or in/],
    ['round not 0 or 1', 'size=25&zone=js7&round=yes', 'round', /round must be/],
    ['q unreadable', `q=${encodeURIComponent('25 H7/')}`, 'q', /shaft zone too/],
    ['q with a size only', 'q=25', 'q', /add a zone/],
    ['q with an undefined zone', `q=${encodeURIComponent('20 H7/t6')}`, 'q', /above 24 mm/],
    ['q and size together', 'q=25+H7&size=25', 'q', /not both/],
    ['q too long', `q=${'9'.repeat(200)}`, 'q', /too long/],
  ] as const)('%s → 400 on %s', async (_name, query, field, message) => {
    const { status, body } = await get(query);
    expect(status).toBe(400);
    expect(body.error).toBe('validation');
    expect(Object.keys(body.fieldErrors)).toContain(field);
    expect(body.fieldErrors[field][0]).toMatch(message);
    expect(body.message).toMatch(message);
    expect(JSON.stringify(body)).not.toMatch(/at .*\.ts:\d+|Error:/); // no stack trace
  });

  test('no size and no zone → both named at once', async () => {
    const { status, body } = await get('');
    expect(status).toBe(400);
    expect(Object.keys(body.fieldErrors).sort()).toEqual(['fit', 'size', 'zone']);
  });
});
