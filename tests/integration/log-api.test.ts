import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listSessionsRoute, POST as createSessionRoute } from '@/app/api/projects/[id]/sessions/route';
import { GET as getSessionRoute, PATCH as patchSessionRoute, DELETE as deleteSessionRoute } from '@/app/api/sessions/[id]/route';
import { POST as moveSessionRoute } from '@/app/api/sessions/[id]/move/route';
import { GET as listEntriesRoute, POST as createEntryRoute } from '@/app/api/sessions/[id]/entries/route';
import { GET as getEntryRoute, PATCH as patchEntryRoute, DELETE as deleteEntryRoute } from '@/app/api/entries/[id]/route';
import { POST as moveEntryRoute } from '@/app/api/entries/[id]/move/route';
import { initModels, Project, ProjectMembership, User, Entry, Media, TimeNote, ShopSession } from '@/db/models';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, other: U, mentor: U;
let publishedId: number, privateId: number;

const sessionBody = { title: 'Facing the blank', heldOn: '2026-11-02', minutesSpent: 95, planned: 'Face both sides.', done: '', nextSteps: '' };
const doc = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

const call = {
  createSession: (who: U | null, projectId: number, body: unknown) => createSessionRoute(request(`/api/projects/${projectId}/sessions`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(projectId) })),
  listSessions: (who: U | null, projectId: number) => listSessionsRoute(request(`/api/projects/${projectId}/sessions`, { cookie: who?.cookie }), params({ id: String(projectId) })),
  getSession: (who: U | null, id: number) => getSessionRoute(request(`/api/sessions/${id}`, { cookie: who?.cookie }), params({ id: String(id) })),
  patchSession: (who: U | null, id: number, body: unknown) => patchSessionRoute(request(`/api/sessions/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) })),
  deleteSession: (who: U | null, id: number) => deleteSessionRoute(request(`/api/sessions/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) })),
  moveSession: (who: U | null, id: number, body: unknown) => moveSessionRoute(request(`/api/sessions/${id}/move`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) })),
  createEntry: (who: U | null, sessionId: number, body: unknown) => createEntryRoute(request(`/api/sessions/${sessionId}/entries`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(sessionId) })),
  listEntries: (who: U | null, sessionId: number) => listEntriesRoute(request(`/api/sessions/${sessionId}/entries`, { cookie: who?.cookie }), params({ id: String(sessionId) })),
  getEntry: (who: U | null, id: number) => getEntryRoute(request(`/api/entries/${id}`, { cookie: who?.cookie }), params({ id: String(id) })),
  patchEntry: (who: U | null, id: number, body: unknown) => patchEntryRoute(request(`/api/entries/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) })),
  deleteEntry: (who: U | null, id: number) => deleteEntryRoute(request(`/api/entries/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) })),
  moveEntry: (who: U | null, id: number, body: unknown) => moveEntryRoute(request(`/api/entries/${id}/move`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) })),
};

beforeAll(async () => {
  initModels();
  [owner, other, mentor] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  const stamp = Date.now();
  publishedId = (await Project.create({ ownerId: owner.id, slug: `log-pub-${stamp}`, title: 'Published log', summary: '', units: 'mm', visibility: 'published', publishedAt: new Date() })).id;
  privateId = (await Project.create({ ownerId: owner.id, slug: `log-priv-${stamp}`, title: 'Private log', summary: '', units: 'in', visibility: 'private', publishedAt: null })).id;
  await ProjectMembership.create({ projectId: privateId, userId: mentor.id, role: 'mentor' });
});

afterAll(async () => {
  await Project.destroy({ where: { id: { [Op.in]: [publishedId, privateId] } } });
  await User.destroy({ where: { id: { [Op.in]: [owner.id, other.id, mentor.id] } } });
  await closeDb();
});

describe('sessions', () => {
  test('policy: 401 signed out, 403 to another member on a published project, 404 on a private one, 403 to a mentor', async () => {
    expect((await call.createSession(null, publishedId, sessionBody)).status).toBe(401);
    expect((await call.createSession(other, publishedId, sessionBody)).status).toBe(403);
    expect((await call.createSession(other, privateId, sessionBody)).status).toBe(404);
    expect((await call.createSession(mentor, privateId, sessionBody)).status).toBe(403);
    expect(await ShopSession.count({ where: { projectId: { [Op.in]: [publishedId, privateId] } } })).toBe(0);
  });

  test('bad input → 400 naming each field, nothing saved', async () => {
    const res = await call.createSession(owner, publishedId, { title: '', heldOn: '3 October', minutesSpent: -5 });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors).sort()).toEqual(['heldOn', 'minutesSpent', 'title']);
    expect(await ShopSession.count({ where: { projectId: publishedId } })).toBe(0);
  });

  test('create, read, list in order, update with a version, stale update → 409', async () => {
    const a = (await (await call.createSession(owner, publishedId, sessionBody)).json()).session;
    const b = (await (await call.createSession(owner, publishedId, { ...sessionBody, title: 'Boring the register' })).json()).session;
    expect([a.position, b.position]).toEqual([0, 1]);
    // A new session starts private: outsiders see nothing until the builder publishes it.
    expect((await call.getSession(null, a.id)).status).toBe(404);
    await ShopSession.update({ visibility: 'published' }, { where: { id: a.id } });
    const read = await call.getSession(null, a.id);
    expect(read.status).toBe(200);
    expect((await read.json()).session).toMatchObject({ title: 'Facing the blank', heldOn: '2026-11-02', minutesSpent: 95 });

    const ok = await call.patchSession(owner, a.id, { done: 'Both sides faced to 40.0 mm.', version: a.version });
    expect(ok.status).toBe(200);
    expect((await ok.json()).session.version).toBe(a.version + 1);
    const stale = await call.patchSession(owner, a.id, { done: 'Overwritten from an old tab', version: a.version });
    expect(stale.status).toBe(409);
    expect((await ShopSession.findByPk(a.id))!.done).toBe('Both sides faced to 40.0 mm.');

    const moved = await call.moveSession(owner, b.id, { position: 0 });
    expect(moved.status).toBe(200);
    const list = (await (await call.listSessions(owner, publishedId)).json()).sessions;
    // Signed out, only the published one is listed.
    expect((await (await call.listSessions(null, publishedId)).json()).sessions.map((s: { title: string }) => s.title)).toEqual(['Facing the blank']);
    expect(list.map((s: { title: string }) => s.title)).toEqual(['Boring the register', 'Facing the blank']);
    expect(list.map((s: { position: number }) => s.position)).toEqual([0, 1]);
  });

  test('a private project’s sessions: 404 to strangers, visible to the mentor', async () => {
    const s = (await (await call.createSession(owner, privateId, sessionBody)).json()).session;
    expect((await call.getSession(null, s.id)).status).toBe(404);
    expect((await call.getSession(other, s.id)).status).toBe(404);
    expect((await call.getSession(mentor, s.id)).status).toBe(200);
    expect((await call.listSessions(other, privateId)).status).toBe(404);
  });

  test('missing → 404, a bad id → 400 naming id', async () => {
    expect((await call.getSession(owner, 99999999)).status).toBe(404);
    const bad = await getSessionRoute(request('/api/sessions/abc', { cookie: owner.cookie }), params({ id: 'abc' }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.id).toBeDefined();
  });
});

describe('entries', () => {
  let sessionA: number, sessionB: number;
  beforeAll(async () => {
    sessionA = (await (await call.createSession(owner, publishedId, { ...sessionBody, title: 'Entries A' })).json()).session.id;
    sessionB = (await (await call.createSession(owner, publishedId, { ...sessionBody, title: 'Entries B' })).json()).session.id;
    await ShopSession.update({ visibility: 'published' }, { where: { id: [sessionA, sessionB] } });
  });

  test('create with a formatted body; bad operation or body → 400 naming the field', async () => {
    const bad = await call.createEntry(owner, sessionA, { title: 'x', operation: 'welding' });
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).fieldErrors).sort()).toEqual(['operation', 'title']);
    const badBody = await call.createEntry(owner, sessionA, { title: 'Facing', operation: 'facing', body: { type: 'doc', content: [{ type: 'marquee', content: [] }] } });
    expect(badBody.status).toBe(400);
    expect((await badBody.json()).fieldErrors.body).toBeDefined();
    expect(await Entry.count({ where: { sessionId: sessionA } })).toBe(0);

    const res = await call.createEntry(owner, sessionA, { title: 'Facing the back', operation: 'facing', body: doc('Light cuts under the scale.') });
    expect(res.status).toBe(201);
    const { entry } = await res.json();
    expect(entry).toMatchObject({ title: 'Facing the back', operation: 'facing', position: 0, version: 1, media: [], notes: [] });
    expect(JSON.stringify(entry.body)).toContain('Light cuts under the scale.');
  });

  test('autosave round trip with versions; a stale save → 409 and the saved text stays', async () => {
    const { entry } = await (await call.createEntry(owner, sessionA, { title: 'Boring', operation: 'boring' })).json();
    const first = await call.patchEntry(owner, entry.id, { body: doc('First draft'), version: entry.version });
    expect(first.status).toBe(200);
    const v2 = (await first.json()).entry.version;
    expect(v2).toBe(entry.version + 1);
    const stale = await call.patchEntry(owner, entry.id, { body: doc('From the other tab'), version: entry.version });
    expect(stale.status).toBe(409);
    expect((await stale.json()).message).toMatch(/another tab or on another device/);
    const now = (await (await call.getEntry(owner, entry.id)).json()).entry;
    expect(JSON.stringify(now.body)).toContain('First draft');
    expect(now.version).toBe(v2);
  });

  test('links with a javascript: address are stripped before storing', async () => {
    const { entry } = await (await call.createEntry(owner, sessionA, { title: 'Links', operation: 'other' })).json();
    const body = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] }] }] };
    const res = await call.patchEntry(owner, entry.id, { body, version: entry.version });
    expect(res.status).toBe(200);
    const stored = (await Entry.findByPk(entry.id))!.body;
    expect(stored).toContain('click');
    expect(stored).not.toContain('javascript:');
  });

  test("a body shows only this project's own uploaded photos, wherever they sit in it", async () => {
    const { entry } = await (await call.createEntry(owner, sessionA, { title: 'Photos', operation: 'turning' })).json();
    const photo = (entryId: number, kind: 'photo' | 'clip' = 'photo') =>
      Media.create({
        entryId, kind, source: 'upload', fileKey: `log-api-${Date.now()}-${Math.random()}`, url: 'pending', name: 'spigot.png',
        mime: kind === 'photo' ? 'image/png' : 'video/mp4', sizeBytes: 100, width: 4, height: 3, durationMs: kind === 'clip' ? 5000 : null, uploadedBy: owner.id,
      }).then(async (m) => {
        await m.update({ url: `/api/media/${m.id}/file` });
        return m;
      });
    const own = await photo(entry.id);
    const clip = await photo(entry.id, 'clip');
    // Another project's photo (the same builder's private log): named by its address, it is still not this log's.
    const elsewhere = await ShopSession.create({ projectId: privateId, position: 0, title: 'Elsewhere', heldOn: '2026-11-03', minutesSpent: 0, planned: '', done: '', nextSteps: '' });
    const otherEntry = await Entry.create({ sessionId: elsewhere.id, position: 0, title: 'Other log', operation: 'other', body: JSON.stringify(doc('')) });
    const foreign = await photo(otherEntry.id);
    const img = (m: { id: number }, pad = '') => ({ type: 'image', attrs: { src: `${pad}/api/media/${m.id}/file${pad}`, alt: `photo ${m.id}` } });
    const body = {
      type: 'doc',
      content: [
        img(own),
        img(foreign),
        img(clip),
        { type: 'image', attrs: { src: '/api/media/999999999/file' } },
        // Deep in a list, with spaces around the address (the editor's paste can leave them).
        { type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'after facing' }] }, img(own, ' ')] }] },
      ],
    };
    const res = await call.patchEntry(owner, entry.id, { body, version: entry.version });
    expect(res.status).toBe(200);
    const stored = JSON.parse((await Entry.findByPk(entry.id))!.body) as { content: { type: string; attrs?: { src: string }; content?: unknown[] }[] };
    const srcs = JSON.stringify(stored).match(/\/api\/media\/\d+\/file/g);
    expect(srcs).toEqual([`/api/media/${own.id}/file`, `/api/media/${own.id}/file`]);
    // A new entry's body goes through the same check.
    const created = await call.createEntry(owner, sessionA, { title: 'Photos again', operation: 'turning', body: { type: 'doc', content: [img(foreign), img(own)] } });
    expect(created.status).toBe(201);
    expect(JSON.stringify((await created.json()).entry.body).match(/\/api\/media\/\d+\/file/g)).toEqual([`/api/media/${own.id}/file`]);
  });

  test('policy on entries: signed out 401, stranger 403, reading a published entry is open', async () => {
    const { entry } = await (await call.createEntry(owner, sessionA, { title: 'Policy', operation: 'other' })).json();
    expect((await call.patchEntry(null, entry.id, { title: 'Nope', version: 1 })).status).toBe(401);
    expect((await call.patchEntry(other, entry.id, { title: 'Nope', version: 1 })).status).toBe(403);
    expect((await call.deleteEntry(other, entry.id)).status).toBe(403);
    expect((await call.getEntry(null, entry.id)).status).toBe(200);
  });

  test('reorder within a session and move to another session', async () => {
    const ids: number[] = [];
    for (const title of ['One', 'Two', 'Three']) ids.push((await (await call.createEntry(owner, sessionB, { title, operation: 'turning' })).json()).entry.id);
    const reordered = await call.moveEntry(owner, ids[2], { position: 0 });
    expect(reordered.status).toBe(200);
    expect((await reordered.json()).entries.map((e: { title: string }) => e.title)).toEqual(['Three', 'One', 'Two']);
    const moved = await call.moveEntry(owner, ids[0], { sessionId: sessionA, position: 0 });
    expect(moved.status).toBe(200);
    expect((await moved.json()).entries[0].title).toBe('One');
    const left = (await (await call.listEntries(owner, sessionB)).json()).entries;
    expect(left.map((e: { title: string; position: number }) => [e.title, e.position])).toEqual([['Three', 0], ['Two', 1]]);
    const elsewhere = (await (await call.createSession(owner, privateId, sessionBody)).json()).session.id;
    const refused = await call.moveEntry(owner, ids[1], { sessionId: elsewhere, position: 0 });
    expect(refused.status).toBe(400);
    expect((await refused.json()).fieldErrors.sessionId).toBeDefined();
  });

  test('deleting an entry removes its media and notes; deleting a session removes its entries', async () => {
    const { entry } = await (await call.createEntry(owner, sessionB, { title: 'With a clip', operation: 'turning' })).json();
    const clip = await Media.create({ entryId: entry.id, kind: 'clip', source: 'link', fileKey: null, url: 'https://video.example.test/watch?v=1', name: 'clip', mime: null, sizeBytes: null, width: null, height: null, durationMs: 60_000, uploadedBy: owner.id });
    await TimeNote.create({ mediaId: clip.id, startMs: 1000, endMs: null, kind: 'note', text: 'hello', authorId: owner.id });
    const counted = (await (await call.getEntry(owner, entry.id)).json()).entry;
    expect([counted.clipCount, counted.noteCount]).toEqual([1, 1]);
    expect((await call.deleteEntry(owner, entry.id)).status).toBe(204);
    expect(await Media.count({ where: { id: clip.id } })).toBe(0);
    expect(await TimeNote.count({ where: { mediaId: clip.id } })).toBe(0);
    expect((await call.getEntry(owner, entry.id)).status).toBe(404);

    expect((await call.deleteSession(owner, sessionB)).status).toBe(204);
    expect(await Entry.count({ where: { sessionId: sessionB } })).toBe(0);
    expect((await call.getSession(owner, sessionB)).status).toBe(404);
  });
});
