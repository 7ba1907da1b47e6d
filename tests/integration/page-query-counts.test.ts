// Query ceilings of the published log's page loaders: a signed-in reader's page render costs at most six
// SQL statements (the current user included), whatever the page holds. Counted with Sequelize's own
// afterQuery hook around each loader, on the demo data (seeded by npm test), whose heaviest entry has a
// clip with notes, measurement records, comments, flags and saved calculations.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { guardTestDatabase, closeDb, request, sessionCookie } from '../support/db';
import { getSequelize } from '@/db/connection';
import { Entry, initModels, Project, ShopSession, User } from '@/db/models';
import { getUserFromRequest } from '@/lib/auth/current-user';
import { loadEntryPage, loadProjectPage, loadSessionPage } from '@/lib/server/reading';

guardTestDatabase();

const CEILING = 6; // the ceiling for any page render of a signed-in user

let statements: string[] = [];
let counting = false;
let heavy: { entryId: number; sessionId: number; slug: string };
const cookies: Record<string, string> = {};

async function counted<T>(fn: () => Promise<T>): Promise<{ result: T; queries: string[] }> {
  statements = [];
  counting = true;
  try {
    const result = await fn();
    return { result, queries: statements };
  } finally {
    counting = false;
  }
}

/** As a page render does it: who is asking (from the cookie), then the page's loader. */
async function render<T>(who: string, load: (user: Awaited<ReturnType<typeof getUserFromRequest>>) => Promise<T>) {
  return counted(async () => load(await getUserFromRequest(request('/', { cookie: cookies[who] }))));
}

beforeAll(async () => {
  initModels();
  getSequelize().addHook('afterQuery', 'count-page-queries', (_options, query) => {
    if (counting) statements.push(String((query as { sql?: string })?.sql ?? '?'));
  });
  // The demo entry with the most in it, in a published session of a published project.
  const [row] = await getSequelize().query<{ entryId: number; sessionId: number; slug: string }>(
    `SELECT e.id AS entryId, s.id AS sessionId, p.slug AS slug
       FROM entries e JOIN shop_sessions s ON s.id = e.session_id JOIN projects p ON p.id = s.project_id
      WHERE p.visibility = 'published' AND s.visibility = 'published'
        AND EXISTS (SELECT 1 FROM media m JOIN time_notes n ON n.media_id = m.id WHERE m.entry_id = e.id AND m.kind = 'clip')
        AND EXISTS (SELECT 1 FROM comments c WHERE c.entry_id = e.id)
      ORDER BY (SELECT COUNT(*) FROM measurement_records r WHERE r.entry_id = e.id) + (SELECT COUNT(*) FROM risk_flags f WHERE f.entry_id = e.id) DESC
      LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  expect(row, 'the demo data has a published entry with a clip, notes and comments (npm test seeds it)').toBeDefined();
  heavy = row;
  for (const [who, email] of [
    ['builder', 'edda@renwick-shop.test'],
    ['follower', 'tobias@quill.test'],
    ['mentor', 'agnes@farrow.test'],
    ['admin', 'juno@scribeline.test'],
  ] as const) {
    const u = await User.findOne({ where: { email } });
    expect(u, `demo account ${email}`).not.toBeNull();
    cookies[who] = await sessionCookie(u!.id, u!.sessionVersion ?? 0);
  }
});

afterAll(async () => {
  getSequelize().removeHook('afterQuery', 'count-page-queries');
  await closeDb();
});

describe('page loaders stay within the query ceiling', () => {
  for (const who of ['builder', 'follower', 'mentor', 'admin']) {
    test(`entry page with clip, notes, records, comments and flags, as the ${who}`, async () => {
      const { result, queries } = await render(who, (user) => {
        expect(user, `${who} is signed in`).not.toBeNull();
        return loadEntryPage(user, heavy.entryId);
      });
      // The page really is the heavy one, and the loader gave all of it.
      expect(result.entry.notes.length).toBeGreaterThan(0);
      expect(result.comments?.comments.length ?? 0).toBeGreaterThan(0);
      expect(queries.length, queries.join('\n')).toBeLessThanOrEqual(CEILING);
    });

    test(`session page, as the ${who}`, async () => {
      const { result, queries } = await render(who, (user) => loadSessionPage(user, heavy.sessionId));
      expect(result.session.entries.length).toBeGreaterThan(0);
      expect(queries.length, queries.join('\n')).toBeLessThanOrEqual(CEILING);
    });

    test(`project page, as the ${who}`, async () => {
      const { result, queries } = await render(who, (user) => loadProjectPage(user, heavy.slug));
      expect(result.sessions.length).toBeGreaterThan(0);
      expect(queries.length, queries.join('\n')).toBeLessThanOrEqual(CEILING);
    });
  }

  test('the walk read along with the entry or session still refuses what the reader may not see', async () => {
    const builder = await User.findOne({ where: { email: 'edda@renwick-shop.test' } });
    const stamp = Date.now();
    const project = await Project.create({ ownerId: builder!.id, slug: `qc-private-${stamp}`, title: 'Private bench work', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
    try {
      const session = await ShopSession.create({ projectId: project.id, position: 0, title: 'Quiet day', heldOn: '2026-11-20', minutesSpent: 0, planned: '', done: '', nextSteps: '', visibility: 'private' });
      const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Not for readers', operation: 'facing', body: JSON.stringify({ type: 'doc', content: [] }) });
      const follower = await getUserFromRequest(request('/', { cookie: cookies.follower }));
      for (const actor of [null, follower]) {
        await expect(loadEntryPage(actor, entry.id)).rejects.toMatchObject({ code: 'not_found' });
        await expect(loadSessionPage(actor, session.id)).rejects.toMatchObject({ code: 'not_found' });
        await expect(loadProjectPage(actor, project.slug)).rejects.toMatchObject({ code: 'not_found' });
      }
      // The builder reads all three.
      const owner = await getUserFromRequest(request('/', { cookie: cookies.builder }));
      expect((await loadEntryPage(owner, entry.id)).entry.title).toBe('Not for readers');
      expect((await loadSessionPage(owner, session.id)).session.entries).toHaveLength(1);
      expect((await loadProjectPage(owner, project.slug)).sessions).toHaveLength(1);
    } finally {
      await project.destroy();
    }
  });

  test('the access walk runs once per page, however many sections ask', async () => {
    const { queries } = await render('follower', (user) => loadEntryPage(user, heavy.entryId));
    expect(queries.filter((q) => q.includes('project_memberships pm')).length).toBe(1);
  });
});
