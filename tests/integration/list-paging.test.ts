// Every list is bounded: with many rows (300 sessions, 120 comment threads, a clip full of notes, 30 projects),
// each page holds at most its page size, and walking the pages through the real route handlers returns every
// row exactly once, in the list's order. A cursor or page size that cannot be read is a 400 naming its field.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op, QueryTypes } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { getSequelize } from '@/db/connection';
import { Comment, Entry, Follow, initModels, Media, Project, ShopSession, TimeNote, User } from '@/db/models';
import { GET as listSessionsRoute } from '@/app/api/projects/[id]/sessions/route';
import { GET as listCommentsRoute } from '@/app/api/entries/[id]/comments/route';
import { GET as listNotesRoute, POST as createNoteRoute } from '@/app/api/media/[id]/notes/route';
import { GET as listProjectsRoute } from '@/app/api/projects/route';
import { GET as listFollowsRoute } from '@/app/api/me/follows/route';
import { FOLLOWS_PER_PAGE } from '@/lib/server/follows';
import { loadProjectPage, loadEntryPage } from '@/lib/server/reading';
import { getUserFromRequest } from '@/lib/auth/current-user';
import { SESSIONS_PER_PAGE } from '@/lib/server/sessions';
import { COMMENT_THREADS_PER_PAGE, REPLIES_PER_THREAD } from '@/lib/server/comments';
import { OWN_PROJECTS_PER_PAGE } from '@/lib/server/projects';
import { NOTES_PER_CLIP_MAX } from '@/lib/validations/notes';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let builder: U, reader: U;
let projectId: number, slug: string, entryId: number, clipId: number;
const otherProjects: number[] = [];

const SESSIONS = 300;
const THREADS = 120;
const LONG_THREAD_REPLIES = 130;

/** Follows `nextCursor` from the first page to the last, through the route; every page's JSON. */
async function walk<T extends { nextCursor: string | null }>(fetchPage: (after: string | null) => Promise<Response>): Promise<T[]> {
  const pages: T[] = [];
  let after: string | null = null;
  for (let guard = 0; guard < 100; guard++) {
    const res = await fetchPage(after);
    expect(res.status, `page ${pages.length + 1}`).toBe(200);
    const page = (await res.json()) as T;
    pages.push(page);
    if (!page.nextCursor) return pages;
    after = page.nextCursor;
  }
  throw new Error('the pages never ended');
}

const q = (after: string | null) => (after ? `?after=${encodeURIComponent(after)}` : '');

beforeAll(async () => {
  initModels();
  [builder, reader] = await Promise.all([makeUser(), makeUser()]);
  const stamp = Date.now();
  slug = `paging-${stamp}`;
  projectId = (await Project.create({ ownerId: builder.id, slug, title: 'A long log', summary: '', units: 'mm', visibility: 'published', publishedAt: new Date() })).id;
  // Every fifth session is private: the reader's pages must skip them and the totals must not count them.
  await ShopSession.bulkCreate(
    Array.from({ length: SESSIONS }, (_, i) => ({
      projectId,
      position: i,
      title: `Session ${i}`,
      heldOn: '2026-03-01',
      minutesSpent: 10,
      planned: '',
      done: '',
      nextSteps: '',
      visibility: i % 5 === 4 ? ('private' as const) : ('published' as const),
    })),
  );
  const first = (await ShopSession.findOne({ where: { projectId, position: 0 } }))!;
  entryId = (await Entry.create({ sessionId: first.id, position: 0, title: 'Facing', operation: 'facing', body: JSON.stringify({ type: 'doc', content: [] }) })).id;
  clipId = (await Media.create({ entryId, kind: 'clip', source: 'link', fileKey: null, url: 'https://video.example.test/facing', name: 'facing', mime: null, sizeBytes: null, width: null, height: null, durationMs: null, uploadedBy: builder.id })).id;

  // 120 threads; many share a second, so the order rests on the id as well.
  const tops = await Comment.bulkCreate(Array.from({ length: THREADS }, (_, i) => ({ entryId, authorId: reader.id, parentId: null, body: `Thread ${i}` })));
  await getSequelize().query(`UPDATE comments SET created_at = DATE_ADD('2026-03-02 08:00:00', INTERVAL FLOOR(id / 7) SECOND) WHERE entry_id = :entryId`, { replacements: { entryId } });
  // One thread runs long; one thread is removed by its author and has no replies (so it is not shown).
  await Comment.bulkCreate(Array.from({ length: LONG_THREAD_REPLIES }, (_, i) => ({ entryId, authorId: builder.id, parentId: tops[3].id, body: `Reply ${i}` })));
  await Comment.update({ deletedAt: new Date(), body: '' }, { where: { id: tops[10].id } });

  // A clip with its notes up to the cap, several at the same moment.
  await TimeNote.bulkCreate(Array.from({ length: NOTES_PER_CLIP_MAX }, (_, i) => ({ mediaId: clipId, startMs: Math.floor(i / 3) * 1000, endMs: null, kind: 'note' as const, text: `Note ${i}`, authorId: builder.id })));

  // More of the builder's projects than one page of "My projects".
  for (let i = 0; i < OWN_PROJECTS_PER_PAGE + 6; i++) {
    otherProjects.push((await Project.create({ ownerId: builder.id, slug: `paging-own-${stamp}-${i}`, title: `Own ${i}`, summary: '', units: 'mm', visibility: 'private', publishedAt: null })).id);
  }
  // The reader follows more projects than one page of their settings holds (all at the same second).
  const more = FOLLOWS_PER_PAGE + 10 - otherProjects.length - 1;
  for (let i = 0; i < more; i++) {
    otherProjects.push((await Project.create({ ownerId: builder.id, slug: `paging-more-${stamp}-${i}`, title: `More ${i}`, summary: '', units: 'mm', visibility: 'published', publishedAt: new Date() })).id);
  }
  await Follow.bulkCreate([projectId, ...otherProjects].map((id) => ({ userId: reader.id, projectId: id, builderId: null, mail: true })));
  await Follow.update({ createdAt: new Date('2026-03-04T09:00:00Z') }, { where: { userId: reader.id }, silent: true });
  // Ties on updated_at, so the order rests on the id as well.
  await Project.update({ updatedAt: new Date('2026-03-03T10:00:00Z') }, { where: { id: { [Op.in]: otherProjects.slice(0, 10) } }, silent: true });
}, 60_000);

afterAll(async () => {
  await Project.destroy({ where: { id: { [Op.in]: [projectId, ...otherProjects] } } });
  await User.destroy({ where: { id: { [Op.in]: [builder.id, reader.id] } } });
  await closeDb();
});

type SessionPage = { sessions: { id: number; position: number; visibility: string }[]; nextCursor: string | null; total: number };

describe('sessions of a long project', () => {
  const listed = async (who: U | null) =>
    walk<SessionPage>((after) => listSessionsRoute(request(`/api/projects/${projectId}/sessions${q(after)}`, { cookie: who?.cookie }), params({ id: String(projectId) })));

  test('the builder walks all 300, in log order, each once, at most 50 a page', async () => {
    const pages = await listed(builder);
    for (const p of pages) expect(p.sessions.length).toBeLessThanOrEqual(SESSIONS_PER_PAGE);
    const positions = pages.flatMap((p) => p.sessions.map((s) => s.position));
    expect(positions).toEqual(Array.from({ length: SESSIONS }, (_, i) => i));
    expect(new Set(pages.flatMap((p) => p.sessions.map((s) => s.id))).size).toBe(SESSIONS);
    expect(pages[0].total).toBe(SESSIONS);
    expect(pages.length).toBe(Math.ceil(SESSIONS / SESSIONS_PER_PAGE));
  });

  test('a reader walks only the published ones, in order, and the total counts only those', async () => {
    const expected = Array.from({ length: SESSIONS }, (_, i) => i).filter((i) => i % 5 !== 4);
    for (const who of [null, reader]) {
      const pages = await listed(who);
      const sessions = pages.flatMap((p) => p.sessions);
      expect(sessions.map((s) => s.position)).toEqual(expected);
      expect(sessions.every((s) => s.visibility === 'published')).toBe(true);
      expect(pages[0].total).toBe(expected.length);
    }
  });

  test('the project page loads the first page and the totals over every listed session', async () => {
    const page = await loadProjectPage(null, slug);
    expect(page.sessions.length).toBe(SESSIONS_PER_PAGE);
    expect(page.nextCursor).not.toBeNull();
    expect(page.totals.sessions).toBe(SESSIONS - SESSIONS / 5);
    expect(page.totals.minutes).toBe((SESSIONS - SESSIONS / 5) * 10);
    const own = await loadProjectPage(await getUserFromRequest(request('/', { cookie: builder.cookie })), slug);
    expect(own.totals.sessions).toBe(SESSIONS);
  });

  test('a cursor that cannot be read is a 400 naming after', async () => {
    for (const bad of ['not-a-cursor!', 'eyJrIjoiYSJ9', Buffer.from(JSON.stringify({ k: 't:2026-01-01T00:00:00Z', id: 1 })).toString('base64url')]) {
      const res = await listSessionsRoute(request(`/api/projects/${projectId}/sessions?after=${encodeURIComponent(bad)}`, { cookie: builder.cookie }), params({ id: String(projectId) }));
      expect(res.status, bad).toBe(400);
      expect((await res.json()).fieldErrors).toHaveProperty('after');
    }
  });
});

type CommentPage = { comments: { id: number; body: string; state: string; replies: { id: number }[] }[]; nextCursor: string | null; count: number };

describe('comments of an entry', () => {
  const pageOf = (after: string | null, who: U | null = reader) =>
    listCommentsRoute(request(`/api/entries/${entryId}/comments${q(after)}`, { cookie: who?.cookie }), params({ id: String(entryId) }));

  test('walking the pages gives every shown thread once, oldest first, at most 30 threads a page', async () => {
    const pages = await walk<CommentPage>((after) => pageOf(after));
    for (const p of pages) expect(p.comments.length).toBeLessThanOrEqual(COMMENT_THREADS_PER_PAGE);
    const rows = await getSequelize().query<{ id: number }>(
      'SELECT id FROM comments WHERE entry_id = :entryId AND parent_id IS NULL AND deleted_at IS NULL ORDER BY created_at, id',
      { replacements: { entryId }, type: QueryTypes.SELECT },
    );
    expect(pages.flatMap((p) => p.comments.map((c) => c.id))).toEqual(rows.map((r) => r.id));
    expect(rows.length).toBe(THREADS - 1);
    // The count is the whole entry's on every page: threads and replies, the removed one left out.
    for (const p of pages) expect(p.count).toBe(THREADS - 1 + LONG_THREAD_REPLIES);
  });

  test('a long thread shows its first 100 replies, oldest first', async () => {
    const pages = await walk<CommentPage>((after) => pageOf(after));
    const long = pages.flatMap((p) => p.comments).find((c) => c.body === 'Thread 3')!;
    expect(long.replies.length).toBe(REPLIES_PER_THREAD);
    const ids = long.replies.map((r) => r.id);
    expect(ids).toEqual([...ids].sort((a, b) => a - b));
  });

  test('the entry page renders the first page with its cursor', async () => {
    const page = await loadEntryPage(null, entryId);
    // The first 30 threads, less the one removed without replies, which is left out.
    expect(page.comments?.comments.length).toBe(COMMENT_THREADS_PER_PAGE - 1);
    expect(page.comments?.nextCursor).toEqual(expect.any(String));
  });

  test('a cursor that cannot be read is a 400 naming after', async () => {
    const res = await pageOf('%%%');
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors).toHaveProperty('after');
  });
});

type NotePage = { notes: { id: number; startMs: number }[]; nextCursor: string | null };

describe('notes of a clip', () => {
  const notes = (query: string) => listNotesRoute(request(`/api/media/${clipId}/notes${query}`, { cookie: reader.cookie }), params({ id: String(clipId) }));

  test('the whole list up to the cap in one page by default', async () => {
    const res = await notes('');
    expect(res.status).toBe(200);
    const page = (await res.json()) as NotePage;
    expect(page.notes.length).toBe(NOTES_PER_CLIP_MAX);
    expect(page.nextCursor).toBeNull();
  });

  test('smaller pages walk every note once in time order', async () => {
    const pages = await walk<NotePage>((after) => notes(`?limit=120${after ? `&after=${encodeURIComponent(after)}` : ''}`));
    for (const p of pages) expect(p.notes.length).toBeLessThanOrEqual(120);
    const all = pages.flatMap((p) => p.notes);
    expect(all.length).toBe(NOTES_PER_CLIP_MAX);
    expect(new Set(all.map((n) => n.id)).size).toBe(NOTES_PER_CLIP_MAX);
    const sorted = [...all].sort((a, b) => a.startMs - b.startMs || a.id - b.id);
    expect(all.map((n) => n.id)).toEqual(sorted.map((n) => n.id));
  });

  test('a bad limit or cursor is a 400 naming it', async () => {
    for (const [query, field] of [['?limit=0', 'limit'], ['?limit=501', 'limit'], ['?limit=ten', 'limit'], ['?after=abc', 'after']] as const) {
      const res = await notes(query);
      expect(res.status, query).toBe(400);
      expect((await res.json()).fieldErrors, query).toHaveProperty(field);
    }
  });

  test('a full clip refuses another note, naming the field, and saves nothing', async () => {
    const res = await createNoteRoute(
      request(`/api/media/${clipId}/notes`, { method: 'POST', cookie: builder.cookie, body: { startMs: 1000, kind: 'note', text: 'One too many' } }),
      params({ id: String(clipId) }),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors).toHaveProperty('startMs');
    expect(await TimeNote.count({ where: { mediaId: clipId } })).toBe(NOTES_PER_CLIP_MAX);
  });
});

describe("a builder's own projects", () => {
  test('walking My projects gives each once, most recently changed first, 24 a page', async () => {
    const pages = await walk<{ projects: { id: number; updatedAt: string }[]; nextCursor: string | null }>((after) =>
      listProjectsRoute(request(`/api/projects?scope=mine${after ? `&after=${encodeURIComponent(after)}` : ''}`, { cookie: builder.cookie }), params({})),
    );
    for (const p of pages) expect(p.projects.length).toBeLessThanOrEqual(OWN_PROJECTS_PER_PAGE);
    const all = pages.flatMap((p) => p.projects);
    const expected = await Project.findAll({ where: { ownerId: builder.id }, attributes: ['id'], order: [['updatedAt', 'DESC'], ['id', 'DESC']] });
    expect(all.map((p) => p.id)).toEqual(expected.map((p) => p.id));
    expect(all.length).toBe(otherProjects.length + 1);
  });

  test('a cursor that cannot be read is a 400 naming after', async () => {
    const res = await listProjectsRoute(request('/api/projects?scope=mine&after=xyz', { cookie: builder.cookie }), params({}));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors).toHaveProperty('after');
  });
});

describe("the member's own follows", () => {
  test('walking the pages gives each follow once, newest first, 50 a page', async () => {
    const pages = await walk<{ follows: { id: number }[]; nextCursor: string | null }>((after) =>
      listFollowsRoute(request(`/api/me/follows${q(after)}`, { cookie: reader.cookie }), params({})),
    );
    expect(pages.length).toBeGreaterThan(1);
    for (const p of pages) expect(p.follows.length).toBeLessThanOrEqual(FOLLOWS_PER_PAGE);
    const expected = await Follow.findAll({ where: { userId: reader.id }, attributes: ['id'], order: [['createdAt', 'DESC'], ['id', 'DESC']] });
    expect(pages.flatMap((p) => p.follows.map((f) => f.id))).toEqual(expected.map((f) => f.id));
  });

  test('a cursor that cannot be read is a 400 naming after', async () => {
    const res = await listFollowsRoute(request('/api/me/follows?after=bad', { cookie: reader.cookie }), params({}));
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors).toHaveProperty('after');
  });
});
