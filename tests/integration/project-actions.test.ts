// The project and session forms' server actions against the real database: the same checks and answers as the JSON
// routes (POST /api/projects, PATCH|DELETE /api/projects/[id]), as states for useActionState.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser } from '../support/db';
import { actAs } from '../support/action-request';
import { initModels, Project, ShopSession, User } from '@/db/models';
import { createProjectAction, deleteProjectAction, updateProjectAction } from '@/lib/actions/projects';
import { createSessionAction, deleteSessionAction, updateSessionAction } from '@/lib/actions/sessions';
import { actionOutcome, formOf } from './permission-probes';

guardTestDatabase();

// Server actions called directly: the request they see (tests/support/action-request.ts).
vi.mock('next/headers', () => import('../support/action-request').then((m) => m.fakeNextHeaders));
vi.mock('next/cache', () => import('../support/action-request').then((m) => m.fakeNextCache));

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


describe('createProjectAction', () => {
  test('creates the project and hands back its slug', async () => {
    actAs(builder);
    const state = await createProjectAction(IDLE, formOf({ title: 'Tailstock die holder', summary: 'Holds a 1 in die square.', units: 'in', visibility: 'private' }));
    expect(state.ok).toBe(true);
    expect(state.data).toMatchObject({ title: 'Tailstock die holder', created: true });
    const row = await Project.findOne({ where: { slug: state.data!.slug } });
    expect(row?.ownerId).toBe(builder.id);
    expect(row?.units).toBe('in');
  });

  test('a title the schema refuses is a 400 naming the field, and nothing is saved', async () => {
    actAs(builder);
    const before = await Project.count({ where: { ownerId: builder.id } });
    const state = await createProjectAction(IDLE, formOf({ title: 'ab', summary: '', units: 'mm', visibility: 'private' }));
    expect(state).toMatchObject({ ok: false, status: 400 });
    expect(state.fieldErrors?.title?.[0]).toMatch(/at least 3/);
    expect(await Project.count({ where: { ownerId: builder.id } })).toBe(before);
  });

  test('the same attempt key twice, even at once, makes one project', async () => {
    actAs(builder);
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
    actAs(null);
    expect(await createProjectAction(IDLE, formOf({ title: 'Nobody', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 401 });
    actAs(builder, 'https://elsewhere.example');
    expect(await createProjectAction(IDLE, formOf({ title: 'From elsewhere', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 403 });
    actAs(builder);
    expect(await createProjectAction(IDLE, { title: 'Not a form' } as unknown as FormData)).toMatchObject({ ok: false, status: 400 });
  });
});

describe('updateProjectAction and deleteProjectAction', () => {
  const make = async () =>
    Project.create({ ownerId: builder.id, slug: `act-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, title: 'Collet stop', summary: '', units: 'mm', visibility: 'private', publishedAt: null });

  test('saves with the version it was opened at and redirects to the list', async () => {
    const p = await make();
    actAs(builder);
    expect(await actionOutcome(() => updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version, title: 'Collet stop, 5C', summary: 'Threaded rod and a lock nut.', units: 'mm', visibility: 'unlisted' })))).toBe(200);
    await p.reload();
    expect(p.title).toBe('Collet stop, 5C');
    expect(p.visibility).toBe('unlisted');
  });

  test('a stale version is a 409 and changes nothing', async () => {
    const p = await make();
    actAs(builder);
    const state = await updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version + 5, title: 'Not this one', units: 'mm', visibility: 'private' }));
    expect(state).toMatchObject({ ok: false, status: 409 });
    await p.reload();
    expect(p.title).toBe('Collet stop');
  });

  test("another member's id is refused and changes nothing; a bad id is a 400 naming projectId", async () => {
    const p = await make();
    actAs(other);
    expect(await updateProjectAction(IDLE, formOf({ projectId: p.id, version: p.version, title: 'Taken over', units: 'mm', visibility: 'private' }))).toMatchObject({ ok: false, status: 404 });
    expect(await deleteProjectAction(IDLE, formOf({ projectId: p.id }))).toMatchObject({ ok: false, status: 404 });
    expect(await Project.count({ where: { id: p.id, title: 'Collet stop' } })).toBe(1);
    actAs(builder);
    const bad = await updateProjectAction(IDLE, formOf({ projectId: 'x1', version: 1, title: 'Whatever', units: 'mm', visibility: 'private' }));
    expect(bad).toMatchObject({ ok: false, status: 400 });
    expect(bad.fieldErrors?.projectId).toBeDefined();
  });

  test('the builder deletes it', async () => {
    const p = await make();
    actAs(builder);
    expect(await actionOutcome(() => deleteProjectAction(IDLE, formOf({ projectId: p.id })))).toBe(200);
    expect(await Project.count({ where: { id: p.id } })).toBe(0);
  });
});

describe('session actions', () => {
  const project = async () =>
    Project.create({ ownerId: builder.id, slug: `ses-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`, title: 'Faceplate', summary: '', units: 'mm', visibility: 'private', publishedAt: null });

  test('adds a session with no time noted, edits it with its version, refuses a stale one, deletes it', async () => {
    const p = await project();
    actAs(builder);
    const made = await createSessionAction(IDLE, formOf({ projectId: p.id, title: 'Facing the casting', heldOn: '2026-11-20', minutesSpent: '', planned: 'Face both sides.' }));
    expect(made.ok).toBe(true);
    expect(made.data).toMatchObject({ title: 'Facing the casting', heldOn: '2026-11-20', minutesSpent: 0, version: 1 });
    const sessionId = made.data!.id;
    const saved = await updateSessionAction(IDLE, formOf({ sessionId, version: 1, title: 'Facing the casting', heldOn: '2026-11-20', minutesSpent: 95, done: 'Both sides faced.' }));
    expect(saved.ok).toBe(true);
    expect((await ShopSession.findByPk(sessionId))?.minutesSpent).toBe(95);
    const stale = await updateSessionAction(IDLE, formOf({ sessionId, version: 1, title: 'Older tab', heldOn: '2026-11-20', minutesSpent: 10 }));
    expect(stale).toMatchObject({ ok: false, status: 409 });
    expect((await ShopSession.findByPk(sessionId))?.title).toBe('Facing the casting');
    expect((await deleteSessionAction(IDLE, formOf({ sessionId }))).ok).toBe(true);
    expect(await ShopSession.count({ where: { id: sessionId } })).toBe(0);
  });

  test('a bad date names heldOn; another member is refused; nothing is saved', async () => {
    const p = await project();
    actAs(builder);
    const bad = await createSessionAction(IDLE, formOf({ projectId: p.id, title: 'Undated', heldOn: '20/11/2026', minutesSpent: 30 }));
    expect(bad).toMatchObject({ ok: false, status: 400 });
    expect(bad.fieldErrors?.heldOn?.[0]).toMatch(/YYYY-MM-DD/);
    actAs(other);
    expect(await createSessionAction(IDLE, formOf({ projectId: p.id, title: 'Not my log', heldOn: '2026-11-20', minutesSpent: 30 }))).toMatchObject({ ok: false, status: 404 });
    expect(await ShopSession.count({ where: { projectId: p.id } })).toBe(0);
  });
});
