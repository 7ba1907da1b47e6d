import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as compute } from '@/app/api/calculators/[kind]/route';
import { GET as listSaved, POST as saveOne } from '@/app/api/entries/[id]/calculations/route';
import { DELETE as deleteOne } from '@/app/api/calculations/[id]/route';
import { initModels, Project, ShopSession, Entry, SavedCalculation, User } from '@/db/models';
import { runCalculator, TABLES_VERSION } from '@/lib/calculators';

guardTestDatabase();

const MH_TAP = "Machinery's Handbook tap drill table — from memory";
const ISO273 = 'ISO 273 clearance holes, medium series — from memory';
const DRILLS = 'ASME B94.11M drill chart — from memory';
const MH_BOLT = "Machinery's Handbook hole-coordinate tables, 3 holes on a 1 in circle — from memory";
const MH_INDEX = "Machinery's Handbook simple indexing table, 40:1 head — from memory";
const GEAR = 'ISO 53 basic rack: d = m·z, da = d + 2m — from memory';
const CUTTERS = "Machinery's Handbook involute cutter ranges, No. 3 = 35–54 teeth — from memory";
const RPM = 'rev/min = 1000·v / (π·d): 1000 × 30 / (π × 8) = 1193.7 — worked by hand';
const COUNTERBORE = 'DIN 974-1 counterbore Ø15 for M8, ISO 4762 head 8 mm + 0.5 mm — from memory';

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, member: U;
const users: number[] = [];
const projects: number[] = [];
let entryId: number, privateEntryId: number;

async function makeLog(visibility: 'published' | 'private', tag: string) {
  const project = await Project.create({
    ownerId: owner.id,
    slug: `calc-it-${tag}-${Date.now().toString(36)}-${process.pid}`,
    title: `Backplate ${tag}`,
    summary: 'Three M8 holes on the bolt circle.',
    units: 'mm',
    visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  const session = await ShopSession.create({
    projectId: project.id, position: 0, title: 'Holes', heldOn: '2026-10-17', minutesSpent: 90, planned: '', done: '', nextSteps: '',
    visibility, publishedAt: visibility === 'published' ? new Date() : null,
  });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Tapping M8', operation: 'tapping', body: JSON.stringify({ type: 'doc', content: [] }) });
  return entry.id;
}

const get = (kind: string, query: string) => compute(request(`/api/calculators/${kind}?${query}`), params({ kind }));
const save = (who: U | null, entry: number, body: unknown) =>
  saveOne(request(`/api/entries/${entry}/calculations`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(entry) }));
const list = (who: U | null, entry: number) => listSaved(request(`/api/entries/${entry}/calculations`, { cookie: who?.cookie }), params({ id: String(entry) }));
const del = (who: U | null, id: number) => deleteOne(request(`/api/calculations/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));

beforeAll(async () => {
  initModels();
  owner = await makeUser();
  member = await makeUser();
  users.push(owner.id, member.id);
  entryId = await makeLog('published', 'pub');
  privateEntryId = await makeLog('private', 'priv');
});

afterAll(async () => {
  // Entries, sessions and saved calculations go with their projects (ON DELETE CASCADE).
  await Project.destroy({ where: { id: projects } });
  await User.destroy({ where: { id: users } });
  await closeDb();
});

describe('GET /api/calculators/[kind]', () => {
  test.each([
    ['tap-drill', 'designation=M8x1.25', (o: any) => { expect(o.choice.drill.name).toBe('6.8 mm'); expect(Math.round(o.choice.percent)).toBe(74); }, MH_TAP],
    ['tap-drill', 'designation=1/4-20&targetPercent=75', (o: any) => { expect(o.choice.drill.name).toBe('#7'); expect(o.choice.percent).toBeCloseTo(75.4, 1); }, MH_TAP],
    ['thread-percent', 'designation=5/16-18&drillDiameterMm=6.35', (o: any) => { expect(Math.round(o.percent)).toBe(87); expect(o.warnings[0].code).toBe('HIGH_ENGAGEMENT'); }, 'common practice: 5/16-18 drilled 1/4 in ≈ 87 %, hard to tap'],
    ['thread-spec', 'designation=M8', (o: any) => { expect(o.major.mm).toBe(8); expect(o.pitch.mm).toBe(1.25); }, 'ISO 261 — from memory'],
    ['clearance-hole', 'size=M8&fit=normal', (o: any) => expect(o.diameter.mm).toBe(9), ISO273],
    ['counterbore', 'size=M8&holeCentreToEdgeMm=10', (o: any) => { expect(o.counterbore.diameter.mm).toBe(15); expect(o.counterbore.depth.mm).toBe(8.5); expect(o.wall.toEdge.mm).toBe(2.5); }, COUNTERBORE],
    ['drill-size', 'name=%237', (o: any) => expect(o.diameter.in).toBeCloseTo(0.201, 4), DRILLS],
    ['nearest-drills', 'diameterMm=6.78&count=3', (o: any) => { expect(o).toHaveLength(3); expect(o[0].drill.name).toBe('6.8 mm'); }, DRILLS],
    ['bolt-circle', 'diameterMm=25.4&holes=3&startAngleDeg=90', (o: any) => { expect(o.holes[0].y.mm).toBeCloseTo(12.7, 6); expect(o.holes[1].x.in).toBeCloseTo(-0.43301, 5); expect(o.holes[1].y.mm).toBeCloseTo(-6.35, 6); }, MH_BOLT],
    ['simple-indexing', 'divisions=36', (o: any) => expect(o.move.description).toBe('1 turn and 2 holes on the 18-hole circle'), MH_INDEX],
    ['simple-indexing', 'divisions=7&circles=21,23,27', (o: any) => expect(o.move.description).toBe('5 turns and 15 holes on the 21-hole circle'), MH_INDEX],
    ['direct-indexing', 'divisions=6&plateHoles=24', (o: any) => expect(o.holesToMove).toBe(4), 'direct indexing: 24 / 6 = 4 holes — worked by hand'],
    ['spur-gear', 'teeth=36&module=1.5', (o: any) => { expect(o.pitchDiameter.mm).toBe(54); expect(o.outsideDiameter.mm).toBe(57); expect(o.cutter.number).toBe(3); }, `${GEAR}; ${CUTTERS}`],
    ['spindle-speed', 'cuttingSpeed=30&unit=m/min&diameterMm=8', (o: any) => expect(Math.round(o.rpm)).toBe(1194), RPM],
    ['speed-range', 'material=mild-steel&tool=hss&diameterMm=25.4', (o: any) => { expect(Math.round(o.rpm[0])).toBe(306); expect(Math.round(o.rpm[1])).toBe(420); }, 'rev/min = 12·v / (π·d): 80 and 110 ft/min on 1 in — worked by hand'],
  ])('%s ?%s', async (kind, query, check) => {
    const res = await get(kind, query);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.kind).toBe(kind);
    expect(body.tablesVersion).toBe(TABLES_VERSION);
    check(body.output);
  });

  test('the input is read back as the calculator got it', async () => {
    const body = await (await get('simple-indexing', 'divisions=36&ratio=40&circles=15,18')).json();
    expect(body.input).toEqual({ divisions: 36, ratio: 40, circles: [15, 18] });
  });

  test.each([
    ['tap-drill', 'designation=M8x3', 'designation'],
    ['bolt-circle', 'diameterMm=100&holes=1', 'holes'],
    ['bolt-circle', 'diameterMm=abc&holes=6', 'diameterMm'],
    ['bolt-circle', 'diameterMm=100&holes=6&midway=perhaps', 'midway'],
    ['simple-indexing', 'divisions=36&circles=18,x', 'circles'],
    ['spur-gear', 'teeth=36', 'module'],
    ['direct-indexing', 'divisions=7&plateHoles=24', 'divisions'],
  ])('%s ?%s → 400 naming %s', async (kind, query, field) => {
    const res = await get(kind, query);
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error).toBe('validation');
    expect(body.message.length).toBeGreaterThan(5);
    expect(Object.keys(body.fieldErrors)).toEqual([field]);
  });

  test('an unknown calculator is a 404', async () => {
    const res = await get('sine-bar', 'angle=30');
    expect(res.status).toBe(404);
  });
});

describe('saving into an entry', () => {
  test('the builder saves a tap drill: 201, the output is the server\'s own computation, tables version stored', async () => {
    const res = await save(owner, entryId, { kind: 'tap-drill', input: { designation: 'M8x1.25', targetPercent: 75 } });
    expect(res.status).toBe(201);
    const { calculation } = await res.json();
    expect(calculation.label).toBe('Tap drill for M8x1.25');
    expect(calculation.tablesVersion).toBe(TABLES_VERSION);
    expect(calculation.reopenHref).toBe('/calculators/tap-drill?thread=M8x1.25');
    // The card's summary is drawn on the server (the entry page carries none of the calculators' code).
    expect(calculation.summary.inputs.map((i: { label: string }) => i.label).join(' ')).toMatch(/M8|thread/i);
    expect(calculation.summary.results.length).toBeGreaterThan(0);
    const row = (await SavedCalculation.findByPk(calculation.id))!;
    expect(row.calculator).toBe('tap-drill');
    expect(row.tablesVersion).toBe(TABLES_VERSION);
    expect(row.createdById).toBe(owner.id);
    expect(JSON.parse(row.outputs)).toEqual(JSON.parse(JSON.stringify(runCalculator('tap-drill', { designation: 'M8x1.25', targetPercent: 75 }))));
    expect(Math.round(JSON.parse(row.outputs).choice.percent)).toBe(74); // MH_TAP
  });

  test('an output sent by the client is ignored, and unknown input fields are not stored', async () => {
    const res = await save(owner, entryId, {
      kind: 'clearance-hole',
      input: { size: 'M8', fit: 'normal', colour: 'blue' },
      output: { diameter: { mm: 3, in: 0.1 } },
      label: '  Through holes for the chuck screws ',
    });
    expect(res.status).toBe(201);
    const { calculation } = await res.json();
    expect(calculation.label).toBe('Through holes for the chuck screws');
    expect(calculation.output.diameter.mm).toBe(9); // ISO273
    expect(calculation.input).toEqual({ size: 'M8', fit: 'normal' });
  });

  test('bad input is a 400 naming the field, and nothing is saved', async () => {
    const before = await SavedCalculation.count({ where: { entryId } });
    const res = await save(owner, entryId, { kind: 'tap-drill', input: { designation: 'M8x3' } });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors)).toEqual(['input.designation']);
    const unknownKind = await save(owner, entryId, { kind: 'sine-bar', input: {} });
    expect(unknownKind.status).toBe(400);
    expect(Object.keys((await unknownKind.json()).fieldErrors)).toContain('kind');
    const notObject = await save(owner, entryId, { kind: 'bolt-circle', input: [1, 2] });
    expect(notObject.status).toBe(400);
    expect(await SavedCalculation.count({ where: { entryId } })).toBe(before);
  });

  test('a member is refused (403), a signed-out visitor asked to sign in (401), an outsider never sees a private entry (404)', async () => {
    const body = { kind: 'drill-size', input: { name: 'F' } };
    expect((await save(member, entryId, body)).status).toBe(403);
    expect((await save(null, entryId, body)).status).toBe(401);
    expect((await save(member, privateEntryId, body)).status).toBe(404);
    expect((await list(member, privateEntryId)).status).toBe(404);
    expect((await list(null, privateEntryId)).status).toBe(404);
  });

  test('the cards\' data: anyone who can read the entry gets the saved results with what is needed to show them', async () => {
    await save(owner, entryId, { kind: 'bolt-circle', input: { diameterMm: 124, holes: 3, startAngleDeg: 90 } });
    const res = await list(null, entryId);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.tablesVersion).toBe(TABLES_VERSION);
    const bolt = body.calculations.find((c: { kind: string }) => c.kind === 'bolt-circle');
    expect(bolt.calculatorName).toBe('Bolt circle');
    expect(bolt.label).toBe('Bolt circle: 3 holes on 124 mm');
    expect(bolt.output.holes).toHaveLength(3);
    expect(bolt.output.chord.mm).toBeCloseTo(124 * Math.sin(Math.PI / 3), 9); // chord = d·sin(180°/n), worked by hand
    expect(bolt.reopenHref).toBe('/calculators/bolt-circle?d=124&holes=3&start=90');
    expect(bolt.createdBy.id).toBe(owner.id);
    expect(body.calculations.map((c: { position: number }) => c.position)).toEqual([...body.calculations.map((c: { position: number }) => c.position)].sort((a, b) => a - b));
  });

  test('only the builder deletes; then it is gone', async () => {
    const { calculation } = await (await save(owner, entryId, { kind: 'spur-gear', input: { teeth: 36, module: 1.5 } })).json();
    expect((await del(member, calculation.id)).status).toBe(403);
    expect((await del(null, calculation.id)).status).toBe(401);
    expect((await del(owner, calculation.id)).status).toBe(204);
    expect(await SavedCalculation.findByPk(calculation.id)).toBeNull();
    expect((await del(owner, calculation.id)).status).toBe(404);
  });
});
