import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listComments, POST as postComment } from '@/app/api/entries/[id]/comments/route';
import { PATCH as patchComment, DELETE as deleteComment } from '@/app/api/comments/[id]/route';
import { POST as hideComment, DELETE as unhideComment } from '@/app/api/comments/[id]/hide/route';
import { initModels, Comment, Project, ProjectMembership, ShopSession, Entry, Media, User } from '@/db/models';
import { COMMENT_RATE_LIMITS } from '@/lib/validations/comments';

guardTestDatabase();

type U = Awaited<ReturnType<typeof makeUser>>;
type Vis = 'private' | 'unlisted' | 'published';
let owner: U, reader: U, other: U, mentor: U, admin: U;
const users: number[] = [];
const projects: number[] = [];
let entryId: number, clipId: number, photoId: number, unsizedClipId: number;
let unpublishedEntryId: number, privateEntryId: number, otherEntryClipId: number;

async function makeLog(projectVisibility: Vis, sessionVisibility: Vis, tag: string) {
  const project = await Project.create({
    ownerId: owner.id,
    slug: `comments-it-${tag}-${Date.now().toString(36)}-${process.pid}`,
    title: `Backplate ${tag}`,
    summary: 'A backplate for the three-jaw chuck.',
    units: 'mm',
    visibility: projectVisibility,
    publishedAt: projectVisibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
  const session = await ShopSession.create({
    projectId: project.id, position: 0, title: 'Spigot', heldOn: '2026-10-10', minutesSpent: 120, planned: '', done: '', nextSteps: '',
    visibility: sessionVisibility, publishedAt: sessionVisibility === 'published' ? new Date() : null,
  });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  const clip = await Media.create({
    entryId: entry.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/c', name: 'last passes.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 12_000, uploadedBy: owner.id,
  });
  return { entry, clip };
}

const post = (who: U | null, id: number, body: unknown) =>
  postComment(request(`/api/entries/${id}/comments`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const list = async (who: U | null, id: number) => listComments(request(`/api/entries/${id}/comments`, { cookie: who?.cookie }), params({ id: String(id) }));
const patch = (who: U | null, id: number, body: unknown) =>
  patchComment(request(`/api/comments/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) }));
const del = (who: U | null, id: number) => deleteComment(request(`/api/comments/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));
const hide = (who: U | null, id: number, body: unknown) =>
  hideComment(request(`/api/comments/${id}/hide`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));
const unhide = (who: U | null, id: number) => unhideComment(request(`/api/comments/${id}/hide`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));

/** Posts and returns the comment, failing loudly on anything but 201. */
async function write(who: U, body: unknown, id = entryId) {
  const res = await post(who, id, body);
  const json = await res.json();
  expect(res.status, JSON.stringify(json)).toBe(201);
  return json.comment;
}

/** Each test's poster is fresh, so the rate limit never counts another test's comments. */
async function freshReader() {
  const u = await makeUser();
  users.push(u.id);
  return u;
}

beforeAll(async () => {
  initModels();
  [owner, reader, other, mentor, admin] = await Promise.all([makeUser(), makeUser(), makeUser(), makeUser(), makeUser('admin')]);
  users.push(owner.id, reader.id, other.id, mentor.id, admin.id);
  const published = await makeLog('published', 'published', 'pub');
  entryId = published.entry.id;
  clipId = published.clip.id;
  const photo = await Media.create({
    entryId, kind: 'photo', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/p', name: 'spigot.jpg',
    mime: 'image/jpeg', sizeBytes: 1000, width: 640, height: 480, durationMs: null, uploadedBy: owner.id,
  });
  photoId = photo.id;
  const unsized = await Media.create({
    entryId, kind: 'clip', source: 'link', fileKey: null, url: 'https://video.example.test/v/1', name: 'linked pass',
    mime: null, sizeBytes: null, width: null, height: null, durationMs: null, uploadedBy: owner.id,
  });
  unsizedClipId = unsized.id;
  unpublishedEntryId = (await makeLog('published', 'unlisted', 'unl')).entry.id;
  privateEntryId = (await makeLog('private', 'private', 'priv')).entry.id;
  otherEntryClipId = (await makeLog('published', 'published', 'pub2')).clip.id;
});

afterAll(async () => {
  // Sessions, entries, media and comments go with their project (ON DELETE CASCADE).
  await ProjectMembership.destroy({ where: { projectId: { [Op.in]: projects } } });
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('writing comments and replies', () => {
  test('a signed-in member comments, pinned to a moment of the clip; anyone reads it', async () => {
    const r = await freshReader();
    const comment = await write(r, { body: '  How did you measure the spigot diameter here?  ', mediaId: clipId, atMs: 5_000 });
    expect(comment).toMatchObject({ entryId, parentId: null, mediaId: clipId, atMs: 5_000, state: 'shown', body: 'How did you measure the spigot diameter here?', version: 1, editedAt: null, hidden: null });
    expect(comment.author).toMatchObject({ id: r.id, role: null });
    expect(comment.can).toEqual({ reply: true, edit: true, delete: true, hide: false, unhide: false });

    const res = await list(null, entryId);
    expect(res.status).toBe(200);
    const payload = await res.json();
    const listed = payload.comments.find((c: { id: number }) => c.id === comment.id);
    expect(listed).toMatchObject({ body: 'How did you measure the spigot diameter here?', atMs: 5_000 });
    // Signed out: nothing may be done with it, and the form asks to sign in.
    expect(listed.can).toEqual({ reply: false, edit: false, delete: false, hide: false, unhide: false });
    expect(payload.can).toEqual({ comment: false, closedReason: 'sign-in' });
    expect(payload.limits).toEqual({ bodyMax: 2000, perMinute: COMMENT_RATE_LIMITS[0].max, perHour: COMMENT_RATE_LIMITS[1].max });

    const asOwner = await (await list(owner, entryId)).json();
    expect(asOwner.comments.find((c: { id: number }) => c.id === comment.id).can).toMatchObject({ hide: true, edit: false, reply: true });
  });

  test('the builder replies one level deep; a reply to a reply → 400 saying so', async () => {
    const r = await freshReader();
    const top = await write(r, { body: 'Which insert grade?' });
    const reply = await write(owner, { body: 'A sharp uncoated one for cast iron.', parentId: top.id });
    expect(reply).toMatchObject({ parentId: top.id, author: { id: owner.id, role: 'builder' } });
    expect(reply.can.reply).toBe(false);

    const before = await Comment.count({ where: { entryId } });
    const deeper = await post(r, entryId, { body: 'Thanks!', parentId: reply.id });
    expect(deeper.status).toBe(400);
    const body = await deeper.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['parentId']);
    expect(body.message).toMatch(/one level deep/);
    expect(await Comment.count({ where: { entryId } })).toBe(before);

    const payload = await (await list(r, entryId)).json();
    const thread = payload.comments.find((c: { id: number }) => c.id === top.id);
    expect(thread.replies.map((c: { id: number }) => c.id)).toEqual([reply.id]);
  });

  test('a reply to a comment of another entry → 400; a pinned reply → 400', async () => {
    const r = await freshReader();
    const elsewhere = (await Entry.findOne({ include: [{ model: Media, as: 'media', where: { id: otherEntryClipId } }] }))!.id;
    const foreign = await write(r, { body: 'On the other entry' }, elsewhere);
    const res = await post(r, entryId, { body: 'Cross-thread', parentId: foreign.id });
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.parentId).toBeDefined();

    const top = await write(r, { body: 'Top' });
    const pinnedReply = await post(r, entryId, { body: 'At 0:03', parentId: top.id, mediaId: clipId, atMs: 3_000 });
    expect(pinnedReply.status).toBe(400);
    expect((await pinnedReply.json()).fieldErrors.mediaId).toBeDefined();
  });
});

describe('pinning to a moment', () => {
  test('a clip of another entry → 400 naming mediaId; a photo → 400; nothing saved', async () => {
    const r = await freshReader();
    for (const mediaId of [otherEntryClipId, photoId, 999_999_999]) {
      const res = await post(r, entryId, { body: 'Pinned elsewhere', mediaId, atMs: 1_000 });
      expect(res.status).toBe(400);
      expect(Object.keys((await res.json()).fieldErrors)).toEqual(['mediaId']);
    }
    expect(await Comment.count({ where: { authorId: r.id } })).toBe(0);
  });

  test('a moment past the clip’s end → 400 naming atMs and the clip’s length; the very end is fine', async () => {
    const r = await freshReader();
    const res = await post(r, entryId, { body: 'After the end', mediaId: clipId, atMs: 12_001 });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['atMs']);
    expect(body.fieldErrors.atMs[0]).toMatch(/0:12/);
    await write(r, { body: 'At the very end', mediaId: clipId, atMs: 12_000 });
    // A linked clip whose length is unknown takes any moment up to the schema's day-long bound.
    await write(r, { body: 'Far into a linked clip', mediaId: unsizedClipId, atMs: 3_600_000 });
  });

  test('a clip without a moment, a moment without a clip, a negative moment → 400', async () => {
    const r = await freshReader();
    expect((await post(r, entryId, { body: 'x', mediaId: clipId })).status).toBe(400);
    expect((await post(r, entryId, { body: 'x', atMs: 2_000 })).status).toBe(400);
    const neg = await post(r, entryId, { body: 'x', mediaId: clipId, atMs: -1 });
    expect(neg.status).toBe(400);
    expect((await neg.json()).fieldErrors.atMs).toBeDefined();
  });
});

describe('who may comment', () => {
  test('signed out → 401, even with a bad body', async () => {
    const res = await post(null, entryId, { body: 'Anonymous' });
    expect(res.status).toBe(401);
    expect((await res.json()).message).toMatch(/Sign in to comment/);
    expect((await post(null, entryId, { nonsense: true })).status).toBe(401);
  });

  test('an unlisted (not published) session → 403 and the payload says why; a private one → 404', async () => {
    const r = await freshReader();
    const res = await post(r, unpublishedEntryId, { body: 'Early bird' });
    expect(res.status).toBe(403);
    expect((await res.json()).message).toMatch(/published/);
    const payload = await (await list(r, unpublishedEntryId)).json();
    expect(payload.can).toEqual({ comment: false, closedReason: 'not-published' });
    // Not even the builder comments before publishing.
    expect((await post(owner, unpublishedEntryId, { body: 'Note to self' })).status).toBe(403);

    expect((await post(r, privateEntryId, { body: 'Peeking' })).status).toBe(404);
    expect((await list(r, privateEntryId)).status).toBe(404);
    expect(await Comment.count({ where: { entryId: { [Op.in]: [unpublishedEntryId, privateEntryId] } } })).toBe(0);
  });

  test('an unknown entry → 404; a bad id → 400', async () => {
    expect((await post(reader, 999_999_999, { body: 'x' })).status).toBe(404);
    const bad = await postComment(request('/api/entries/abc/comments', { method: 'POST', cookie: reader.cookie, body: { body: 'x' } }), params({ id: 'abc' }));
    expect(bad.status).toBe(400);
  });
});

describe('editing and deleting one’s own', () => {
  test('the author edits with the version read; a stale version → 409 and nothing changes', async () => {
    const r = await freshReader();
    const c = await write(r, { body: 'Fed at 0.1 mm/rev' });
    const ok = await patch(r, c.id, { body: 'Fed at 0.08 mm/rev', version: 1 });
    expect(ok.status).toBe(200);
    const edited = (await ok.json()).comment;
    expect(edited).toMatchObject({ body: 'Fed at 0.08 mm/rev', version: 2 });
    expect(edited.editedAt).not.toBeNull();

    const stale = await patch(r, c.id, { body: 'Overwritten?', version: 1 });
    expect(stale.status).toBe(409);
    expect((await stale.json()).error).toBe('conflict');
    const row = await Comment.findByPk(c.id);
    expect(row?.body).toBe('Fed at 0.08 mm/rev');
    expect(row?.version).toBe(2);
  });

  test('anyone else: 403 (the builder and admins included); signed out 401', async () => {
    const r = await freshReader();
    const c = await write(r, { body: 'My own words' });
    expect((await patch(other, c.id, { body: 'Not yours', version: 1 })).status).toBe(403);
    expect((await patch(owner, c.id, { body: 'Not yours', version: 1 })).status).toBe(403);
    expect((await patch(admin, c.id, { body: 'Not yours', version: 1 })).status).toBe(403);
    expect((await patch(null, c.id, { body: 'Not yours', version: 1 })).status).toBe(401);
    expect((await del(other, c.id)).status).toBe(403);
    expect((await del(null, c.id)).status).toBe(401);
    expect((await Comment.findByPk(c.id))?.body).toBe('My own words');
  });

  test('deleting with replies leaves a placeholder without text or author; without replies it disappears', async () => {
    const r = await freshReader();
    const withReply = await write(r, { body: 'Asked and answered' });
    await write(owner, { body: 'Answer', parentId: withReply.id });
    const alone = await write(r, { body: 'Nobody answered' });
    expect((await del(r, withReply.id)).status).toBe(204);
    expect((await del(r, alone.id)).status).toBe(204);
    // Deleting twice is not an error.
    expect((await del(r, alone.id)).status).toBe(204);

    const row = await Comment.findByPk(withReply.id);
    expect(row?.deletedAt).not.toBeNull();
    expect(row?.body).toBe('');

    const payload = await (await list(null, entryId)).json();
    const placeholder = payload.comments.find((c: { id: number }) => c.id === withReply.id);
    expect(placeholder).toMatchObject({ state: 'removed', body: '', author: null });
    expect(placeholder.replies).toHaveLength(1);
    expect(payload.comments.some((c: { id: number }) => c.id === alone.id)).toBe(false);
    expect(JSON.stringify(payload)).not.toContain('Asked and answered');
    expect((await patch(r, withReply.id, { body: 'Back again', version: 2 })).status).toBe(404);
  });
});

describe('hiding', () => {
  test('the builder hides with a reason: readers see the reason, not the text; the author, builder and admin still read it', async () => {
    const r = await freshReader();
    const c = await write(r, { body: 'Buy my ugly-secret-discount gadget now', mediaId: clipId, atMs: 7_000 });
    const res = await hide(owner, c.id, { reason: 'Advertising' });
    expect(res.status).toBe(200);
    const hidden = (await res.json()).comment;
    expect(hidden).toMatchObject({ state: 'hidden', hidden: { by: 'builder', reason: 'Advertising', textShown: true } });
    expect(hidden.can).toMatchObject({ hide: false, unhide: true });

    for (const who of [null, other, mentor]) {
      const text = await (await list(who, entryId)).text();
      expect(text).not.toContain('ugly-secret-discount');
      const seen = JSON.parse(text).comments.find((x: { id: number }) => x.id === c.id);
      expect(seen).toMatchObject({ state: 'hidden', body: '', hidden: { by: 'builder', reason: 'Advertising', textShown: false } });
    }
    for (const who of [r, owner, admin]) {
      const seen = (await (await list(who, entryId)).json()).comments.find((x: { id: number }) => x.id === c.id);
      expect(seen.body).toBe('Buy my ugly-secret-discount gadget now');
      expect(seen.hidden.textShown).toBe(true);
    }
    // Kept in the database.
    expect((await Comment.findByPk(c.id))?.body).toBe('Buy my ugly-secret-discount gadget now');
    // A hidden comment can no longer be edited or answered, but its author may delete it.
    expect((await patch(r, c.id, { body: 'Changed', version: hidden.version })).status).toBe(403);
    expect((await post(other, entryId, { body: 'Reply', parentId: c.id })).status).toBe(400);

    const back = await unhide(owner, c.id);
    expect(back.status).toBe(200);
    expect((await back.json()).comment).toMatchObject({ state: 'shown', hidden: null, body: 'Buy my ugly-secret-discount gadget now' });
  });

  test('an admin hides with a reason and is named as an admin', async () => {
    const r = await freshReader();
    const c = await write(r, { body: 'Rude words' });
    const res = await hide(admin, c.id, { reason: 'Insults another reader' });
    expect(res.status).toBe(200);
    const listed = (await (await list(null, entryId)).json()).comments.find((x: { id: number }) => x.id === c.id);
    expect(listed.hidden).toMatchObject({ by: 'admin', reason: 'Insults another reader' });
    expect((await unhide(admin, c.id)).status).toBe(200);
  });

  test('a member, a mentor or the author cannot hide or unhide: 403; signed out 401; a reason is required', async () => {
    const r = await freshReader();
    const c = await write(r, { body: 'Mild words' });
    expect((await hide(other, c.id, { reason: 'I disagree' })).status).toBe(403);
    expect((await hide(r, c.id, { reason: 'Mine' })).status).toBe(403);
    expect((await hide(mentor, c.id, { reason: 'Mentor' })).status).toBe(403);
    expect((await hide(null, c.id, { reason: 'Anon' })).status).toBe(401);
    expect((await unhide(other, c.id)).status).toBe(403);

    const empty = await hide(owner, c.id, { reason: '   ' });
    expect(empty.status).toBe(400);
    expect(Object.keys((await empty.json()).fieldErrors)).toEqual(['reason']);
    const long = await hide(owner, c.id, { reason: 'x'.repeat(301) });
    expect(long.status).toBe(400);
    expect((await long.json()).fieldErrors.reason[0]).toMatch(/300 characters or fewer/);
    expect((await Comment.findByPk(c.id))?.hiddenAt).toBeNull();
  });
});

describe('abuse limits', () => {
  test('length: 2,000 characters after trimming is fine, 2,001 → 400 naming body; empty → 400', async () => {
    const r = await freshReader();
    await write(r, { body: `  ${'a'.repeat(2000)}  ` });
    const long = await post(r, entryId, { body: 'a'.repeat(2001) });
    expect(long.status).toBe(400);
    const body = await long.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['body']);
    expect(body.fieldErrors.body[0]).toBe('Comment must be 2,000 characters or fewer.');
    expect((await post(r, entryId, { body: ' \n\t ' })).status).toBe(400);
    // Characters as people count them: 2,000 emoji are 4,000 UTF-16 units and still fit.
    await write(r, { body: '🔩'.repeat(2000) });
  });

  test('rate: the sixth comment within a minute → 429 saying the limits and when to try again', async () => {
    const r = await freshReader();
    const minute = COMMENT_RATE_LIMITS[0];
    // Rows written directly with times inside the window, so the test need not wait.
    const rows = await Comment.bulkCreate(
      Array.from({ length: minute.max }, (_, i) => ({ entryId, authorId: r.id, body: `Burst ${i}`, parentId: null, mediaId: null, atMs: null, createdAt: new Date(Date.now() - 30_000 + i * 1000) })),
    );
    expect(rows).toHaveLength(minute.max);
    const res = await post(r, entryId, { body: 'One too many' });
    expect(res.status).toBe(429);
    const body = await res.json();
    expect(body.error).toBe('rate_limited');
    expect(body.message).toMatch(/at most 5 comments a minute and 30 an hour/);
    // The oldest of the five was written 30 s ago: it leaves the one-minute window in about 30 s.
    expect(body.message).toMatch(/in (29|30|31) seconds/);
    expect(await Comment.count({ where: { authorId: r.id } })).toBe(minute.max);
  });

  test('rate: 30 within the hour → 429 naming minutes; older ones do not count', async () => {
    const r = await freshReader();
    const hour = COMMENT_RATE_LIMITS[1];
    const now = Date.now();
    await Comment.bulkCreate([
      // Spread over the last 50 minutes, none in the last minute.
      ...Array.from({ length: hour.max }, (_, i) => ({ entryId, authorId: r.id, body: `Steady ${i}`, parentId: null, mediaId: null, atMs: null, createdAt: new Date(now - 50 * 60_000 + i * 60_000) })),
      // Outside the hour: never counted.
      { entryId, authorId: r.id, body: 'Long ago', parentId: null, mediaId: null, atMs: null, createdAt: new Date(now - 3 * 3_600_000) },
    ]);
    const res = await post(r, entryId, { body: 'Thirty-first' });
    expect(res.status).toBe(429);
    // The oldest counted was written 50 minutes ago: it ages out of the hour in about 10 minutes.
    expect((await res.json()).message).toMatch(/in (10|11) minutes/);

    const fresh = await freshReader();
    await Comment.bulkCreate(
      Array.from({ length: 10 }, (_, i) => ({ entryId, authorId: fresh.id, body: `Old ${i}`, parentId: null, mediaId: null, atMs: null, createdAt: new Date(now - 2 * 3_600_000 + i * 1000) })),
    );
    await write(fresh, { body: 'Old comments do not count' });
  });
});
