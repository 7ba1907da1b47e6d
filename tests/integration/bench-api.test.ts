import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op, QueryTypes } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { POST as addReading } from '@/app/api/measurements/[id]/readings/route';
import { PATCH as patchRecord, DELETE as deleteRecord } from '@/app/api/measurements/[id]/route';
import { POST as addNote } from '@/app/api/sessions/[id]/bench-notes/route';
import { POST as addTime } from '@/app/api/sessions/[id]/time/route';
import { initModels, Entry, MeasurementReading, MeasurementRecord, Project, ProjectMembership, ShopSession, User } from '@/db/models';
import { getSequelize } from '@/db/connection';
import { loadBench } from '@/lib/server/bench';
import { findActor } from '@/lib/server/users';

guardTestDatabase();

// The bench view's writes go through the same route handlers as every client, on the real database: each
// carries a client-made id, and sending it again (one after another, or at once) never writes twice.
const ISO286 = 'ISO 286-2:2010, k6 over 120 up to 140 mm: +28 / +3 µm — from memory';

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, stranger: U, mentor: U;
const projects: number[] = [];
let sessionId = 0, entryId = 0, secondEntryId = 0, recordId = 0, boreId = 0, privateSessionId = 0;

const uuid = () => crypto.randomUUID();
const reading = (value: number, extra: Record<string, unknown> = {}) => ({ value, unit: 'mm', instrument: 'micrometer', resolution: 0.001, ...extra });
const post = (who: U | null, id: number, body: unknown) => addReading(request(`/api/measurements/${id}/readings`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const note = (who: U | null, id: number, body: unknown) => addNote(request(`/api/sessions/${id}/bench-notes`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const time = (who: U | null, id: number, body: unknown) => addTime(request(`/api/sessions/${id}/time`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const readingsOf = (id: number) => MeasurementReading.count({ where: { recordId: id } });

async function makeLog(visibility: 'published' | 'private') {
  const project = await Project.create({
    ownerId: owner.id, slug: `bench-it-${visibility}-${Date.now().toString(36)}-${process.pid}`, title: 'Backplate for the three-jaw', summary: '', units: 'mm',
    visibility, publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  const session = await ShopSession.create({ projectId: project.id, position: 0, title: 'Spigot to the recess', heldOn: '2026-03-14', minutesSpent: 50, planned: '', done: 'Faced the plate.', nextSteps: '', visibility: 'published', publishedAt: new Date() });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  const second = await Entry.create({ sessionId: session.id, position: 1, title: 'Boring the register', operation: 'boring', body: JSON.stringify({ type: 'doc', content: [] }) });
  return { project, session, entry, second };
}

beforeAll(async () => {
  initModels();
  [owner, stranger, mentor] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  const log = await makeLog('published');
  await ProjectMembership.create({ projectId: log.project.id, userId: mentor.id, role: 'mentor' });
  sessionId = log.session.id;
  entryId = log.entry.id;
  secondEntryId = log.second.id;
  // Made in the order they are worked: the bore's entry comes second though its record is made first.
  boreId = (await MeasurementRecord.create({ entryId: secondEntryId, feature: 'Register bore', kind: 'inside', nominal: '52.00000', unit: 'mm', specType: 'zone', specZone: 'H7', specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null })).id;
  recordId = (await MeasurementRecord.create({ entryId, feature: 'Spigot diameter', kind: 'outside', nominal: '130.00000', unit: 'mm', specType: 'zone', specZone: 'k6', specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null })).id;
  privateSessionId = (await makeLog('private')).session.id;
});

afterAll(async () => {
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: [owner.id, stranger.id, mentor.id] } } });
  await closeDb();
});

describe('a reading sent again with its clientId', () => {
  test('the first answer is 201, a retry 200 with the same record: one reading, not two', async () => {
    const clientId = uuid();
    const before = await readingsOf(recordId);
    const first = await post(owner, recordId, reading(130.05, { clientId }));
    expect(first.status).toBe(201);
    const made = await first.json();
    expect(made.created).toBe(true);
    const again = await post(owner, recordId, reading(130.05, { clientId }));
    expect(again.status).toBe(200);
    const body = await again.json();
    expect(body.created).toBe(false);
    expect(body.record.readings).toHaveLength(made.record.readings.length);
    expect(await readingsOf(recordId)).toBe(before + 1);
    expect(await MeasurementReading.count({ where: { clientId } })).toBe(1);
    // Judged by the server as the phone judged it: 130.05 is over the k6 band (ISO 286).
    expect(body.record.verdict.state, ISO286).toBe('over');
  });

  test('the same clientId sent three times at once still makes one reading', async () => {
    const clientId = uuid();
    const before = await readingsOf(recordId);
    const answers = await Promise.all([0, 1, 2].map(() => post(owner, recordId, reading(130.02, { clientId }))));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 201]);
    expect(await readingsOf(recordId)).toBe(before + 1);
  });

  test('readings queued one after another keep their order', async () => {
    const ids = [uuid(), uuid(), uuid()];
    const values = [130.04, 130.025, 130.015];
    for (const [i, clientId] of ids.entries()) expect((await post(owner, recordId, reading(values[i]!, { clientId }))).status).toBe(201);
    const rows = await MeasurementReading.findAll({ where: { clientId: { [Op.in]: ids } }, order: [['position', 'ASC']] });
    expect(rows.map((r) => r.clientId)).toEqual(ids);
    expect(rows.map((r) => Number(r.value))).toEqual(values);
  });

  test('a clientId already used on another record is a 409 naming clientId; nothing saved', async () => {
    const clientId = uuid();
    expect((await post(owner, recordId, reading(130.01, { clientId }))).status).toBe(201);
    const before = await readingsOf(boreId);
    const res = await post(owner, boreId, reading(52.01, { clientId }));
    expect(res.status).toBe(409);
    expect((await res.json()).fieldErrors.clientId).toBeTruthy();
    expect(await readingsOf(boreId)).toBe(before);
  });

  test('a clientId that is not a UUID is a 400 naming clientId', async () => {
    const res = await post(owner, recordId, reading(130.01, { clientId: 'reading-1' }));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.clientId).toBeTruthy();
  });
});

describe('a reading judged against a record that changed meanwhile', () => {
  test('a stale recordVersion is a 409 naming recordVersion and saves nothing; the current version saves', async () => {
    const record = await MeasurementRecord.findByPk(boreId);
    const judged = record!.version;
    const patched = await patchRecord(request(`/api/measurements/${boreId}`, { method: 'PATCH', cookie: owner.cookie, body: { spec: { type: 'zone', zone: 'H8' }, version: judged } }), params({ id: String(boreId) }));
    expect(patched.status).toBe(200);
    const before = await readingsOf(boreId);
    const clientId = uuid();
    const stale = await post(owner, boreId, reading(52.02, { clientId, recordVersion: judged }));
    expect(stale.status).toBe(409);
    expect((await stale.json()).fieldErrors.recordVersion).toBeTruthy();
    expect(await readingsOf(boreId)).toBe(before);
    // The builder chose to keep it against the record as it is now: the same write, the new version.
    const now = await post(owner, boreId, reading(52.02, { clientId, recordVersion: judged + 1 }));
    expect(now.status).toBe(201);
    expect(await readingsOf(boreId)).toBe(before + 1);
  });

  test('a record deleted meanwhile answers 404, so the phone can keep the reading as a note', async () => {
    const gone = await MeasurementRecord.create({ entryId, feature: 'Chamfer', kind: 'outside', nominal: '10.00000', unit: 'mm', specType: 'plusMinus', specZone: null, specUpper: null, specLower: null, specTolerance: '0.10000', specGeneralClass: null });
    expect((await deleteRecord(request(`/api/measurements/${gone.id}`, { method: 'DELETE', cookie: owner.cookie }), params({ id: String(gone.id) }))).status).toBe(204);
    expect((await post(owner, gone.id, reading(10.02, { clientId: uuid(), recordVersion: 1 }))).status).toBe(404);
  });
});

describe('who may write from the bench', () => {
  test('signed out 401, another member 403, a mentor 403, a private log 404 to outsiders; nothing saved', async () => {
    const before = await readingsOf(recordId);
    expect((await post(null, recordId, reading(130.01, { clientId: uuid() }))).status).toBe(401);
    expect((await post(stranger, recordId, reading(130.01, { clientId: uuid() }))).status).toBe(403);
    expect((await post(mentor, recordId, reading(130.01, { clientId: uuid() }))).status).toBe(403);
    expect(await readingsOf(recordId)).toBe(before);
    expect((await note(null, sessionId, { clientId: uuid(), text: 'x' })).status).toBe(401);
    expect((await note(stranger, sessionId, { clientId: uuid(), text: 'x' })).status).toBe(403);
    expect((await time(mentor, sessionId, { clientId: uuid(), minutes: 5 })).status).toBe(403);
    expect((await note(stranger, privateSessionId, { clientId: uuid(), text: 'x' })).status).toBe(404);
  });

  test('the bench view is the builder’s circle’s: the builder writes, a mentor reads, anyone else is refused', async () => {
    const builder = (await findActor(owner.id))!;
    const data = await loadBench(builder, sessionId);
    expect(data.canWrite).toBe(true);
    // Entries in order, then their records: the spigot's entry comes first.
    expect(data.records.map((r) => r.feature)).toEqual(['Spigot diameter', 'Register bore']);
    expect(data.entry).toEqual({ id: secondEntryId, title: 'Boring the register' });
    expect((await loadBench((await findActor(mentor.id))!, sessionId)).canWrite).toBe(false);
    await expect(loadBench((await findActor(stranger.id))!, sessionId)).rejects.toMatchObject({ code: 'forbidden' });
    await expect(loadBench((await findActor(stranger.id))!, privateSessionId)).rejects.toMatchObject({ code: 'not_found' });
    await expect(loadBench(null, sessionId)).rejects.toMatchObject({ code: 'unauthenticated' });
  });
});

describe('notes and timer minutes from the bench', () => {
  test('a note is one line of "What got done", once however often it is sent', async () => {
    const clientId = uuid();
    const body = { clientId, text: 'Spring pass, no chatter now', clock: '14:05' };
    const first = await note(owner, sessionId, body);
    expect(first.status).toBe(201);
    expect((await note(owner, sessionId, body)).status).toBe(200);
    const session = await ShopSession.findByPk(sessionId);
    expect(session!.done).toBe('Faced the plate.\n14:05 — Spring pass, no chatter now');
  });

  test('minutes are added once per clientId, also when sent at once', async () => {
    const clientId = uuid();
    const before = (await ShopSession.findByPk(sessionId))!.minutesSpent;
    const answers = await Promise.all([0, 1, 2].map(() => time(owner, sessionId, { clientId, minutes: 25 })));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 201]);
    expect((await ShopSession.findByPk(sessionId))!.minutesSpent).toBe(before + 25);
  });

  test('minutes past a day are a 400 naming minutes, and the refused write leaves no trace: the same id saves once corrected', async () => {
    const clientId = uuid();
    const before = (await ShopSession.findByPk(sessionId))!.minutesSpent;
    const refused = await time(owner, sessionId, { clientId, minutes: 24 * 60 });
    expect(refused.status).toBe(400);
    expect((await refused.json()).fieldErrors.minutes).toBeTruthy();
    const ledger = (await getSequelize().query('SELECT COUNT(*) AS n FROM session_writes WHERE client_id = ?', { replacements: [clientId], type: QueryTypes.SELECT, plain: true })) as { n: number | string } | null;
    expect(Number(ledger?.n)).toBe(0);
    expect((await time(owner, sessionId, { clientId, minutes: 10 })).status).toBe(201);
    expect((await ShopSession.findByPk(sessionId))!.minutesSpent).toBe(before + 10);
  });

  test('a clientId used for a note cannot add minutes: 409 naming clientId', async () => {
    const clientId = uuid();
    expect((await note(owner, sessionId, { clientId, text: 'Checked the jaws' })).status).toBe(201);
    const res = await time(owner, sessionId, { clientId, minutes: 5 });
    expect(res.status).toBe(409);
    expect((await res.json()).fieldErrors.clientId).toBeTruthy();
  });

  test('an empty note is a 400 naming text', async () => {
    const res = await note(owner, sessionId, { clientId: uuid(), text: '   ' });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.text).toBeTruthy();
  });
});
