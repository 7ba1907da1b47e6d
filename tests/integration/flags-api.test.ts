import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listFlags, POST as postFlag } from '@/app/api/entries/[id]/flags/route';
import { PATCH as patchFlag, DELETE as deleteFlag } from '@/app/api/flags/[id]/route';
import { POST as acknowledge } from '@/app/api/flags/[id]/acknowledge/route';
import { POST as resolve } from '@/app/api/flags/[id]/resolve/route';
import { openFlagCounts, unansweredStopFlags } from '@/lib/server/flags';
import { initModels, Entry, Media, MeasurementRecord, OutboxMessage, Project, ProjectMembership, RiskFlag, ShopSession, TimeNote, User } from '@/db/models';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, mentor: U, mentor2: U, member: U;
const users: number[] = [];
const projects: number[] = [];
const TAG = `flags-${Date.now().toString(36)}-${process.pid}`;

type Log = { projectId: number; sessionId: number; entryId: number; noteId: number; recordId: number };
let log: Log, other: Log, hidden: Log;

async function makeLog(visibility: 'published' | 'private', tag: string): Promise<Log> {
  const project = await Project.create({
    ownerId: builder.id,
    slug: `${TAG}-${tag}`,
    title: `Backplate ${tag}`,
    summary: '',
    units: 'mm',
    visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
  await ProjectMembership.create({ projectId: project.id, userId: mentor2.id, role: 'mentor' });
  const session = await ShopSession.create({
    projectId: project.id, position: 0, title: 'Spigot', heldOn: '2026-10-10', minutesSpent: 90, planned: '', done: '', nextSteps: '',
    visibility, publishedAt: visibility === 'published' ? new Date() : null,
  });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: `First run ${tag}`, operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  const clip = await Media.create({
    entryId: entry.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/x', name: 'first run.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 60_000, uploadedBy: builder.id,
  });
  const note = await TimeNote.create({ mediaId: clip.id, startMs: 42_000, endMs: null, kind: 'caution', text: 'Chuck key out', authorId: builder.id });
  const record = await MeasurementRecord.create({
    entryId: entry.id, timeNoteId: null, feature: 'Spigot diameter', kind: 'outside', nominal: '130', unit: 'mm',
    specType: 'zone', specZone: 'js6', specUpper: null, specLower: null, specTolerance: null, specGeneralClass: null,
  });
  return { projectId: project.id, sessionId: session.id, entryId: entry.id, noteId: note.id, recordId: record.id };
}

const good = { target: 'entry', severity: 'warning', hazard: 'rotating-work', concern: 'The plate may not be seated on the shoulder.', instead: 'Seat it, take the key out, start slow and stand clear.' };

const post = (who: U | null, entryId: number, body: unknown) =>
  postFlag(request(`/api/entries/${entryId}/flags`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(entryId) }));
const list = (who: U | null, entryId: number) => listFlags(request(`/api/entries/${entryId}/flags`, { cookie: who?.cookie }), params({ id: String(entryId) }));
const patch = (who: U | null, id: number, body: unknown) => patchFlag(request(`/api/flags/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) }));
const del = (who: U | null, id: number) => deleteFlag(request(`/api/flags/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));
const ack = (who: U | null, id: number, body?: unknown) => acknowledge(request(`/api/flags/${id}/acknowledge`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const res = (who: U | null, id: number, body: unknown) => resolve(request(`/api/flags/${id}/resolve`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));

async function raise(body: unknown = good, entryId = log.entryId, who = mentor) {
  const r = await post(who, entryId, body);
  expect(r.status).toBe(201);
  return (await r.json()).flag as { id: number; version: number; status: string; target: { kind: string }; can: { edit: boolean; answer: boolean } };
}

const emailOf = async (u: U) => (await User.findByPk(u.id))!.email;

beforeAll(async () => {
  initModels();
  [builder, mentor, mentor2, member] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser()]);
  users.push(builder.id, mentor.id, mentor2.id, member.id);
  log = await makeLog('published', 'main');
  other = await makeLog('published', 'other');
  hidden = await makeLog('private', 'hidden');
});

afterAll(async () => {
  const emails = (await User.findAll({ where: { id: { [Op.in]: users } }, attributes: ['email'] })).map((u) => u.email);
  await OutboxMessage.destroy({ where: { toAddress: { [Op.in]: emails } } });
  // Flags, sessions, entries, notes and records go with their project (ON DELETE CASCADE).
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('raising a flag', () => {
  test('a mentor flags the entry: stored with its project, session and entry; the builder is e-mailed', async () => {
    const flag = await raise();
    expect(flag.status).toBe('open');
    expect(flag.target.kind).toBe('entry');
    const row = (await RiskFlag.findByPk(flag.id))!;
    expect([row.projectId, row.sessionId, row.entryId, row.mentorId]).toEqual([log.projectId, log.sessionId, log.entryId, mentor.id]);
    const mail = await OutboxMessage.findAll({ where: { toAddress: await emailOf(builder), kind: 'flag-raised' } });
    expect(mail.length).toBeGreaterThanOrEqual(1);
    expect(mail.some((m) => m.textBody.includes(good.concern) && m.textBody.includes(good.instead) && m.subject.startsWith('Warning:'))).toBe(true);
  });

  test('a mentor flags a note and a measurement record of the entry', async () => {
    const onNote = await raise({ ...good, target: { noteId: log.noteId }, severity: 'stop', hazard: 'flying-chips' });
    expect(onNote.target).toMatchObject({ kind: 'note', noteId: log.noteId, startMs: 42_000 });
    const onRecord = await raise({ ...good, target: { recordId: log.recordId }, severity: 'caution', hazard: 'other' });
    expect(onRecord.target).toMatchObject({ kind: 'measurement', recordId: log.recordId, feature: 'Spigot diameter' });
    expect(await unansweredStopFlags(log.sessionId)).toBe(1);
  });

  test('a note or record of another entry is refused with 400 naming the target, and nothing is saved', async () => {
    const before = await RiskFlag.count({ where: { entryId: log.entryId } });
    const n = await post(mentor, log.entryId, { ...good, target: { noteId: other.noteId } });
    expect(n.status).toBe(400);
    expect((await n.json()).fieldErrors['target.noteId']).toBeDefined();
    const r = await post(mentor, log.entryId, { ...good, target: { recordId: other.recordId } });
    expect(r.status).toBe(400);
    expect((await r.json()).fieldErrors['target.recordId']).toBeDefined();
    expect(await RiskFlag.count({ where: { entryId: log.entryId } })).toBe(before);
  });

  test('bad fields are named: severity, hazard, a missing "instead", an unknown target', async () => {
    const r = await post(mentor, log.entryId, { ...good, severity: 'panic', hazard: 'sharks', instead: '' });
    expect(r.status).toBe(400);
    const body = await r.json();
    expect(Object.keys(body.fieldErrors)).toEqual(expect.arrayContaining(['severity', 'hazard', 'instead']));
    const t = await post(mentor, log.entryId, { ...good, target: { mediaId: 1 } });
    expect(t.status).toBe(400);
    expect(Object.keys((await t.json()).fieldErrors)[0]).toMatch(/^target/);
    const long = await post(mentor, log.entryId, { ...good, concern: 'x'.repeat(2001) });
    expect(long.status).toBe(400);
  });

  test('only mentors flag: a member 403, the builder 403, signed out 401, an outsider to a private project 404', async () => {
    expect((await post(member, log.entryId, good)).status).toBe(403);
    expect((await post(builder, log.entryId, good)).status).toBe(403);
    expect((await post(null, log.entryId, good)).status).toBe(401);
    expect((await post(member, hidden.entryId, good)).status).toBe(404);
    expect((await list(member, hidden.entryId)).status).toBe(404);
    // A mentor of the private project can.
    await raise(good, hidden.entryId);
  });

  test('readers see the flags of a visible entry, without the controls', async () => {
    const r = await list(null, log.entryId);
    expect(r.status).toBe(200);
    const { flags } = await r.json();
    expect(flags.length).toBeGreaterThan(0);
    expect(flags.every((f: { can: { edit: boolean; answer: boolean } }) => !f.can.edit && !f.can.answer)).toBe(true);
  });
});

describe('answering a flag', () => {
  test('the builder acknowledges, then resolves with an answer; the mentor gets the answer by e-mail', async () => {
    const flag = await raise({ ...good, concern: 'Key left in the chuck on the first run.' });
    expect((await ack(mentor, flag.id)).status).toBe(403);
    expect((await ack(member, flag.id)).status).toBe(403);
    const a = await ack(builder, flag.id, { version: flag.version });
    expect(a.status).toBe(200);
    const acked = (await a.json()).flag;
    expect(acked.status).toBe('acknowledged');
    expect(acked.acknowledgedAt).not.toBeNull();
    // Acknowledging twice changes nothing.
    expect((await (await ack(builder, flag.id)).json()).flag.version).toBe(acked.version);

    const answer = `Key on a lanyard now, and I start at 60 rpm. ${TAG}`;
    expect((await res(mentor, flag.id, { answer, version: acked.version })).status).toBe(403);
    const empty = await res(builder, flag.id, { answer: ' ', version: acked.version });
    expect(empty.status).toBe(400);
    expect((await empty.json()).fieldErrors.answer).toBeDefined();
    const stale = await res(builder, flag.id, { answer, version: acked.version - 1 });
    expect(stale.status).toBe(409);
    expect((await RiskFlag.findByPk(flag.id))!.status).toBe('acknowledged');

    const r = await res(builder, flag.id, { answer, version: acked.version });
    expect(r.status).toBe(200);
    const done = (await r.json()).flag;
    expect(done.status).toBe('resolved');
    expect(done.answer).toBe(answer);

    const mail = await OutboxMessage.findAll({ where: { toAddress: await emailOf(mentor), kind: 'flag-answered', dedupeKey: `flag-answered:${flag.id}` } });
    expect(mail).toHaveLength(1);
    expect(mail[0].textBody).toContain(answer);
    expect(mail[0].textBody).toContain('Key left in the chuck on the first run.');
    expect(mail[0].textBody).toContain(`/entries/${log.entryId}#flag-${flag.id}`);

    // Answered is final: no second answer, no acknowledging, no changes, no withdrawing.
    expect((await res(builder, flag.id, { answer: 'again', version: done.version })).status).toBe(409);
    expect((await ack(builder, flag.id)).status).toBe(409);
    expect((await patch(mentor, flag.id, { concern: 'changed my mind', version: done.version })).status).toBe(409);
    expect((await del(mentor, flag.id)).status).toBe(409);
  });

  test('open counts leave resolved flags out and keep to the sessions asked for', async () => {
    const counts = await openFlagCounts(log.projectId, [log.sessionId]);
    const rows = await RiskFlag.count({ where: { projectId: log.projectId, status: { [Op.ne]: 'resolved' } } });
    expect(counts.total).toBe(rows);
    expect(counts.bySession[log.sessionId]).toBe(rows);
    expect((await openFlagCounts(log.projectId, [])).total).toBe(0);
  });
});

describe('the mentor’s own flag', () => {
  test('the mentor changes it (a stale version is 409); another mentor and the builder cannot', async () => {
    const flag = await raise();
    const ok = await patch(mentor, flag.id, { severity: 'stop', version: flag.version });
    expect(ok.status).toBe(200);
    const changed = (await ok.json()).flag;
    expect(changed.severity).toBe('stop');
    expect(changed.version).toBe(flag.version + 1);
    const stale = await patch(mentor, flag.id, { severity: 'caution', version: flag.version });
    expect(stale.status).toBe(409);
    expect((await patch(mentor2, flag.id, { severity: 'caution', version: changed.version })).status).toBe(403);
    expect((await patch(builder, flag.id, { severity: 'caution', version: changed.version })).status).toBe(403);
    expect((await patch(null, flag.id, { severity: 'caution', version: changed.version })).status).toBe(401);
    expect((await RiskFlag.findByPk(flag.id))!.severity).toBe('stop');
  });

  test('a change after the builder acknowledged asks them to look again (back to open)', async () => {
    const flag = await raise();
    const acked = (await (await ack(builder, flag.id)).json()).flag;
    const r = await patch(mentor, flag.id, { instead: 'Use the chuck guard too, and a board across the bed.', version: acked.version });
    expect(r.status).toBe(200);
    const changed = (await r.json()).flag;
    expect(changed.status).toBe('open');
    expect(changed.acknowledgedAt).toBeNull();
  });

  test('the mentor withdraws it; another mentor cannot', async () => {
    const flag = await raise();
    expect((await del(mentor2, flag.id)).status).toBe(403);
    expect((await del(builder, flag.id)).status).toBe(403);
    expect((await del(mentor, flag.id)).status).toBe(204);
    expect(await RiskFlag.findByPk(flag.id)).toBeNull();
    expect((await del(mentor, flag.id)).status).toBe(404);
  });
});
