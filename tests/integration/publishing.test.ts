import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { PATCH as visibilityRoute } from '@/app/api/sessions/[id]/visibility/route';
import { GET as getSessionRoute, PATCH as patchSessionRoute } from '@/app/api/sessions/[id]/route';
import { GET as listSessionsRoute } from '@/app/api/projects/[id]/sessions/route';
import { GET as getEntryRoute } from '@/app/api/entries/[id]/route';
import { GET as projectMeasurementsRoute } from '@/app/api/projects/[id]/measurements/route';
import { GET as measurementRoute } from '@/app/api/measurements/[id]/route';
import { PATCH as patchProjectRoute } from '@/app/api/projects/[id]/route';
import { initModels, Entry, MeasurementPair, MeasurementReading, MeasurementRecord, Project, ProjectMembership, RiskFlag, ShopSession, User } from '@/db/models';
import { listRecentlyPublishedSessions } from '@/lib/server/publishing';
import { countProjectMeasurements } from '@/lib/server/measurements';

guardTestDatabase();

// Who sees which session, and publishing a session (with the "stop" flag rule). Data is made here
// and removed in afterAll; nothing else in the database is touched.

type U = Awaited<ReturnType<typeof makeUser>>;
type Vis = 'private' | 'unlisted' | 'published';
let owner: U, member: U, mentor: U, admin: U;
const projectIds: number[] = [];
const stamp = `${Date.now().toString(36)}-${process.pid}`;
const body = JSON.stringify({ type: 'doc', content: [] });

const call = {
  visibility: (who: U | null, id: number, b: unknown) => visibilityRoute(request(`/api/sessions/${id}/visibility`, { method: 'PATCH', cookie: who?.cookie, body: b }), params({ id: String(id) })),
  getSession: (who: U | null, id: number) => getSessionRoute(request(`/api/sessions/${id}`, { cookie: who?.cookie }), params({ id: String(id) })),
  patchSession: (who: U | null, id: number, b: unknown) => patchSessionRoute(request(`/api/sessions/${id}`, { method: 'PATCH', cookie: who?.cookie, body: b }), params({ id: String(id) })),
  list: (who: U | null, projectId: number) => listSessionsRoute(request(`/api/projects/${projectId}/sessions`, { cookie: who?.cookie }), params({ id: String(projectId) })),
  entry: (who: U | null, id: number) => getEntryRoute(request(`/api/entries/${id}`, { cookie: who?.cookie }), params({ id: String(id) })),
  table: (who: U | null, projectId: number, query = '') => projectMeasurementsRoute(request(`/api/projects/${projectId}/measurements${query}`, { cookie: who?.cookie }), params({ id: String(projectId) })),
  record: (who: U | null, id: number) => measurementRoute(request(`/api/measurements/${id}`, { cookie: who?.cookie }), params({ id: String(id) })),
};

async function makeProject(visibility: Vis, tag: string) {
  const p = await Project.create({ ownerId: owner.id, slug: `pub-${tag}-${stamp}`, title: `Publishing ${tag}`, summary: '', units: 'mm', visibility, publishedAt: visibility === 'published' ? new Date() : null });
  projectIds.push(p.id);
  await ProjectMembership.create({ projectId: p.id, userId: mentor.id, role: 'mentor' });
  return p;
}

let position = 0;
async function makeSession(projectId: number, visibility: Vis, title: string, publishedAt: Date | null = null) {
  return ShopSession.create({
    projectId, position: position++, title, heldOn: '2026-11-07', minutesSpent: 60, planned: '', done: `Done in ${title}.\nSecond line.`, nextSteps: '',
    visibility, publishedAt: publishedAt ?? (visibility === 'published' ? new Date() : null), announcedAt: visibility === 'published' ? new Date() : null,
  });
}

async function makeRecord(sessionId: number, feature: string, kind: 'outside' | 'inside') {
  const entry = await Entry.create({ sessionId, position: 0, title: `Entry for ${feature}`, operation: 'turning', body });
  const record = await MeasurementRecord.create({
    entryId: entry.id, feature, kind, nominal: '25.00000', unit: 'mm', specType: 'zone', specZone: kind === 'outside' ? 'g6' : 'H7',
  } as never);
  await MeasurementReading.create({ recordId: record.id, position: 0, passNumber: null, value: '24.99000', unit: 'mm', instrument: 'micrometer', resolution: '0.00100', measuredBy: 'Builder', measuredAt: new Date(), temperatureC: null, note: '' } as never);
  return { entry, record };
}

const titles = async (res: Response) => ((await res.json()).sessions as { title: string }[]).map((s) => s.title).sort();

beforeAll(async () => {
  initModels();
  [owner, member, mentor, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser('admin')]);
});

afterAll(async () => {
  await RiskFlag.destroy({ where: { projectId: { [Op.in]: projectIds } } });
  await Project.destroy({ where: { id: { [Op.in]: projectIds } } });
  await User.destroy({ where: { id: { [Op.in]: [owner.id, member.id, mentor.id, admin.id] } } });
  await closeDb();
});

describe('who sees which session', () => {
  let published: Project, unlisted: Project;
  const s: Record<string, ShopSession> = {};

  beforeAll(async () => {
    published = await makeProject('published', 'pub');
    unlisted = await makeProject('unlisted', 'unl');
    s.pubPrivate = await makeSession(published.id, 'private', 'P-private');
    s.pubUnlisted = await makeSession(published.id, 'unlisted', 'P-unlisted');
    s.pubPublished = await makeSession(published.id, 'published', 'P-published');
    s.unlPrivate = await makeSession(unlisted.id, 'private', 'U-private');
    s.unlUnlisted = await makeSession(unlisted.id, 'unlisted', 'U-unlisted');
    s.unlPublished = await makeSession(unlisted.id, 'published', 'U-published');
  });

  test('a private session is a 404 to outsiders, signed in or not, and open to the builder, a mentor and an admin', async () => {
    expect((await call.getSession(null, s.pubPrivate.id)).status).toBe(404);
    expect((await call.getSession(member, s.pubPrivate.id)).status).toBe(404);
    for (const who of [owner, mentor, admin]) expect((await call.getSession(who, s.pubPrivate.id)).status).toBe(200);
    // ...and so is everything under it.
    const entry = await Entry.create({ sessionId: s.pubPrivate.id, position: 0, title: 'Hidden entry', operation: 'facing', body });
    expect((await call.entry(null, entry.id)).status).toBe(404);
    expect((await call.entry(owner, entry.id)).status).toBe(200);
  });

  test('an unlisted session opens by its link for anyone', async () => {
    expect((await call.getSession(null, s.pubUnlisted.id)).status).toBe(200);
    expect((await call.getSession(null, s.unlUnlisted.id)).status).toBe(200);
  });

  test('a published project lists only its published sessions to outsiders; its circle sees all, each with its visibility', async () => {
    expect(await titles(await call.list(null, published.id))).toEqual(['P-published']);
    expect(await titles(await call.list(member, published.id))).toEqual(['P-published']);
    for (const who of [owner, mentor, admin]) expect(await titles(await call.list(who, published.id))).toEqual(['P-private', 'P-published', 'P-unlisted']);
    const all = (await (await call.list(owner, published.id)).json()).sessions as { title: string; visibility: Vis; publishedAt: string | null }[];
    expect(all.find((x) => x.title === 'P-private')).toMatchObject({ visibility: 'private', publishedAt: null });
    expect(all.find((x) => x.title === 'P-published')!.visibility).toBe('published');
  });

  test('an unlisted project lists its unlisted and published sessions to whoever has the link', async () => {
    expect(await titles(await call.list(null, unlisted.id))).toEqual(['U-published', 'U-unlisted']);
    expect(await titles(await call.list(owner, unlisted.id))).toEqual(['U-private', 'U-published', 'U-unlisted']);
  });

  test('the measurements table, its CSV and its count leave out what the timeline leaves out', async () => {
    const seen = await makeRecord(s.pubPublished.id, `Spigot seen ${stamp}`, 'outside');
    const hidden = await makeRecord(s.pubPrivate.id, `Bore hidden ${stamp}`, 'inside');
    await MeasurementPair.create({ holeRecordId: hidden.record.id, shaftRecordId: seen.record.id } as never);

    const outsider = await (await call.table(null, published.id)).json();
    expect(outsider.records.map((r: { feature: string }) => r.feature)).toEqual([`Spigot seen ${stamp}`]);
    // The fit's other half sits in a private session: neither it nor the fit shows.
    expect(outsider.pairs).toEqual([]);
    expect(outsider.records[0].pairIds).toEqual([]);
    const csv = await (await call.table(null, published.id, '?format=csv')).text();
    expect(csv).toContain(`Spigot seen ${stamp}`);
    expect(csv).not.toContain(`Bore hidden ${stamp}`);
    expect(await countProjectMeasurements(null, published.id)).toBe(1);

    const builder = await (await call.table(owner, published.id)).json();
    expect(builder.records.map((r: { feature: string }) => r.feature).sort()).toEqual([`Bore hidden ${stamp}`, `Spigot seen ${stamp}`]);
    expect(builder.pairs).toHaveLength(1);
    expect(await countProjectMeasurements({ id: owner.id, siteRole: 'member' }, published.id)).toBe(2);

    // The record page of the visible half does not show the hidden one either; the hidden record is a 404.
    const page = await (await call.record(null, seen.record.id)).json();
    expect(page.pairs).toEqual([]);
    expect(page.record.pairIds).toEqual([]);
    expect((await call.record(null, hidden.record.id)).status).toBe(404);
  });
});

describe('the home page list', () => {
  test('only sessions that are published in a published project, newest publishedAt first', async () => {
    const published = await makeProject('published', 'home-pub');
    const unlisted = await makeProject('unlisted', 'home-unl');
    // Dates ahead of anything else in the test database, so these come first whatever else is there.
    const later = (days: number) => new Date(Date.now() + days * 86_400_000);
    const older = await makeSession(published.id, 'published', `Home older ${stamp}`, later(300));
    const newer = await makeSession(published.id, 'published', `Home newer ${stamp}`, later(301));
    await makeSession(published.id, 'unlisted', `Home unlisted session ${stamp}`, later(302));
    await makeSession(unlisted.id, 'published', `Home in unlisted project ${stamp}`, later(303));
    const hidden = await makeSession(published.id, 'private', `Home private ${stamp}`);
    await hidden.update({ publishedAt: later(304) }); // published once, private again: not listed

    const list = await listRecentlyPublishedSessions(null, 50);
    const mine = list.filter((x) => x.title.endsWith(stamp));
    expect(mine.map((x) => x.title)).toEqual([`Home newer ${stamp}`, `Home older ${stamp}`]);
    expect(mine[0]).toMatchObject({ id: newer.id, summary: `Done in Home newer ${stamp}.`, project: { slug: published.slug }, builder: { id: owner.id } });
    expect(list.slice(0, 2).map((x) => x.id)).toEqual([newer.id, older.id]);
  });
});

describe('setting a session’s visibility', () => {
  let project: Project;
  let session: ShopSession;

  beforeAll(async () => {
    project = await makeProject('published', 'set');
    session = await makeSession(project.id, 'private', 'To publish');
  });

  test('signed out 401; an outsider 404 (the session is private); a mentor or another member 403 once it is visible', async () => {
    expect((await call.visibility(null, session.id, { visibility: 'published' })).status).toBe(401);
    expect((await call.visibility(member, session.id, { visibility: 'published' })).status).toBe(404);
    expect((await call.visibility(mentor, session.id, { visibility: 'published' })).status).toBe(403);
    await session.update({ visibility: 'unlisted' });
    expect((await call.visibility(member, session.id, { visibility: 'published' })).status).toBe(403);
    await session.update({ visibility: 'private' });
    expect((await call.visibility(owner, 999_999_999, { visibility: 'published' })).status).toBe(404);
    expect((await ShopSession.findByPk(session.id))!.visibility).toBe('private');
  });

  test('bad input is a 400 naming the field; the session PATCH cannot change visibility', async () => {
    const res = await call.visibility(owner, session.id, { visibility: 'everyone' });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.visibility).toBeDefined();
    expect((await call.visibility(owner, session.id, {})).status).toBe(400);
    const patched = await call.patchSession(owner, session.id, { visibility: 'published', version: session.version });
    expect(patched.status).toBe(200);
    expect((await ShopSession.findByPk(session.id))!.visibility).toBe('private');
  });

  test('publishing sets publishedAt the first time only; a stale version is a 409', async () => {
    const first = await call.visibility(owner, session.id, { visibility: 'published' });
    expect(first.status).toBe(200);
    const { session: view } = await first.json();
    expect(view.visibility).toBe('published');
    expect(view.publishedAt).not.toBeNull();
    const firstAt = (await ShopSession.findByPk(session.id))!.publishedAt!.getTime();
    expect((await call.visibility(owner, session.id, { visibility: 'unlisted' })).status).toBe(200);
    expect((await call.visibility(owner, session.id, { visibility: 'published' })).status).toBe(200);
    expect((await ShopSession.findByPk(session.id))!.publishedAt!.getTime()).toBe(firstAt);
    const fresh = (await ShopSession.findByPk(session.id))!;
    expect((await call.visibility(owner, session.id, { visibility: 'private', version: fresh.version + 1 })).status).toBe(409);
    expect((await ShopSession.findByPk(session.id))!.visibility).toBe('published');
  });

  test('an unanswered "stop" flag keeps the session from being published: 409 naming how many', async () => {
    const s = await makeSession(project.id, 'private', 'Flagged');
    const entry = await Entry.create({ sessionId: s.id, position: 0, title: 'First power-on', operation: 'turning', body });
    const flag = (severity: 'caution' | 'warning' | 'stop', status: 'open' | 'acknowledged' | 'resolved') =>
      RiskFlag.create({ projectId: project.id, sessionId: s.id, entryId: entry.id, targetKind: 'entry', noteId: null, recordId: null, mentorId: mentor.id, severity, hazard: 'rotating-work', concern: 'Chuck key left in.', instead: 'Remove the key first.', status });

    await flag('caution', 'open'); // not a stop: does not hold publishing back
    await flag('stop', 'resolved'); // answered: does not either
    const one = await flag('stop', 'open');
    let res = await call.visibility(owner, s.id, { visibility: 'published' });
    expect(res.status).toBe(409);
    let json = await res.json();
    expect(json.message).toMatch(/an unanswered “stop” flag/);
    expect(json.fieldErrors.visibility[0]).toMatch(/stop/);
    await flag('stop', 'acknowledged'); // acknowledged but not resolved still counts
    res = await call.visibility(owner, s.id, { visibility: 'published' });
    expect(res.status).toBe(409);
    json = await res.json();
    expect(json.message).toMatch(/2 unanswered “stop” flags/);
    expect((await ShopSession.findByPk(s.id))!.visibility).toBe('private');
    // Unlisted is still allowed (the builder may share it with someone by link).
    expect((await call.visibility(owner, s.id, { visibility: 'unlisted' })).status).toBe(200);

    await RiskFlag.update({ status: 'resolved', resolvedAt: new Date(), answer: 'Key out, plate seated.' }, { where: { sessionId: s.id, severity: 'stop' } });
    expect(one.id).toBeGreaterThan(0);
    res = await call.visibility(owner, s.id, { visibility: 'published' });
    expect(res.status).toBe(200);
  });
});

describe('publishing a project', () => {
  test('refused while one of its published sessions carries an unanswered "stop" flag; nothing changes', async () => {
    const p = await makeProject('private', 'stop-project');
    const s = await makeSession(p.id, 'published', 'Ready but flagged');
    const entry = await Entry.create({ sessionId: s.id, position: 0, title: 'First start with the new plate', operation: 'turning', body });
    await RiskFlag.create({ projectId: p.id, sessionId: s.id, entryId: entry.id, targetKind: 'entry', noteId: null, recordId: null, mentorId: mentor.id, severity: 'stop', hazard: 'rotating-work', concern: 'Plate not seated.', instead: 'Seat it against the shoulder first.' });
    const publish = () => patchProjectRoute(request(`/api/projects/${p.id}`, { method: 'PATCH', cookie: owner.cookie, body: { visibility: 'published', version: p.version } }), params({ id: String(p.id) }));
    const res = await publish();
    expect(res.status).toBe(409);
    const json = await res.json();
    expect(json.message).toMatch(/stop/);
    expect(json.fieldErrors.visibility[0]).toMatch(/stop/);
    expect((await Project.findByPk(p.id))!.visibility).toBe('private');
    await RiskFlag.update({ status: 'resolved', resolvedAt: new Date(), answer: 'Seated and checked.' }, { where: { sessionId: s.id } });
    expect((await publish()).status).toBe(200);
    expect((await Project.findByPk(p.id))!.visibility).toBe('published');
  });
});
