// Cross-site refusal, body types and sizes, and fuzzed bodies through the real route handlers and MariaDB.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import fc from 'fast-check';
import { NextRequest } from 'next/server';
import { guardTestDatabase, closeDb, makeUser, params } from '../support/db';
import { initModels, Project, ProjectMembership, ShopSession, Entry, Media, TimeNote, Comment, User } from '@/db/models';
import { POST as createProject } from '@/app/api/projects/route';
import { PATCH as patchProject, DELETE as deleteProject } from '@/app/api/projects/[id]/route';
import { POST as createSession } from '@/app/api/projects/[id]/sessions/route';
import { GET as getSession, PATCH as patchSession } from '@/app/api/sessions/[id]/route';
import { POST as moveSession } from '@/app/api/sessions/[id]/move/route';
import { PATCH as setVisibility } from '@/app/api/sessions/[id]/visibility/route';
import { POST as createEntry } from '@/app/api/sessions/[id]/entries/route';
import { GET as getEntry, PATCH as patchEntry } from '@/app/api/entries/[id]/route';
import { POST as moveEntry } from '@/app/api/entries/[id]/move/route';
import { POST as postComment } from '@/app/api/entries/[id]/comments/route';
import { PATCH as patchComment } from '@/app/api/comments/[id]/route';
import { POST as hideComment } from '@/app/api/comments/[id]/hide/route';
import { POST as postFlag } from '@/app/api/entries/[id]/flags/route';
import { POST as postMeasurement } from '@/app/api/entries/[id]/measurements/route';
import { POST as postCalculation } from '@/app/api/entries/[id]/calculations/route';
import { POST as postMedia } from '@/app/api/entries/[id]/media/route';
import { PATCH as patchMedia } from '@/app/api/media/[id]/route';
import { POST as postNote } from '@/app/api/media/[id]/notes/route';
import { POST as importNotes } from '@/app/api/media/[id]/notes/import/route';
import { PATCH as patchNote } from '@/app/api/notes/[id]/route';
import { POST as invite } from '@/app/api/projects/[id]/invitations/route';
import { POST as acceptInvitation } from '@/app/api/invitations/accept/route';
import { PATCH as patchFollows } from '@/app/api/me/follows/route';
import { POST as pairs } from '@/app/api/measurements/pairs/route';
import { POST as unsubscribe } from '@/app/api/unsubscribe/route';
import { POST as signUp } from '@/app/api/account/route';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, mentor: U;
let projectId: number, sessionId: number, entryId: number, clipId: number, noteId: number, commentId: number;
const users: number[] = [];

const BASE = 'http://127.0.0.1:3000';
type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** A request as a browser (or anyone) would send it: explicit headers, any body. */
function req(path: string, init: { method: string; cookie?: string; headers?: Record<string, string>; body?: BodyInit | null }) {
  const headers = new Headers(init.headers);
  if (init.cookie) headers.set('cookie', init.cookie);
  return new NextRequest(new URL(path, BASE), { method: init.method, headers, body: init.body ?? undefined, duplex: 'half' } as unknown as ConstructorParameters<typeof NextRequest>[1]);
}
const json = (body: unknown) => ({ 'content-type': 'application/json', body: JSON.stringify(body) });
const call = (h: unknown, r: NextRequest, p: Record<string, string> = {}) => (h as Handler)(r, params(p));

beforeAll(async () => {
  initModels();
  [owner, mentor] = await Promise.all([makeUser(), makeUser()]);
  users.push(owner.id, mentor.id);
  const project = await Project.create({
    ownerId: owner.id, slug: `walls-it-${Date.now().toString(36)}-${process.pid}`, title: 'Dividing head backplate', summary: 'Walls test.',
    units: 'mm', visibility: 'published', publishedAt: new Date(),
  });
  projectId = project.id;
  await ProjectMembership.create({ projectId, userId: mentor.id, role: 'mentor' });
  const session = await ShopSession.create({
    projectId, position: 0, title: 'Facing', heldOn: '2026-10-10', minutesSpent: 60, planned: '', done: '', nextSteps: '', visibility: 'published', publishedAt: new Date(),
  });
  sessionId = session.id;
  const entry = await Entry.create({ sessionId, position: 0, title: 'Facing the plate', operation: 'facing', body: JSON.stringify({ type: 'doc', content: [] }) });
  entryId = entry.id;
  const clip = await Media.create({
    entryId, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/w', name: 'facing.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 30_000, uploadedBy: owner.id,
  });
  clipId = clip.id;
  noteId = (await TimeNote.create({ mediaId: clipId, startMs: 1000, endMs: null, kind: 'note', text: 'First cut', authorId: owner.id })).id;
  commentId = (await Comment.create({ entryId, authorId: mentor.id, body: 'Which insert?' } as never)).id;
});

afterAll(async () => {
  await Project.destroy({ where: { ownerId: { [Op.in]: users } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await User.destroy({ where: { email: { [Op.like]: 'walls-fuzz-%' } } });
  await closeDb();
});

const countProjects = () => Project.count({ where: { ownerId: owner.id } });
const projectBody = { title: 'Tailstock die holder', summary: 'Holds 1 inch dies square.', units: 'mm', visibility: 'private' };

describe('cross-site requests are refused before anything is written', () => {
  const foreign: [string, Record<string, string>][] = [
    ['a foreign Origin', { origin: 'https://attacker.example' }],
    ['Sec-Fetch-Site: cross-site', { 'sec-fetch-site': 'cross-site' }],
    ['another port of the same host (same-site)', { origin: 'http://127.0.0.1:4000', 'sec-fetch-site': 'same-site' }],
    ['a sandboxed frame (Origin: null)', { origin: 'null' }],
  ];

  test.each(foreign)('POST with %s → 403, no project', async (_, headers) => {
    const before = await countProjects();
    const { body, ...type } = json(projectBody);
    const res = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { ...headers, ...type }, body }));
    expect(res.status).toBe(403);
    expect((await res.json()).error).toBe('forbidden');
    expect(await countProjects()).toBe(before);
  });

  test.each(foreign)('PATCH and DELETE with %s → 403, project untouched', async (_, headers) => {
    const { body, ...type } = json({ title: 'Renamed from elsewhere', version: 1 });
    const patch = await call(patchProject, req(`/api/projects/${projectId}`, { method: 'PATCH', cookie: owner.cookie, headers: { ...headers, ...type }, body }), { id: String(projectId) });
    expect(patch.status).toBe(403);
    const del = await call(deleteProject, req(`/api/projects/${projectId}`, { method: 'DELETE', cookie: owner.cookie, headers }), { id: String(projectId) });
    expect(del.status).toBe(403);
    const row = await Project.findByPk(projectId);
    expect(row?.title).toBe('Dividing head backplate');
  });

  test('the same origin, and NEXTAUTH_URL’s origin, are allowed', async () => {
    const before = await countProjects();
    const { body, ...type } = json(projectBody);
    const same = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { host: '127.0.0.1:3000', origin: BASE, 'sec-fetch-site': 'same-origin', ...type }, body }));
    expect(same.status).toBe(201);
    const saved = process.env.NEXTAUTH_URL;
    // The app's public URL (as a proxy in front of it would be addressed), plain http so the cookie name stays.
    process.env.NEXTAUTH_URL = 'http://scribeline.example:8080';
    try {
      const app = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { host: '127.0.0.1:3000', origin: 'http://scribeline.example:8080', ...type }, body }));
      expect(app.status).toBe(201);
    } finally {
      process.env.NEXTAUTH_URL = saved;
    }
    expect(await countProjects()).toBe(before + 2);
  });

  test('a plain-text body (a form another page can send without asking) → 415, no project', async () => {
    const before = await countProjects();
    for (const type of ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x']) {
      const res = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { 'content-type': type }, body: JSON.stringify(projectBody) }));
      expect(res.status, type).toBe(415);
      expect((await res.json()).message).toMatch(/JSON/);
    }
    expect(await countProjects()).toBe(before);
  });
});

describe('body size', () => {
  test('a 20 MB body → 413 without reading it all (counted while streaming)', async () => {
    const chunk = new Uint8Array(64 * 1024).fill(0x20);
    const total = 20 * 1024 * 1024;
    let pulled = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (pulled >= total) return controller.close();
        pulled += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const before = await countProjects();
    const res = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { 'content-type': 'application/json' }, body: stream }));
    expect(res.status).toBe(413);
    expect((await res.json()).message).toMatch(/larger than/);
    expect(pulled).toBeLessThan(2 * 1024 * 1024);
    expect(await countProjects()).toBe(before);
  });

  test('a declared Content-Length past the limit → 413 before any byte is read', async () => {
    let pulled = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled++;
        controller.enqueue(new Uint8Array(10));
        controller.close();
      },
    });
    const res = await call(createProject, req('/api/projects', { method: 'POST', cookie: owner.cookie, headers: { 'content-type': 'application/json', 'content-length': String(20 * 1024 * 1024) }, body: stream }));
    expect(res.status).toBe(413);
    expect(pulled).toBeLessThanOrEqual(1); // a stream may be primed once by the runtime, never drained
  });

  test('an entry autosave may be larger than the default limit (1 MB)', async () => {
    const text = 'x'.repeat(400 * 1024);
    const { body, ...type } = json({ body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] }, version: 1 });
    const res = await call(patchEntry, req(`/api/entries/${entryId}`, { method: 'PATCH', cookie: owner.cookie, headers: type, body }), { id: String(entryId) });
    expect(res.status).not.toBe(413);
    expect(res.status).toBeLessThan(500);
  });
});

describe('answers of 500 found by fuzzing are 400s naming the problem', () => {
  test('heldOn 0000-02-29 on session create → 400 naming heldOn, nothing saved', async () => {
    const before = await ShopSession.count({ where: { projectId } });
    const { body, ...type } = json({ title: 'Leap year zero', heldOn: '0000-02-29', minutesSpent: 10 });
    const res = await call(createSession, req(`/api/projects/${projectId}/sessions`, { method: 'POST', cookie: owner.cookie, headers: type, body }), { id: String(projectId) });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.heldOn).toBeDefined();
    expect(await ShopSession.count({ where: { projectId } })).toBe(before);
  });

  test.each([
    ['comment create', () => [postComment, `/api/entries/${entryId}/comments`, 'POST', entryId, mentor] as const],
    ['comment update', () => [patchComment, `/api/comments/${commentId}`, 'PATCH', commentId, mentor] as const],
    ['note create', () => [postNote, `/api/media/${clipId}/notes`, 'POST', clipId, owner] as const],
    ['note update', () => [patchNote, `/api/notes/${noteId}`, 'PATCH', noteId, owner] as const],
  ])('a null body on %s → 400', async (_, make) => {
    const [handler, path, method, id, who] = make();
    for (const raw of ['null', '[]', '"text"', '42']) {
      const res = await call(handler, req(path, { method, cookie: who.cookie, headers: { 'content-type': 'application/json' }, body: raw }), { id: String(id) });
      expect(res.status, raw).toBe(400);
      expect((await res.json()).message).toMatch(/must be a JSON object/);
    }
  });
});

// ── Fuzzing: every JSON write handler, hostile bodies and ids; nothing may answer 500. ────────────

const FIELDS = [
  'title', 'summary', 'units', 'visibility', 'heldOn', 'minutesSpent', 'planned', 'done', 'nextSteps', 'operation', 'body', 'version',
  'startMs', 'endMs', 'kind', 'text', 'fileName', 'parentId', 'mediaId', 'atMs', 'sessionId', 'position', 'email', 'note', 'token', 'mail',
  'target', 'severity', 'hazard', 'concern', 'instead', 'answer', 'reason', 'feature', 'nominal', 'unit', 'spec', 'readings', 'value',
  'instrument', 'resolution', 'measuredAt', 'temperatureC', 'pass', 'recordIds', 'name', 'password', 'url', 'calculator', 'input', 'label',
];
const hostileScalar = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, -0.5, 1e308, -1e308, 2 ** 53 + 1, 2 ** 64, 1e-320, '', ' ', '0000-02-29', '9999-12-31', '10000-01-01',
    '1970-01-01T00:00:00Z', '2026-02-30', 'NaN', 'Infinity', '-1', '1e308', '\u0000', '\u202e\u0041', '💥'.repeat(200), 'x'.repeat(70_000),
    '<script>alert(1)</script>', 'javascript:alert(1)', 'http://' + 'a'.repeat(3000) + '.example', '{"type":"doc"}'),
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.integer(),
  fc.double(),
);
const hostileValue = fc.oneof(hostileScalar, fc.array(hostileScalar, { maxLength: 4 }), fc.dictionary(fc.constantFrom(...FIELDS), hostileScalar, { maxKeys: 3 }));
const hostileBody = fc.oneof(
  { weight: 1, arbitrary: fc.oneof(hostileScalar, fc.array(hostileValue, { maxLength: 3 })) },
  { weight: 6, arbitrary: fc.dictionary(fc.constantFrom(...FIELDS), hostileValue, { maxKeys: 8 }) },
);
const hostileId = fc.oneof(fc.constantFrom('-1', '0', '1.5', '1e308', '99999999999999999999999', 'abc', '١٢', ' 1', '0x10', '%00', ''), fc.string({ maxLength: 8 }));

type Target = { name: string; handler: unknown; method: string; path: (id: string) => string; id: () => number; who: () => U | null };
const targets: Target[] = [
  { name: 'POST /api/projects', handler: createProject, method: 'POST', path: () => '/api/projects', id: () => 0, who: () => owner },
  { name: 'PATCH /api/projects/[id]', handler: patchProject, method: 'PATCH', path: (i) => `/api/projects/${i}`, id: () => projectId, who: () => owner },
  { name: 'POST /api/projects/[id]/sessions', handler: createSession, method: 'POST', path: (i) => `/api/projects/${i}/sessions`, id: () => projectId, who: () => owner },
  { name: 'POST /api/projects/[id]/invitations', handler: invite, method: 'POST', path: (i) => `/api/projects/${i}/invitations`, id: () => projectId, who: () => owner },
  { name: 'PATCH /api/sessions/[id]', handler: patchSession, method: 'PATCH', path: (i) => `/api/sessions/${i}`, id: () => sessionId, who: () => owner },
  { name: 'POST /api/sessions/[id]/move', handler: moveSession, method: 'POST', path: (i) => `/api/sessions/${i}/move`, id: () => sessionId, who: () => owner },
  { name: 'PATCH /api/sessions/[id]/visibility', handler: setVisibility, method: 'PATCH', path: (i) => `/api/sessions/${i}/visibility`, id: () => sessionId, who: () => owner },
  { name: 'POST /api/sessions/[id]/entries', handler: createEntry, method: 'POST', path: (i) => `/api/sessions/${i}/entries`, id: () => sessionId, who: () => owner },
  { name: 'PATCH /api/entries/[id]', handler: patchEntry, method: 'PATCH', path: (i) => `/api/entries/${i}`, id: () => entryId, who: () => owner },
  { name: 'POST /api/entries/[id]/move', handler: moveEntry, method: 'POST', path: (i) => `/api/entries/${i}/move`, id: () => entryId, who: () => owner },
  { name: 'POST /api/entries/[id]/comments', handler: postComment, method: 'POST', path: (i) => `/api/entries/${i}/comments`, id: () => entryId, who: () => mentor },
  { name: 'PATCH /api/comments/[id]', handler: patchComment, method: 'PATCH', path: (i) => `/api/comments/${i}`, id: () => commentId, who: () => mentor },
  { name: 'POST /api/comments/[id]/hide', handler: hideComment, method: 'POST', path: (i) => `/api/comments/${i}/hide`, id: () => commentId, who: () => owner },
  { name: 'POST /api/entries/[id]/flags', handler: postFlag, method: 'POST', path: (i) => `/api/entries/${i}/flags`, id: () => entryId, who: () => mentor },
  { name: 'POST /api/entries/[id]/measurements', handler: postMeasurement, method: 'POST', path: (i) => `/api/entries/${i}/measurements`, id: () => entryId, who: () => owner },
  { name: 'POST /api/entries/[id]/calculations', handler: postCalculation, method: 'POST', path: (i) => `/api/entries/${i}/calculations`, id: () => entryId, who: () => owner },
  { name: 'POST /api/entries/[id]/media', handler: postMedia, method: 'POST', path: (i) => `/api/entries/${i}/media`, id: () => entryId, who: () => owner },
  { name: 'PATCH /api/media/[id]', handler: patchMedia, method: 'PATCH', path: (i) => `/api/media/${i}`, id: () => clipId, who: () => owner },
  { name: 'POST /api/media/[id]/notes', handler: postNote, method: 'POST', path: (i) => `/api/media/${i}/notes`, id: () => clipId, who: () => owner },
  { name: 'POST /api/media/[id]/notes/import', handler: importNotes, method: 'POST', path: (i) => `/api/media/${i}/notes/import`, id: () => clipId, who: () => owner },
  { name: 'PATCH /api/notes/[id]', handler: patchNote, method: 'PATCH', path: (i) => `/api/notes/${i}`, id: () => noteId, who: () => owner },
  { name: 'POST /api/measurements/pairs', handler: pairs, method: 'POST', path: () => '/api/measurements/pairs', id: () => 0, who: () => owner },
  { name: 'POST /api/invitations/accept', handler: acceptInvitation, method: 'POST', path: () => '/api/invitations/accept', id: () => 0, who: () => mentor },
  { name: 'PATCH /api/me/follows', handler: patchFollows, method: 'PATCH', path: () => '/api/me/follows', id: () => 0, who: () => owner },
  { name: 'POST /api/unsubscribe', handler: unsubscribe, method: 'POST', path: () => '/api/unsubscribe', id: () => 0, who: () => null },
  { name: 'POST /api/account', handler: signUp, method: 'POST', path: () => '/api/account', id: () => 0, who: () => null },
];

describe('fuzzed bodies and ids never answer 500', () => {
  test.each(targets.map((t) => [t.name, t] as const))('%s', async (_, t) => {
    await fc.assert(
      fc.asyncProperty(hostileBody, fc.option(hostileId, { freq: 4 }), async (body, badId) => {
        const id = badId ?? String(t.id());
        const res = await call(t.handler, req(t.path(encodeURIComponent(id)), { method: t.method, cookie: t.who()?.cookie, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }), { id });
        if (res.status >= 500) throw new Error(`${t.name} answered ${res.status} to id ${JSON.stringify(id)}, body ${JSON.stringify(body).slice(0, 300)}: ${await res.text()}`);
        if (res.status >= 400) {
          const answer = await res.json();
          expect(typeof answer.message).toBe('string');
        }
      }),
      { numRuns: Number(process.env.FUZZ_RUNS ?? 40), seed: Number(process.env.FUZZ_SEED ?? 11), endOnFailure: true },
    );
  }, 120_000);

  test('GET handlers with hostile ids never answer 500', async () => {
    for (const [handler, path] of [[getSession, '/api/sessions/'], [getEntry, '/api/entries/']] as const) {
      await fc.assert(
        fc.asyncProperty(hostileId, async (id) => {
          const res = await call(handler, req(path + encodeURIComponent(id), { method: 'GET', cookie: owner.cookie }), { id });
          expect(res.status, `${path}${id}`).toBeLessThan(500);
        }),
        { numRuns: 30, seed: 11 },
      );
    }
  });
});
