// The project forms' server actions against the real database: the same checks and answers as the JSON
// routes (POST /api/projects, PATCH|DELETE /api/projects/[id]), as states for useActionState.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { initModels, Project, User } from '@/db/models';
import { createProjectAction, deleteProjectAction, updateProjectAction } from '@/lib/actions/projects';
import { actionOutcome, formOf } from './permission-probes';

guardTestDatabase();

// Actions read the session and the Origin through next/headers, which exists only inside a Next request.
const req = vi.hoisted(() => ({ cookie: '', origin: '' }));
vi.mock('next/headers', () => ({
  cookies: async () => {
    const jar = new Map(req.cookie ? req.cookie.split('; ').map((c) => c.split('=', 2) as [string, string]) : []);
    return { get: (name: string) => (jar.has(name) ? { name, value: jar.get(name)! } : undefined), getAll: () => [...jar].map(([name, value]) => ({ name, value })) };
  },
  headers: async () => {
    const h = new Headers({ host: '127.0.0.1:3000' });
    if (req.cookie) h.set('cookie', req.cookie);
    if (req.origin) h.set('origin', req.origin);
    return h;
  },
}));
vi.mock('next/cache', () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

let builder: Awaited<ReturnType<typeof makeUser>>;
let other: Awaited<ReturnType<typeof makeUser>>;
const IDLE = { ok: true };

beforeAll(async () => {
  initModels();
  [builder, other] = await Promise.all([makeUser(), makeUser()]);
});

afterAll(async () => {
  const ids = [builder.id, other.id];
  await Project.destroy({ where: { ownerId: { [Op.in]: ids } } });
  await User.destroy({ where: { id: { [Op.in]: ids } } });
  await closeDb();
});

const as = (who: { cookie: string } | null, origin = '') => {
  req.cookie = who?.cookie ?? '';
  req.origin = origin;
};

describe('createProjectAction', () => {
  test('creates the project and hands back its slug', async () => {
    as(builder);
    const state = await createProjectAction(IDLE, formOf({ title: 'Tailstock die holder', summary: 'Holds a 1 in die square.', units: 'in', visibility: 'private' }));
    expect(state.ok).toBe(true);
    expect(state.data).toMatchObject({ title: 'Tailstock die holder', created: true });
    const row = await Project.findOne({ where: { slug: state.data!.slug } });
    expect(row?.ownerId).toBe(builder.id);
    expect(row?.units).toBe('in');
  });

  test('a title the schema refuses is a 400 naming the field, and nothing is saved', async () => {
    as(builder);
    const before = await Project.count({ where: { ownerId: builder.id } });
    const state = await createProjectAction(IDLE, formOf({ title: 'ab', summary: '', units: 'mm', visibility: 'private' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.title?.[0]).toMatch(/at least 3/);
    expect(await Project.count({ where: { ownerId: builder.id } })).toBe(before);
  });

  test('the same attempt key twice, even at once, makes one project', async () => {
    as(builder);
    const form = () => formOf({ title: 'Boring bar holder', summary: '', units: 'mm', visibility: 'private', requestId: `attempt-${Date.now()}` });
    const key = `attempt-${Date.now()}-${Math.random().toString(36).slice(2)}`;
    const f1 = form();
    const f2 = form();
    f1.set('requestId', key);
    f2.set('requestId', key);
    const [a, b] = await Promise.all([createProjectAction(IDLE, f1), createProjectAction(IDLE, f2)]);
    expect(a.ok && b.ok).toBe(true);
    expect(a.data!.slug).toBe(b.data!.slug);
    expect([a.data!.created, b.data!.created].sort()).toEqual([false, true]);
    expect(await Project.count({ where: { ownerId: builder.id, createRequestId: key } })).toBe(1);
  });

  test('signed out is a 401; a foreign Origin a 403; anything but a form a 400', async () => {
    as(null);
    expect(await createProjectAction(IDLE, formOf({ title: 'Nobody', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 401 });
    as(builder, 'https://elsewhere.example');
    expect(await createProjectAction(IDLE, formOf({ title: 'From elsewhere', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 403 });
    as(builder);
    expect(await createProjectAction(IDLE, { title: 'Not a form' } as unknown as FormData)).toMatchObject({ ok: false, status: 400 });
  });
});

describe('updateProjectAction and deleteProjectAction', () => {
  const make = async () =>
    Project.create({ ownerId: builder.id, slug: `act-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, title: 'Collet stop', summary: '', units: 'mm', visibility: 'private', publishedAt: null });

  test('saves with the version it was opened at and redirects to the list', async () => {
    const p = await make();
    as(builder);
    expect(await actionOutcome(() => updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version, title: 'Collet stop, 5C', summary: 'Threaded rod and a lock nut.', units: 'mm', visibility: 'unlisted' })))).toBe(200);
    await p.reload();
    expect(p.title).toBe('Collet stop, 5C');
    expect(p.visibility).toBe('unlisted');
  });

  test('a stale version is a 409 and changes nothing', async () => {
    const p = await make();
    as(builder);
    const state = await updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version + 5, title: 'Not this one', units: 'mm', visibility: 'private' }));
    expect(state).toMatchObject({ ok: false, status: 409 });
    await p.reload();
    expect(p.title).toBe('Collet stop');
  });

  test("another member's id is refused and changes nothing; a bad id is a 400 naming projectId", async () => {
    const p = await make();
    as(other);
    expect(await updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version, title: 'Taken over', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 404 });
    expect(await deleteProjectAction(IDLE, formOf({ projectId: p.id }))).toMatchObject({ ok: false, status: 404 });
    expect(await Project.count({ where: { id: p.id, title: 'Collet stop' } })).toBe(1);
    as(builder);
    const bad = await updateProjectAction(IDLE, formOf({ projectId: 'x1', version: 1, title: 'Whatever', units: 'mm', visibility: 'private' }));
    expect(bad).toMatchObject({ ok: false, status: 400 });
    expect(bad.fieldErrors?.projectId).toBeDefined();
  });

  test('the builder deletes it', async () => {
    const p = await make();
    as(builder);
    expect(await actionOutcome(() => deleteProjectAction(IDLE, formOf({ projectId: p.id })))).toBe(200);
    expect(await Project.count({ where: { id: p.id } })).toBe(0);
  });
});
