import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { Op } from 'sequelize';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { GET as listNotes, POST as postNote } from '@/app/api/media/[id]/notes/route';
import { PATCH as patchNote, DELETE as deleteNote } from '@/app/api/notes/[id]/route';
import { POST as importNotes } from '@/app/api/media/[id]/notes/import/route';
import { GET as getChapters } from '@/app/api/media/[id]/chapters/route';
import { initModels, Project, ProjectMembership, ShopSession, Entry, Media, TimeNote, User } from '@/db/models';

guardTestDatabase();

const VTT = 'W3C WebVTT: Web Video Text Tracks Format — from memory';

type U = Awaited<ReturnType<typeof makeUser>>;
let owner: U, other: U, mentor: U;
const users: number[] = [];
const projects: number[] = [];
let clipId: number, photoId: number, privateClipId: number, emptyClipId: number;

async function makeLog(visibility: 'published' | 'private', tag: string) {
  const project = await Project.create({
    ownerId: owner.id,
    slug: `notes-it-${tag}-${Date.now().toString(36)}-${process.pid}`,
    title: `Backplate spigot ${tag}`,
    summary: 'Turning the spigot to the chuck recess.',
    units: 'mm',
    visibility,
    publishedAt: visibility === 'published' ? new Date() : null,
  });
  projects.push(project.id);
  await ProjectMembership.create({ projectId: project.id, userId: mentor.id, role: 'mentor' });
  const session = await ShopSession.create({ projectId: project.id, position: 0, title: 'Spigot', heldOn: '2026-03-14', minutesSpent: 90, planned: '', done: '', nextSteps: '', visibility: 'published' });
  const entry = await Entry.create({ sessionId: session.id, position: 0, title: 'Turning the spigot', operation: 'turning', body: JSON.stringify({ type: 'doc', content: [] }) });
  const clip = await Media.create({
    entryId: entry.id, kind: 'clip', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/x', name: 'spigot pass.mp4',
    mime: 'video/mp4', sizeBytes: 1000, width: 640, height: 360, durationMs: 400_000, uploadedBy: owner.id,
  });
  const photo = await Media.create({
    entryId: entry.id, kind: 'photo', source: 'upload', fileKey: null, url: 'http://127.0.0.1:3100/f/y', name: 'spigot.jpg',
    mime: 'image/jpeg', sizeBytes: 1000, width: 640, height: 480, durationMs: null, uploadedBy: owner.id,
  });
  return { clip, photo, entry };
}

const post = (who: U | null, mediaId: number, body: unknown) =>
  postNote(request(`/api/media/${mediaId}/notes`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(mediaId) }));
const list = (who: U | null, mediaId: number) => listNotes(request(`/api/media/${mediaId}/notes`, { cookie: who?.cookie }), params({ id: String(mediaId) }));
const patch = (who: U | null, noteId: number, body: unknown) =>
  patchNote(request(`/api/notes/${noteId}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(noteId) }));
const del = (who: U | null, noteId: number) => deleteNote(request(`/api/notes/${noteId}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(noteId) }));
const doImport = (who: U | null, mediaId: number, body: unknown) =>
  importNotes(request(`/api/media/${mediaId}/notes/import`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(mediaId) }));
const chapters = (who: U | null, mediaId: number, format?: string) =>
  getChapters(request(`/api/media/${mediaId}/chapters${format ? `?format=${format}` : ''}`, { cookie: who?.cookie }), params({ id: String(mediaId) }));

const good = { startMs: 221_000, kind: 'measurement', text: 'Spigot reads 79.98 mm' };

beforeAll(async () => {
  initModels();
  [owner, other, mentor] = await Promise.all([makeUser(), makeUser(), makeUser()]);
  users.push(owner.id, other.id, mentor.id);
  const published = await makeLog('published', 'pub');
  clipId = published.clip.id;
  photoId = published.photo.id;
  privateClipId = (await makeLog('private', 'priv')).clip.id;
  const spare = await Media.create({
    entryId: published.entry.id, kind: 'clip', source: 'link', fileKey: null, url: 'http://127.0.0.1:3100/f/z', name: 'Facing «pass» 2',
    mime: null, sizeBytes: null, width: null, height: null, durationMs: null, uploadedBy: owner.id,
  });
  emptyClipId = spare.id;
});

afterAll(async () => {
  // Sessions, entries, media and notes go with their project (ON DELETE CASCADE).
  await ProjectMembership.destroy({ where: { projectId: { [Op.in]: projects } } });
  await Project.destroy({ where: { id: { [Op.in]: projects } } });
  await User.destroy({ where: { id: { [Op.in]: users } } });
  await closeDb();
});

describe('notes on a clip: round trip', () => {
  test('create → list → update → delete', async () => {
    const res = await post(owner, clipId, { ...good, endMs: 240_000 });
    expect(res.status).toBe(201);
    const { note } = await res.json();
    expect(note).toMatchObject({ mediaId: clipId, startMs: 221_000, endMs: 240_000, kind: 'measurement', text: 'Spigot reads 79.98 mm', version: 1 });
    expect(note.author).toEqual({ id: owner.id, name: expect.any(String) });

    await post(owner, clipId, { startMs: 5_000, kind: 'caution', text: 'Chuck key out before power-on' });
    const listed = await (await list(null, clipId)).json();
    expect(listed.notes.map((n: { startMs: number }) => n.startMs)).toEqual([5_000, 221_000]);

    const upd = await patch(owner, note.id, { text: 'Spigot reads 79.99 mm', endMs: null, version: 1 });
    expect(upd.status).toBe(200);
    const updated = (await upd.json()).note;
    expect(updated).toMatchObject({ text: 'Spigot reads 79.99 mm', endMs: null, version: 2, startMs: 221_000 });

    const gone = await del(owner, note.id);
    expect(gone.status).toBe(204);
    expect(await TimeNote.count({ where: { id: note.id } })).toBe(0);
  });

  test('a stale version → 409 and nothing changes', async () => {
    const { note } = await (await post(owner, clipId, { startMs: 10_000, kind: 'note', text: 'First cut' })).json();
    expect((await patch(owner, note.id, { text: 'Second cut', version: 1 })).status).toBe(200);
    const stale = await patch(owner, note.id, { text: 'Overwritten?', version: 1 });
    expect(stale.status).toBe(409);
    expect((await stale.json()).error).toBe('conflict');
    const row = await TimeNote.findByPk(note.id);
    expect(row?.text).toBe('Second cut');
    expect(row?.version).toBe(2);
  });

  test('an update that puts the end before the start → 400 naming endMs', async () => {
    const { note } = await (await post(owner, clipId, { startMs: 20_000, endMs: 30_000, kind: 'note', text: 'Span' })).json();
    const res = await patch(owner, note.id, { startMs: 35_000, version: 1 });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors)).toEqual(['endMs']);
    expect((await TimeNote.findByPk(note.id))?.startMs).toBe(20_000);
  });
});

describe('bad input → 400 naming each field, nothing saved', () => {
  test('negative start, end before start, unknown kind, empty text', async () => {
    const before = await TimeNote.count({ where: { mediaId: clipId } });
    const res = await post(owner, clipId, { startMs: -1, endMs: -5, kind: 'shout', text: '   ' });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors).sort()).toEqual(['endMs', 'kind', 'startMs', 'text']);
    expect(body.fieldErrors.startMs[0]).toMatch(/cannot be negative/);
    expect(body.fieldErrors.kind[0]).toMatch(/note, measurement, caution or question/);
    expect(body.fieldErrors.text[0]).toMatch(/Write the note/);
    expect(await TimeNote.count({ where: { mediaId: clipId } })).toBe(before);
  });

  test('end before start alone → 400 naming endMs', async () => {
    const res = await post(owner, clipId, { startMs: 50_000, endMs: 40_000, kind: 'note', text: 'Backwards' });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors)).toEqual(['endMs']);
  });

  test('a start past the clip’s known duration → 400 naming startMs', async () => {
    const res = await post(owner, clipId, { startMs: 400_001, kind: 'note', text: 'After the end' });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['startMs']);
    expect(body.fieldErrors.startMs[0]).toMatch(/6:40/);
    expect((await post(owner, clipId, { startMs: 400_000, kind: 'note', text: 'At the very end' })).status).toBe(201);
  });

  test('a body that is not JSON → 400', async () => {
    const res = await postNote(request(`/api/media/${clipId}/notes`, { method: 'POST', cookie: owner.cookie, rawBody: '{"startMs":' }), params({ id: String(clipId) }));
    expect(res.status).toBe(400);
  });

  test('a note on a photo → 400', async () => {
    const res = await post(owner, photoId, good);
    expect(res.status).toBe(400);
    expect((await res.json()).fieldErrors.mediaId).toBeDefined();
    expect(await TimeNote.count({ where: { mediaId: photoId } })).toBe(0);
  });

  test('an unknown clip → 404', async () => {
    expect((await post(owner, 999_999_999, good)).status).toBe(404);
  });
});

describe('policy', () => {
  test('signed out: POST → 401 (even with a bad body), GET on a published clip → 200, on a private one → 404', async () => {
    expect((await post(null, clipId, good)).status).toBe(401);
    expect((await post(null, clipId, { kind: 'shout' })).status).toBe(401);
    expect((await list(null, clipId)).status).toBe(200);
    expect((await list(null, privateClipId)).status).toBe(404);
  });

  test('another member: 403 on a published project, 404 on a private one; nothing saved', async () => {
    const before = await TimeNote.count();
    expect((await post(other, clipId, good)).status).toBe(403);
    expect((await post(other, privateClipId, good)).status).toBe(404);
    expect(await TimeNote.count()).toBe(before);
  });

  test('a mentor may read a private log but not change it: 403', async () => {
    expect((await list(mentor, privateClipId)).status).toBe(200);
    expect((await post(mentor, privateClipId, good)).status).toBe(403);
    expect((await post(mentor, clipId, good)).status).toBe(403);
  });

  test('PATCH and DELETE by anyone but the builder are refused and change nothing', async () => {
    const { note } = await (await post(owner, clipId, { startMs: 60_000, kind: 'question', text: 'Which insert?' })).json();
    expect((await patch(null, note.id, { text: 'x', version: 1 })).status).toBe(401);
    expect((await patch(other, note.id, { text: 'x', version: 1 })).status).toBe(403);
    expect((await patch(mentor, note.id, { text: 'x', version: 1 })).status).toBe(403);
    expect((await del(other, note.id)).status).toBe(403);
    expect((await del(null, note.id)).status).toBe(401);
    expect((await TimeNote.findByPk(note.id))?.text).toBe('Which insert?');
  });
});

describe('import', () => {
  test(`a WebVTT file with 3 good cues and 2 bad lines → 3 notes and 2 problems with line numbers (${VTT})`, async () => {
    const text = [
      'WEBVTT', //                                 1
      '', //                                       2
      '00:00:00.000 --> 00:00:30.000', //          3
      'Facing the spigot', //                      4
      '', //                                       5
      'this line is not a cue', //                 6
      '', //                                       7
      '00:00:30.000 --> 00:01:00.000', //          8
      'Turning to size', //                        9
      '', //                                      10
      '00:01:30.000 --> 00:01:20.000', //         11
      'Backwards', //                             12
      '', //                                      13
      '00:02:00.000 --> 00:10:00.000', //         14
      'Check the fit', //                         15
    ].join('\n');
    const before = await TimeNote.count({ where: { mediaId: emptyClipId } });
    const res = await doImport(owner, emptyClipId, { fileName: 'spigot.vtt', text });
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.created.map((n: { startMs: number; text: string }) => [n.startMs, n.text])).toEqual([
      [0, 'Facing the spigot'],
      [30_000, 'Turning to size'],
      [120_000, 'Check the fit'],
    ]);
    expect(body.problems.map((p: { line: number }) => p.line)).toEqual([6, 11]);
    expect(body.problems[1].reason).toMatch(/before its start/);
    expect(await TimeNote.count({ where: { mediaId: emptyClipId } })).toBe(before + 3);
  });

  test('an SRT file is read too', async () => {
    const res = await doImport(owner, clipId, { fileName: 'pass.srt', text: '1\r\n00:03:00,000 --> 00:03:10,000\r\nDeburr\r\n' });
    expect(res.status).toBe(201);
    expect((await res.json()).created[0]).toMatchObject({ startMs: 180_000, endMs: 190_000, kind: 'note', text: 'Deburr' });
  });

  test('a cue starting after the clip’s end is reported, the rest saved', async () => {
    const res = await doImport(owner, clipId, { fileName: 'late.vtt', text: 'WEBVTT\n\n00:01:00.000 --> 00:01:05.000\nIn\n\n00:07:00.000 --> 00:07:05.000\nOut\n' });
    const body = await res.json();
    expect(body.created.map((n: { text: string }) => n.text)).toEqual(['In']);
    expect(body.problems).toEqual([{ line: 6, reason: expect.stringMatching(/after the end of the clip \(6:40\)/) }]);
  });

  test('an unreadable file → 400 naming the lines, nothing saved', async () => {
    const before = await TimeNote.count({ where: { mediaId: clipId } });
    const res = await doImport(owner, clipId, { fileName: 'shopping.txt', text: 'cutting oil\n\nmore tool bits\n' });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.message).toMatch(/Nothing was imported/);
    expect(body.fieldErrors.text).toEqual([expect.stringMatching(/^Line 1: /), expect.stringMatching(/^Line 3: /)]);
    expect(await TimeNote.count({ where: { mediaId: clipId } })).toBe(before);
  });

  test('a file over 1 MB → 413 with a clear message, nothing saved', async () => {
    const before = await TimeNote.count({ where: { mediaId: clipId } });
    const text = 'WEBVTT\n\n00:00:01.000 --> 00:00:02.000\n' + 'x'.repeat(1024 * 1024) + '\n';
    const res = await doImport(owner, clipId, { fileName: 'huge.vtt', text });
    expect(res.status).toBe(413);
    expect((await res.json()).message).toMatch(/larger than 1 MB/);
    expect(await TimeNote.count({ where: { mediaId: clipId } })).toBe(before);
  });

  test('missing fields → 400 naming them; signed out → 401; another member → 403', async () => {
    const res = await doImport(owner, clipId, {});
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).fieldErrors).sort()).toEqual(['fileName', 'text']);
    expect((await doImport(null, clipId, { fileName: 'a.vtt', text: 'WEBVTT' })).status).toBe(401);
    expect((await doImport(other, clipId, { fileName: 'a.vtt', text: 'WEBVTT' })).status).toBe(403);
  });
});

describe('chapters export', () => {
  let exportClip: number;
  beforeAll(async () => {
    const log = await makeLog('published', 'export');
    exportClip = log.clip.id;
    await post(owner, exportClip, { startMs: 221_000, kind: 'measurement', text: 'Measure the spigot' });
    await post(owner, exportClip, { startMs: 0, kind: 'note', text: 'Facing the spigot' });
    await post(owner, exportClip, { startMs: 300_000, endMs: 320_000, kind: 'caution', text: 'Chuck key out & <check>' });
  });

  test(`?format=vtt → text/vtt with HH:MM:SS.mmm cues, each ending at the next start, its own end or the clip end (${VTT})`, async () => {
    const res = await chapters(null, exportClip, 'vtt');
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/vtt; charset=utf-8');
    expect(await res.text()).toBe(
      'WEBVTT\n\n' +
        '1\n00:00:00.000 --> 00:03:41.000\nFacing the spigot\n\n' +
        '2\n00:03:41.000 --> 00:05:00.000\nMeasure the spigot\n\n' +
        '3\n00:05:00.000 --> 00:05:20.000\nChuck key out &amp; &lt;check&gt;\n',
    );
  });

  test('the download is named after the clip (RFC 6266 Content-Disposition)', async () => {
    const res = await chapters(null, exportClip, 'vtt');
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="spigot pass-chapters\.vtt"/);
    const other = await chapters(null, emptyClipId, 'vtt');
    // Non-ASCII names keep an ASCII fallback and the full name in filename* (RFC 5987).
    expect(other.headers.get('content-disposition')).toBe(`attachment; filename="Facing _pass_ 2-chapters.vtt"; filename*=UTF-8''${encodeURIComponent('Facing «pass» 2-chapters.vtt')}`);
  });

  test('?format=txt → the timestamp list, one "m:ss title" line per note', async () => {
    const res = await chapters(null, exportClip, 'txt');
    expect(res.headers.get('content-type')).toBe('text/plain; charset=utf-8');
    expect(await res.text()).toBe('0:00 Facing the spigot\n3:41 Measure the spigot\n5:00 Chuck key out & <check>\n');
  });

  test('an unknown format → 400; a private clip signed out → 404; a photo → 400', async () => {
    expect((await chapters(null, exportClip, 'pdf')).status).toBe(400);
    expect((await chapters(null, privateClipId, 'vtt')).status).toBe(404);
    expect((await chapters(null, photoId, 'vtt')).status).toBe(400);
  });
});
