// The measurement and risk-flag forms' server actions against the real database: the same checks and answers
// as their JSON routes (POST /api/entries/[id]/measurements, /api/measurements/..., /api/readings/[id],
// /api/entries/[id]/flags, /api/flags/[id]/...), read from the forms' fields, as states for useActionState.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { actAs } from '../support/action-request';
import { initModels, Entry, MeasurementPair, MeasurementReading, MeasurementRecord, Project, ProjectMembership, RiskFlag, ShopSession, User } from '@/db/models';
import {
  addReadingAction, createMeasurementAction, createPairAction, deleteMeasurementAction, deletePairAction, deleteReadingAction, updateMeasurementAction, updateReadingAction,
} from '@/lib/actions/measurements';
import { acknowledgeFlagAction, raiseFlagAction, resolveFlagAction, updateFlagAction, withdrawFlagAction } from '@/lib/actions/flags';
import { formOf } from './permission-probes';

guardTestDatabase();

// Server actions called directly: the request they see (tests/support/action-request.ts).
vi.mock('next/headers', () => import('../support/action-request').then((m) => m.fakeNextHeaders));
vi.mock('next/cache', () => import('../support/action-request').then((m) => m.fakeNextCache));

type Person = Awaited<ReturnType<typeof makeUser>>;
let builder: Person;
let mentor: Person;
let other: Person;
let entryId: number;
let slug: string;
const IDLE = { ok: true };

beforeAll(async () => {
  initModels();
  [builder, mentor, other] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  const p = await Project.create({
    ownerId: builder.id, slug: `rfa-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, title: 'Backplate', summary: '', units: 'mm', visibility: 'private', publishedAt: null,
  });
  slug = p.slug;
  await ProjectMembership.create({ projectId: p.id, userId: mentor.id, role: 'mentor' });
  const s = await ShopSession.create({
    projectId: p.id, position: 0, title: 'Spigot', heldOn: '2026-11-30', minutesSpent: 0, planned: '', done: '', nextSteps: '', visibility: 'private', publishedAt: null, announcedAt: null,
  });
  entryId = (await Entry.create({ sessionId: s.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) })).id;
});

afterAll(async () => {
  const ids = [builder.id, mentor.id, other.id];
  await Project.destroy({ where: { ownerId: { [Op.in]: ids } } });
  await User.destroy({ where: { id: { [Op.in]: ids } } });
  await closeDb();
});


/** The record form's fields as the browser posts them (react-hook-form's dotted names). */
const recordForm = (extra: Record<string, string | number> = {}) =>
  formOf({
    entryId, feature: 'Register spigot', kind: 'outside', nominal: '52', unit: 'mm', 'spec.type': 'zone', 'spec.zone': 'g6', timeNoteId: '',
    'readings.0.value': '52,005', 'readings.0.unit': 'mm', 'readings.0.instrument': 'micrometer', 'readings.0.resolution': '0.001',
    'readings.0.measuredBy': '', 'readings.0.measuredAt': '2026-11-30T09:15:00.000Z', 'readings.0.temperatureC': '', 'readings.0.pass': '1', 'readings.0.note': '',
    'readings.1.value': '51.985', 'readings.1.unit': 'mm', 'readings.1.instrument': 'micrometer', 'readings.1.resolution': '0.001', 'readings.1.pass': '2', 'readings.1.temperatureC': '21',
    ...extra,
  });

async function made(extra: Record<string, string | number> = {}) {
  actAs(builder);
  const state = await createMeasurementAction(IDLE, recordForm(extra));
  expect(state.ok, state.message).toBe(true);
  return state.data!;
}

/** Where a redirecting action sent the browser (next/navigation's redirect throws with it in its digest). */
async function redirectOf(run: () => Promise<unknown>): Promise<string | null> {
  try {
    await run();
    return null;
  } catch (err) {
    const digest = (err as { digest?: string }).digest ?? '';
    if (!digest.startsWith('NEXT_REDIRECT')) throw err;
    return digest.split(';')[2] ?? '';
  }
}

describe('measurement records', () => {
  test('a record with two readings from the form’s dotted fields: judged, in order, the time as sent', async () => {
    const record = await made();
    expect(record.feature).toBe('Register spigot');
    expect(record.limits.label).toBe('g6');
    // ISO 286-2:2010, 52 g6 = −10 / −29 µm (from memory): 51.971 to 51.990 mm; 52.005 (typed with a decimal comma) is over, 51.985 inside.
    expect(record.readings.map((r) => [r.valueText, r.judgement.state, r.pass])).toEqual([
      ['52.005', 'over', 1],
      ['51.985', 'inside', 2],
    ]);
    expect(record.readings[0]!.measuredAt).toBe('2026-11-30T09:15:00.000Z');
    expect(record.readings[1]!.temperatureC).toBe(21);
  });

  test('one bad reading is a 400 naming it, and nothing at all is saved', async () => {
    actAs(builder);
    const before = await MeasurementRecord.count({ where: { entryId } });
    const state = await createMeasurementAction(IDLE, recordForm({ feature: 'Half a record', 'readings.1.value': '5.2' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(Object.keys(state.fieldErrors ?? {})).toEqual(['readings.1.value']);
    expect(await MeasurementRecord.count({ where: { entryId } })).toBe(before);
    expect(await MeasurementRecord.count({ where: { feature: 'Half a record' } })).toBe(0);
  });

  test('a zone letter that does not match the side is a 400 naming spec.zone', async () => {
    actAs(builder);
    const state = await createMeasurementAction(IDLE, recordForm({ 'spec.zone': 'H7' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.['spec.zone']?.[0]).toBeTruthy();
  });

  test('field names that reach for a prototype or clash with another are a 400, never a 500', async () => {
    actAs(builder);
    const proto = recordForm({ '__proto__.polluted': 'yes' });
    expect(await createMeasurementAction(IDLE, proto)).toMatchObject({ ok: false, status: 400 });
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(await createMeasurementAction(IDLE, recordForm({ spec: 'zone' }))).toMatchObject({ ok: false, status: 400 });
    expect(await createMeasurementAction(IDLE, { entryId } as unknown as FormData)).toMatchObject({ ok: false, status: 400 });
  });

  test('edits with its version; a stale version is a 409 and changes nothing', async () => {
    const record = await made();
    actAs(builder);
    const saved = await updateMeasurementAction(IDLE, formOf({ recordId: record.id, version: record.version, feature: 'Register spigot, finished', kind: 'outside', nominal: '52', unit: 'mm', 'spec.type': 'zone', 'spec.zone': 'g6' }));
    expect(saved.ok, saved.message).toBe(true);
    expect(saved.data?.feature).toBe('Register spigot, finished');
    const stale = await updateMeasurementAction(IDLE, formOf({ recordId: record.id, version: record.version, feature: 'From an older tab' }));
    expect(stale).toMatchObject({ ok: false, status: 409 });
    expect((await MeasurementRecord.findByPk(record.id))?.feature).toBe('Register spigot, finished');
  });

  test('signed out is a 401, a foreign Origin a 403, someone outside the project a 404; nothing changes', async () => {
    const record = await made();
    actAs(null);
    expect(await updateMeasurementAction(IDLE, formOf({ recordId: record.id, version: record.version, feature: 'Nobody' }))).toMatchObject({ ok: false, status: 401 });
    actAs(builder, 'https://elsewhere.example');
    expect(await deleteMeasurementAction(IDLE, formOf({ recordId: record.id }))).toMatchObject({ ok: false, status: 403 });
    actAs(other);
    expect(await deleteMeasurementAction(IDLE, formOf({ recordId: record.id }))).toMatchObject({ ok: false, status: 404 });
    expect(await createMeasurementAction(IDLE, recordForm())).toMatchObject({ ok: false, status: 404 });
    expect(await MeasurementRecord.count({ where: { id: record.id, feature: 'Register spigot' } })).toBe(1);
  });

  test('deleting goes to the record’s entry, with its readings gone', async () => {
    const record = await made();
    actAs(builder);
    expect(await redirectOf(() => deleteMeasurementAction(IDLE, formOf({ recordId: record.id })))).toBe(`/logs/${slug}/entries/${entryId}`);
    expect(await MeasurementRecord.count({ where: { id: record.id } })).toBe(0);
    expect(await MeasurementReading.count({ where: { recordId: record.id } })).toBe(0);
  });
});

describe('readings', () => {
  test('adds one, changes it with its version, refuses a stale one, deletes it but never the last', async () => {
    const record = await made();
    actAs(builder);
    const added = await addReadingAction(IDLE, formOf({ recordId: record.id, 'readings.0.value': '51.982', 'readings.0.unit': 'mm', 'readings.0.instrument': 'micrometer', 'readings.0.resolution': '0.001', 'readings.0.pass': '3' }));
    expect(added.ok, added.message).toBe(true);
    const rows = await MeasurementReading.findAll({ where: { recordId: record.id }, order: [['position', 'ASC']] });
    expect(rows.map((r) => Number(r.value))).toEqual([52.005, 51.985, 51.982]);
    const third = rows[2]!;
    expect(await updateReadingAction(IDLE, formOf({ readingId: third.id, version: third.version, 'readings.0.note': 'Last spring pass.' }))).toMatchObject({ ok: true });
    expect(await updateReadingAction(IDLE, formOf({ readingId: third.id, version: third.version, 'readings.0.note': 'Older tab.' }))).toMatchObject({ ok: false, status: 409 });
    expect((await MeasurementReading.findByPk(third.id))?.note).toBe('Last spring pass.');

    for (const r of rows.slice(1)) expect((await deleteReadingAction(IDLE, formOf({ readingId: r.id }))).ok).toBe(true);
    expect(await deleteReadingAction(IDLE, formOf({ readingId: rows[0]!.id }))).toMatchObject({ ok: false, status: 409 });
    expect(await MeasurementReading.count({ where: { recordId: record.id } })).toBe(1);
  });

  test('a reading far from the nominal is a 400 naming value; a missing record id names recordId', async () => {
    const record = await made();
    actAs(builder);
    const far = await addReadingAction(IDLE, formOf({ recordId: record.id, 'readings.0.value': '5.2', 'readings.0.unit': 'mm', 'readings.0.instrument': 'caliper', 'readings.0.resolution': '0.01' }));
    expect(far).toMatchObject({ ok: false, status: 400 });
    expect(far.fieldErrors?.value?.[0]).toBeTruthy();
    const noId = await addReadingAction(IDLE, formOf({ 'readings.0.value': '51.99' }));
    expect(noId).toMatchObject({ ok: false, status: 400 });
    expect(noId.fieldErrors?.recordId).toBeDefined();
    expect(await MeasurementReading.count({ where: { recordId: record.id } })).toBe(2);
  });
});

describe('fits', () => {
  // ISO 286-2:2010 (from memory): 52 H7 = +30 / 0 µm, 52 g6 = −10 / −29 µm, so 52 H7/g6 is a clearance fit.
  test('pairs a bore with a spigot of the same size, refuses the same pair twice, unpairs', async () => {
    const shaft = await made();
    const hole = await made({ feature: 'Register bore', kind: 'inside', 'spec.zone': 'H7', 'readings.0.value': '52.012', 'readings.1.value': '52.013' });
    actAs(builder);
    expect(await createPairAction(IDLE, formOf({ holeRecordId: hole.id, shaftRecordId: shaft.id }))).toMatchObject({ ok: true });
    const again = await createPairAction(IDLE, formOf({ holeRecordId: hole.id, shaftRecordId: shaft.id }));
    expect(again).toMatchObject({ ok: false, status: 409 });
    const pair = await MeasurementPair.findOne({ where: { holeRecordId: hole.id, shaftRecordId: shaft.id } });
    expect(pair).not.toBeNull();
    expect(await deletePairAction(IDLE, formOf({ pairId: pair!.id }))).toMatchObject({ ok: true });
    expect(await MeasurementPair.count({ where: { id: pair!.id } })).toBe(0);
  });

  test('a record paired with itself names shaftRecordId', async () => {
    const shaft = await made();
    actAs(builder);
    const state = await createPairAction(IDLE, formOf({ holeRecordId: shaft.id, shaftRecordId: shaft.id }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.shaftRecordId).toBeDefined();
  });
});

describe('risk flags', () => {
  const raise = (extra: Record<string, string | number> = {}) =>
    raiseFlagAction(IDLE, formOf({ entryId, target: 'entry', severity: 'stop', hazard: 'rotating-work', concern: 'The chuck key is still in the chuck.', instead: 'Take it out and hang it up first.', ...extra }));

  test('the mentor raises a flag on a record; the builder sees it, then answers it; the mentor is mailed', async () => {
    const record = await made();
    actAs(mentor);
    const raised = await raise({ target: `record:${record.id}` });
    expect(raised.ok, raised.message).toBe(true);
    expect(raised.data?.target).toMatchObject({ kind: 'measurement', recordId: record.id });
    const flagId = raised.data!.id;

    actAs(builder);
    const seen = await acknowledgeFlagAction(IDLE, formOf({ flagId, version: raised.data!.version }));
    expect(seen).toMatchObject({ ok: true, data: { status: 'acknowledged' } });
    const short = await resolveFlagAction(IDLE, formOf({ flagId, version: seen.data!.version, answer: 'ok' }));
    expect(short).toMatchObject({ ok: false, status: 400 });
    expect(short.fieldErrors?.answer?.[0]).toMatch(/at least 3/);
    expect(await resolveFlagAction(IDLE, formOf({ flagId, version: raised.data!.version, answer: 'Key out and on its hook.' }))).toMatchObject({ ok: false, status: 409 });
    expect((await RiskFlag.findByPk(flagId))?.status).toBe('acknowledged');
    const answered = await resolveFlagAction(IDLE, formOf({ flagId, version: seen.data!.version, answer: 'Key out and on its hook.' }));
    expect(answered).toMatchObject({ ok: true, data: { status: 'resolved', answer: 'Key out and on its hook.' } });
  });

  test('a target that is not on this entry names target.noteId; nothing is raised', async () => {
    actAs(mentor);
    const before = await RiskFlag.count({ where: { entryId } });
    const state = await raise({ target: 'note:999999999' });
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.['target.noteId']).toBeDefined();
    const missing = await raise({ severity: '' });
    expect(missing).toMatchObject({ ok: false, status: 400 });
    expect(missing.fieldErrors?.severity).toBeDefined();
    expect(await RiskFlag.count({ where: { entryId } })).toBe(before);
  });

  test('only the mentor who raised it changes or withdraws it; the builder cannot raise one', async () => {
    actAs(mentor);
    const raised = await raise();
    const flagId = raised.data!.id;
    actAs(builder);
    expect(await raise()).toMatchObject({ ok: false, status: 403 });
    expect(await updateFlagAction(IDLE, formOf({ flagId, version: 1, concern: 'Changed by the builder.' }))).toMatchObject({ ok: false, status: 403 });
    expect(await withdrawFlagAction(IDLE, formOf({ flagId }))).toMatchObject({ ok: false, status: 403 });
    actAs(mentor);
    const changed = await updateFlagAction(IDLE, formOf({ flagId, version: 1, concern: 'The chuck key was left in the chuck at the first start.' }));
    expect(changed).toMatchObject({ ok: true, data: { concern: 'The chuck key was left in the chuck at the first start.', version: 2 } });
    expect((await withdrawFlagAction(IDLE, formOf({ flagId }))).ok).toBe(true);
    expect(await RiskFlag.count({ where: { id: flagId } })).toBe(0);
  });
});
