import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listEntry, POST as createRecord } from '@/app/api/entries/[id]/measurements/route';
import { GET as getRecord, PATCH as patchRecord, DELETE as deleteRecord } from '@/app/api/measurements/[id]/route';
import { POST as addReading } from '@/app/api/measurements/[id]/readings/route';
import { PATCH as patchReading, DELETE as deleteReading } from '@/app/api/readings/[id]/route';
import { POST as createPair } from '@/app/api/measurements/pairs/route';
import { DELETE as deletePair } from '@/app/api/measurements/pairs/[pairId]/route';
import { GET as listProject } from '@/app/api/projects/[id]/measurements/route';
import { initModels, Project, ProjectMembership, ShopSession, Entry, Media, TimeNote, MeasurementRecord, MeasurementReading, MeasurementPair, User } from '@/db/models';
import { parseCsv } from '@/lib/measurements';
import { seedDemoMeasurements } from '@/db/seeders/demo-measurements';

guardTestDatabase();

const ISO286 = 'ISO 286-2:2010 limit deviation tables — from memory';
const ISO2768 = 'ISO 2768-1:1989 table 1 — from memory';
const INCH = 'international inch: 1 in = 25.4 mm exactly';
const RFC4180 = 'RFC 4180 (CSV) — from memory';

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, other: U, mentor: U;
const users: number[] = [];
const projects: number[] = [];
let entryId: number, otherEntryId: number, privateEntryId: number, projectId: number, privateProjectId: number, noteId: number, foreignNoteId: number;

async function makeLog(visibility: 'published' | 'private', tag: string) {
  const project = await Project.create({
    ownerId: owner.id,
    slug: `meas-it-${tag}-${Date.now().toString(36)}-${process.pid}`,
    title: `Backplate ${tag}`,
    summary: 'Spigot to the chuck recess.',
    units: 'mm',
    visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
  // Sessions are private unless published; this log's session is published, its project decides who sees it.
  const session = await ShopSession.create({ projectId: project.id, position: 0, title: 'Spigot', heldOn: '2026-03-14', minutesSpent: 90, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date() });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  const second = await Entry.create({ sessionId: session.id, position: 1, title: 'Boring the plate', operation: 'boring', body: JSON.stringify({ type: 'doc', content: [] }) });
  const clip = await Media.create({
    entryId: entry.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/m', name: 'spigot.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 60_000, uploadedBy: owner.id,
  });
  const note = await TimeNote.create({ mediaId: clip.id, startMs: 42_500, endMs: null, kind: 'measurement', text: 'Final reading', authorId: owner.id });
  const clip2 = await Media.create({
    entryId: second.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/n', name: 'bore.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 60_000, uploadedBy: owner.id,
  });
  const note2 = await TimeNote.create({ mediaId: clip2.id, startMs: 1000, endMs: null, kind: 'measurement', text: 'Bore', authorId: owner.id });
  return { project, entry, second, note, note2, clip };
}

const reading = (value: number | string, extra: Record<string, unknown> = {}) => ({ value, unit: 'mm', instrument: 'micrometer', resolution: 0.001, ...extra });
const spigot = (extra: Record<string, unknown> = {}) => ({
  feature: 'Spigot diameter',
  kind: 'outside',
  nominal: 130,
  unit: 'mm',
  spec: { type: 'zone', zone: 'k6' },
  readings: [reading(130.03, { pass: 3, note: 'Over by 0.002 mm: took a spring pass' }), reading(130.012, { pass: 4, temperatureC: 21 })],
  ...extra,
});

const post = (who: U | null, entry: number, body: unknown) =>
  createRecord(request(`/api/entries/${entry}/measurements`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(entry) }));
const list = (who: U | null, entry: number) => listEntry(request(`/api/entries/${entry}/measurements`, { cookie: who?.cookie }), params({ id: String(entry) }));
const get = (who: U | null, id: number) => getRecord(request(`/api/measurements/${id}`, { cookie: who?.cookie }), params({ id: String(id) }));
const patch = (who: U | null, id: number, body: unknown) => patchRecord(request(`/api/measurements/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) }));
const del = (who: U | null, id: number) => deleteRecord(request(`/api/measurements/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));
const addR = (who: U | null, id: number, body: unknown) => addReading(request(`/api/measurements/${id}/readings`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const patchR = (who: U | null, id: number, body: unknown) => patchReading(request(`/api/readings/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) }));
const delR = (who: U | null, id: number) => deleteReading(request(`/api/readings/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));
const pair = (who: U | null, body: unknown) => createPair(request('/api/measurements/pairs', { method: 'POST', cookie: who?.cookie, body }), params({}));
const unpair = (who: U | null, id: number) => deletePair(request(`/api/measurements/pairs/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ pairId: String(id) }));
const projectList = (who: U | null, id: number, query = '') => listProject(request(`/api/projects/${id}/measurements${query}`, { cookie: who?.cookie }), params({ id: String(id) }));

async function recordCount(entry: number) {
  return MeasurementRecord.count({ where: { entryId: entry } });
}

beforeAll(async () => {
  initModels();
  [owner, other, mentor] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  users.push(owner.id, other.id, mentor.id);
  const pub = await makeLog('published', 'pub');
  entryId = pub.entry.id;
  otherEntryId = pub.second.id;
  projectId = pub.project.id;
  noteId = pub.note.id;
  foreignNoteId = pub.note2.id;
  const priv = await makeLog('private', 'priv');
  privateEntryId = priv.entry.id;
  privateProjectId = priv.project.id;
});

afterAll(async () => {
  // Sessions, entries, media, notes, records, readings and pairs go with their project (ON DELETE CASCADE).
  await ProjectMembership.destroy({ where: { projectId: { [Op.in]: projects } } });
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('creating a record with its readings', () => {
  test('the builder saves a record and two readings; the server judges them', async () => {
    const res = await post(owner, entryId, spigot({ timeNoteId: noteId }));
    expect(res.status).toBe(201);
    const { record } = await res.json();
    expect(record.limits.upperUm, ISO286).toBe(28); // 130 k6 = +28 / +3 µm
    expect(record.limits.lowerUm, ISO286).toBe(3);
    expect(record.readings).toHaveLength(2);
    expect(record.readings[0].judgement).toMatchObject({ state: 'over', outsideByUm: 2 });
    expect(record.readings[0].note).toBe('Over by 0.002 mm: took a spring pass');
    expect(record.readings[1].judgement).toMatchObject({ state: 'inside', marginUm: 9 });
    expect(record.readings[1].measuredBy).toMatch(/^Test /); // the builder's name by default
    expect(record.verdict.state).toBe('inside');
    expect(record.moment.href).toBe(`/logs/${record.project.slug}/entries/${entryId}?clip=${record.moment.mediaId}#t=42`);
    // Only inputs are stored.
    const row = await MeasurementRecord.findByPk(record.id, { raw: true });
    expect(Object.keys(row!).some((k) => /limit|verdict|deviation/i.test(k))).toBe(false);
    expect(Number(row!.nominal)).toBe(130);
  });

  test('inches: 1.575 in ± 0.002 with an inch micrometer', async () => {
    const res = await post(owner, entryId, {
      feature: 'Plate thickness', kind: 'outside', nominal: '1.575', unit: 'in', spec: { type: 'plusMinus', tolerance: '0.002' },
      readings: [{ value: '1.5745', unit: 'in', instrument: 'micrometer', resolution: '0.0001' }],
    });
    expect(res.status).toBe(201);
    const { record } = await res.json();
    expect(record.limits.nominalMm, INCH).toBe(40.005);
    expect(record.limits.upperUm, INCH).toBe(50.8);
    expect(record.readings[0].valueText).toBe('1.5745');
    expect(record.readings[0].judgement.deviationUm, INCH).toBe(-12.7); // −0.0005 in
  });

  test.each<[string, Record<string, unknown>, string, RegExp]>([
    ['a negative nominal', { nominal: -130 }, 'nominal', /greater than zero/],
    ['a zero nominal', { nominal: 0 }, 'nominal', /greater than zero/],
    ['a zone the standard does not define at that size', { nominal: 10, spec: { type: 'zone', zone: 't6' }, readings: [reading(10.05)] }, 'spec.zone', /t only above 24 mm/],
    ['a hole zone on an outside feature', { spec: { type: 'zone', zone: 'H7' } }, 'spec.zone', /hole zone/],
    ['a reading nowhere near the nominal', { readings: [reading(130.012), reading(13.012)] }, 'readings.1.value', /nowhere near/],
    ['a resolution of zero', { readings: [reading(130.012, { resolution: 0 })] }, 'readings.0.resolution', /cannot be zero/],
    ['an unknown instrument', { readings: [reading(130.012, { instrument: 'laser tracker' })] }, 'readings.0.instrument', /Pick the instrument/],
    ['no readings', { readings: [] }, 'readings', /at least one reading/],
    ['an unknown kind of specification', { spec: { type: 'tight' } }, 'spec.type', /Pick how the size is toleranced/],
    ['explicit limits upside down', { spec: { type: 'limits', upper: -0.1, lower: 0 } }, 'spec.upper', /larger than the lower/],
    ['a general class beyond the table', { nominal: 2, spec: { type: 'general', generalClass: 'v' }, readings: [reading(2)] }, 'spec.generalClass', /no class v/],
    ['a moment on another entry’s clip', {}, 'timeNoteId', /this entry’s clips/],
  ])('refuses %s with 400 naming %s, saving nothing', async (_label, change, field, message) => {
    const before = await recordCount(entryId);
    const readingsBefore = await MeasurementReading.count();
    const body = _label.startsWith('a moment') ? spigot({ timeNoteId: foreignNoteId }) : spigot(change);
    const res = await post(owner, entryId, body);
    expect(res.status).toBe(400);
    const json = await res.json();
    expect(json.fieldErrors[field]?.[0]).toMatch(message);
    expect(json.message).toContain(field);
    expect(await recordCount(entryId)).toBe(before);
    expect(await MeasurementReading.count()).toBe(readingsBefore);
  });

  test('a body that is not JSON is a 400, not a 500', async () => {
    const res = await createRecord(request(`/api/entries/${entryId}/measurements`, { method: 'POST', cookie: owner.cookie, rawBody: '{nope' }), params({ id: String(entryId) }));
    expect(res.status).toBe(400);
  });
});

describe('who may do what', () => {
  let recordId: number;
  beforeAll(async () => {
    recordId = (await (await post(owner, entryId, spigot({ feature: 'Policy spigot' }))).json()).record.id;
  });

  test('signed out: reads a published log, 401 on every change', async () => {
    expect((await list(null, entryId)).status).toBe(200);
    expect((await get(null, recordId)).status).toBe(200);
    expect((await post(null, entryId, spigot())).status).toBe(401);
    expect((await patch(null, recordId, { feature: 'x', version: 1 })).status).toBe(401);
    expect((await del(null, recordId)).status).toBe(401);
    expect((await addR(null, recordId, reading(130.01))).status).toBe(401);
    expect((await pair(null, { holeRecordId: recordId, shaftRecordId: recordId })).status).toBe(401);
  });

  test('a stranger: 403 on a published log, 404 on a private one', async () => {
    expect((await post(other, entryId, spigot())).status).toBe(403);
    expect((await patch(other, recordId, { feature: 'Mine now', version: 1 })).status).toBe(403);
    expect((await del(other, recordId)).status).toBe(403);
    expect((await list(other, privateEntryId)).status).toBe(404);
    expect((await post(other, privateEntryId, spigot())).status).toBe(404);
    expect((await projectList(other, privateProjectId)).status).toBe(404);
    expect((await projectList(other, privateProjectId, '?format=csv')).status).toBe(404);
  });

  test('a mentor reads, but may not change the builder’s records (403)', async () => {
    expect((await list(mentor, privateEntryId)).status).toBe(200);
    expect((await post(mentor, entryId, spigot())).status).toBe(403);
    expect((await addR(mentor, recordId, reading(130.01))).status).toBe(403);
    const json = await (await get(mentor, recordId)).json();
    expect(json.canEdit).toBe(false);
    expect(json.candidates).toEqual([]);
  });

  test('the record is still as the builder left it', async () => {
    const json = await (await get(owner, recordId)).json();
    expect(json.record.feature).toBe('Policy spigot');
    expect(json.record.readings).toHaveLength(2);
    expect(json.canEdit).toBe(true);
  });
});

describe('editing', () => {
  let record: { id: number; version: number; readings: { id: number; version: number }[] };
  beforeAll(async () => {
    record = (await (await post(owner, entryId, spigot({ feature: 'Edited spigot' }))).json()).record;
  });

  test('a change with the current version saves and bumps it; a stale one is a 409 and changes nothing', async () => {
    const ok = await patch(owner, record.id, { feature: 'Spigot, second try', version: record.version });
    expect(ok.status).toBe(200);
    expect((await ok.json()).record.version).toBe(record.version + 1);
    const stale = await patch(owner, record.id, { feature: 'Lost edit', version: record.version });
    expect(stale.status).toBe(409);
    expect((await stale.json()).message).toMatch(/changed in another tab/);
    expect((await MeasurementRecord.findByPk(record.id))!.feature).toBe('Spigot, second try');
  });

  test('a new nominal nowhere near the stored readings is refused on nominal', async () => {
    const current = (await MeasurementRecord.findByPk(record.id))!;
    const res = await patch(owner, record.id, { nominal: 13, version: current.version });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.nominal[0]).toMatch(/Reading 1: .*nowhere near/);
    expect(Number((await MeasurementRecord.findByPk(record.id))!.nominal)).toBe(130);
  });

  test('readings: add, change with version, refuse a bad one, delete down to one', async () => {
    const added = await addR(owner, record.id, reading('130.015', { pass: 5, temperatureC: '28' }));
    expect(added.status).toBe(201);
    const view = (await added.json()).record;
    expect(view.readings).toHaveLength(3);
    expect(view.readings[2].temperature.warn).toBe(true); // 8 °C off on a 25 µm band — common practice
    const bad = await addR(owner, record.id, reading('1300.15'));
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.value[0]).toMatch(/nowhere near/);
    const zero = await addR(owner, record.id, reading('130.01', { resolution: '0' }));
    expect((await zero.json()).fieldErrors.resolution[0]).toMatch(/cannot be zero/);

    const r = view.readings[2];
    const changed = await patchR(owner, r.id, { value: 130.014, version: r.version });
    expect(changed.status).toBe(200);
    expect((await changed.json()).record.readings[2].valueText).toBe('130.014');
    expect((await patchR(owner, r.id, { value: 130.013, version: r.version })).status).toBe(409);
    expect((await patchR(other, r.id, { value: 130.013, version: r.version + 1 })).status).toBe(403);

    expect((await delR(owner, view.readings[0].id)).status).toBe(204);
    expect((await delR(owner, view.readings[1].id)).status).toBe(204);
    const last = await delR(owner, view.readings[2].id);
    expect(last.status).toBe(409);
    expect(await MeasurementReading.count({ where: { recordId: record.id } })).toBe(1);
  });
});

describe('pairs', () => {
  let shaftId: number, holeId: number, smallHoleId: number;
  beforeAll(async () => {
    shaftId = (await (await post(owner, entryId, spigot({ feature: 'Pair spigot' }))).json()).record.id;
    holeId = (
      await (
        await post(owner, entryId, {
          feature: 'Chuck recess', kind: 'inside', nominal: 130, unit: 'mm', spec: { type: 'zone', zone: 'H7' }, readings: [reading(130.015, { instrument: 'telescoping-gauge' })],
        })
      ).json()
    ).record.id;
    smallHoleId = (
      await (
        await post(owner, otherEntryId, {
          feature: 'Small recess', kind: 'inside', nominal: 129, unit: 'mm', spec: { type: 'zone', zone: 'H7' }, readings: [reading(129.01)],
        })
      ).json()
    ).record.id;
  });

  test('the record page offers the mating record as a candidate', async () => {
    const json = await (await get(owner, shaftId)).json();
    expect(json.candidates.map((c: { id: number }) => c.id)).toContain(holeId);
    expect(json.candidates.map((c: { id: number }) => c.id)).not.toContain(smallHoleId);
  });

  test('a hole and a shaft of the same nominal pair as a fit, judged', async () => {
    const res = await pair(owner, { holeRecordId: holeId, shaftRecordId: shaftId });
    expect(res.status).toBe(201);
    const { pair: p } = await res.json();
    expect(p.analysis.fit).toBe('H7/k6');
    expect(p.analysis.kind, ISO286).toBe('transition');
    expect([p.analysis.maxClearanceUm, p.analysis.minClearanceUm], ISO286).toEqual([37, -28]);
    expect(p.analysis.actualClearanceUm).toBe(3); // 130.015 − 130.012, by hand
    expect(p.analysis.actualState).toBe('within');
    expect((await pair(owner, { holeRecordId: holeId, shaftRecordId: shaftId })).status).toBe(409);

    // Paired: the nominal and the kind stay put.
    const v = (await MeasurementRecord.findByPk(shaftId))!.version;
    const moved = await patch(owner, shaftId, { nominal: 130.5, version: v });
    expect(moved.status).toBe(400);
    expect((await moved.json()).fieldErrors.nominal[0]).toMatch(/part of a fit/);

    expect((await unpair(other, p.id)).status).toBe(403);
    expect((await unpair(owner, p.id)).status).toBe(204);
    expect(await MeasurementPair.count({ where: { id: p.id } })).toBe(0);
  });

  test.each<[string, () => Record<string, number>, string, RegExp]>([
    ['different nominal sizes', () => ({ holeRecordId: smallHoleId, shaftRecordId: shaftId }), 'shaftRecordId', /same nominal size/],
    ['two outside features', () => ({ holeRecordId: shaftId, shaftRecordId: shaftId }), 'shaftRecordId', /two different records/],
    ['a shaft as the hole', () => ({ holeRecordId: shaftId, shaftRecordId: holeId }), 'holeRecordId', /inside/],
    ['a missing record', () => ({ holeRecordId: holeId, shaftRecordId: 999_999_999 }), 'shaftRecordId', /no measurement record/],
  ])('refuses %s naming %s', async (_label, body, field, message) => {
    const before = await MeasurementPair.count();
    const res = await pair(owner, body());
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors[field][0]).toMatch(message);
    expect(await MeasurementPair.count()).toBe(before);
  });

  test('records of another project do not pair', async () => {
    const foreign = (
      await (
        await post(owner, privateEntryId, {
          feature: 'Other recess', kind: 'inside', nominal: 130, unit: 'mm', spec: { type: 'zone', zone: 'H7' }, readings: [reading(130.01)],
        })
      ).json()
    ).record.id;
    const res = await pair(owner, { holeRecordId: foreign, shaftRecordId: shaftId });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.shaftRecordId[0]).toMatch(/same project/);
  });

  test('deleting a record takes its readings and fits with it', async () => {
    const p = (await (await pair(owner, { holeRecordId: holeId, shaftRecordId: shaftId })).json()).pair;
    expect((await del(owner, holeId)).status).toBe(204);
    expect(await MeasurementReading.count({ where: { recordId: holeId } })).toBe(0);
    expect(await MeasurementPair.count({ where: { id: p.id } })).toBe(0);
    expect((await get(owner, holeId)).status).toBe(404);
  });
});

describe('the project’s records and the CSV', () => {
  test('JSON lists every record of the project, judged', async () => {
    const res = await projectList(null, projectId);
    expect(res.status).toBe(200);
    const json = await res.json();
    expect(json.records.length).toBeGreaterThan(3);
    expect(json.canEdit).toBe(false);
    expect(json.records.every((r: { project: { id: number } }) => r.project.id === projectId)).toBe(true);
  });

  test('CSV: a header, one row per reading, both units, quoted per RFC 4180', async () => {
    await post(owner, otherEntryId, {
      feature: 'Bore, "as bored", first try', kind: 'inside', nominal: 36.9, unit: 'mm', spec: { type: 'limits', upper: 0.1, lower: 0 },
      readings: [reading('36.86', { instrument: 'caliper', resolution: '0.01', pass: 1, note: '=HYPERLINK("x")' }), reading('36.95', { instrument: 'caliper', resolution: '0.01', pass: 2 })],
    });
    const res = await projectList(owner, projectId, '?format=csv');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename=".*-measurements\.csv"/);
    const text = await res.text();
    expect(text.includes('\r\n'), RFC4180).toBe(true);
    const rows = parseCsv(text.replace(/^\uFEFF/, ''));
    const header = rows[0]!;
    const col = (name: string) => header.indexOf(name);
    expect(col('Feature')).toBeGreaterThan(-1);
    const bore = rows.filter((r) => r[col('Feature')] === 'Bore, "as bored", first try');
    expect(bore).toHaveLength(2);
    expect(bore[0]![col('Reading')]).toBe('36.86');
    expect(bore[0]![col('Verdict')]).toBe('Outside');
    expect(bore[0]![col('Outside by (mm)')]).toBe('0.040');
    expect(bore[0]![col('Outside by (in)')], INCH).toBe('0.0016'); // 0.04 / 25.4 = 0.00157
    expect(bore[0]![col('Note')]).toBe('\'=HYPERLINK("x")'); // a formula is kept as text
    expect(bore[1]![col('Verdict')]).toBe('Inside');
    expect(bore[1]![col('Lower limit (mm)')]).toBe('36.900');
    expect(bore[1]![col('Upper limit (in)')], INCH).toBe('1.4567'); // 37.0 / 25.4 = 1.45669
    expect(bore[1]![col('Latest reading')]).toBe('yes');
    expect(text).toContain('"Bore, ""as bored"", first try"');
  });

  test('an unknown format is a 400 naming it', async () => {
    const res = await projectList(owner, projectId, '?format=xls');
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.format).toBeDefined();
  });
});

describe('the demo data', () => {
  test('the demo records seed against a log like the demo’s: the spigot by passes, paired, one reading outside with a note', async () => {
    const project = await Project.create({
      ownerId: owner.id, slug: `meas-demo-${Date.now().toString(36)}-${process.pid}`, title: 'Demo copy', summary: '', units: 'mm', visibility: 'published', publishedAt: new Date(),
    });
    projects.push(project.id);
    const s1 = await ShopSession.create({ projectId: project.id, position: 0, title: 'One', heldOn: '2026-10-03', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'published' });
    const s2 = await ShopSession.create({ projectId: project.id, position: 1, title: 'Two', heldOn: '2026-10-10', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'published' });
    const s3 = await ShopSession.create({ projectId: project.id, position: 2, title: 'Three', heldOn: '2026-10-17', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'published' });
    const body = JSON.stringify({ type: 'doc', content: [] });
    await Entry.create({ sessionId: s1.id, position: 0, title: 'Facing the casting and checking for flaws', operation: 'facing', body });
    await Entry.create({ sessionId: s1.id, position: 1, title: 'Boring and screw-cutting 1½ × 8 TPI', operation: 'threading', body });
    const e21 = await Entry.create({ sessionId: s2.id, position: 0, title: 'Turning the spigot toward size', operation: 'turning', body });
    await Entry.create({ sessionId: s3.id, position: 0, title: 'Tapping M8 × 1.25', operation: 'tapping', body });
    const clip = await Media.create({ entryId: e21.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/d', name: 'd.mp4', mime: 'video/mp4', sizeBytes: 1, width: 1, height: 1, durationMs: 12_000, uploadedBy: owner.id });
    await TimeNote.create({ mediaId: clip.id, startMs: 4000, endMs: 8000, kind: 'measurement', text: 'Pass 3: spigot at 130.03 mm', authorId: owner.id });
    const final = await TimeNote.create({ mediaId: clip.id, startMs: 8000, endMs: null, kind: 'measurement', text: 'Final reading 130.012 mm with the plate at 21 °C', authorId: owner.id });

    const sequelize = initModels();
    await sequelize.transaction((transaction) => seedDemoMeasurements(project.id, transaction));

    const json = await (await projectList(null, project.id)).json();
    const byFeature = (f: string) => json.records.find((r: { feature: string }) => r.feature.startsWith(f));
    const sp = byFeature('Spigot diameter');
    expect(sp.readings.map((r: { valueText: string }) => r.valueText)).toEqual(['130.40', '130.100', '130.030', '130.012']);
    expect(sp.verdict.state).toBe('inside');
    expect(sp.readings[2].judgement).toMatchObject({ state: 'over', outsideByUm: 2 }); // 130.030 against +28 µm, ISO 286-2 k6 — from memory
    expect(sp.readings[2].note).toMatch(/Over by 0.002 mm/);
    expect(sp.timeNoteId).toBe(final.id);
    expect(sp.pairIds).toHaveLength(1);
    expect(json.pairs[0].analysis.actualState).toBe('within');
    expect(byFeature('Bore of the plate').limits.label).toBe('+0.1 / 0 mm');
    expect(byFeature('Tapped-hole depth').limits.upperUm, ISO2768).toBe(200); // class m, over 6 up to 30 mm: ±0.2
    expect(byFeature('Plate thickness').unit).toBe('in');
  });
});
