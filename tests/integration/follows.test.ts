import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as projectFollowGet, POST as followProjectRoute, DELETE as unfollowProjectRoute } from '@/app/api/projects/[id]/follow/route';
import { GET as builderFollowGet, POST as followBuilderRoute, DELETE as unfollowBuilderRoute } from '@/app/api/builders/[handle]/follow/route';
import { GET as profileRoute } from '@/app/api/builders/[handle]/route';
import { GET as myFollowsRoute, PATCH as allMailRoute } from '@/app/api/me/follows/route';
import { PATCH as followMailRoute, DELETE as deleteFollowRoute } from '@/app/api/me/follows/[id]/route';
import { POST as unsubscribeRoute } from '@/app/api/unsubscribe/route';
import { initModels, Follow, Project, ShopSession, User } from '@/db/models';
import { readUnsubscribeToken, unsubscribeToken } from '@/lib/server/unsubscribe';
import { describeUnsubscribe } from '@/lib/server/follows';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, reader: U, other: U;
let builderHandle: string;
let published: Project, privateProject: Project;
const stamp = `${Date.now().toString(36)}-${process.pid}`;

const call = {
  projectState: (who: U | null, id: number | string) => projectFollowGet(request(`/api/projects/${id}/follow`, { cookie: who?.cookie }), params({ id: String(id) })),
  followProject: (who: U | null, id: number | string) => followProjectRoute(request(`/api/projects/${id}/follow`, { method: 'POST', cookie: who?.cookie }), params({ id: String(id) })),
  unfollowProject: (who: U | null, id: number | string) => unfollowProjectRoute(request(`/api/projects/${id}/follow`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) })),
  builderState: (who: U | null, handle: string) => builderFollowGet(request(`/api/builders/${handle}/follow`, { cookie: who?.cookie }), params({ handle })),
  followBuilder: (who: U | null, handle: string) => followBuilderRoute(request(`/api/builders/${handle}/follow`, { method: 'POST', cookie: who?.cookie }), params({ handle })),
  unfollowBuilder: (who: U | null, handle: string) => unfollowBuilderRoute(request(`/api/builders/${handle}/follow`, { method: 'DELETE', cookie: who?.cookie }), params({ handle })),
  profile: (who: U | null, handle: string) => profileRoute(request(`/api/builders/${handle}`, { cookie: who?.cookie }), params({ handle })),
  mine: (who: U | null) => myFollowsRoute(request('/api/me/follows', { cookie: who?.cookie }), params({})),
  allMail: (who: U | null, body: unknown) => allMailRoute(request('/api/me/follows', { method: 'PATCH', cookie: who?.cookie, body }), params({})),
  mail: (who: U | null, id: number, body: unknown) => followMailRoute(request(`/api/me/follows/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) })),
  remove: (who: U | null, id: number) => deleteFollowRoute(request(`/api/me/follows/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) })),
  unsubscribe: (body: unknown, cookie?: string) => unsubscribeRoute(request('/api/unsubscribe', { method: 'POST', cookie, body }), params({})),
};

beforeAll(async () => {
  initModels();
  [builder, reader, other] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  builderHandle = (await User.findByPk(builder.id))!.handle;
  published = await Project.create({ ownerId: builder.id, slug: `follow-pub-${stamp}`, title: `Followed plate ${stamp}`, summary: 'A plate.', units: 'mm', visibility: 'published', publishedAt: new Date() });
  privateProject = await Project.create({ ownerId: builder.id, slug: `follow-priv-${stamp}`, title: `Private jig ${stamp}`, summary: '', units: 'in', visibility: 'private', publishedAt: null });
});

afterAll(async () => {
  await Project.destroy({ where: { id: { [Op.in]: [published.id, privateProject.id] } } });
  await User.destroy({ where: { id: { [Op.in]: [builder.id, reader.id, other.id] } } });
  await closeDb();
});

describe('following a project', () => {
  test('signed out 401; the builder 403; a private project 404; a bad id 400; nothing stored', async () => {
    const anon = await call.followProject(null, published.id);
    expect(anon.status).toBe(401);
    expect((await anon.json()).message).toMatch(/Sign in to follow/);
    const own = await call.followProject(builder, published.id);
    expect(own.status).toBe(403);
    expect((await own.json()).message).toMatch(/own project/);
    expect((await call.followProject(reader, privateProject.id)).status).toBe(404);
    expect((await call.followProject(reader, 999_999_999)).status).toBe(404);
    expect((await call.followProject(reader, 'abc')).status).toBe(400);
    expect(await Follow.count({ where: { projectId: { [Op.in]: [published.id, privateProject.id] } } })).toBe(0);
  });

  test('a member follows (201), again is harmless (200), sees it in their state, and unfollows (204)', async () => {
    const first = await call.followProject(reader, published.id);
    expect(first.status).toBe(201);
    expect((await first.json()).follow).toMatchObject({ following: true, mail: true, followers: 1 });
    expect((await call.followProject(reader, published.id)).status).toBe(200);
    expect(await Follow.count({ where: { userId: reader.id, projectId: published.id } })).toBe(1);
    expect((await (await call.projectState(other, published.id)).json()).follow).toMatchObject({ following: false, followers: 1 });
    expect((await call.unfollowProject(null, published.id)).status).toBe(401);
    expect((await call.unfollowProject(reader, published.id)).status).toBe(204);
    expect(await Follow.count({ where: { userId: reader.id, projectId: published.id } })).toBe(0);
    // Unfollowing what you do not follow on a private project answers like reading it: 404.
    expect((await call.unfollowProject(reader, privateProject.id)).status).toBe(404);
  });
});

describe('following a builder', () => {
  test('signed out 401; yourself 400 naming why; an unknown handle 404', async () => {
    expect((await call.followBuilder(null, builderHandle)).status).toBe(401);
    const self = await call.followBuilder(builder, builderHandle);
    expect(self.status).toBe(400);
    const json = await self.json();
    expect(json.message).toMatch(/cannot follow yourself/);
    expect(json.fieldErrors.handle).toBeDefined();
    expect((await call.followBuilder(reader, `nobody-${stamp}`)).status).toBe(404);
    expect(await Follow.count({ where: { builderId: builder.id } })).toBe(0);
  });

  test('follow (201), state, unfollow (204)', async () => {
    expect((await call.followBuilder(reader, builderHandle)).status).toBe(201);
    expect((await (await call.builderState(reader, builderHandle)).json()).follow).toMatchObject({ following: true, mail: true, followers: 1 });
    expect((await call.unfollowBuilder(reader, builderHandle)).status).toBe(204);
    expect((await (await call.builderState(reader, builderHandle)).json()).follow.following).toBe(false);
  });

  test('the public profile lists published projects only, counting their published sessions only', async () => {
    await ShopSession.bulkCreate([
      { projectId: published.id, position: 0, title: 'One', heldOn: '2026-10-03', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date() },
      { projectId: published.id, position: 1, title: 'Two', heldOn: '2026-10-10', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'unlisted' },
      { projectId: published.id, position: 2, title: 'Three', heldOn: '2026-10-17', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'private' },
      { projectId: privateProject.id, position: 0, title: 'Secret', heldOn: '2026-10-17', minutesSpent: 1, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date() },
    ]);
    const res = await call.profile(null, builderHandle);
    expect(res.status).toBe(200);
    const { profile } = await res.json();
    expect(profile).toMatchObject({ handle: builderHandle, canFollow: false, isSelf: false });
    expect(profile.projects).toHaveLength(1);
    expect(profile.projects[0]).toMatchObject({ slug: published.slug, publishedSessions: 1 });
    expect((await (await call.profile(reader, builderHandle)).json()).profile.canFollow).toBe(true);
    expect((await (await call.profile(builder, builderHandle)).json()).profile).toMatchObject({ canFollow: false, isSelf: true });
    expect((await call.profile(null, `nobody-${stamp}`)).status).toBe(404);
  });
});

describe('settings: the member’s follows', () => {
  let projectFollowId: number, builderFollowId: number;

  beforeAll(async () => {
    await call.followProject(reader, published.id);
    await call.followBuilder(reader, builderHandle);
    projectFollowId = (await Follow.findOne({ where: { userId: reader.id, projectId: published.id } }))!.id;
    builderFollowId = (await Follow.findOne({ where: { userId: reader.id, builderId: builder.id } }))!.id;
  });

  test('signed out: 401 on every settings route, even with a bad body', async () => {
    expect((await call.mine(null)).status).toBe(401);
    expect((await call.allMail(null, 'nonsense')).status).toBe(401);
    expect((await call.mail(null, projectFollowId, { mail: false })).status).toBe(401);
    expect((await call.remove(null, projectFollowId)).status).toBe(401);
  });

  test('lists both follows, newest first, with what each is', async () => {
    const { follows } = await (await call.mine(reader)).json();
    expect(follows.map((f: { id: number }) => f.id).sort()).toEqual([projectFollowId, builderFollowId].sort());
    expect(follows.find((f: { kind: string }) => f.kind === 'project')).toMatchObject({ mail: true, project: { slug: published.slug, title: published.title } });
    expect(follows.find((f: { kind: string }) => f.kind === 'builder')).toMatchObject({ mail: true, builder: { handle: builderHandle } });
  });

  test('switches one follow’s mail; someone else’s follow is a 404; a bad body a 400', async () => {
    const off = await call.mail(reader, projectFollowId, { mail: false });
    expect(off.status).toBe(200);
    expect((await off.json()).follow).toMatchObject({ id: projectFollowId, mail: false });
    expect((await call.mail(other, projectFollowId, { mail: true })).status).toBe(404);
    const bad = await call.mail(reader, projectFollowId, { mail: 'yes' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors.mail).toBeDefined();
    expect((await Follow.findByPk(projectFollowId))!.mail).toBe(false);
  });

  test('"all follow e-mail off" switches off every follow of the member, and only theirs', async () => {
    const others = await Follow.create({ userId: other.id, projectId: published.id, builderId: null, mail: true });
    const res = await call.allMail(reader, { mail: false });
    expect(res.status).toBe(200);
    expect((await res.json()).changed).toBe(1); // the project follow was already off
    expect(await Follow.count({ where: { userId: reader.id, mail: true } })).toBe(0);
    expect((await Follow.findByPk(others.id))!.mail).toBe(true);
    await others.destroy();
  });

  test('a follow of a project made private keeps its row but not its name', async () => {
    await privateProject.update({ visibility: 'unlisted' });
    await call.followProject(reader, privateProject.id);
    await privateProject.update({ visibility: 'private' });
    const { follows } = await (await call.mine(reader)).json();
    const row = follows.find((f: { project: { id: number } | null }) => f.project?.id === privateProject.id);
    expect(row.project.title).toBeNull();
  });

  test('unfollow from settings: another member’s follow 404, own 204', async () => {
    expect((await call.remove(other, builderFollowId)).status).toBe(404);
    expect((await call.remove(reader, builderFollowId)).status).toBe(204);
    expect(await Follow.findByPk(builderFollowId)).toBeNull();
  });
});

describe('unsubscribe links', () => {
  test('a valid token switches that follow’s mail off, signed out; a tampered one is refused and changes nothing', async () => {
    const f = await Follow.create({ userId: other.id, projectId: published.id, builderId: null, mail: true });
    const token = unsubscribeToken(f.id, other.id);
    expect(readUnsubscribeToken(token)).toEqual({ followId: f.id, userId: other.id });

    // Tampering: another follow id with the same signature, another member, a changed signature.
    const [, , sig] = token.split('.');
    const flipped = sig.slice(0, 10) + (sig[10] === 'A' ? 'B' : 'A') + sig.slice(11);
    for (const bad of [`${f.id + 1}.${other.id}.${sig}`, `${f.id}.${reader.id}.${sig}`, `${f.id}.${other.id}.${flipped}`, `${f.id}.${other.id}`, 'x'.repeat(300)]) {
      expect(readUnsubscribeToken(bad)).toBeNull();
      const res = await call.unsubscribe({ token: bad });
      expect(res.status).toBe(400);
      expect((await res.json()).message).toMatch(/not valid|too long/);
    }
    expect((await call.unsubscribe({})).status).toBe(400);
    expect((await Follow.findByPk(f.id))!.mail).toBe(true);

    // Reading what the link would do changes nothing.
    expect(await describeUnsubscribe(token)).toMatchObject({ followId: f.id, kind: 'project', name: published.title, mail: true });
    expect((await Follow.findByPk(f.id))!.mail).toBe(true);

    const res = await call.unsubscribe({ token });
    expect(res.status).toBe(200);
    expect((await res.json()).unsubscribed).toMatchObject({ followId: f.id, mail: false });
    expect((await Follow.findByPk(f.id))!.mail).toBe(false);
    // Again: still fine, still off.
    expect((await call.unsubscribe({ token })).status).toBe(200);

    await f.destroy();
    expect((await call.unsubscribe({ token })).status).toBe(404);
  });

  test('the confirmation page’s plain form gets a 303 back to the page', async () => {
    const f = await Follow.create({ userId: other.id, builderId: builder.id, projectId: null, mail: true });
    const token = unsubscribeToken(f.id, other.id);
    const req = request('/api/unsubscribe', { method: 'POST', rawBody: new URLSearchParams({ token }).toString() });
    req.headers.set('content-type', 'application/x-www-form-urlencoded');
    const res = await unsubscribeRoute(req, params({}));
    expect(res.status).toBe(303);
    const to = new URL(res.headers.get('location')!);
    expect(to.pathname).toBe('/unsubscribe');
    expect(to.searchParams.get('done')).toBe('1');
    expect(to.searchParams.get('token')).toBe(token);
    expect((await Follow.findByPk(f.id))!.mail).toBe(false);
    await f.destroy();
  });
});
