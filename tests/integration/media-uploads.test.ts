import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { Op } from 'sequelize';
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { genUploader } from 'uploadthing/client';
import { UTApi, UTFile } from 'uploadthing/server';

import { startUploadService, type UploadService } from '@/uploads-fake/server';
import { guardTestDatabase, closeDb, makeUser, request, params } from '../support/db';
import { installFetchXhr, serveApp, type FetchHandler } from '../support/upload-harness';
import { initModels, Entry, Media, Project, ShopSession, TimeNote, User } from '@/db/models';
import type { MediaView } from '@/lib/types/log';
import type { OurFileRouter } from '@/app/api/uploadthing/core';

guardTestDatabase();

// The real route handler and the real, unmodified upload SDK on both sides, against the local
// upload service; only the browser's XMLHttpRequest is stood in for (see tests/support/upload-harness.ts).

const TOKEN = Buffer.from(JSON.stringify({ apiKey: 'sk_scribeline_media_test', appId: 'scribeline-media-test', regions: ['local'] })).toString('base64');
const fixture = (name: string) => readFile(path.join(__dirname, '..', 'fixtures', 'media', name));

type U = Awaited<ReturnType<typeof makeUser>>;
type Outcome = { ok: true; media: MediaView } | { ok: false; message: string };

let dataDir = '';
let service: UploadService;
let app: { url: string; close(): Promise<void> };
let restoreXhr: () => void;
let utapi: UTApi;
let builder: U, stranger: U;
let projectId = 0, privateProjectId = 0, entryId = 0, privateEntryId = 0;

// Loaded after the UPLOADTHING_* environment points at the service, as the app would be.
let mediaRoutes: typeof import('@/app/api/entries/[id]/media/route');
let itemRoutes: typeof import('@/app/api/media/[id]/route');
let sweepRoute: typeof import('@/app/api/admin/uploads/sweep/route');
let mediaLib: typeof import('@/lib/server/media');

function uploader() {
  return genUploader<OurFileRouter>({ url: new URL(`${app.url}/api/uploadthing`), package: 'uploadthing/client', fetch });
}

async function storedKeys(): Promise<string[]> {
  const names = await readdir(path.join(dataDir, 'files')).catch(() => [] as string[]);
  return names.filter((n) => !n.endsWith('.json')).sort();
}

async function upload(who: U | null, slug: 'entryPhoto' | 'entryClip', files: File[], input: { entryId: number; durationMs?: number }) {
  return uploader().uploadFiles(slug, { files, input, headers: who ? { cookie: who.cookie } : {} });
}

async function refusal(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
  } catch (err) {
    return (err as Error).message;
  }
  throw new Error('the upload was expected to be refused');
}

beforeAll(async () => {
  initModels();
  dataDir = await mkdtemp(path.join(os.tmpdir(), 'scribeline-media-'));
  service = await startUploadService({ port: 0, dataDir, token: TOKEN, callbackTimeoutMs: 5_000 });
  let routes: Record<string, FetchHandler> = {};
  app = await serveApp(() => routes);
  Object.assign(process.env, {
    UPLOADTHING_TOKEN: TOKEN,
    UPLOADTHING_INGEST_URL: service.url,
    UPLOADTHING_API_URL: service.url,
    UPLOADTHING_IS_DEV: 'false',
    UPLOADTHING_CALLBACK_URL: `${app.url}/api/uploadthing`,
    UPLOADTHING_LOG_LEVEL: 'Error',
  });
  const handler = await import('@/app/api/uploadthing/route');
  routes = { '/api/uploadthing': (req) => (req.method === 'GET' ? handler.GET(req as never) : handler.POST(req as never)) };
  mediaRoutes = await import('@/app/api/entries/[id]/media/route');
  itemRoutes = await import('@/app/api/media/[id]/route');
  sweepRoute = await import('@/app/api/admin/uploads/sweep/route');
  mediaLib = await import('@/lib/server/media');
  utapi = new UTApi({ token: TOKEN, apiUrl: service.url, ingestUrl: service.url, logLevel: 'Error' });
  restoreXhr = installFetchXhr();

  [builder, stranger] = await Promise.all([makeUser(), makeUser()]);
  const tag = Date.now().toString(36);
  const project = await Project.create({ ownerId: builder.id, slug: `media-it-${tag}`, title: 'Faceplate for the dividing head', summary: '', units: 'mm', visibility: 'published', publishedAt: new Date() });
  const hidden = await Project.create({ ownerId: builder.id, slug: `media-it-private-${tag}`, title: 'Private tooling', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
  projectId = project.id;
  privateProjectId = hidden.id;
  const session = await ShopSession.create({ projectId, position: 0, title: 'Facing the blank', heldOn: '2026-03-14', minutesSpent: 90, planned: '', done: '', nextSteps: '', visibility: 'published' });
  const privateSession = await ShopSession.create({ projectId: privateProjectId, position: 0, title: 'Jig', heldOn: '2026-03-15', minutesSpent: 30, planned: '', done: '', nextSteps: '' });
  entryId = (await Entry.create({ sessionId: session.id, position: 0, title: 'Facing cut', operation: 'facing', body: '{"type":"doc"}' })).id;
  privateEntryId = (await Entry.create({ sessionId: privateSession.id, position: 0, title: 'Jig plate', operation: 'layout', body: '{"type":"doc"}' })).id;
});

afterAll(async () => {
  restoreXhr?.();
  await Project.destroy({ where: { id: { [Op.in]: [projectId, privateProjectId] } } });
  await User.destroy({ where: { id: { [Op.in]: [builder?.id, stranger?.id].filter(Boolean) as number[] } } });
  await app?.close();
  await service?.close();
  await rm(dataDir, { recursive: true, force: true });
  await closeDb();
});

describe('uploading photos and clips through the upload SDK', () => {
  test('the builder uploads a real PNG: a row with its measured size, and the file is served', async () => {
    const png = await fixture('scribe-4x3.png');
    const [result] = await upload(builder, 'entryPhoto', [new File([png], 'backplate.png', { type: 'image/png' })], { entryId });
    const outcome = result!.serverData as Outcome;
    expect(outcome).toMatchObject({ ok: true, media: { kind: 'photo', source: 'upload', width: 4, height: 3, mime: 'image/png', sizeBytes: png.length, position: 0, name: 'backplate.png' } });
    const row = await Media.findOne({ where: { fileKey: result!.key } });
    expect(row).toMatchObject({ entryId, width: 4, height: 3, uploadedBy: builder.id, url: result!.ufsUrl });
    const served = await fetch(result!.ufsUrl);
    expect(served.status).toBe(200);
    expect(Buffer.from(await served.arrayBuffer()).equals(png)).toBe(true);
  });

  test('a photo turned by its EXIF orientation gets its shown size, next in line', async () => {
    // 4×2 pixels stored, EXIF orientation 6: shown 2 wide and 4 high (Exif 2.3, tag 0x0112 — from memory)
    const jpg = await fixture('rotated-4x2-orient6.jpg');
    const [result] = await upload(builder, 'entryPhoto', [new File([jpg], 'upright.jpg', { type: 'image/jpeg' })], { entryId });
    expect(result!.serverData).toMatchObject({ ok: true, media: { width: 2, height: 4, mime: 'image/jpeg', position: 1 } });
  });

  test('several photos sent at once are recorded side by side, each in its own place', async () => {
    const session = await ShopSession.findOne({ where: { projectId } });
    const batchEntry = await Entry.create({ sessionId: session!.id, position: 1, title: 'Batch', operation: 'other', body: '{"type":"doc"}' });
    const types = { 'scribe-4x3.png': 'image/png', 'dye-2x2.jpg': 'image/jpeg', 'tiny-3x5.gif': 'image/gif', 'tiny-6x4.webp': 'image/webp' };
    const files = await Promise.all(Object.entries(types).map(async ([name, type]) => new File([await fixture(name)], name, { type })));
    // The callbacks for one batch reach the app at the same time.
    const results = await upload(builder, 'entryPhoto', files, { entryId: batchEntry.id });
    expect(results.map((r) => (r.serverData as Outcome).ok)).toEqual([true, true, true, true]);
    const rows = await Media.findAll({ where: { entryId: batchEntry.id }, order: [['position', 'ASC']] });
    expect(rows.map((r) => r.position)).toEqual([0, 1, 2, 3]);
    // Sizes as ImageMagick made them (identify reports 4×3, 2×2, 3×5, 6×4).
    expect(Object.fromEntries(rows.map((r) => [r.name, [r.width, r.height]]))).toEqual({ 'scribe-4x3.png': [4, 3], 'dye-2x2.jpg': [2, 2], 'tiny-3x5.gif': [3, 5], 'tiny-6x4.webp': [6, 4] });
  });

  test('text named .jpg is refused by its content: clear message, no row, no stored file', async () => {
    const before = await storedKeys();
    const rowsBefore = await Media.count({ where: { entryId } });
    const text = new TextEncoder().encode('Spindle bearings: 0.005 mm runout after adjusting the preload.\n'.repeat(20));
    const [result] = await upload(builder, 'entryPhoto', [new File([text], 'runout.jpg', { type: 'image/jpeg' })], { entryId });
    const outcome = result!.serverData as Outcome;
    expect(outcome.ok).toBe(false);
    expect(!outcome.ok && outcome.message).toMatch(/“runout\.jpg” is not a JPEG, PNG, WebP or GIF photo/);
    expect(await Media.count({ where: { entryId } })).toBe(rowsBefore);
    expect(await Media.count({ where: { fileKey: result!.key } })).toBe(0);
    expect((await fetch(result!.ufsUrl)).status).toBe(404);
    expect(await storedKeys()).toEqual(before);
  });

  test('a 21 MB photo is refused with the 20 MB limit before any byte is stored', async () => {
    const before = await storedKeys();
    const big = new Uint8Array(21 * 1024 * 1024);
    big.set([0xff, 0xd8, 0xff, 0xe0]);
    const message = await refusal(upload(builder, 'entryPhoto', [new File([big], 'whole-lathe.jpg', { type: 'image/jpeg' })], { entryId }));
    expect(message).toMatch(/“whole-lathe\.jpg” is 21 MB; a photo can be at most 20 MB/);
    expect(await storedKeys()).toEqual(before);
  });

  test('another member, and a signed-out visitor, are refused and nothing is stored', async () => {
    const before = await storedKeys();
    const png = await fixture('scribe-4x3.png');
    const file = () => new File([png], 'not-mine.png', { type: 'image/png' });
    expect(await refusal(upload(stranger, 'entryPhoto', [file()], { entryId }))).toMatch(/Only the builder can add photos and clips/);
    expect(await refusal(upload(null, 'entryPhoto', [file()], { entryId }))).toMatch(/Sign in to add photos and clips/);
    // A private project's entry does not exist as far as a stranger can tell.
    expect(await refusal(upload(stranger, 'entryPhoto', [file()], { entryId: privateEntryId }))).toMatch(/not found/);
    expect(await refusal(upload(builder, 'entryPhoto', [file()], { entryId: 999_999_999 }))).toMatch(/entry was not found/);
    expect(await storedKeys()).toEqual(before);
  });

  test('bad input is refused naming the field', async () => {
    const png = await fixture('scribe-4x3.png');
    const message = await refusal(upload(builder, 'entryPhoto', [new File([png], 'a.png', { type: 'image/png' })], { entryId: -3 }));
    expect(message).toMatch(/entryId/);
  });

  test('a clip with its length as the browser measured it is kept; an implausible length is refused before storing', async () => {
    const mp4 = await fixture('tiny-1s.mp4');
    // ffprobe reports 1.000 s for this file (made with ffmpeg's testsrc for 1 s)
    const [ok] = await upload(builder, 'entryClip', [new File([mp4], 'facing-pass.mp4', { type: 'video/mp4' })], { entryId, durationMs: 1000 });
    expect(ok!.serverData).toMatchObject({ ok: true, media: { kind: 'clip', mime: 'video/mp4', durationMs: 1000, sizeBytes: mp4.length, width: null, position: 0 } });

    const before = await storedKeys();
    // 2.8 KB said to last an hour: about 6 bit/s, far below any video (bytes × 8 / seconds — common practice)
    const tooLong = await refusal(upload(builder, 'entryClip', [new File([mp4], 'hour.mp4', { type: 'video/mp4' })], { entryId, durationMs: 3_600_000 }));
    expect(tooLong).toMatch(/“hour\.mp4” is .* but said to be 1:00:00 long/);
    expect(await refusal(upload(builder, 'entryClip', [new File([mp4], 'day.mp4', { type: 'video/mp4' })], { entryId, durationMs: 13 * 3600 * 1000 }))).toMatch(/shorter than 12 hours/);
    expect(await refusal(upload(builder, 'entryClip', [new File([mp4], 'zero.mp4', { type: 'video/mp4' })], { entryId, durationMs: 0 }))).toMatch(/durationMs/);
    expect(await storedKeys()).toEqual(before);
  });

  test('a WebM clip is kept; a photo sent as a clip is refused by its content', async () => {
    const webm = await fixture('tiny-1s.webm');
    const [ok] = await upload(builder, 'entryClip', [new File([webm], 'parting.webm', { type: 'video/webm' })], { entryId, durationMs: 1000 });
    expect(ok!.serverData).toMatchObject({ ok: true, media: { mime: 'video/webm', position: 1 } });

    const png = await fixture('scribe-4x3.png');
    // Sent without a length: a browser that cannot play a file cannot measure it either.
    const [bad] = await upload(builder, 'entryClip', [new File([png], 'still.mp4', { type: 'video/mp4' })], { entryId });
    expect(bad!.serverData).toMatchObject({ ok: false, message: expect.stringMatching(/is a photo \(PNG\), not a video/) });
    expect((await fetch(bad!.ufsUrl)).status).toBe(404);
  });
});

describe('clips that are links', () => {
  const post = (who: U | null, body: unknown, id = entryId) =>
    mediaRoutes.POST(request(`/api/entries/${id}/media`, { method: 'POST', cookie: who?.cookie, body }), params({ id: String(id) }));

  test.each([
    ['javascript:', 'javascript:alert(1)'],
    ['data:', 'data:video/mp4;base64,AAAA'],
    ['no scheme', 'www.example.test/clip.mp4'],
    ['a page that is not a video', 'https://example.test/about'],
    ['too long', `https://example.test/${'a'.repeat(2050)}.mp4`],
  ])('%s → 400 naming url, nothing saved', async (_name, url) => {
    const before = await Media.count({ where: { entryId } });
    const res = await post(builder, { url });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['url']);
    expect(body.message).toMatch(/url/);
    expect(await Media.count({ where: { entryId } })).toBe(before);
  });

  test('a video-site link and a direct .mp4 link are kept as clips without a stored file', async () => {
    const site = await post(builder, { url: 'https://www.youtube.com/watch?v=Ab3dEf6hIj9', name: 'Cutting the register' });
    expect(site.status).toBe(201);
    expect((await site.json()).media).toMatchObject({ kind: 'clip', source: 'link', name: 'Cutting the register', mime: null, sizeBytes: null });
    const direct = await post(builder, { url: 'https://media.example.test/shop/boring-bar.mp4' });
    expect(direct.status).toBe(201);
    const { media } = await direct.json();
    expect(media).toMatchObject({ source: 'link', url: 'https://media.example.test/shop/boring-bar.mp4', name: 'media.example.test · boring-bar.mp4' });
    expect(await Media.findByPk(media.id)).toMatchObject({ fileKey: null });
  });

  test('another member gets 403, a signed-out visitor 401, a private entry 404', async () => {
    expect((await post(stranger, { url: 'https://media.example.test/a.mp4' })).status).toBe(403);
    expect((await post(null, { url: 'https://media.example.test/a.mp4' })).status).toBe(401);
    expect((await post(stranger, { url: 'https://media.example.test/a.mp4' }, privateEntryId)).status).toBe(404);
  });
});

describe('listing, changing and deleting', () => {
  const list = async (who: U | null, id = entryId) => mediaRoutes.GET(request(`/api/entries/${id}/media`, { cookie: who?.cookie }), params({ id: String(id) }));
  const patch = (who: U | null, id: number, body: unknown) => itemRoutes.PATCH(request(`/api/media/${id}`, { method: 'PATCH', cookie: who?.cookie, body }), params({ id: String(id) }));
  const del = (who: U | null, id: number) => itemRoutes.DELETE(request(`/api/media/${id}`, { method: 'DELETE', cookie: who?.cookie }), params({ id: String(id) }));

  test('lists photos then clips, each in order; anyone may read a published log', async () => {
    const res = await list(null);
    expect(res.status).toBe(200);
    const { media } = (await res.json()) as { media: MediaView[] };
    const photos = media.filter((m) => m.kind === 'photo');
    const clips = media.filter((m) => m.kind === 'clip');
    expect(media.slice(0, photos.length)).toEqual(photos);
    expect(photos.map((p) => p.position)).toEqual(photos.map((_, i) => i));
    expect(clips.map((c) => c.position)).toEqual(clips.map((_, i) => i));
    expect((await list(stranger, privateEntryId)).status).toBe(404);
  });

  test('captions change; moving a photo renumbers its siblings', async () => {
    const photos = await Media.findAll({ where: { entryId, kind: 'photo' }, order: [['position', 'ASC']] });
    expect(photos.length).toBeGreaterThanOrEqual(2);
    const last = photos[photos.length - 1]!;
    const res = await patch(builder, last.id, { caption: '  Register cut to 0.02 mm under the chuck spigot  ', position: 0 });
    expect(res.status).toBe(200);
    expect((await res.json()).media).toMatchObject({ caption: 'Register cut to 0.02 mm under the chuck spigot', position: 0 });
    const after = await Media.findAll({ where: { entryId, kind: 'photo' }, order: [['position', 'ASC']] });
    expect(after.map((p) => p.id)).toEqual([last.id, ...photos.slice(0, -1).map((p) => p.id)]);
    expect((await patch(builder, last.id, { caption: 'x'.repeat(301) })).status).toBe(400);
    expect((await patch(builder, last.id, {})).status).toBe(400);
    expect((await patch(stranger, last.id, { caption: 'mine now' })).status).toBe(403);
  });

  test('a stranger cannot delete (403 on a published log); the builder deletes the row, its notes and the stored file', async () => {
    const photo = (await Media.findOne({ where: { entryId, kind: 'photo', source: 'upload' }, order: [['position', 'ASC']] }))!;
    const note = await TimeNote.create({ mediaId: photo.id, startMs: 0, endMs: null, kind: 'note', text: 'chatter here', authorId: builder.id });
    expect((await del(stranger, photo.id)).status).toBe(403);
    expect((await del(null, photo.id)).status).toBe(401);
    expect(await Media.findByPk(photo.id)).not.toBeNull();

    const res = await del(builder, photo.id);
    expect(res.status).toBe(204);
    expect(await Media.findByPk(photo.id)).toBeNull();
    expect(await TimeNote.findByPk(note.id)).toBeNull();
    expect((await fetch(photo.url)).status).toBe(404);
    const left = await Media.findAll({ where: { entryId, kind: 'photo' }, order: [['position', 'ASC']] });
    expect(left.map((p) => p.position)).toEqual(left.map((_, i) => i));
    expect((await del(builder, photo.id)).status).toBe(404);
  });

  test('deleting a media item of a private log is a 404 to a stranger', async () => {
    const png = await fixture('scribe-4x3.png');
    const [r] = await upload(builder, 'entryPhoto', [new File([png], 'jig.png', { type: 'image/png' })], { entryId: privateEntryId });
    const { media } = r!.serverData as Extract<Outcome, { ok: true }>;
    expect((await del(stranger, media.id)).status).toBe(404);
    expect((await itemRoutes.GET(request(`/api/media/${media.id}`, { cookie: stranger.cookie }), params({ id: String(media.id) }))).status).toBe(404);
    expect((await itemRoutes.GET(request(`/api/media/${media.id}`, { cookie: builder.cookie }), params({ id: String(media.id) }))).status).toBe(200);
  });
});

describe('cleaning up stored files', () => {
  test('sweepOrphanUploads removes a stored file that has no row, and keeps the ones that do', async () => {
    const stray = await utapi.uploadFiles(new UTFile([new TextEncoder().encode('left behind')], 'stray.bin'));
    const strayKey = stray.data!.key;
    const kept = await Media.findAll({ where: { entryId: { [Op.in]: [entryId, privateEntryId] }, fileKey: { [Op.ne]: null } }, attributes: ['fileKey'] });
    expect(kept.length).toBeGreaterThan(0);

    // Too young to be swept with a one-hour cut-off.
    expect((await mediaLib.sweepOrphanUploads(60 * 60 * 1000)).deleted).toEqual([]);
    const result = await mediaLib.sweepOrphanUploads(0);
    expect(result.deleted).toEqual([strayKey]);
    expect((await fetch(stray.data!.ufsUrl)).status).toBe(404);
    const remaining = await storedKeys();
    for (const row of kept) expect(remaining).toContain(row.fileKey);
  });

  test('the sweep route is for admins only', async () => {
    const admin = await makeUser('admin');
    try {
      const call = (who: U | null) => sweepRoute.POST(request('/api/admin/uploads/sweep', { method: 'POST', cookie: who?.cookie, body: { olderThanMs: 0 } }), params({}));
      expect((await call(null)).status).toBe(401);
      expect((await call(builder)).status).toBe(403);
      const res = await call(admin);
      expect(res.status).toBe(200);
      expect(await res.json()).toMatchObject({ deleted: [] });
    } finally {
      await User.destroy({ where: { id: admin.id } });
    }
  });

  test('deleteStoredFiles does not throw when the upload service is down', async () => {
    const down = new UTApi({ token: TOKEN, apiUrl: 'http://127.0.0.1:9', logLevel: 'Error' });
    await expect(down.deleteFiles(['x'])).rejects.toBeTruthy();
    const previous = process.env.UPLOADTHING_API_URL;
    // A fresh module copy reads the environment pointing at a port where nothing listens.
    process.env.UPLOADTHING_API_URL = 'http://127.0.0.1:9';
    vi.resetModules();
    try {
      const fresh = await import('@/lib/server/media');
      await expect(fresh.deleteStoredFiles(['some-key'])).resolves.toBeUndefined();
    } finally {
      process.env.UPLOADTHING_API_URL = previous;
    }
  });
});
