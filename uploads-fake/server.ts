import { randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream, type WriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import { fileURLToPath } from 'node:url';

import { boundaryOf, MultipartError, receiveFilePart, type ReceivedFile } from './multipart';
import { parseRange } from './ranges';
import { CallbackResults, RegistrationTable, type CallbackOutcome, type Registration, type RouteMetadata } from './registrations';
import { parseToken, safeEqual, sign, verifyPresignedUrl, verifySignedRead, type Credentials, type PresignedParams } from './signing';
import { FileStore, isValidKey, type StoredFile } from './store';

/**
 * Local stand-in for the hosted upload service, spoken to by the app's
 * unmodified uploadthing SDK in development and tests. See README.md.
 */

export interface UploadServiceOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  dataDir: string;
  /** The same base64 token the app uses; or give apiKey and appId. */
  token?: string;
  apiKey?: string;
  appId?: string;
  /** Base URL put in file URLs and in the callback `origin`; defaults to http://host:port. */
  publicUrl?: string;
  /** Upper bound on waiting for the app's upload-complete callback and its result. */
  callbackTimeoutMs?: number;
  /** How long a PUT waits for the app's /route-metadata registration to arrive. */
  registrationWaitMs?: number;
  /** How long a dev-mode /route-metadata stream may stay open with uploads outstanding. */
  registrationTtlMs?: number;
  /** Reported by getUsageInfo. */
  limitBytes?: number;
  /**
   * The ACL of a file uploaded without one (the hosted service takes the app's default). 'private'
   * (the default here): reads need a signed, unexpired URL. 'public-read': anyone with the URL.
   */
  defaultAcl?: 'private' | 'public-read';
  log?: (line: string) => void;
}

export interface UploadService {
  url: string;
  port: number;
  dataDir: string;
  close(): Promise<void>;
  /** Removes leftovers of uploads that never completed; returns the paths removed. */
  sweepAbandoned(olderThanMs: number): Promise<string[]>;
}

export interface UploadResponseBody {
  url: string;
  appUrl: string;
  ufsUrl: string;
  fileHash: string;
  serverData: unknown;
}

const DEFAULT_CALLBACK_TIMEOUT_MS = 15_000;
const DEFAULT_REGISTRATION_WAIT_MS = 5_000;
const DEFAULT_REGISTRATION_TTL_MS = 60 * 60 * 1000;
const DEFAULT_LIMIT_BYTES = 100 * 1024 ** 3;
const MAX_JSON_BYTES = 1024 * 1024;
// Multipart framing around the file: part headers, boundaries, the file name.
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
// A refused upload's remaining body is read and discarded up to this much so
// the client can still read the reply; past it the connection is closed.
const DRAIN_LIMIT_BYTES = 1024 * 1024;

// For the browser's uploads (HEAD/PUT from the app's pages). File reads get none of these: a page shows
// a photo or plays a clip without CORS, and no other site's script may read a private file's bytes.
const CORS_HEADERS: Record<string, string> = {
  'access-control-allow-origin': '*',
  'access-control-expose-headers': 'x-ut-range-start, content-range, content-length, accept-ranges, x-uploadthing-version',
};
const NOSNIFF = { 'x-content-type-options': 'nosniff' };

class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    /** False for file reads, which never carry CORS headers. */
    readonly cors = true,
  ) {
    super(message);
  }
}

function credentialsFrom(options: UploadServiceOptions): Credentials {
  if (options.token) return parseToken(options.token);
  if (options.apiKey && options.appId) return { apiKey: options.apiKey, appId: options.appId };
  throw new Error('startUploadService needs `token`, or `apiKey` and `appId`');
}

function sendJson(res: ServerResponse, status: number, body: unknown, extra: Record<string, string> = {}): void {
  if (res.headersSent || res.destroyed) return;
  const text = JSON.stringify(body);
  res.writeHead(status, {
    ...CORS_HEADERS,
    ...NOSNIFF,
    'content-type': 'application/json; charset=utf-8',
    'content-length': String(Buffer.byteLength(text)),
    ...extra,
  });
  res.end(text);
}

async function readJson(req: IncomingMessage): Promise<unknown> {
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of req) {
    const buf = typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer);
    total += buf.length;
    if (total > MAX_JSON_BYTES) throw new HttpError(413, 'JSON body too large');
    chunks.push(buf);
  }
  const text = Buffer.concat(chunks).toString('utf8');
  if (text.trim() === '') return {};
  try {
    return JSON.parse(text) as unknown;
  } catch {
    throw new HttpError(400, 'body is not valid JSON');
  }
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function stringArray(value: unknown, field: string): string[] {
  if (!Array.isArray(value) || !value.every((v): v is string => typeof v === 'string')) {
    throw new HttpError(400, `${field} must be an array of strings`);
  }
  return value;
}

function contentDispositionHeader(disposition: string, name: string): string {
  const kind = disposition === 'attachment' ? 'attachment' : 'inline';
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

function errorMessage(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

/**
 * Replies to an upload refused before its body was read. Small leftovers
 * are drained so the reply reaches a client still sending; large ones get
 * the reply plus a closed connection instead of gigabytes read for nothing.
 */
function refuseUpload(req: IncomingMessage, res: ServerResponse, status: number, error: string): void {
  if (req.complete || req.readableEnded || req.destroyed) {
    sendJson(res, status, { error });
    return;
  }
  let drained = 0;
  let done = false;
  const reply = (closeConnection: boolean): void => {
    if (done) return;
    done = true;
    req.off('data', onData);
    req.off('end', onEnd);
    if (!closeConnection) {
      sendJson(res, status, { error });
      return;
    }
    req.pause();
    sendJson(res, status, { error }, { connection: 'close' });
    res.once('finish', () => setTimeout(() => req.socket.destroy(), 200).unref());
  };
  const onData = (chunk: Buffer): void => {
    drained += chunk.length;
    if (drained > DRAIN_LIMIT_BYTES) reply(true);
  };
  const onEnd = (): void => reply(false);
  req.on('data', onData);
  req.once('end', onEnd);
  req.once('error', () => {
    done = true;
  });
  req.resume();
}

/** Resolves once the file is flushed and its descriptor closed. */
function finishWriteStream(ws: WriteStream): Promise<void> {
  return new Promise((resolve, reject) => {
    if (ws.errored) return reject(ws.errored);
    ws.once('error', reject);
    ws.once('close', () => (ws.errored ? reject(ws.errored) : resolve()));
    ws.end();
  });
}

/**
 * Waits for the descriptor to close: the file is opened asynchronously, so
 * removing it before this could race with the open and leave it behind.
 */
function discardWriteStream(ws: WriteStream): Promise<void> {
  return new Promise((resolve) => {
    if (ws.closed) return resolve();
    ws.once('close', () => resolve());
    ws.destroy();
  });
}

export async function startUploadService(options: UploadServiceOptions): Promise<UploadService> {
  const creds = credentialsFrom(options);
  const host = options.host ?? '127.0.0.1';
  const callbackTimeoutMs = options.callbackTimeoutMs ?? DEFAULT_CALLBACK_TIMEOUT_MS;
  const registrationWaitMs = options.registrationWaitMs ?? DEFAULT_REGISTRATION_WAIT_MS;
  const limitBytes = options.limitBytes ?? DEFAULT_LIMIT_BYTES;
  const defaultAcl = options.defaultAcl ?? 'private';
  const log = options.log ?? ((): void => undefined);
  const store = new FileStore(path.resolve(options.dataDir));
  await store.init();

  const registrations = new RegistrationTable(options.registrationTtlMs ?? DEFAULT_REGISTRATION_TTL_MS);
  const callbackResults = new CallbackResults();
  /** Keys with an upload in flight; sweeping leaves them alone. */
  const activeKeys = new Set<string>();
  let baseUrl = '';

  const fileUrl = (key: string): string => `${baseUrl}/f/${encodeURIComponent(key)}`;
  const urlsFor = (key: string): { url: string; appUrl: string; ufsUrl: string } => {
    const url = fileUrl(key);
    return { url, appUrl: url, ufsUrl: url };
  };

  /** A read URL for a private file, signed the way the SDK's generateSignedURL signs one. */
  const signedFileUrl = (key: string, ttlMs: number): string => {
    const url = new URL(fileUrl(key));
    url.searchParams.append('expires', String(Date.now() + ttlMs));
    url.searchParams.append('signature', sign(url.toString(), creds.apiKey));
    return url.href;
  };

  const requireApiKey = (req: IncomingMessage): void => {
    const given = req.headers['x-uploadthing-api-key'];
    if (typeof given !== 'string' || !safeEqual(given, creds.apiKey)) throw new HttpError(401, 'invalid or missing x-uploadthing-api-key');
  };

  /** What the SDK may have used as the ingest base when it signed a URL. */
  const signingOrigins = (req: IncomingMessage): string[] => {
    const origins = new Set<string>([baseUrl]);
    if (req.headers.host) {
      origins.add(`http://${req.headers.host}`);
      origins.add(`https://${req.headers.host}`);
    }
    return [...origins];
  };

  // ---- the app registering a batch of uploads -------------------------------

  const handleRouteMetadata = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    requireApiKey(req);
    const body = await readJson(req);
    if (!isRecord(body)) throw new HttpError(400, 'expected a JSON object');
    const fileKeys = stringArray(body.fileKeys, 'fileKeys');
    if (!fileKeys.every(isValidKey)) throw new HttpError(400, 'fileKeys contains an invalid key');
    if (typeof body.callbackUrl !== 'string' || !URL.canParse(body.callbackUrl)) throw new HttpError(400, 'callbackUrl must be a URL');
    if (typeof body.callbackSlug !== 'string') throw new HttpError(400, 'callbackSlug must be a string');
    const meta: RouteMetadata = {
      fileKeys,
      metadata: isRecord(body.metadata) ? body.metadata : {},
      isDev: body.isDev === true,
      callbackUrl: body.callbackUrl,
      callbackSlug: body.callbackSlug,
      awaitServerData: body.awaitServerData !== false,
    };
    log(`route-metadata ${meta.isDev ? 'dev' : 'prod'} slug=${meta.callbackSlug} files=${fileKeys.length}`);
    if (!meta.isDev) {
      registrations.register(meta, null);
      sendJson(res, 200, { ok: true });
      return;
    }
    // Dev mode: the reply stays open; one JSON line per finished file is
    // written on it, and it ends when the batch is done.
    res.writeHead(200, { ...CORS_HEADERS, 'content-type': 'application/x-ndjson; charset=utf-8', 'cache-control': 'no-store' });
    res.flushHeaders();
    registrations.register(meta, res);
  };

  const handleCallbackResult = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    requireApiKey(req);
    const body = await readJson(req);
    if (!isRecord(body) || typeof body.fileKey !== 'string') throw new HttpError(400, 'expected {fileKey, callbackData}');
    const outcome: CallbackOutcome =
      typeof body.error === 'string' ? { ok: false, error: body.error } : { ok: true, serverData: body.callbackData ?? null };
    const waited = callbackResults.deliver(body.fileKey, outcome);
    if (!waited && !(await store.read(body.fileKey))) throw new HttpError(404, 'no upload is waiting for this file key');
    sendJson(res, 200, { ok: true });
  };

  // ---- upload-complete delivery ----------------------------------------------

  const callbackPayload = (reg: Registration, file: StoredFile): string =>
    JSON.stringify({
      status: 'uploaded',
      metadata: reg.metadata,
      origin: baseUrl,
      file: {
        name: file.name,
        size: file.size,
        type: file.type,
        customId: file.customId,
        key: file.key,
        ...urlsFor(file.key),
        fileHash: file.fileHash,
        lastModified: file.uploadedAt,
      },
    });

  const postToApp = async (reg: Registration, hook: 'callback' | 'error', payload: string, timeoutMs: number): Promise<void> => {
    const target = new URL(reg.callbackUrl);
    target.searchParams.set('slug', reg.callbackSlug);
    const response = await fetch(target, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'uploadthing-hook': hook,
        'x-uploadthing-signature': sign(payload, creds.apiKey),
      },
      body: payload,
      signal: AbortSignal.timeout(timeoutMs),
    });
    await response.arrayBuffer().catch(() => undefined);
    if (!response.ok) throw new Error(`the app answered the ${hook} hook with ${response.status}`);
  };

  /** Runs the app's onUploadComplete one way or the other; never waits past the timeout. */
  const deliverCallback = async (reg: Registration, file: StoredFile): Promise<CallbackOutcome> => {
    const payload = callbackPayload(reg, file);
    const result = reg.awaitServerData ? callbackResults.expect(file.key, callbackTimeoutMs) : null;
    if (reg.isDev) {
      const written = registrations.writeLine(reg, { payload, signature: sign(payload, creds.apiKey), hook: 'callback' });
      if (!written) {
        callbackResults.deliver(file.key, { ok: false, error: 'cancelled' });
        return { ok: false, error: 'the app closed its /route-metadata stream before the upload finished' };
      }
    } else {
      try {
        await postToApp(reg, 'callback', payload, callbackTimeoutMs);
      } catch (err) {
        callbackResults.deliver(file.key, { ok: false, error: 'cancelled' });
        return { ok: false, error: `upload-complete callback failed: ${errorMessage(err)}` };
      }
    }
    return result ? await result : { ok: true, serverData: null };
  };

  /** Lets the app's onUploadError run for a verified upload that failed. */
  const reportUploadError = (key: string, error: string): void => {
    const reg = registrations.get(key);
    if (!reg) return;
    const payload = JSON.stringify({ fileKey: key, error });
    if (reg.isDev) {
      registrations.writeLine(reg, { payload, signature: sign(payload, creds.apiKey), hook: 'error' });
      registrations.finish(reg, key);
      return;
    }
    registrations.finish(reg, key);
    postToApp(reg, 'error', payload, callbackTimeoutMs).catch((err: unknown) => log(`error hook for ${key} failed: ${errorMessage(err)}`));
  };

  // ---- presigned ingest URLs --------------------------------------------------

  const checkPresigned = (req: IncomingMessage): PresignedParams => {
    const check = verifyPresignedUrl(req.url ?? '/', signingOrigins(req), creds);
    if (!check.ok) throw new HttpError(check.status, check.error);
    if (!isValidKey(check.params.fileKey)) throw new HttpError(400, 'invalid file key');
    return check.params;
  };

  const handleIngestHead = (req: IncomingMessage, res: ServerResponse): void => {
    checkPresigned(req);
    // Resuming a partial upload is not supported, so every upload starts at 0.
    res.writeHead(200, { ...CORS_HEADERS, 'x-ut-range-start': '0', 'content-length': '0' });
    res.end();
  };

  const receiveBody = async (
    req: IncomingMessage,
    params: PresignedParams,
    boundary: string,
    tempPath: string,
  ): Promise<ReceivedFile> => {
    const ws = createWriteStream(tempPath, { flags: 'wx' });
    // Without a listener a disk error would crash the process.
    ws.on('error', (err) => log(`temp file error for ${params.fileKey}: ${err.message}`));
    try {
      const received = await receiveFilePart(req, boundary, ws, params.fileSize);
      await finishWriteStream(ws);
      if (received.size !== params.fileSize) {
        throw new MultipartError(400, `file is ${received.size} bytes but ${params.fileSize} were declared`);
      }
      return received;
    } catch (err) {
      await discardWriteStream(ws);
      throw err;
    }
  };

  const handleIngestPut = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    let params: PresignedParams;
    let boundary: string;
    try {
      params = checkPresigned(req);
      const range = req.headers.range;
      if (range !== undefined && !/^bytes=0-\s*$/.test(range)) throw new HttpError(416, 'resuming an upload is not supported; start at 0');
      const found = boundaryOf(req.headers['content-type']);
      if (!found) throw new HttpError(400, 'expected a multipart/form-data body');
      boundary = found;
      const declaredLength = Number(req.headers['content-length']);
      if (Number.isFinite(declaredLength) && declaredLength > params.fileSize + MULTIPART_OVERHEAD_BYTES) {
        throw new HttpError(413, `body is larger than the declared file size of ${params.fileSize} bytes`);
      }
      if (activeKeys.has(params.fileKey)) throw new HttpError(409, 'this file is already being uploaded');
      if (await store.read(params.fileKey)) throw new HttpError(409, 'this file key has already been uploaded');
    } catch (err) {
      if (!(err instanceof HttpError)) throw err;
      log(`PUT refused (${err.status}): ${err.message}`);
      refuseUpload(req, res, err.status, err.message);
      return;
    }

    const key = params.fileKey;
    activeKeys.add(key);
    const tempPath = store.newTempPath(key);
    let committed = false;
    try {
      let received: ReceivedFile;
      try {
        received = await receiveBody(req, params, boundary, tempPath);
      } catch (err) {
        await rm(tempPath, { force: true });
        const status = err instanceof MultipartError ? err.status : 500;
        const message = errorMessage(err);
        log(`PUT ${key} failed (${status}): ${message}`);
        if (params.slug) reportUploadError(key, message);
        refuseUpload(req, res, status, message);
        return;
      }

      const file: StoredFile = {
        id: randomUUID(),
        key,
        name: params.fileName,
        size: received.size,
        type: params.fileType,
        customId: params.customId,
        uploadedAt: Date.now(),
        fileHash: received.sha256,
        // A route-handler upload only counts once the app has accepted it.
        status: params.slug ? 'Uploading' : 'Uploaded',
        contentDisposition: params.contentDisposition,
        acl: params.acl,
      };
      // Committed before the callback so onUploadComplete can already fetch it.
      await store.commit(tempPath, file);
      committed = true;

      let serverData: unknown = null;
      if (params.slug) {
        const reg = await registrations.waitFor(key, registrationWaitMs);
        if (!reg) {
          await store.remove(key);
          sendJson(res, 409, { error: 'the app never registered route metadata for this upload' });
          return;
        }
        const outcome = await deliverCallback(reg, file);
        registrations.finish(reg, key);
        if (!outcome.ok) {
          await store.remove(key);
          log(`PUT ${key} failed: ${outcome.error}`);
          sendJson(res, 502, { error: outcome.error });
          return;
        }
        serverData = outcome.serverData;
        await store.update(key, { status: 'Uploaded' });
      }
      log(`stored ${key} (${file.size} bytes, ${file.type})`);
      const reply: UploadResponseBody = { ...urlsFor(key), fileHash: file.fileHash, serverData };
      sendJson(res, 200, reply);
    } catch (err) {
      if (committed) await store.remove(key).catch(() => undefined);
      else await rm(tempPath, { force: true });
      throw err;
    } finally {
      activeKeys.delete(key);
    }
  };

  // ---- serving stored files ---------------------------------------------------

  const isPrivate = (file: StoredFile): boolean => (file.acl ?? defaultAcl) !== 'public-read';

  const handleServeFile = async (req: IncomingMessage, res: ServerResponse, key: string): Promise<void> => {
    const file = await store.read(key);
    // Still 'Uploading' while the app's onUploadComplete reads it back; a signature is needed either way.
    if (!file) throw new HttpError(404, 'file not found', false);
    if (isPrivate(file)) {
      // As the hosted service does: a private file is read only through a signed URL that has not expired.
      const check = verifySignedRead(req.url ?? '/', signingOrigins(req), creds.apiKey);
      if (!check.ok) throw new HttpError(403, check.error, false);
    }
    const headers: Record<string, string> = {
      ...NOSNIFF,
      'cache-control': isPrivate(file) ? 'private, no-store' : 'public, max-age=3600',
      'content-type': file.type,
      'accept-ranges': 'bytes',
      'content-disposition': contentDispositionHeader(file.contentDisposition, file.name),
      etag: `"${file.fileHash}"`,
    };
    const range = parseRange(req.headers.range, file.size);
    if (range.kind === 'unsatisfiable') {
      res.writeHead(416, { ...headers, 'content-range': `bytes */${file.size}`, 'content-length': '0' });
      res.end();
      return;
    }
    const start = range.kind === 'partial' ? range.start : 0;
    const end = range.kind === 'partial' ? range.end : file.size - 1;
    const length = file.size === 0 ? 0 : end - start + 1;
    if (range.kind === 'partial') headers['content-range'] = `bytes ${start}-${end}/${file.size}`;
    headers['content-length'] = String(length);
    res.writeHead(range.kind === 'partial' ? 206 : 200, headers);
    if (req.method === 'HEAD' || length === 0) {
      res.end();
      return;
    }
    try {
      await pipeline(createReadStream(store.dataPath(key), { start, end }), res);
    } catch (err) {
      // Players drop range requests all the time while seeking; that is not an error.
      if (res.destroyed && !res.writableFinished) return;
      throw err;
    }
  };

  // ---- server-side API (/v6/*) ------------------------------------------------

  const resolveKeys = async (body: Record<string, unknown>): Promise<string[]> => {
    if (body.fileKeys !== undefined) return stringArray(body.fileKeys, 'fileKeys');
    if (body.customIds !== undefined) {
      const ids = new Set(stringArray(body.customIds, 'customIds'));
      return (await store.list()).filter((f) => f.customId !== null && ids.has(f.customId)).map((f) => f.key);
    }
    throw new HttpError(400, 'expected fileKeys or customIds');
  };

  const resolveOne = async (entry: unknown): Promise<StoredFile> => {
    if (!isRecord(entry)) throw new HttpError(400, 'expected an object per update');
    const file =
      typeof entry.fileKey === 'string'
        ? await store.read(entry.fileKey)
        : typeof entry.customId === 'string'
          ? await store.findByCustomId(entry.customId)
          : null;
    if (!file) throw new HttpError(404, `file not found: ${String(entry.fileKey ?? entry.customId)}`);
    return file;
  };

  const apiHandlers: Record<string, (body: Record<string, unknown>) => Promise<unknown>> = {
    deleteFiles: async (body) => {
      let deletedCount = 0;
      for (const key of await resolveKeys(body)) if (await store.remove(key)) deletedCount += 1;
      return { success: true, deletedCount };
    },
    getFileUrl: async (body) => {
      const data: Array<{ key: string; url: string }> = [];
      for (const key of await resolveKeys(body)) if (await store.read(key)) data.push({ key, url: fileUrl(key) });
      return { data };
    },
    listFiles: async (body) => {
      const limit = typeof body.limit === 'number' && body.limit > 0 ? Math.floor(body.limit) : 500;
      const offset = typeof body.offset === 'number' && body.offset > 0 ? Math.floor(body.offset) : 0;
      const all = await store.list();
      const files = all.slice(offset, offset + limit).map((f) => ({
        id: f.id,
        customId: f.customId,
        key: f.key,
        name: f.name,
        size: f.size,
        status: f.status,
        uploadedAt: f.uploadedAt,
      }));
      return { hasMore: offset + limit < all.length, files };
    },
    renameFiles: async (body) => {
      if (!Array.isArray(body.updates)) throw new HttpError(400, 'expected updates');
      for (const entry of body.updates) {
        const file = await resolveOne(entry);
        const newName = isRecord(entry) ? entry.newName : undefined;
        if (typeof newName !== 'string' || newName === '') throw new HttpError(400, 'newName must be a non-empty string');
        await store.update(file.key, { name: newName });
      }
      return { success: true };
    },
    updateACL: async (body) => {
      if (!Array.isArray(body.updates)) throw new HttpError(400, 'expected updates');
      for (const entry of body.updates) {
        const file = await resolveOne(entry);
        const acl = isRecord(entry) ? entry.acl : undefined;
        if (acl !== 'public-read' && acl !== 'private') throw new HttpError(400, 'acl must be public-read or private');
        await store.update(file.key, { acl });
      }
      return { success: true };
    },
    getUsageInfo: async () => {
      const files = (await store.list()).filter((f) => f.status === 'Uploaded');
      const totalBytes = files.reduce((sum, f) => sum + f.size, 0);
      return { totalBytes, appTotalBytes: totalBytes, filesUploaded: files.length, limitBytes };
    },
    requestFileAccess: async (body) => {
      const file = await resolveOne(body);
      const seconds = typeof body.expiresIn === 'number' && body.expiresIn > 0 ? body.expiresIn : 300;
      const url = signedFileUrl(file.key, seconds * 1000);
      return { url, ufsUrl: url };
    },
    sweepAbandoned: async (body) => {
      const olderThanMs = typeof body.olderThanMs === 'number' && body.olderThanMs >= 0 ? body.olderThanMs : 60 * 60 * 1000;
      const removed = await store.sweep(olderThanMs, activeKeys);
      return { success: true, removedCount: removed.length };
    },
  };

  const handleApi = async (req: IncomingMessage, res: ServerResponse, name: string): Promise<void> => {
    const handler = Object.hasOwn(apiHandlers, name) ? apiHandlers[name] : undefined;
    if (!handler) throw new HttpError(404, `unknown endpoint /v6/${name}`);
    requireApiKey(req);
    const body = await readJson(req);
    if (!isRecord(body)) throw new HttpError(400, 'expected a JSON object');
    sendJson(res, 200, await handler(body));
  };

  // ---- routing ----------------------------------------------------------------

  const route = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    const method = req.method ?? 'GET';
    const pathname = (req.url ?? '/').split('?')[0] ?? '/';

    if (method === 'OPTIONS') {
      res.writeHead(204, {
        ...CORS_HEADERS,
        'access-control-allow-methods': 'GET, HEAD, PUT, POST, OPTIONS',
        'access-control-allow-headers':
          req.headers['access-control-request-headers'] ?? 'content-type, range, x-uploadthing-version, b3, traceparent',
        'access-control-max-age': '600',
        'content-length': '0',
      });
      res.end();
      return;
    }
    if (method === 'POST' && pathname === '/route-metadata') return handleRouteMetadata(req, res);
    if (method === 'POST' && pathname === '/callback-result') return handleCallbackResult(req, res);
    if (method === 'POST' && pathname.startsWith('/v6/')) return handleApi(req, res, pathname.slice('/v6/'.length));

    // `/f/<key>` as uploads return it; `/a/<appId>/<key>` as the SDK's generateSignedURL builds it
    // with ufsAppIdLocation 'path'.
    const fileMatch = /^\/f\/([^/]+)$/.exec(pathname) ?? /^\/a\/([^/]+)\/([^/]+)$/.exec(pathname);
    if (fileMatch && (method === 'GET' || method === 'HEAD')) {
      if (fileMatch.length === 3 && fileMatch[1] !== encodeURIComponent(creds.appId)) throw new HttpError(404, 'file not found', false);
      let key: string;
      try {
        key = decodeURIComponent(fileMatch[fileMatch.length - 1] ?? '');
      } catch {
        throw new HttpError(400, 'bad file key', false);
      }
      if (!isValidKey(key)) throw new HttpError(404, 'file not found', false);
      return handleServeFile(req, res, key);
    }
    if (/^\/[^/]+$/.test(pathname)) {
      if (method === 'HEAD') return handleIngestHead(req, res);
      if (method === 'PUT') return handleIngestPut(req, res);
    }
    throw new HttpError(404, `no route for ${method} ${pathname}`);
  };

  const server: Server = createServer((req, res) => {
    route(req, res).catch((err: unknown) => {
      if (err instanceof HttpError) {
        const cors = err.cors ? CORS_HEADERS : {};
        if (req.method === 'HEAD') {
          if (!res.headersSent) res.writeHead(err.status, { ...cors, ...NOSNIFF, 'content-length': '0' });
          res.end();
          return;
        }
        if (!err.cors) {
          if (res.headersSent || res.destroyed) return;
          const text = JSON.stringify({ error: err.message });
          res.writeHead(err.status, { ...NOSNIFF, 'content-type': 'application/json; charset=utf-8', 'content-length': String(Buffer.byteLength(text)) });
          res.end(text);
          return;
        }
        sendJson(res, err.status, { error: err.message });
        return;
      }
      log(`internal error on ${req.method} ${req.url?.split('?')[0]}: ${errorMessage(err)}`);
      if (!res.headersSent) sendJson(res, 500, { error: 'internal error in the upload service' });
      else res.destroy();
    });
  });
  // Each request is short except uploads and dev streams, which must not be cut.
  server.requestTimeout = 0;

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const port = (server.address() as AddressInfo).port;
  const hostForUrl = host.includes(':') ? `[${host}]` : host;
  baseUrl = (options.publicUrl ?? `http://${hostForUrl}:${port}`).replace(/\/$/, '');
  log(`listening on ${baseUrl}, storing in ${store.dataDir}`);

  let closing: Promise<void> | null = null;
  return {
    url: baseUrl,
    port,
    dataDir: store.dataDir,
    sweepAbandoned: (olderThanMs) => store.sweep(olderThanMs, activeKeys),
    close: () => {
      closing ??= new Promise<void>((resolve) => {
        callbackResults.cancelAll('the upload service is shutting down');
        registrations.closeAll();
        server.close(() => resolve());
        server.closeIdleConnections();
        // In-flight uploads cannot finish once we stop; drop them.
        setTimeout(() => server.closeAllConnections(), 100).unref();
      });
      return closing;
    },
  };
}

/** Removes leftovers of uploads that never completed, for use while no service runs on `dataDir`. */
export function sweepAbandoned(dataDir: string, olderThanMs: number): Promise<string[]> {
  return new FileStore(path.resolve(dataDir)).sweep(olderThanMs);
}

// ---- command line -------------------------------------------------------------

async function main(): Promise<void> {
  const token = process.env.UPLOADTHING_TOKEN;
  if (!token) {
    console.error('UPLOADTHING_TOKEN is not set: the upload service needs the same token as the app (see uploads-fake/README.md)');
    process.exit(1);
  }
  const port = Number(process.env.UPLOADS_FAKE_PORT ?? 3100);
  const dataDir = path.resolve(process.env.UPLOADS_FAKE_DIR ?? '.data/uploads');
  const acl = process.env.UPLOADS_FAKE_DEFAULT_ACL;
  if (acl !== undefined && acl !== 'private' && acl !== 'public-read') {
    console.error('UPLOADS_FAKE_DEFAULT_ACL must be private or public-read');
    process.exit(1);
  }
  const service = await startUploadService({
    port,
    dataDir,
    token,
    defaultAcl: acl,
    log: (line) => console.log(`[uploads] ${line}`),
  });
  console.log(`upload service on ${service.url}`);

  const hour = 60 * 60 * 1000;
  const sweep = (): void => {
    service.sweepAbandoned(hour).then(
      (removed) => removed.length > 0 && console.log(`[uploads] swept ${removed.length} abandoned file(s)`),
      (err: unknown) => console.error(`[uploads] sweep failed: ${errorMessage(err)}`),
    );
  };
  sweep();
  setInterval(sweep, hour).unref();

  const stop = (signal: string): void => {
    console.log(`[uploads] ${signal}: stopping`);
    service.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

const invokedPath = process.argv[1] ? path.resolve(process.argv[1]) : '';
if (invokedPath === fileURLToPath(import.meta.url)) {
  main().catch((err: unknown) => {
    console.error(`upload service failed to start: ${errorMessage(err)}`);
    process.exit(1);
  });
}
