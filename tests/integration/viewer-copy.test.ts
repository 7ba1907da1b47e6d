import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as viewerRoute } from '@/app/api/me/viewer/route';
import { initModels, Project, ProjectMembership, User } from '@/db/models';

// Which copy of the published log's pages a member is given (lib/server/viewer.ts): the one cached for
// everyone ('shared') for a member outside every project's circle; their own for a builder, a mentor or an
// admin, who see more there. The answer sets the scribeline-copy cookie next.config.mjs's rewrites read.

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let reader: U, builder: U, mentor: U, admin: U, unverified: U;
let project: Project;
const stamp = `${Date.now().toString(36)}-${process.pid}`;

const ask = (cookie?: string) => viewerRoute(request('/api/me/viewer', { cookie }), params({}));

beforeAll(async () => {
  initModels();
  [reader, builder, mentor, admin, unverified] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser('admin'), makeUser('member', { verified: false })]);
  project = await Project.create({ ownerId: builder.id, slug: `viewer-copy-${stamp}`, title: `Viewer copy ${stamp}`, summary: '', units: 'mm', visibility: 'private', publishedAt: null });
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
});

afterAll(async () => {
  await ProjectMembership.destroy({ where: { projectId: project.id } });
  await Project.destroy({ where: { id: project.id } });
  await User.destroy({ where: { id: { [Op.in]: [reader.id, builder.id, mentor.id, admin.id, unverified.id] } } });
  await closeDb();
});

describe('GET /api/me/viewer', () => {
  test('a member outside every circle reads the shared copy; the cookie says so and is readable by the page', async () => {
    const res = await ask(reader.cookie);
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toMatch(/no-store/);
    const { viewer } = await res.json();
    const row = await User.findByPk(reader.id);
    expect(viewer).toEqual({ name: row!.name, handle: row!.handle, verified: true, manageUsers: false, copy: 'shared' });
    const cookie = res.headers.get('set-cookie') ?? '';
    expect(cookie).toMatch(/^scribeline-copy=shared;/);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).toMatch(/SameSite=lax/i);
    expect(cookie).not.toMatch(/HttpOnly/i);
  });

  test('the builder (even of a private project), a mentor and an admin are given their own copy', async () => {
    for (const who of [builder, mentor, admin]) {
      const res = await ask(who.cookie);
      expect((await res.json()).viewer.copy).toBe('own');
      expect(res.headers.get('set-cookie')).toMatch(/^scribeline-copy=own;/);
    }
    expect((await (await ask(admin.cookie)).json()).viewer.manageUsers).toBe(true);
  });

  test('a member who becomes a mentor is told so on the next ask (the page then reads their own copy)', async () => {
    const newcomer = await makeUser();
    try {
      expect((await (await ask(newcomer.cookie)).json()).viewer.copy).toBe('shared');
      await ProjectMembership.create({ projectId: project.id, userId: newcomer.id, role: 'mentor' });
      expect((await (await ask(newcomer.cookie)).json()).viewer.copy).toBe('own');
    } finally {
      await ProjectMembership.destroy({ where: { userId: newcomer.id } });
      await User.destroy({ where: { id: newcomer.id } });
    }
  });

  test('an unverified address is reported (the follow button then offers nothing to click)', async () => {
    expect((await (await ask(unverified.cookie)).json()).viewer.verified).toBe(false);
  });

  test('signed out, or with a cookie that no longer signs anyone in: null, and a stale copy cookie is cleared', async () => {
    const none = await ask();
    expect(none.status).toBe(200);
    expect(await none.json()).toEqual({ viewer: null });
    expect(none.headers.get('set-cookie')).toBeNull();

    const stale = await ask('scribeline-copy=shared; next-auth.session-token=not-a-token');
    expect(await stale.json()).toEqual({ viewer: null });
    expect(stale.headers.get('set-cookie')).toMatch(/^scribeline-copy=;.*(Max-Age=0|Expires=Thu, 01 Jan 1970)/i);
  });
});
