import { createHmac } from 'node:crypto';
import { mkdtemp, readFile, readdir, rm } from 'node:fs/promises';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
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
let fileRoute: typeof import('@/app/api/media/[id]/file/route');
let projectRoutes: typeof import('@/app/api/projects/[id]/route');
let uploadRoute: typeof import('@/app/api/uploadthing/route');
let mediaLib: typeof import('@/lib/server/media');
let uploadService: typeof import('@/lib/server/upload-service');

function uploader() {
  return genUploader<OurFileRouter>({ url: new URL(`${app.url}/api/uploadthing`), package: 'uploadthing/client', fetch });
}

async function storedKeys(): Promise<string[]> {
  const names = await readdir(path.join(dataDir, 'files')).catch(() => [] as string[]);
  return names.filter((n) => !n.endsWith('.json')).sort();
}

async function upload(who: U | null, slug: 'entryPhoto' | 'entryClip', files: File[], input: { entryId: number; durationMs?: number; clientId?: string; caption?: string }) {
  return uploader().uploadFiles(slug, { files, input, headers: who ? { cookie: who.cookie } : {} });
}

/** Asks the app's file route as `who`; returns the signed address it redirects to (and checks it is one). */
async function followFileRoute(who: U | null, id: number): Promise<string> {
  const res = await fileRoute.GET(request(`/api/media/${id}/file`, { cookie: who?.cookie }), params({ id: String(id) }));
  expect(res.status).toBe(302);
  expect(res.headers.get('cache-control')).toMatch(/no-store/);
  const target = res.headers.get('location')!;
  expect(target).toMatch(/[?&]signature=/);
  return target;
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
    // Signed read URLs (UTApi.generateSignedURL) point at the local service, as scripts/common.sh sets them.
    UPLOADTHING_UFS_HOST: `localhost:${service.port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
  });
  const handler = await import('@/app/api/uploadthing/route');
  uploadRoute = handler;
  routes = { '/api/uploadthing': (req) => (req.method === 'GET' ? handler.GET(req as never) : handler.POST(req as never)) };
  fileRoute = await import('@/app/api/media/[id]/file/route');
  projectRoutes = await import('@/app/api/projects/[id]/route');
  mediaRoutes = await import('@/app/api/entries/[id]/media/route');
  itemRoutes = await import('@/app/api/media/[id]/route');
  sweepRoute = await import('@/app/api/admin/uploads/sweep/route');
  mediaLib = await import('@/lib/server/media');
  uploadService = await import('@/lib/server/upload-service');
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
    // Pages and bodies get the app's own address, never the upload service's.
    expect(row).toMatchObject({ entryId, width: 4, height: 3, uploadedBy: builder.id, url: `/api/media/${row!.id}/file` });
    expect(outcome.ok && outcome.media.url).toBe(`/api/media/${row!.id}/file`);
    // Private on the service: its plain address is refused; the app's route redirects to a signed one.
    expect((await fetch(result!.ufsUrl)).status).toBe(403);
    const sidecar = JSON.parse(await readFile(path.join(dataDir, 'files', `${result!.key}.json`), 'utf8')) as { acl: string | null };
    expect(sidecar.acl).toBe('private');
    const served = await fetch(await followFileRoute(null, row!.id));
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
    expect(await storedKeys()).not.toContain(photo.fileKey);
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
    expect((await uploadService.sweepOrphanUploads(60 * 60 * 1000)).deleted).toEqual([]);
    const result = await uploadService.sweepOrphanUploads(0);
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
      const fresh = await import('@/lib/server/upload-service');
      await expect(fresh.deleteStoredFiles(['some-key'])).resolves.toBeUndefined();
    } finally {
      process.env.UPLOADTHING_API_URL = previous;
    }
  });
});

// ---- upload-complete callbacks that did not come from the upload service ----------------------

/** A server that counts what reaches it: standing in for an address an attacker controls. */
async function foreignServer(): Promise<{ url: string; hits: string[]; close(): Promise<void> }> {
  const hits: string[] = [];
  const server: Server = createServer((req, res) => {
    hits.push(`${req.method} ${req.url} key=${req.headers['x-uploadthing-api-key'] ?? ''}`);
    res.writeHead(200, { 'content-type': 'image/png' }).end(Buffer.alloc(16));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    hits,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

// Signed as the upload service signs a callback: hex HMAC-SHA256 of the exact body with the API key,
// prefixed "hmac-sha256=" (shared/notes/upload-service.md, read off uploadthing 7.7.4).
const signWith = (apiKey: string, body: string) => `hmac-sha256=${createHmac('sha256', apiKey).update(body).digest('hex')}`;
const MEDIA_TEST_KEY = 'sk_scribeline_media_test';
// The key uploads-fake/README.md used to publish for local use.
const PUBLISHED_KEY = 'sk_scribeline_local';

function callbackBody(opts: { key: string; origin: string; fileUrl: string; entryId: number; userId: number; name?: string; size?: number }): string {
  return JSON.stringify({
    status: 'uploaded',
    metadata: { userId: opts.userId, entryId: opts.entryId, durationMs: null },
    origin: opts.origin,
    file: { name: opts.name ?? 'forged.png', size: opts.size ?? 16, type: 'image/png', customId: null, key: opts.key, url: opts.fileUrl, appUrl: opts.fileUrl, ufsUrl: opts.fileUrl, fileHash: 'x', lastModified: Date.now() },
  });
}

async function postCallback(body: string, signature: string): Promise<Response> {
  return uploadRoute.POST(
    new Request(`${app.url}/api/uploadthing?slug=entryPhoto`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'uploadthing-hook': 'callback', 'x-uploadthing-signature': signature },
      body,
    }) as never,
  );
}

const settle = () => new Promise((r) => setTimeout(r, 400));

describe('upload-complete callbacks are checked before the upload SDK acts on them', () => {
  test('a callback signed with the published key is refused: no row, no fetch, the key goes nowhere', async () => {
    const foreign = await foreignServer();
    try {
      const key = `forgedKey${Date.now()}`;
      const body = callbackBody({ key, origin: foreign.url, fileUrl: `${foreign.url}/f/${key}`, entryId: privateEntryId, userId: stranger.id });
      const res = await postCallback(body, signWith(PUBLISHED_KEY, body));
      expect(res.status).toBe(400);
      await settle();
      expect(await Media.count({ where: { fileKey: key } })).toBe(0);
      expect(foreign.hits).toEqual([]);
    } finally {
      await foreign.close();
    }
  });

  test('a rightly signed callback naming a foreign origin, or a foreign file address, is refused before anything is sent or fetched', async () => {
    const foreign = await foreignServer();
    try {
      const key1 = `foreignOrigin${Date.now()}`;
      const toForeignOrigin = callbackBody({ key: key1, origin: foreign.url, fileUrl: `${service.url}/f/${key1}`, entryId: privateEntryId, userId: builder.id });
      expect((await postCallback(toForeignOrigin, signWith(MEDIA_TEST_KEY, toForeignOrigin))).status).toBe(400);

      const key2 = `foreignFile${Date.now()}`;
      const fromForeignFile = callbackBody({ key: key2, origin: service.url, fileUrl: `${foreign.url}/f/${key2}`, entryId: privateEntryId, userId: builder.id });
      expect((await postCallback(fromForeignFile, signWith(MEDIA_TEST_KEY, fromForeignFile))).status).toBe(400);

      // Same host, another path: not the file this key names.
      const key3 = `otherPath${Date.now()}`;
      const otherPath = callbackBody({ key: key3, origin: service.url, fileUrl: `${service.url}/v6/listFiles`, entryId: privateEntryId, userId: builder.id });
      expect((await postCallback(otherPath, signWith(MEDIA_TEST_KEY, otherPath))).status).toBe(400);

      await settle();
      expect(await Media.count({ where: { fileKey: { [Op.in]: [key1, key2, key3] } } })).toBe(0);
      expect(foreign.hits).toEqual([]);
    } finally {
      await foreign.close();
    }
  });

  test('the same callback delivered again is answered with the first row and never deletes its file', async () => {
    const png = await fixture('scribe-4x3.png');
    const [first] = await upload(builder, 'entryPhoto', [new File([png], 'twice.png', { type: 'image/png' })], { entryId });
    const row = await Media.findOne({ where: { fileKey: first!.key } });
    expect(row).not.toBeNull();
    const body = callbackBody({ key: first!.key, origin: service.url, fileUrl: `${service.url}/f/${first!.key}`, entryId, userId: builder.id, name: 'twice.png', size: png.length });
    const res = await postCallback(body, signWith(MEDIA_TEST_KEY, body));
    expect(res.status).toBe(200);
    await settle();
    expect(await Media.count({ where: { fileKey: first!.key } })).toBe(1);
    expect(await storedKeys()).toContain(first!.key);
  });

  test('two deliveries of one callback at the same moment record one row and keep the file', async () => {
    // A stored file with no row yet, as the service holds it while the callback is on its way.
    const png = await fixture('scribe-4x3.png');
    const stored = await utapi.uploadFiles(new UTFile([png], 'race.png', { type: 'image/png' }), { acl: 'private' });
    const key = stored.data!.key;
    const file = { key, name: 'race.png', size: png.length, type: 'image/png', ufsUrl: `${service.url}/f/${key}` };
    const meta = { userId: builder.id, entryId, durationMs: null };
    const [a, b] = await Promise.all([mediaLib.acceptUploadedFile('photo', meta, file), mediaLib.acceptUploadedFile('photo', meta, file)]);
    expect(a).toMatchObject({ ok: true });
    expect(b).toMatchObject({ ok: true });
    expect(a.ok && b.ok && a.media.id).toBe(b.ok ? b.media.id : -1);
    expect(await Media.count({ where: { fileKey: key } })).toBe(1);
    expect(await storedKeys()).toContain(key);
  });
});

describe('private files behind the app’s file route', () => {
  test('a private project’s photo: 404 to a stranger and to a signed-out visitor, a signed redirect for the builder', async () => {
    const png = await fixture('scribe-4x3.png');
    const [r] = await upload(builder, 'entryPhoto', [new File([png], 'jig-private.png', { type: 'image/png' })], { entryId: privateEntryId });
    const { media } = r!.serverData as Extract<Outcome, { ok: true }>;
    const ask = (who: U | null) => fileRoute.GET(request(`/api/media/${media.id}/file`, { cookie: who?.cookie }), params({ id: String(media.id) }));
    expect((await ask(stranger)).status).toBe(404);
    expect((await ask(null)).status).toBe(404);

    const target = await followFileRoute(builder, media.id);
    const served = await fetch(target);
    expect(served.status).toBe(200);
    expect(served.headers.get('x-content-type-options')).toBe('nosniff');
    expect(served.headers.get('access-control-allow-origin')).toBeNull();
    expect(Buffer.from(await served.arrayBuffer()).equals(png)).toBe(true);
    // The same address without its signature, or with it altered, is refused by the service.
    const bare = new URL(target);
    bare.search = '';
    expect((await fetch(bare)).status).toBe(403);
    expect((await fetch(target.replace(/signature=hmac-sha256%3D(.)/, (_m, c: string) => `signature=hmac-sha256%3D${c === '0' ? '1' : '0'}`))).status).toBe(403);
    // A link clip has no stored file: nothing to redirect to.
    const link = await mediaRoutes.POST(request(`/api/entries/${privateEntryId}/media`, { method: 'POST', cookie: builder.cookie, body: { url: 'https://media.example.test/jig.mp4' } }), params({ id: String(privateEntryId) }));
    const linkId = (await link.json()).media.id as number;
    expect((await fileRoute.GET(request(`/api/media/${linkId}/file`, { cookie: builder.cookie }), params({ id: String(linkId) }))).status).toBe(404);
  });

  test('a clip seeks through its signed address: a Range request gets 206', async () => {
    const mp4 = await fixture('tiny-1s.mp4');
    const [r] = await upload(builder, 'entryClip', [new File([mp4], 'seek.mp4', { type: 'video/mp4' })], { entryId, durationMs: 1000 });
    const { media } = r!.serverData as Extract<Outcome, { ok: true }>;
    const target = await followFileRoute(null, media.id);
    const part = await fetch(target, { headers: { range: 'bytes=100-199' } });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe(`bytes 100-199/${mp4.length}`);
    expect(Buffer.from(await part.arrayBuffer()).equals(mp4.subarray(100, 200))).toBe(true);
  });

  test('deleting a project deletes its files from the upload service', async () => {
    const tag = Date.now().toString(36);
    const doomed = await Project.create({ ownerId: builder.id, slug: `media-it-doomed-${tag}`, title: 'Scrapped fixture', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
    const session = await ShopSession.create({ projectId: doomed.id, position: 0, title: 'Only session', heldOn: '2026-03-16', minutesSpent: 10, planned: '', done: '', nextSteps: '' });
    const doomedEntry = await Entry.create({ sessionId: session.id, position: 0, title: 'Only entry', operation: 'other', body: '{"type":"doc"}' });
    const png = await fixture('scribe-4x3.png');
    const mp4 = await fixture('tiny-1s.mp4');
    const [photo] = await upload(builder, 'entryPhoto', [new File([png], 'doomed.png', { type: 'image/png' })], { entryId: doomedEntry.id });
    const [clip] = await upload(builder, 'entryClip', [new File([mp4], 'doomed.mp4', { type: 'video/mp4' })], { entryId: doomedEntry.id, durationMs: 1000 });
    expect(await storedKeys()).toEqual(expect.arrayContaining([photo!.key, clip!.key]));

    const del = (who: U) => projectRoutes.DELETE(request(`/api/projects/${doomed.id}`, { method: 'DELETE', cookie: who.cookie }), params({ id: String(doomed.id) }));
    expect((await del(stranger)).status).toBe(404);
    expect(await storedKeys()).toEqual(expect.arrayContaining([photo!.key, clip!.key]));
    expect((await del(builder)).status).toBe(204);
    expect(await Project.findByPk(doomed.id)).toBeNull();
    const left = await storedKeys();
    expect(left).not.toContain(photo!.key);
    expect(left).not.toContain(clip!.key);
  });
});

describe('a clip link too long once written out', () => {
  test('700 accented letters become 4,200 characters escaped: 400 naming url, nothing saved', async () => {
    // "é" is written %C3%A9 in a URL path (RFC 3986 §2.1, UTF-8 per RFC 3987 §3.1)
    const typed = `https://media.example.test/${'é'.repeat(700)}.mp4`;
    expect(typed.length).toBeLessThan(2048);
    const before = await Media.count({ where: { entryId } });
    const res = await mediaRoutes.POST(request(`/api/entries/${entryId}/media`, { method: 'POST', cookie: builder.cookie, body: { url: typed } }), params({ id: String(entryId) }));
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(Object.keys(body.fieldErrors)).toEqual(['url']);
    expect(body.message).toMatch(/url/);
    expect(await Media.count({ where: { entryId } })).toBe(before);
  });
});

describe('a photo sent again from the bench view’s queue', () => {
  test('the same clientId twice makes one row with its caption; the second copy of the file is deleted', async () => {
    const png = await fixture('scribe-4x3.png');
    const clientId = crypto.randomUUID();
    const input = { entryId, clientId, caption: '14:05 — spigot after the spring pass' };
    const [first] = await upload(builder, 'entryPhoto', [new File([png], 'bench.png', { type: 'image/png' })], input);
    const made = first!.serverData as Outcome;
    expect(made).toMatchObject({ ok: true, media: { caption: '14:05 — spigot after the spring pass' } });
    const keysAfterFirst = await storedKeys();
    // The answer was lost on the phone: it sends the same write again.
    const [second] = await upload(builder, 'entryPhoto', [new File([png], 'bench.png', { type: 'image/png' })], input);
    const again = second!.serverData as Outcome;
    expect(again.ok && made.ok && again.media.id).toBe(made.ok && made.media.id);
    expect(await Media.count({ where: { clientId } })).toBe(1);
    expect(await storedKeys()).toEqual(keysAfterFirst);
  });

  test('another member cannot take over a clientId: refused, nothing stored', async () => {
    const png = await fixture('scribe-4x3.png');
    const clientId = crypto.randomUUID();
    await upload(builder, 'entryPhoto', [new File([png], 'mine.png', { type: 'image/png' })], { entryId, clientId });
    const before = await storedKeys();
    const strangerProject = await Project.create({ ownerId: stranger.id, slug: `media-it-stranger-${Date.now().toString(36)}`, title: 'Vice jaws', summary: '', units: 'mm', visibility: 'private', publishedAt: null });
    const s = await ShopSession.create({ projectId: strangerProject.id, position: 0, title: 'Jaws', heldOn: '2026-03-16', minutesSpent: 0, planned: '', done: '', nextSteps: '' });
    const e = await Entry.create({ sessionId: s.id, position: 0, title: 'Soft jaws', operation: 'facing', body: '{"type":"doc"}' });
    try {
      const [result] = await upload(stranger, 'entryPhoto', [new File([png], 'theirs.png', { type: 'image/png' })], { entryId: e.id, clientId });
      expect(result!.serverData).toMatchObject({ ok: false, message: expect.stringMatching(/clientId/) });
      expect(await Media.count({ where: { entryId: e.id } })).toBe(0);
      expect(await storedKeys()).toEqual(before);
    } finally {
      await Project.destroy({ where: { id: strangerProject.id } });
    }
  });
});
