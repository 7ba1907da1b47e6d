import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listProjects, POST as createProject } from '@/app/api/projects/route';
import { GET as readProject, PATCH as patchProject, DELETE as deleteProject } from '@/app/api/projects/[id]/route';
import { initModels, Project, User, ProjectMembership } from '@/db/models';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, other: U, mentor: U, admin: U;
const createdUsers: number[] = [];

async function create(who: U | null, body: unknown) {
  return createProject(request('/api/projects', { method: 'POST', cookie: who?.cookie, body }), params({}));
}
const valid = { title: 'Spindle nose thread gauge', summary: 'A go gauge for the spindle thread.', units: 'mm', visibility: 'published' };

beforeAll(async () => {
  initModels();
  [owner, other, mentor, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser('admin')]);
  createdUsers.push(owner.id, other.id, mentor.id, admin.id);
});

afterAll(async () => {
  await Project.destroy({ where: { ownerId: { [Op.in]: createdUsers } } });
  await User.destroy({ where: { id: { [Op.in]: createdUsers } } });
  await closeDb();
});

describe('POST /api/projects', () => {
  test('signed out → 401', async () => {
    const res = await create(null, valid);
    expect(res.status).toBe(401);
    expect((await res.json()).error).toBe('unauthenticated');
  });

  test('bad input → 400 naming each bad field, nothing saved', async () => {
    const before = await Project.count({ where: { ownerId: owner.id } });
    const res = await create(owner, { title: 'x', units: 'furlongs', visibility: 'secret' });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors).sort()).toEqual(['title', 'units', 'visibility']);
    expect(body.fieldErrors.title[0]).toMatch(/at least 3 characters/);
    expect(await Project.count({ where: { ownerId: owner.id } })).toBe(before);
  });

  test('a body that is not JSON → 400, not 500', async () => {
    const res = await createProject(request('/api/projects', { method: 'POST', cookie: owner.cookie, rawBody: '{"title": ' }), params({}));
    expect(res.status).toBe(400);
    expect((await res.json()).message).toMatch(/not valid JSON/);
  });

  test('creates a project with a readable, unique slug', async () => {
    const a = await (await create(owner, valid)).json();
    const b = await (await create(owner, valid)).json();
    expect(a.project.slug).toBe('spindle-nose-thread-gauge');
    expect(b.project.slug).toBe('spindle-nose-thread-gauge-2');
    expect(a.project.owner.id).toBe(owner.id);
    expect(a.project.publishedAt).not.toBeNull();
  });
});

describe('GET /api/projects', () => {
  test('scope=mine needs a session', async () => {
    const res = await listProjects(request('/api/projects?scope=mine'), params({}));
    expect(res.status).toBe(401);
  });
  test('scope=mine lists only the signed-in builder’s projects', async () => {
    await create(other, { ...valid, title: 'Other builder’s vise jaws', visibility: 'private' });
    const res = await listProjects(request('/api/projects?scope=mine', { cookie: owner.cookie }), params({}));
    expect(res.status).toBe(200);
    const { projects } = await res.json();
    expect(projects.length).toBeGreaterThan(0);
    expect(projects.every((p: { owner: { id: number } }) => p.owner.id === owner.id)).toBe(true);
  });
  test('an unknown scope → 400 naming scope', async () => {
    const res = await listProjects(request('/api/projects?scope=everything'), params({}));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.scope).toBeDefined();
  });
  test('the public list never holds private or unlisted projects', async () => {
    const res = await listProjects(request('/api/projects'), params({}));
    const { projects } = await res.json();
    expect(projects.every((p: { visibility: string }) => p.visibility === 'published')).toBe(true);
  });
});

describe('/api/projects/[id]', () => {
  let privateId: number;
  let version: number;
  beforeAll(async () => {
    const { project } = await (await create(owner, { ...valid, title: 'Private fixture plate', visibility: 'private' })).json();
    privateId = project.id;
    version = project.version;
    await ProjectMembership.create({ projectId: privateId, userId: mentor.id, role: 'mentor' });
  });

  const read = (who: U | null, id: number | string = privateId) => readProject(request(`/api/projects/${id}`, { cookie: who?.cookie }), params({ id: String(id) }));

  test('a private project: 404 signed out and to another member; 200 to owner, mentor, admin', async () => {
    expect((await read(null)).status).toBe(404);
    expect((await read(other)).status).toBe(404);
    expect((await read(owner)).status).toBe(200);
    expect((await read(mentor)).status).toBe(200);
    expect((await read(admin)).status).toBe(200);
  });

  test('missing → 404; a non-numeric id → 400 naming id', async () => {
    expect((await read(owner, 99999999)).status).toBe(404);
    const bad = await read(owner, 'abc');
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.id).toBeDefined();
  });

  const patch = (who: U | null, body: unknown) =>
    patchProject(request(`/api/projects/${privateId}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(privateId) }));

  test('update: 401 signed out, 404 to a stranger, 403 to the mentor, 400 on bad input', async () => {
    expect((await patch(null, { title: 'Hijacked', version })).status).toBe(401);
    expect((await patch(other, { title: 'Hijacked', version })).status).toBe(404);
    expect((await patch(mentor, { title: 'Hijacked', version })).status).toBe(403);
    const bad = await patch(owner, { title: '', version });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.title).toBeDefined();
    expect((await Project.findByPk(privateId))!.title).toBe('Private fixture plate');
  });

  test('update by the owner bumps the version; a stale version → 409 and nothing changes', async () => {
    const ok = await patch(owner, { title: 'Fixture plate, rev B', visibility: 'unlisted', version });
    expect(ok.status).toBe(200);
    const { project } = await ok.json();
    expect(project.version).toBe(version + 1);
    expect(project.title).toBe('Fixture plate, rev B');
    const stale = await patch(owner, { title: 'From the other tab', version });
    expect(stale.status).toBe(409);
    expect((await stale.json()).message).toMatch(/changed elsewhere/);
    expect((await Project.findByPk(privateId))!.title).toBe('Fixture plate, rev B');
    // Unlisted now: anyone with the link may read it.
    expect((await read(null)).status).toBe(200);
  });

  test('delete: 401 signed out, 403 to the mentor, 204 to the owner, then 404', async () => {
    const del = (who: U | null) => deleteProject(request(`/api/projects/${privateId}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(privateId) }));
    expect((await del(null)).status).toBe(401);
    expect((await del(mentor)).status).toBe(403);
    expect((await del(owner)).status).toBe(204);
    expect((await read(owner)).status).toBe(404);
    expect(await ProjectMembership.count({ where: { projectId: privateId } })).toBe(0);
  });

  test('an admin may delete another builder’s project', async () => {
    const { project } = await (await create(other, { ...valid, title: 'Spam listing' })).json();
    const res = await deleteProject(request(`/api/projects/${project.id}`, { method: 'DELETE', cookie: admin.cookie }), params({ id: String(project.id) }));
    expect(res.status).toBe(204);
  });
});
