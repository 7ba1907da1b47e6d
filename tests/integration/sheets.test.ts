// The shop sheet's data through GET /api/sessions/[id]/sheet, against the real database: who may print it,
// the sizes in both units, every hole of a saved bolt circle, only open flags, the session's cautions,
// and the choice of records (refused with a 400 naming `records`, nothing else read).
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as sheetRoute } from '@/app/api/sessions/[id]/sheet/route';
import { initModels, Project, ProjectMembership, ShopSession, Entry, MeasurementRecord, MeasurementReading, RiskFlag, User } from '@/db/models';
import { saveCalculation } from '@/lib/server/calculations';
import { DEFERRAL_LINE } from '@/lib/safety/cautions';
import type { SessionSheet } from '@/lib/types/sheets';

guardTestDatabase();

const ISO286 = 'ISO 286-2:2010 limit deviation tables — from memory';
const INWARD = 'IEEE/ASTM SI 10, converted limits rounded inward — from memory; 1 in = 25.4 mm exactly';
const BOLT = 'Machinery’s Handbook, hole coordinates on a bolt circle: x = r·cos θ, y = r·sin θ — from memory';

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, mentor: U, member: U, admin: U;
const projectIds: number[] = [];
let sessionId: number, privateSessionId: number, otherSessionId: number, spigotId: number, recessId: number, foreignRecordId: number;

async function makeProject(visibility: 'published' | 'private', tag: string) {
  const project = await Project.create({
    ownerId: owner.id, slug: `sheet-it-${tag}-${Date.now().toString(36)}-${process.pid}`, title: `Backplate ${tag}`, summary: '', units: 'mm', visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projectIds.push(project.id);
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
  return project;
}

const session = (projectId: number, position: number, title: string) =>
  ShopSession.create({ projectId, position, title, heldOn: '2026-10-10', minutesSpent: 120, planned: 'Spigot to k6, then the bolt circle.', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date() });
const entry = (sid: number, position: number, title: string, operation: string) =>
  Entry.create({ sessionId: sid, position, title, operation, body: JSON.stringify({ type: 'doc', content: [] }) });
const none = { specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null, timeNoteId: null };

beforeAll(async () => {
  initModels();
  [owner, mentor, member, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser('admin')]);
  const project = await makeProject('published', 'pub');
  const s = await session(project.id, 0, 'Spigot and bolt circle');
  sessionId = s.id;
  const turning = await entry(s.id, 0, 'Turning the spigot', 'turning');
  const drilling = await entry(s.id, 1, 'Drilling the bolt circle', 'drilling');
  const spigot = await MeasurementRecord.create({ entryId: turning.id, feature: 'Spigot diameter', kind: 'outside', nominal: '130', unit: 'mm', specType: 'zone', specZone: 'k6', ...none });
  spigotId = spigot.id;
  await MeasurementReading.create({ recordId: spigot.id, position: 0, passNumber: 1, value: '130.012', unit: 'mm', instrument: 'micrometer', resolution: '0.001', measuredBy: 'Test', measuredAt: new Date(), temperatureC: '21', note: '' });
  recessId = (await MeasurementRecord.create({ entryId: turning.id, feature: 'Chuck recess', kind: 'inside', nominal: '130', unit: 'mm', specType: 'zone', specZone: 'H7', ...none })).id;
  // Sixteen holes: more than a saved card lists (twelve), all of which the sheet must carry.
  await saveCalculation({ id: owner.id, siteRole: 'member' }, drilling.id, { kind: 'bolt-circle', input: { diameterMm: 124, holes: 16, startAngleDeg: 90 } });
  await saveCalculation({ id: owner.id, siteRole: 'member' }, drilling.id, { kind: 'simple-indexing', input: { divisions: 36, ratio: 40 } });
  const base = { projectId: project.id, sessionId: s.id, entryId: turning.id, mentorId: mentor.id, noteId: null, recordId: null, targetKind: 'entry' as const, hazard: 'rotating-work' as const };
  await RiskFlag.create({ ...base, severity: 'warning', concern: 'First run of the plate: check it is seated.', instead: 'Turn it by hand first.', status: 'acknowledged', acknowledgedAt: new Date(), version: 2 });
  await RiskFlag.create({ ...base, severity: 'caution', concern: 'Answered already.', instead: 'Isolate first.', status: 'resolved', acknowledgedAt: new Date(), resolvedAt: new Date(), answer: 'Done.', version: 3 });

  const other = await session(project.id, 1, 'Another day');
  otherSessionId = other.id;
  const otherEntry = await entry(other.id, 0, 'Facing', 'facing');
  foreignRecordId = (await MeasurementRecord.create({ entryId: otherEntry.id, feature: 'Thickness', kind: 'outside', nominal: '40', unit: 'mm', specType: 'plusMinus', ...none, specTolerance: '0.05000' })).id;

  const hidden = await makeProject('private', 'priv');
  privateSessionId = (await session(hidden.id, 0, 'Private day')).id;
});

afterAll(async () => {
  await Project.destroy({ where: { id: projectIds } });
  await User.destroy({ where: { id: [owner, mentor, member, admin].map((u) => u.id) } });
  await closeDb();
});

const get = (who: U | null, id: number, query = '') => sheetRoute(request(`/api/sessions/${id}/sheet${query}`, { cookie: who?.cookie }), params({ id: String(id) }));
async function sheetOf(who: U, id = sessionId, query = ''): Promise<SessionSheet> {
  const res = await get(who, id, query);
  expect(res.status).toBe(200);
  return (await res.json()).sheet;
}

describe('who may print a session’s sheet (policy printSheet)', () => {
  test.each([
    ['the builder', (): U | null => owner, 200],
    ['a mentor', (): U | null => mentor, 200],
    ['an admin', (): U | null => admin, 200],
    ['another member of a published log', (): U | null => member, 403],
    ['someone signed out', (): U | null => null, 401],
  ] as const)('%s: %i', async (_who, who, status) => {
    expect((await get(who(), sessionId)).status).toBe(status);
  });

  test('a private log’s session is a 404 to a member outside it, a sheet to its mentor', async () => {
    expect((await get(member, privateSessionId)).status).toBe(404);
    // Signed out is a 401 whatever the visibility, so the answer tells nothing about a private log.
    expect((await get(null, privateSessionId)).status).toBe(401);
    expect((await get(mentor, privateSessionId)).status).toBe(200);
  });

  test('a member is refused before the records choice is read', async () => {
    const res = await get(member, sessionId, '?records=abc');
    expect(res.status).toBe(403);
  });
});

describe('what the sheet holds', () => {
  test(`sizes in both units and the instrument (${ISO286}; ${INWARD})`, async () => {
    const sheet = await sheetOf(owner);
    expect(sheet.records.map((r) => r.feature)).toEqual(['Spigot diameter', 'Chuck recess']);
    const [spigot, recess] = sheet.records;
    expect(spigot.sizes.map((s) => [s.unit, s.min, s.max])).toEqual([['mm', '130.003', '130.028'], ['in', '5.1183', '5.1192']]);
    expect(spigot.instrument.instrument).toBe('micrometer');
    expect(spigot.latest).toEqual({ valueText: '130.012', unit: 'mm', verdict: 'Inside' });
    expect(recess.sizes.map((s) => [s.unit, s.min, s.max])).toEqual([['mm', '130.000', '130.040'], ['in', '5.1182', '5.1196']]);
    expect(recess.instrument.instrument).toBe('bore-gauge');
    expect(recess.latest).toBeNull();
  });

  test(`every hole of a saved bolt circle, and the indexing move (${BOLT}; 40/36 = 1 turn 2/18, common practice)`, async () => {
    const sheet = await sheetOf(mentor);
    const bolt = sheet.calculations.find((c) => c.kind === 'bolt-circle')!;
    const rows = bolt.summary!.table!.rows;
    expect(rows).toHaveLength(16);
    expect(bolt.summary!.table!.more).toBe(0);
    // Hole 1 at 90°: (0, 62); hole 5 at 180°: (−62, 0).
    const [one, , , , five] = rows;
    expect(one.cells[2]).toMatchObject({ mm: 0 });
    expect((one.cells[3] as { mm: number }).mm).toBeCloseTo(62, 9);
    expect((five.cells[2] as { mm: number }).mm).toBeCloseTo(-62, 9);
    const indexing = sheet.calculations.find((c) => c.kind === 'simple-indexing')!;
    expect(indexing.summary!.results[0].value.text).toBe('1 turn and 2 holes on the 18-hole circle');
  });

  test('open flags only, and each caution once with the operations that call for it', async () => {
    const sheet = await sheetOf(owner);
    expect(sheet.flags.map((f) => f.concern)).toEqual(['First run of the plate: check it is seated.']);
    const rotating = sheet.cautions.find((c) => c.id === 'rotating')!;
    expect(rotating.operations).toEqual(['Turning', 'Drilling']);
    expect(sheet.cautions.filter((c) => c.id === 'rotating')).toHaveLength(1);
    expect(sheet.cautions.map((c) => c.id)).toContain('tool-breakage');
    expect(sheet.deferral).toBe(DEFERRAL_LINE);
  });
});

describe('a chosen set of records', () => {
  test('narrows the sheet, in either form of the query', async () => {
    expect((await sheetOf(owner, sessionId, `?records=${recessId}`)).records.map((r) => r.id)).toEqual([recessId]);
    const both = await sheetOf(owner, sessionId, `?records=${recessId}&records=${spigotId}`);
    expect(both.records.map((r) => r.id)).toEqual([spigotId, recessId]);
    expect(both.allRecords).toHaveLength(2);
  });

  test.each([
    ['not a number', 'abc'],
    ['a negative number', '-3'],
    ['a fraction', '1.5'],
  ])('%s is a 400 naming records', async (_what, value) => {
    const res = await get(owner, sessionId, `?records=${value}`);
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.records[0]).toMatch(/record numbers/);
  });

  test('a record of another session is a 400 naming it', async () => {
    const res = await get(owner, sessionId, `?records=${spigotId},${foreignRecordId}`);
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.records[0]).toContain(String(foreignRecordId));
    expect((await sheetOf(owner, otherSessionId, `?records=${foreignRecordId}`)).records.map((r) => r.feature)).toEqual(['Thickness']);
  });
});
