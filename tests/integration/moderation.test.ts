// Reporting comments to the admins, the admins' queue (reported and hidden), dismissing reports, and
// the accounts search with paging: through the real route handlers and MariaDB.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { POST as reportRoute } from '@/app/api/comments/[id]/report/route';
import { POST as hideRoute } from '@/app/api/comments/[id]/hide/route';
import { GET as queueRoute } from '@/app/api/admin/comments/route';
import { POST as dismissRoute } from '@/app/api/admin/comments/[id]/dismiss/route';
import { GET as accountsRoute } from '@/app/api/admin/accounts/route';
import { initModels, Comment, CommentReport, Project, ShopSession, Entry, User } from '@/db/models';
import { ACCOUNTS_PER_PAGE } from '@/lib/validations/moderation';
import type { ModerationQueue, AccountPage } from '@/lib/types/moderation';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, reader: U, other: U, admin: U;
const users: number[] = [];
let projectId: number, entryId: number;

beforeAll(async () => {
  initModels();
  [owner, reader, other, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser('admin')]);
  users.push(owner.id, reader.id, other.id, admin.id);
  const project = await Project.create({
    ownerId: owner.id, slug: `moderation-it-${Date.now().toString(36)}-${process.pid}`, title: 'Tailstock die holder', summary: '', units: 'mm',
    visibility: 'published', publishedAt: new Date(),
  });
  projectId = project.id;
  const session = await ShopSession.create({
    projectId, position: 0, title: 'Threading', heldOn: '2026-11-20', minutesSpent: 60, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date(),
  });
  entryId = (await Entry.create({ sessionId: session.id, position: 0, title: 'Cutting the thread', operation: 'threading', body: JSON.stringify({ type: 'doc', content: [] }) })).id;
});

afterAll(async () => {
  await Project.destroy({ where: { id: projectId } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

const comment = (authorId: number, body = 'Run it at top speed, no guard needed.') => Comment.create({ entryId, authorId, parentId: null, mediaId: null, atMs: null, body });
const report = (who: U | null, id: number, body: unknown) => reportRoute(request(`/api/comments/${id}/report`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const queue = async (who: U) => {
  const res = await queueRoute(request('/api/admin/comments', { cookie: who.cookie }), params({}));
  return { status: res.status, body: (await res.json()) as ModerationQueue };
};
const dismiss = (who: U, id: number) => dismissRoute(request(`/api/admin/comments/${id}/dismiss`, { method: 'POST', cookie: who.cookie }), params({ id: String(id) }));

describe('reporting a comment', () => {
  test('a reader reports once; the same report again is recognised, not doubled', async () => {
    const c = await comment(other.id);
    const first = await report(reader, c.id, { reason: 'Unsafe advice about the guard.' });
    expect(first.status).toBe(200);
    expect(await first.json()).toEqual({ reported: true, alreadyReported: false });
    const again = await report(reader, c.id, { reason: 'Unsafe advice about the guard.' });
    expect(await again.json()).toEqual({ reported: true, alreadyReported: true });
    expect(await CommentReport.count({ where: { commentId: c.id } })).toBe(1);
  });

  test('two identical reports at once leave one row', async () => {
    const c = await comment(other.id);
    const both = await Promise.all([report(reader, c.id, { reason: 'Spam link.' }), report(reader, c.id, { reason: 'Spam link.' })]);
    expect(both.map((r) => r.status)).toEqual([200, 200]);
    expect(await CommentReport.count({ where: { commentId: c.id } })).toBe(1);
  });

  test('a reason is required and named; one’s own comment cannot be reported; signed out is a 401', async () => {
    const c = await comment(other.id);
    const blank = await report(reader, c.id, { reason: '  ' });
    expect(blank.status).toBe(400);
    expect((await blank.json()).fieldErrors.reason[0]).toMatch(/Say why/);
    const own = await report(other, c.id, { reason: 'Testing my own.' });
    expect(own.status).toBe(400);
    expect((await own.json()).message).toMatch(/cannot report your own comment/);
    expect((await report(null, c.id, { reason: 'Anonymous.' })).status).toBe(401);
    expect((await report(reader, 999_999_999, { reason: 'Nothing there.' })).status).toBe(404);
    expect(await CommentReport.count({ where: { commentId: c.id } })).toBe(0);
  });
});

describe('the admins’ queue', () => {
  test('lists a reported comment with its reasons; dismissing empties it and keeps the comment', async () => {
    const c = await comment(other.id, 'Skip the centre drill, it is fine.');
    await report(reader, c.id, { reason: 'Bad advice for a beginner.' });
    await report(owner, c.id, { reason: 'Not what this entry says.' });
    const before = await queue(admin);
    expect(before.status).toBe(200);
    const item = before.body.reported.find((i) => i.commentId === c.id)!;
    expect(item.reports.map((r) => r.reason).sort()).toEqual(['Bad advice for a beginner.', 'Not what this entry says.']);
    expect(item.href).toMatch(new RegExp(`/entries/${entryId}#comment-${c.id}$`));
    const res = await dismiss(admin, c.id);
    expect(await res.json()).toEqual({ dismissed: 2 });
    expect((await queue(admin)).body.reported.some((i) => i.commentId === c.id)).toBe(false);
    expect(await Comment.count({ where: { id: c.id, hiddenAt: null } })).toBe(1);
  });

  test('hiding a reported comment moves it to the hidden list with the reason', async () => {
    const c = await comment(other.id, 'Buy my tool at example.test');
    await report(reader, c.id, { reason: 'Advertising.' });
    const hidden = await hideRoute(request(`/api/comments/${c.id}/hide`, { method: 'POST', cookie: admin.cookie, body: { reason: 'Advertising is not allowed here.' } }), params({ id: String(c.id) }));
    expect(hidden.status).toBe(200);
    const q = (await queue(admin)).body;
    expect(q.reported.some((i) => i.commentId === c.id)).toBe(false);
    expect(q.hidden.find((i) => i.commentId === c.id)?.hidden?.reason).toBe('Advertising is not allowed here.');
  });

  test('members cannot read the queue or dismiss', async () => {
    const c = await comment(other.id);
    await report(reader, c.id, { reason: 'Rude.' });
    expect((await queue(reader)).status).toBe(403);
    expect((await dismiss(owner, c.id)).status).toBe(403);
    expect(await CommentReport.count({ where: { commentId: c.id, dismissedAt: null } })).toBe(1);
    expect((await dismiss(admin, 999_999_999)).status).toBe(404);
  });
});

describe('accounts search and paging', () => {
  const tag = `pg${Date.now().toString(36)}`;
  beforeAll(async () => {
    const made = await User.bulkCreate(
      Array.from({ length: ACCOUNTS_PER_PAGE + 3 }, (_, i) => ({ email: `${tag}-${i}@example.test`, name: `Paging ${tag} ${i}`, handle: `${tag}-${i}`, passwordHash: 'x', siteRole: 'member' as const })),
    );
    users.push(...made.map((u) => u.id));
  });
  const page = async (q: string, n: number) => {
    const res = await accountsRoute(request(`/api/admin/accounts?q=${encodeURIComponent(q)}&page=${n}`, { cookie: admin.cookie }), params({}));
    return { status: res.status, body: (await res.json()) as AccountPage };
  };

  test('a search finds by name or e-mail, a page at a time', async () => {
    const one = await page(tag, 1);
    expect(one.body.total).toBe(ACCOUNTS_PER_PAGE + 3);
    expect(one.body.pages).toBe(2);
    expect(one.body.accounts).toHaveLength(ACCOUNTS_PER_PAGE);
    const two = await page(tag, 2);
    expect(two.body.accounts).toHaveLength(3);
    const all = new Set([...one.body.accounts, ...two.body.accounts].map((a) => a.id));
    expect(all.size).toBe(ACCOUNTS_PER_PAGE + 3);
    expect((await page(`${tag}-7@`, 1)).body.accounts.map((a) => a.email)).toEqual([`${tag}-7@example.test`]);
  });

  test('% and _ are searched as themselves; a bad page is a 400 naming it; members are refused', async () => {
    expect((await page('%', 1)).body.total).toBe(0);
    const bad = await page(tag, 0);
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/page/);
    const res = await accountsRoute(request('/api/admin/accounts', { cookie: reader.cookie }), params({}));
    expect(res.status).toBe(403);
  });
});
