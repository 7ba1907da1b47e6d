import { createHash, createHmac } from 'node:crypto';
import { mkdtemp, mkdir, readdir, rm, stat, utimes, writeFile } from 'node:fs/promises';
import { execFileSync } from 'node:child_process';
import { readFile as readText } from 'node:fs/promises';
import { request as httpRequest } from 'node:http';
import os from 'node:os';
import path from 'node:path';

import { genUploader, version as clientVersion } from 'uploadthing/client';
import { createRouteHandler, createUploadthing, UTApi, UTFile, type FileRouter } from 'uploadthing/server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

import { startUploadService, sweepAbandoned, type UploadService } from '@/uploads-fake/server';
import { FetchXhr, serveApp, type FetchHandler } from '@/tests/support/upload-harness';

// The service is driven by the real, unmodified uploadthing SDK (server and
// browser client). Only the browser's XMLHttpRequest, which Node lacks, is
// provided below, on top of fetch.

const API_KEY = 'sk_scribeline_test_0f3c9a';
const APP_ID = 'scribeline-test-app';
const CALLBACK_TIMEOUT_MS = 2_000;
const TOKEN = Buffer.from(JSON.stringify({ apiKey: API_KEY, appId: APP_ID, regions: ['local'] })).toString('base64');

// ---------------------------------------------------------------- helpers ---

async function tempDir(): Promise<string> {
  return mkdtemp(path.join(os.tmpdir(), 'scribeline-uploads-'));
}

/** Every regular file under `dir`, relative, so a test can say "nothing is left". */
async function filesUnder(dir: string): Promise<string[]> {
  const out: string[] = [];
  const walk = async (current: string): Promise<void> => {
    let entries;
    try {
      entries = await readdir(current, { withFileTypes: true });
    } catch {
      return;
    }
    for (const entry of entries) {
      const full = path.join(current, entry.name);
      if (entry.isDirectory()) await walk(full);
      else out.push(path.relative(dir, full));
    }
  };
  await walk(dir);
  return out.sort();
}

async function waitUntil(check: () => Promise<boolean> | boolean, timeoutMs = 5_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Computed here rather than with the service's code, so a wrong hash shows. */
function sha256Hex(data: Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

function bytes(length: number, seed: number): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(length);
  for (let i = 0; i < length; i++) out[i] = (i * 31 + seed * 7) % 251;
  return out;
}

interface Completion {
  metadata: Record<string, unknown>;
  file: { key: string; name: string; size: number; type: string; ufsUrl: string; fileHash: string; customId: string | null };
  /** What the app could read back from the service while handling the callback. */
  fetchedBytes: Uint8Array;
}

function buildRouter(completions: Completion[], uploadErrors: string[]) {
  const f = createUploadthing();
  return {
    photo: f({ image: { maxFileSize: '4MB', maxFileCount: 4 } })
      .middleware(({ files }) => ({ builderId: 'builder-7', declaredFiles: files.length }))
      .onUploadError(({ fileKey }) => {
        uploadErrors.push(fileKey);
      })
      .onUploadComplete(async ({ metadata, file }) => {
        const fetched = await fetch(file.ufsUrl);
        completions.push({
          metadata,
          file: {
            key: file.key,
            name: file.name,
            size: file.size,
            type: file.type,
            ufsUrl: file.ufsUrl,
            fileHash: file.fileHash,
            customId: file.customId,
          },
          fetchedBytes: new Uint8Array(await fetched.arrayBuffer()),
        });
        return { savedAs: `log-entry/${file.key}`, by: metadata.builderId };
      }),
    clip: f({ video: { maxFileSize: '16MB' } })
      .onUploadError(({ fileKey }) => {
        uploadErrors.push(fileKey);
      })
      .onUploadComplete(() => ({ ok: true })),
    broken: f({ blob: { maxFileSize: '1MB' } }).onUploadComplete(() => {
      throw new Error('the app failed to save the upload');
    }),
  } satisfies FileRouter;
}

type TestRouter = ReturnType<typeof buildRouter>;

interface Stack {
  service: UploadService;
  app: { url: string; close(): Promise<void> };
  dataDir: string;
  completions: Completion[];
  uploadErrors: string[];
  apiUrl: string;
  close(): Promise<void>;
}

async function startStack(isDev: boolean, callbackTimeoutMs = 10_000): Promise<Stack> {
  const dataDir = await tempDir();
  // Public reads here: these tests are about the upload flow; private reads have their own below.
  const service = await startUploadService({ port: 0, dataDir, token: TOKEN, callbackTimeoutMs, defaultAcl: 'public-read' });
  const completions: Completion[] = [];
  const uploadErrors: string[] = [];
  const router = buildRouter(completions, uploadErrors);
  let routes: Record<string, FetchHandler> = {};
  const app = await serveApp(() => routes);
  const config = { token: TOKEN, ingestUrl: service.url, isDev, logLevel: 'Error' as const };
  routes = {
    '/api/uploadthing': createRouteHandler({ router, config: { ...config, callbackUrl: `${app.url}/api/uploadthing` } }),
    // Same app, but its callback URL points at a port where nothing listens.
    '/api/unreachable': createRouteHandler({ router, config: { ...config, callbackUrl: 'http://127.0.0.1:9/api/uploadthing' } }),
  };
  return {
    service,
    app,
    dataDir,
    completions,
    uploadErrors,
    apiUrl: `${app.url}/api/uploadthing`,
    close: async () => {
      await app.close();
      await service.close();
      await rm(dataDir, { recursive: true, force: true });
    },
  };
}

interface Presigned {
  url: string;
  key: string;
  name: string;
  customId: string | null;
}

/** Asks the app for presigned URLs the way uploadthing/client does. */
async function presign(
  endpoint: string,
  slug: keyof TestRouter,
  files: Array<{ name: string; size: number; type: string }>,
): Promise<Presigned[]> {
  const res = await fetch(`${endpoint}?actionType=upload&slug=${slug}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-uploadthing-version': clientVersion, 'x-uploadthing-package': 'uploadthing/client' },
    body: JSON.stringify({ input: null, files: files.map((f) => ({ ...f, lastModified: Date.now() })) }),
  });
  expect(res.status).toBe(200);
  return (await res.json()) as Presigned[];
}

function putFile(url: string, file: File): Promise<Response> {
  const form = new FormData();
  form.append('file', file);
  return fetch(url, { method: 'PUT', body: form, headers: { range: 'bytes=0-', 'x-uploadthing-version': clientVersion } });
}

function withParam(url: string, name: string, value: string): string {
  // Keeps every other byte of the URL as signed; only the one value changes.
  const u = new URL(url);
  const parts = u.search.slice(1).split('&').map((p) => (p.startsWith(`${name}=`) ? `${name}=${encodeURIComponent(encodeURIComponent(value))}` : p));
  return `${u.origin}${u.pathname}?${parts.join('&')}`;
}

let previousXhr: unknown;
beforeAll(() => {
  previousXhr = (globalThis as Record<string, unknown>).XMLHttpRequest;
  (globalThis as Record<string, unknown>).XMLHttpRequest = FetchXhr;
});
afterAll(() => {
  (globalThis as Record<string, unknown>).XMLHttpRequest = previousXhr;
});

// ------------------------------------------------------------------ tests ---

describe('server-side UTApi against the upload service', () => {
  let dataDir = '';
  let service: UploadService;
  let utapi: UTApi;

  beforeAll(async () => {
    dataDir = await tempDir();
    service = await startUploadService({ port: 0, dataDir, token: TOKEN, defaultAcl: 'public-read' });
    utapi = new UTApi({ token: TOKEN, ingestUrl: service.url, apiUrl: service.url, logLevel: 'Error' });
  });
  afterAll(async () => {
    await service.close();
    await rm(dataDir, { recursive: true, force: true });
  });

  it('uploads, serves with ranges, lists, renames and deletes a file', async () => {
    const content = bytes(5000, 1);
    const result = await utapi.uploadFiles(new UTFile([content], 'spindle-notes.txt', { customId: 'note-1' }));
    expect(result.error).toBeNull();
    const data = result.data;
    if (!data) throw new Error('upload returned no data');
    expect(data.ufsUrl).toBe(`${service.url}/f/${data.key}`);
    expect(data.customId).toBe('note-1');
    expect(data.fileHash).toBe(sha256Hex(content));

    const full = await fetch(data.ufsUrl);
    expect(full.status).toBe(200);
    expect(full.headers.get('content-type')).toBe('text/plain');
    expect(full.headers.get('content-length')).toBe('5000');
    expect(full.headers.get('accept-ranges')).toBe('bytes');
    expect(new Uint8Array(await full.arrayBuffer())).toEqual(content);

    const part = await fetch(data.ufsUrl, { headers: { range: 'bytes=100-199' } });
    expect(part.status).toBe(206);
    expect(part.headers.get('content-range')).toBe('bytes 100-199/5000');
    expect(part.headers.get('content-length')).toBe('100');
    expect(new Uint8Array(await part.arrayBuffer())).toEqual(content.slice(100, 200));

    const suffix = await fetch(data.ufsUrl, { headers: { range: 'bytes=-10' } });
    expect(suffix.status).toBe(206);
    expect(new Uint8Array(await suffix.arrayBuffer())).toEqual(content.slice(4990));

    const beyond = await fetch(data.ufsUrl, { headers: { range: 'bytes=5000-' } });
    expect(beyond.status).toBe(416);
    expect(beyond.headers.get('content-range')).toBe('bytes */5000');
    await beyond.arrayBuffer();

    const listed = await utapi.listFiles();
    expect(listed.hasMore).toBe(false);
    expect(listed.files).toEqual([
      expect.objectContaining({ key: data.key, name: 'spindle-notes.txt', size: 5000, status: 'Uploaded', customId: 'note-1' }),
    ]);

    const urls = await utapi.getFileUrls(data.key);
    expect(urls.data).toEqual([{ key: data.key, url: data.ufsUrl }]);

    expect((await utapi.renameFiles({ fileKey: data.key, newName: 'spindle-runout.txt' })).success).toBe(true);
    expect((await utapi.listFiles()).files[0]?.name).toBe('spindle-runout.txt');
    expect((await utapi.updateACL(data.key, 'private')).success).toBe(true);

    const usage = await utapi.getUsageInfo();
    expect(usage).toMatchObject({ totalBytes: 5000, appTotalBytes: 5000, filesUploaded: 1 });

    const deleted = await utapi.deleteFiles(data.key);
    expect(deleted).toMatchObject({ success: true, deletedCount: 1 });
    const gone = await fetch(data.ufsUrl);
    expect(gone.status).toBe(404);
    await gone.arrayBuffer();
    expect((await utapi.listFiles()).files).toEqual([]);
    expect(await filesUnder(dataDir)).toEqual([]);
  });

  it('deletes by customId and refuses API calls without the key', async () => {
    const result = await utapi.uploadFiles([
      new UTFile([bytes(10, 2)], 'a.bin', { customId: 'keep' }),
      new UTFile([bytes(20, 3)], 'b.bin', { customId: 'drop' }),
    ]);
    expect(result.map((r) => r.error)).toEqual([null, null]);
    const deleted = await utapi.deleteFiles('drop', { keyType: 'customId' });
    expect(deleted.deletedCount).toBe(1);
    expect((await utapi.listFiles()).files.map((f) => f.customId)).toEqual(['keep']);

    const anonymous = await fetch(`${service.url}/v6/listFiles`, { method: 'POST', body: '{}' });
    expect(anonymous.status).toBe(401);
    const wrongKey = await fetch(`${service.url}/v6/deleteFiles`, {
      method: 'POST',
      headers: { 'x-uploadthing-api-key': 'sk_someone_else' },
      body: JSON.stringify({ customIds: ['keep'] }),
    });
    expect(wrongKey.status).toBe(401);
    expect((await utapi.listFiles()).files).toHaveLength(1);
  });

  it('answers CORS preflights for the browser upload', async () => {
    const res = await fetch(`${service.url}/somekey?expires=1`, {
      method: 'OPTIONS',
      headers: { origin: 'http://127.0.0.1:3000', 'access-control-request-method': 'PUT', 'access-control-request-headers': 'range, x-uploadthing-version' },
    });
    expect(res.status).toBe(204);
    expect(res.headers.get('access-control-allow-origin')).toBe('*');
    expect(res.headers.get('access-control-allow-methods')).toContain('PUT');
    expect(res.headers.get('access-control-allow-methods')).toContain('HEAD');
    expect(res.headers.get('access-control-allow-headers')).toBe('range, x-uploadthing-version');
    expect(res.headers.get('access-control-expose-headers')).toContain('x-ut-range-start');
  });
});

for (const isDev of [false, true]) {
  describe(`route-handler upload, ${isDev ? 'development' : 'production'} mode`, () => {
    let stack: Stack;
    beforeAll(async () => {
      stack = await startStack(isDev, CALLBACK_TIMEOUT_MS);
    });
    afterAll(async () => {
      await stack.close();
    });

    it('runs the real client upload end to end and calls onUploadComplete', async () => {
      const { uploadFiles } = genUploader<TestRouter>({ url: new URL(stack.apiUrl), package: 'uploadthing/client', fetch });
      const first = bytes(3000, 4);
      const second = bytes(1200, 5);
      const files = [
        new File([first], 'tailstock.png', { type: 'image/png' }),
        new File([second], 'cross slide.png', { type: 'image/png' }),
      ];
      const results = await uploadFiles('photo', { files });

      expect(results).toHaveLength(2);
      for (const [i, result] of results.entries()) {
        const sent = i === 0 ? first : second;
        expect(result.serverData).toEqual({ savedAs: `log-entry/${result.key}`, by: 'builder-7' });
        expect(result.ufsUrl).toBe(`${stack.service.url}/f/${result.key}`);
        expect(result.fileHash).toBe(sha256Hex(sent));
        const served = await fetch(result.ufsUrl);
        expect(served.status).toBe(200);
        expect(served.headers.get('content-type')).toBe('image/png');
        expect(new Uint8Array(await served.arrayBuffer())).toEqual(sent);
      }

      expect(stack.completions).toHaveLength(2);
      const byName = new Map(stack.completions.map((c) => [c.file.name, c]));
      const tailstock = byName.get('tailstock.png');
      expect(tailstock?.metadata).toEqual({ builderId: 'builder-7', declaredFiles: 2 });
      expect(tailstock?.file).toMatchObject({ size: 3000, type: 'image/png', customId: null, key: results[0]?.key });
      expect(tailstock?.fetchedBytes).toEqual(first);
      expect(byName.get('cross slide.png')?.fetchedBytes).toEqual(second);

      const stored = await filesUnder(stack.dataDir);
      expect(stored.filter((f) => f.startsWith('tmp'))).toEqual([]);
      expect(stored.filter((f) => !f.endsWith('.json'))).toHaveLength(2);
    });

    it('answers the HEAD probe with a zero resume offset', async () => {
      const [presigned] = await presign(stack.apiUrl, 'photo', [{ name: 'probe.png', size: 4, type: 'image/png' }]);
      if (!presigned) throw new Error('no presigned URL');
      const head = await fetch(presigned.url, { method: 'HEAD' });
      expect(head.status).toBe(200);
      expect(head.headers.get('x-ut-range-start')).toBe('0');
      const put = await putFile(presigned.url, new File([bytes(4, 6)], 'probe.png', { type: 'image/png' }));
      expect(put.status).toBe(200);
      const body = (await put.json()) as { serverData: unknown; ufsUrl: string };
      expect(body.serverData).toEqual({ savedAs: `log-entry/${presigned.key}`, by: 'builder-7' });
    });

    it('fails the upload and keeps nothing when the app never reports a result', async () => {
      const [presigned] = await presign(stack.apiUrl, 'broken', [{ name: 'gcode.nc', size: 64, type: 'text/plain' }]);
      if (!presigned) throw new Error('no presigned URL');
      const before = await filesUnder(path.join(stack.dataDir, 'files'));
      const started = Date.now();
      const put = await putFile(presigned.url, new File([bytes(64, 7)], 'gcode.nc', { type: 'text/plain' }));
      expect(put.status).toBe(502);
      expect(((await put.json()) as { error: string }).error).toMatch(/did not report/);
      // Bounded by the service's callback timeout, not left hanging.
      expect(Date.now() - started).toBeGreaterThanOrEqual(CALLBACK_TIMEOUT_MS - 100);
      expect(Date.now() - started).toBeLessThan(CALLBACK_TIMEOUT_MS + 3_000);
      expect(await filesUnder(path.join(stack.dataDir, 'files'))).toEqual(before);
      expect((await fetch(`${stack.service.url}/f/${presigned.key}`)).status).toBe(404);
    });

    it('fails the upload, without hanging, when the app cannot be reached', async () => {
      const endpoint = `${stack.app.url}/api/unreachable`;
      const [presigned] = await presign(endpoint, 'photo', [{ name: 'vise.png', size: 32, type: 'image/png' }]);
      if (!presigned) throw new Error('no presigned URL');
      const put = await putFile(presigned.url, new File([bytes(32, 8)], 'vise.png', { type: 'image/png' }));
      expect(put.status).toBe(502);
      const { error } = (await put.json()) as { error: string };
      // In production the service itself calls the dead URL and fails at
      // once; in development the SDK forwards the callback, fails, and the
      // service stops waiting at its timeout.
      expect(error).toMatch(isDev ? /did not report/ : /callback failed/);
      expect((await fetch(`${stack.service.url}/f/${presigned.key}`)).status).toBe(404);
    });
  });
}

describe('refused and failed uploads leave nothing behind', () => {
  let stack: Stack;
  beforeAll(async () => {
    stack = await startStack(false);
  });
  afterAll(async () => {
    await stack.close();
  });

  it('refuses forged, tampered and expired presigned URLs', async () => {
    const content = new File([bytes(50, 9)], 'chuck.png', { type: 'image/png' });
    const [presigned] = await presign(stack.apiUrl, 'photo', [{ name: 'chuck.png', size: 50, type: 'image/png' }]);
    if (!presigned) throw new Error('no presigned URL');

    // The signature is the last query parameter: flip its last hex digit.
    const forgedSignature = presigned.url.slice(0, -1) + (presigned.url.endsWith('0') ? '1' : '0');
    const biggerFile = withParam(presigned.url, 'x-ut-file-size', '999999');
    const laterExpiry = withParam(presigned.url, 'expires', String(Date.now() + 10 * 86_400_000));
    const otherKey = presigned.url.replace(`/${presigned.key}?`, `/${presigned.key}x?`);

    for (const url of [forgedSignature, biggerFile, laterExpiry, otherKey]) {
      const head = await fetch(url, { method: 'HEAD' });
      expect(head.status).toBe(403);
      const put = await putFile(url, content);
      expect(put.status).toBe(403);
      expect(((await put.json()) as { error: string }).error).toMatch(/signature/);
    }

    // Correctly signed with this app's key, but already expired.
    const u = new URL(presigned.url);
    u.search = '';
    u.searchParams.append('expires', String(Date.now() - 1_000));
    for (const [name, value] of [
      ['x-ut-identifier', APP_ID],
      ['x-ut-file-name', 'chuck.png'],
      ['x-ut-file-size', '50'],
      ['x-ut-file-type', 'image/png'],
    ] as const) {
      u.searchParams.append(name, encodeURIComponent(value));
    }
    u.searchParams.append('signature', `hmac-sha256=${createHmac('sha256', API_KEY).update(u.toString()).digest('hex')}`);
    const expired = await putFile(u.href, content);
    expect(expired.status).toBe(403);
    expect(((await expired.json()) as { error: string }).error).toMatch(/expired/);

    // Signed with a different API key.
    const foreign = new URL(u.href);
    foreign.search = '';
    foreign.searchParams.append('expires', String(Date.now() + 60_000));
    foreign.searchParams.append('x-ut-identifier', APP_ID);
    foreign.searchParams.append('x-ut-file-name', 'chuck.png');
    foreign.searchParams.append('x-ut-file-size', '50');
    foreign.searchParams.append('signature', `hmac-sha256=${createHmac('sha256', 'sk_other').update(foreign.toString()).digest('hex')}`);
    expect((await putFile(foreign.href, content)).status).toBe(403);

    expect(await filesUnder(stack.dataDir)).toEqual([]);
    expect(stack.completions).toEqual([]);

    // The untouched URL still works, so the refusals above were about tampering.
    const genuine = await putFile(presigned.url, content);
    expect(genuine.status).toBe(200);
    expect(stack.completions).toHaveLength(1);
    expect((await stack.service.sweepAbandoned(0)).length).toBe(0);
    await fetch(`${stack.service.url}/v6/deleteFiles`, {
      method: 'POST',
      headers: { 'x-uploadthing-api-key': API_KEY },
      body: JSON.stringify({ fileKeys: [presigned.key] }),
    });
    expect(await filesUnder(stack.dataDir)).toEqual([]);
  });

  it('refuses a body larger or smaller than declared', async () => {
    const [tooBig, tooSmall] = await presign(stack.apiUrl, 'photo', [
      { name: 'big.png', size: 10, type: 'image/png' },
      { name: 'small.png', size: 100, type: 'image/png' },
    ]);
    if (!tooBig || !tooSmall) throw new Error('no presigned URLs');

    const big = await putFile(tooBig.url, new File([bytes(5000, 10)], 'big.png', { type: 'image/png' }));
    expect(big.status).toBe(413);
    expect(((await big.json()) as { error: string }).error).toMatch(/larger/);

    const small = await putFile(tooSmall.url, new File([bytes(40, 11)], 'small.png', { type: 'image/png' }));
    expect(small.status).toBe(400);
    expect(((await small.json()) as { error: string }).error).toMatch(/40 bytes but 100/);

    expect(await filesUnder(stack.dataDir)).toEqual([]);
    // The app hears about both through its onUploadError.
    await waitUntil(() => stack.uploadErrors.includes(tooBig.key) && stack.uploadErrors.includes(tooSmall.key));
  });

  it('cleans up after a client that aborts mid-body', async () => {
    const size = 512 * 1024;
    const [presigned] = await presign(stack.apiUrl, 'clip', [{ name: 'facing-pass.mp4', size, type: 'video/mp4' }]);
    if (!presigned) throw new Error('no presigned URL');

    const boundary = 'scribeline-abort-boundary';
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="facing-pass.mp4"\r\nContent-Type: video/mp4\r\n\r\n`);
    const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
    const req = httpRequest(presigned.url, {
      method: 'PUT',
      headers: {
        'content-type': `multipart/form-data; boundary=${boundary}`,
        'content-length': String(head.length + size + tail.length),
        range: 'bytes=0-',
      },
    });
    const outcome = new Promise<string>((resolve) => {
      req.on('error', (err) => resolve(`error: ${err.message}`));
      req.on('close', () => resolve('closed'));
      req.on('response', (res) => resolve(`response: ${res.statusCode}`));
    });
    req.write(head);
    req.write(Buffer.from(bytes(128 * 1024, 12)));

    const tmpDir = path.join(stack.dataDir, 'tmp');
    await waitUntil(async () => (await filesUnder(tmpDir)).length === 1);
    const partial = await stat(path.join(tmpDir, (await filesUnder(tmpDir))[0] ?? ''));
    expect(partial.size).toBeGreaterThan(0);

    req.destroy();
    expect(await outcome).not.toMatch(/^response/);
    await waitUntil(async () => (await filesUnder(stack.dataDir)).length === 0);
    expect((await fetch(`${stack.service.url}/f/${presigned.key}`)).status).toBe(404);
    await waitUntil(() => stack.uploadErrors.includes(presigned.key));
    expect(await stack.service.sweepAbandoned(0)).toEqual([]);
  });

  it('sweeps leftovers of uploads that never completed', async () => {
    const tmpDir = path.join(stack.dataDir, 'tmp');
    const filesDir = path.join(stack.dataDir, 'files');
    await mkdir(tmpDir, { recursive: true });
    const old = new Date(Date.now() - 2 * 60 * 60 * 1000);

    // What a crash would leave: a half-received body, a file whose callback
    // never finished, and bytes whose sidecar was never written.
    const staleTemp = path.join(tmpDir, 'crashkey1.0000.part');
    await writeFile(staleTemp, bytes(100, 13));
    await utimes(staleTemp, old, old);
    const pending = { id: 'x', key: 'crashkey2', name: 'p.png', size: 3, type: 'image/png', customId: null, uploadedAt: 0, fileHash: '', status: 'Uploading', contentDisposition: 'inline', acl: null };
    await writeFile(path.join(filesDir, 'crashkey2'), 'abc');
    await writeFile(path.join(filesDir, 'crashkey2.json'), JSON.stringify(pending));
    await writeFile(path.join(filesDir, 'crashkey3'), 'orphan');
    for (const name of ['crashkey2', 'crashkey2.json', 'crashkey3']) await utimes(path.join(filesDir, name), old, old);
    const freshTemp = path.join(tmpDir, 'livekey.0000.part');
    await writeFile(freshTemp, bytes(10, 14));

    const removed = await stack.service.sweepAbandoned(60 * 60 * 1000);
    expect(removed.map((p) => path.basename(p)).sort()).toEqual(['crashkey1.0000.part', 'crashkey2', 'crashkey2.json', 'crashkey3']);
    expect(await filesUnder(stack.dataDir)).toEqual(['tmp/livekey.0000.part']);

    // The same sweep over HTTP, then the standalone one for a stopped service.
    const viaHttp = await fetch(`${stack.service.url}/v6/sweepAbandoned`, {
      method: 'POST',
      headers: { 'x-uploadthing-api-key': API_KEY },
      body: JSON.stringify({ olderThanMs: 60 * 60 * 1000 }),
    });
    expect(await viaHttp.json()).toEqual({ success: true, removedCount: 0 });
    expect(await sweepAbandoned(stack.dataDir, 0)).toEqual([freshTemp]);
    expect(await filesUnder(stack.dataDir)).toEqual([]);
  });
});

describe('private files: read only through a signed, unexpired URL', () => {
  let dataDir = '';
  let service: UploadService;
  let utapi: UTApi;

  beforeAll(async () => {
    dataDir = await tempDir();
    service = await startUploadService({ port: 0, dataDir, token: TOKEN });
    // Signed URLs from the SDK's generateSignedURL, pointed at this service ("local" in the host → http).
    utapi = new UTApi({ token: TOKEN, ingestUrl: service.url, apiUrl: service.url, ufsHost: `localhost:${service.port}`, ufsAppIdLocation: 'path', logLevel: 'Error' });
  });
  afterAll(async () => {
    await service.close();
    await rm(dataDir, { recursive: true, force: true });
  });

  it('refuses a private file without a signature (403), serves it signed, with ranges and nosniff, without CORS', async () => {
    const content = bytes(3000, 5);
    const result = await utapi.uploadFiles(new UTFile([content], 'gib-strip.bin'), { acl: 'private' });
    const key = result.data!.key;
    const plain = await fetch(result.data!.ufsUrl);
    expect(plain.status).toBe(403);
    expect(plain.headers.get('x-content-type-options')).toBe('nosniff');
    expect(plain.headers.get('access-control-allow-origin')).toBeNull();

    const { ufsUrl } = await utapi.generateSignedURL(key, { expiresIn: 60 });
    expect(ufsUrl.startsWith(`http://localhost:${service.port}/a/${APP_ID}/${key}?`)).toBe(true);
    const whole = await fetch(ufsUrl);
    expect(whole.status).toBe(200);
    expect(whole.headers.get('x-content-type-options')).toBe('nosniff');
    expect(whole.headers.get('access-control-allow-origin')).toBeNull();
    expect(sha256Hex(new Uint8Array(await whole.arrayBuffer()))).toBe(sha256Hex(content));
    const part = await fetch(ufsUrl, { headers: { range: 'bytes=10-19' } });
    expect(part.status).toBe(206);
    expect(Buffer.from(await part.arrayBuffer()).equals(Buffer.from(content.subarray(10, 20)))).toBe(true);

    // Signed with another key (the one the README once published), or for another file: refused.
    const forged = new URL(ufsUrl);
    forged.searchParams.delete('signature');
    forged.searchParams.append('signature', 'hmac-sha256=' + createHmac('sha256', 'sk_scribeline_local').update(forged.toString()).digest('hex'));
    expect((await fetch(forged)).status).toBe(403);
    const other = await utapi.uploadFiles(new UTFile([bytes(10, 6)], 'other.bin'), { acl: 'private' });
    expect((await fetch(ufsUrl.replace(key, other.data!.key))).status).toBe(403);
  });

  it('refuses a signed URL once it has expired', async () => {
    const result = await utapi.uploadFiles(new UTFile([bytes(100, 7)], 'expiring.bin'), { acl: 'private' });
    const { ufsUrl } = await utapi.generateSignedURL(result.data!.key, { expiresIn: 1 });
    expect((await fetch(ufsUrl)).status).toBe(200);
    await new Promise((r) => setTimeout(r, 1_100));
    const late = await fetch(ufsUrl);
    expect(late.status).toBe(403);
    expect(await late.json()).toEqual({ error: 'signed URL has expired' });
  });

  it('treats a file uploaded without an ACL as private; a public-read one is served to anyone', async () => {
    const noAcl = await utapi.uploadFiles(new UTFile([bytes(50, 8)], 'default.bin'));
    expect((await fetch(noAcl.data!.ufsUrl)).status).toBe(403);
    const open = await utapi.uploadFiles(new UTFile([bytes(50, 9)], 'open.bin'), { acl: 'public-read' });
    const res = await fetch(open.data!.ufsUrl);
    expect(res.status).toBe(200);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
  });
});

describe('the key that serving modes use', () => {
  it('npm start gets a key generated for its data folder, not one written in the README', async () => {
    const root = path.resolve(__dirname, '..', '..');
    const env = { ...process.env };
    delete env.UPLOADTHING_TOKEN;
    // What scripts/start.sh exports, read the way it reads it.
    const token = execFileSync('bash', ['-c', 'source scripts/common.sh >/dev/null && printf %s "$UPLOADTHING_TOKEN"'], { cwd: root, env }).toString();
    const { apiKey, appId } = JSON.parse(Buffer.from(token, 'base64').toString('utf8')) as { apiKey: string; appId: string };
    expect(apiKey).toMatch(/^sk_[A-Za-z0-9_-]{40,}$/);
    const readme = await readText(path.join(root, 'uploads-fake', 'README.md'), 'utf8');
    expect(readme).not.toContain(apiKey);
    expect(readme).not.toContain(token);
    // The key the README once gave for local use must not be the one in use.
    expect(apiKey).not.toBe('sk_scribeline_local');
    expect(appId).not.toBe('scribeline-local');
    // Stable for the data folder: the same key next time, so stored files stay readable.
    expect(execFileSync('bash', ['-c', 'source scripts/common.sh >/dev/null && printf %s "$UPLOADTHING_TOKEN"'], { cwd: root, env }).toString()).toBe(token);
  });
});
