// Parallel requests through the real route handlers against the real MariaDB: each must get the answer
// it would get if the requests had come one after another.
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { POST as postComment } from '@/app/api/entries/[id]/comments/route';
import { POST as postSession } from '@/app/api/projects/[id]/sessions/route';
import { POST as postCalculation } from '@/app/api/entries/[id]/calculations/route';
import { POST as postInvitation } from '@/app/api/projects/[id]/invitations/route';
import { POST as postFollow } from '@/app/api/projects/[id]/follow/route';
import { POST as postProject } from '@/app/api/projects/route';
import { POST as postEntry } from '@/app/api/sessions/[id]/entries/route';
import { PATCH as patchEntry } from '@/app/api/entries/[id]/route';
import { initModels, Comment, Entry, Follow, Media, MentorInvitation, OutboxMessage, Project, SavedCalculation, ShopSession, User } from '@/db/models';
import { COMMENT_RATE_LIMITS } from '@/lib/validations/comments';
import { withTransaction } from '@/db/connection';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, reader: U;
const users: number[] = [];
const projects: number[] = [];
const stamp = `${Date.now().toString(36)}-${process.pid}`;
let projectId: number, entryId: number;

async function makeProject(tag: string) {
  const p = await Project.create({
    ownerId: builder.id, slug: `races-${tag}-${stamp}`, title: `Race plate ${tag}`, summary: '', units: 'mm', visibility: 'published', publishedAt: new Date(),
  });
  projects.push(p.id);
  return p;
}

async function statusesOf(responses: Response[]) {
  return Promise.all(responses.map(async (r) => ({ status: r.status, body: await r.json() })));
}

const count = (statuses: { status: number }[], status: number) => statuses.filter((s) => s.status === status).length;

beforeAll(async () => {
  initModels();
  [builder, reader] = await Promise.all([makeUser(), makeUser()]);
  users.push(builder.id, reader.id);
  const project = await makeProject('log');
  projectId = project.id;
  const session = await ShopSession.create({
    projectId, position: 0, title: 'Spigot', heldOn: '2026-10-10', minutesSpent: 60, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date(),
  });
  entryId = (await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) })).id;
});

afterAll(async () => {
  await Project.destroy({ where: { [Op.or]: [{ id: { [Op.in]: projects } }, { ownerId: { [Op.in]: users } }] } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('the comment rate limit under parallel posts', () => {
  test('10 comments posted at once with a limit of 5 a minute: exactly 5 are created and 5 answered 429', async () => {
    const perMinute = COMMENT_RATE_LIMITS[0].max;
    expect(perMinute).toBe(5);
    const responses = await Promise.all(
      Array.from({ length: 10 }, (_, i) =>
        postComment(request(`/api/entries/${entryId}/comments`, { method: 'POST', cookie: reader.cookie, body: { body: `Question ${i} about the spigot` } }), params({ id: String(entryId) })),
      ),
    );
    const answers = await statusesOf(responses);
    expect(count(answers, 201), JSON.stringify(answers.map((a) => a.status))).toBe(perMinute);
    expect(count(answers, 429)).toBe(10 - perMinute);
    for (const a of answers.filter((x) => x.status === 429)) expect(a.body.message).toMatch(/post again in/);
    expect(await Comment.count({ where: { authorId: reader.id, entryId } })).toBe(perMinute);
  });
});

describe('positions handed out to parallel creates', () => {
  test('6 sessions created at once get positions 1..6 after the existing one, all distinct, each answered with its own', async () => {
    const responses = await Promise.all(
      Array.from({ length: 6 }, (_, i) =>
        postSession(
          request(`/api/projects/${projectId}/sessions`, { method: 'POST', cookie: builder.cookie, body: { title: `Parallel day ${i}`, heldOn: '2026-10-11', minutesSpent: 30 } }),
          params({ id: String(projectId) }),
        ),
      ),
    );
    const answers = await statusesOf(responses);
    expect(answers.map((a) => a.status)).toEqual(Array(6).fill(201));
    const rows = await ShopSession.findAll({ where: { projectId }, order: [['position', 'ASC']] });
    expect(rows.map((r) => r.position)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    // Each answer is the session it made, read inside its own transaction.
    const answered = answers.map((a) => [a.body.session.id, a.body.session.position]).sort((x, y) => x[1] - y[1]);
    expect(answered).toEqual(rows.slice(1).map((r) => [r.id, r.position]));
  });

  test('6 calculations saved into one entry at once get positions 0..5', async () => {
    const responses = await Promise.all(
      Array.from({ length: 6 }, () =>
        postCalculation(
          request(`/api/entries/${entryId}/calculations`, { method: 'POST', cookie: builder.cookie, body: { kind: 'tap-drill', input: { designation: 'M8x1.25', targetPercent: 75 } } }),
          params({ id: String(entryId) }),
        ),
      ),
    );
    const answers = await statusesOf(responses);
    expect(answers.map((a) => a.status)).toEqual(Array(6).fill(201));
    const positions = (await SavedCalculation.findAll({ where: { entryId }, attributes: ['position'] })).map((r) => r.position).sort((a, b) => a - b);
    expect(positions).toEqual([0, 1, 2, 3, 4, 5]);
    expect(answers.map((a) => a.body.calculation.position).sort((a: number, b: number) => a - b)).toEqual([0, 1, 2, 3, 4, 5]);
  });
});

describe('parallel mentor invitations', () => {
  test('26 invitations at once: no 500, 20 created (the daily limit), 6 refused with 429, one e-mail per created invitation', async () => {
    const project = await makeProject('invites');
    const emails = Array.from({ length: 26 }, (_, i) => `race-${i}-${stamp}@example.test`);
    const responses = await Promise.all(
      emails.map((email) =>
        postInvitation(request(`/api/projects/${project.id}/invitations`, { method: 'POST', cookie: builder.cookie, body: { email } }), params({ id: String(project.id) })),
      ),
    );
    const answers = await statusesOf(responses);
    expect(count(answers, 500)).toBe(0);
    expect(count(answers, 201), JSON.stringify(answers.map((a) => a.status))).toBe(20);
    expect(count(answers, 429)).toBe(6);
    const rows = await MentorInvitation.findAll({ where: { projectId: project.id } });
    expect(rows).toHaveLength(20);
    expect(new Set(rows.map((r) => r.email)).size).toBe(20);
    expect(await OutboxMessage.count({ where: { kind: 'mentor-invite', toAddress: { [Op.in]: emails } } })).toBe(20);
  });

  test('the same address invited 6 times at once: every answer 201, exactly one link left pending', async () => {
    const project = await makeProject('reinvite');
    const email = `race-again-${stamp}@example.test`;
    const responses = await Promise.all(
      Array.from({ length: 6 }, () =>
        postInvitation(request(`/api/projects/${project.id}/invitations`, { method: 'POST', cookie: builder.cookie, body: { email } }), params({ id: String(project.id) })),
      ),
    );
    const answers = await statusesOf(responses);
    expect(answers.map((a) => a.status)).toEqual(Array(6).fill(201));
    const rows = await MentorInvitation.findAll({ where: { projectId: project.id, email } });
    expect(rows).toHaveLength(6);
    expect(rows.filter((r) => !r.revokedAt && !r.acceptedAt)).toHaveLength(1);
  });
});

describe('parallel follows', () => {
  test('8 follows of one project at once: all 2xx (one 201, the rest 200) and one row', async () => {
    const project = await makeProject('follow');
    const responses = await Promise.all(
      Array.from({ length: 8 }, () => postFollow(request(`/api/projects/${project.id}/follow`, { method: 'POST', cookie: reader.cookie }), params({ id: String(project.id) }))),
    );
    const answers = await statusesOf(responses);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 200, 200, 200, 201]);
    for (const a of answers) expect(a.body.follow).toMatchObject({ following: true, followers: 1 });
    expect(await Follow.count({ where: { userId: reader.id, projectId: project.id } })).toBe(1);
  });
});

describe('parallel project creates', () => {
  const create = (body: unknown, headers: Record<string, string> = {}) => {
    const req = request('/api/projects', { method: 'POST', cookie: builder.cookie, body });
    for (const [k, v] of Object.entries(headers)) req.headers.set(k, v);
    return postProject(req, params({}));
  };

  test('6 projects with the same title at once: all 201, each with its own slug', async () => {
    const title = `Dividing head adapter ${stamp}`;
    const answers = await statusesOf(await Promise.all(Array.from({ length: 6 }, () => create({ title, units: 'mm', visibility: 'private' }))));
    expect(answers.map((a) => a.status), JSON.stringify(answers.map((a) => a.body.message))).toEqual(Array(6).fill(201));
    const slugs = answers.map((a) => a.body.project.slug);
    expect(new Set(slugs).size).toBe(6);
    expect(await Project.count({ where: { ownerId: builder.id, title } })).toBe(6);
  });

  test('the same submit sent 5 times at once with one request id: one project, one 201 and four 200 with the same project', async () => {
    const title = `Change gear blank ${stamp}`;
    const requestId = `req-${stamp}-gear`;
    const answers = await statusesOf(await Promise.all(Array.from({ length: 5 }, () => create({ title, units: 'in', visibility: 'private', requestId }))));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 200, 200, 200, 201]);
    expect(new Set(answers.map((a) => a.body.project.id)).size).toBe(1);
    expect(await Project.count({ where: { ownerId: builder.id, title } })).toBe(1);
    // Later, sent again as the Idempotency-Key header: still that project.
    const again = await create({ title, units: 'in', visibility: 'private' }, { 'Idempotency-Key': requestId });
    expect(again.status).toBe(200);
    expect((await again.json()).project.id).toBe(answers[0].body.project.id);
  });

  test('a request id reused for a different project is a 409 naming requestId; a malformed one a 400; nothing is made', async () => {
    const requestId = `req-${stamp}-reuse`;
    expect((await create({ title: `Tailstock die holder ${stamp}`, units: 'mm', visibility: 'private', requestId })).status).toBe(201);
    const other = await create({ title: `Something else ${stamp}`, units: 'mm', visibility: 'private', requestId });
    expect(other.status).toBe(409);
    expect((await other.json()).fieldErrors.requestId[0]).toMatch(/already created/);
    const bad = await create({ title: `Bad id ${stamp}`, units: 'mm', visibility: 'private', requestId: 'no spaces allowed here' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).fieldErrors).toHaveProperty('requestId');
    const mismatch = await create({ title: `Two ids ${stamp}`, units: 'mm', visibility: 'private', requestId: `req-${stamp}-a` }, { 'Idempotency-Key': `req-${stamp}-b` });
    expect(mismatch.status).toBe(400);
    expect(await Project.count({ where: { ownerId: builder.id, title: { [Op.in]: [`Something else ${stamp}`, `Bad id ${stamp}`, `Two ids ${stamp}`] } } })).toBe(0);
  });

  test("one member's request id does not reach another member's project", async () => {
    const requestId = `req-${stamp}-shared`;
    const mine = await create({ title: `Lathe dog ${stamp}`, units: 'mm', visibility: 'private', requestId });
    expect(mine.status).toBe(201);
    const theirs = await postProject(request('/api/projects', { method: 'POST', cookie: reader.cookie, body: { title: `Lathe dog ${stamp}`, units: 'mm', visibility: 'private', requestId } }), params({}));
    expect(theirs.status).toBe(201);
    expect((await theirs.json()).project.id).not.toBe((await mine.json()).project.id);
  });
});

describe('published pages read while the builder writes', () => {
  // Next loads lib/server and db/models once per bundle (pages apart from route handlers): a published page can be
  // the first thing a fresh copy of the models is asked for. Each read here goes through such a fresh copy, many
  // at once, while the builder adds entries and autosaves in the same session through the route handlers.
  test('the first reads of a session and an entry page in a fresh module copy all answer, with writes going on', async () => {
    const project = await makeProject('pages');
    const session = await ShopSession.create({
      projectId: project.id, position: 0, title: 'Counterbores', heldOn: '2026-10-12', minutesSpent: 120, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date(),
    });
    const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Three M8 holes', operation: 'drilling', body: JSON.stringify({ type: 'doc', content: [] }) });
    const photo = await Media.create({
      entryId: entry.id, kind: 'photo', source: 'upload', fileKey: `races-pages-${stamp}`, url: '', name: 'bolt-circle.png', mime: 'image/png', sizeBytes: 100, width: 4, height: 3, durationMs: null, uploadedBy: builder.id,
    });
    await photo.update({ url: `/api/media/${photo.id}/file` });

    vi.resetModules();
    const fresh = await import('@/lib/server/reading');
    const writes = [
      ...Array.from({ length: 4 }, (_, i) =>
        postEntry(request(`/api/sessions/${session.id}/entries`, { method: 'POST', cookie: builder.cookie, body: { title: `Step ${i}`, operation: 'drilling' } }), params({ id: String(session.id) })),
      ),
      patchEntry(
        request(`/api/entries/${entry.id}`, { method: 'PATCH', cookie: builder.cookie, body: { body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Spotted, drilled 6.8, tapped M8.' }] }] }, version: 1 } }),
        params({ id: String(entry.id) }),
      ),
    ];
    const reads = [
      ...Array.from({ length: 6 }, () => fresh.loadSessionPage(null, session.id)),
      ...Array.from({ length: 6 }, () => fresh.loadEntryPage(null, entry.id)),
      fresh.loadSessionPage({ id: builder.id, siteRole: 'member', emailVerified: true }, session.id),
    ];
    const [written, read] = await Promise.all([Promise.all(writes), Promise.allSettled(reads)]);
    expect(written.map((r) => r.status)).toEqual([201, 201, 201, 201, 200]);
    const failures = read.filter((r): r is PromiseRejectedResult => r.status === 'rejected').map((r) => String(r.reason?.stack ?? r.reason));
    expect(failures).toEqual([]);
    const pages = read.map((r) => (r as PromiseFulfilledResult<{ session?: { id: number; entries: { id: number; photoCount: number }[] }; entry?: { id: number } }>).value);
    for (const page of pages.slice(0, 6)) {
      expect(page.session!.id).toBe(session.id);
      // The entries seen are the first one (with its photo) and any of the new ones already committed.
      expect(page.session!.entries[0]).toMatchObject({ id: entry.id, photoCount: 1 });
      expect(page.session!.entries.length).toBeGreaterThanOrEqual(1);
      expect(page.session!.entries.length).toBeLessThanOrEqual(5);
    }
    for (const page of pages.slice(6, 12)) expect(page.entry!.id).toBe(entry.id);
    // The builder's own read, after the writes: every new entry is there.
    const after = await fresh.loadSessionPage({ id: builder.id, siteRole: 'member', emailVerified: true }, session.id);
    expect(after.session.entries.map((e) => e.title).sort()).toEqual(['Step 0', 'Step 1', 'Step 2', 'Step 3', 'Three M8 holes']);
  });
});

describe('withTransaction', () => {
  test('a deadlock between two transactions is retried: both finish, and the lost attempt ran again', async () => {
    const [a, b] = await Promise.all([makeProject('lock-a'), makeProject('lock-b')]);
    let attempts = 0;
    // Each locks one row, waits until the other has its lock, then asks for the other's row: MariaDB picks a victim (1213).
    let arrived = 0;
    const bothHold = () =>
      new Promise<void>((resolve) => {
        arrived++;
        const poll = () => (arrived >= 2 ? resolve() : setTimeout(poll, 5));
        poll();
      });
    const crosswise = (first: number, second: number) =>
      withTransaction(async (transaction) => {
        attempts++;
        await Project.findByPk(first, { transaction, lock: transaction.LOCK.UPDATE });
        await bothHold();
        await Project.findByPk(second, { transaction, lock: transaction.LOCK.UPDATE });
        await Project.update({ summary: `touched ${first}` }, { where: { id: first }, transaction });
        return first;
      });
    const done = await Promise.all([crosswise(a.id, b.id), crosswise(b.id, a.id)]);
    expect(done).toEqual([a.id, b.id]);
    expect(attempts).toBe(3);
    expect((await Project.findByPk(a.id))!.summary).toBe(`touched ${a.id}`);
    expect((await Project.findByPk(b.id))!.summary).toBe(`touched ${b.id}`);
  });
});
