import { randomUUID } from 'node:crypto';
import { createWriteStream, type WriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import type { IncomingMessage, ServerResponse } from 'node:http';

import { deliverCallback, reportUploadError } from '../callbacks';
import { CORS_HEADERS, errorMessage, HttpError, sendJson } from '../http';
import { boundaryOf, MultipartError, receiveFilePart, type ReceivedFile } from '../multipart';
import { verifyPresignedUrl, type PresignedParams } from '../signing';
import { signingOrigins, urlsFor, type ServiceState } from '../state';
import { isValidKey, type StoredFile } from '../store';

// HEAD and PUT /<fileKey>?…: the browser's upload through a presigned ingest URL.

export interface UploadResponseBody {
  url: string;
  appUrl: string;
  ufsUrl: string;
  fileHash: string;
  serverData: unknown;
}

// Multipart framing around the file: part headers, boundaries, the file name.
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
// A refused upload's remaining body is read and discarded up to this much so
// the client can still read the reply; past it the connection is closed.
const DRAIN_LIMIT_BYTES = 1024 * 1024;

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

function checkPresigned(state: ServiceState, req: IncomingMessage): PresignedParams {
  const check = verifyPresignedUrl(req.url ?? '/', signingOrigins(state, req), state.creds);
  if (!check.ok) throw new HttpError(check.status, check.error);
  if (!isValidKey(check.params.fileKey)) throw new HttpError(400, 'invalid file key');
  return check.params;
}

/** HEAD /<fileKey>?…: where a (resumed) upload would start. */
export function handleIngestHead(state: ServiceState, req: IncomingMessage, res: ServerResponse): void {
  checkPresigned(state, req);
  // Resuming a partial upload is not supported, so every upload starts at 0.
  res.writeHead(200, { ...CORS_HEADERS, 'x-ut-range-start': '0', 'content-length': '0' });
  res.end();
}

async function receiveBody(state: ServiceState, req: IncomingMessage, params: PresignedParams, boundary: string, tempPath: string): Promise<ReceivedFile> {
  const ws = createWriteStream(tempPath, { flags: 'wx' });
  // Without a listener a disk error would crash the process.
  ws.on('error', (err) => state.log(`temp file error for ${params.fileKey}: ${err.message}`));
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
}

/** PUT /<fileKey>?…: streams the file to disk, runs the app's callback, answers the SDK. */
export async function handleIngestPut(state: ServiceState, req: IncomingMessage, res: ServerResponse): Promise<void> {
  const { store, registrations, activeKeys, log } = state;
  let params: PresignedParams;
  let boundary: string;
  try {
    params = checkPresigned(state, req);
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
      received = await receiveBody(state, req, params, boundary, tempPath);
    } catch (err) {
      await rm(tempPath, { force: true });
      const status = err instanceof MultipartError ? err.status : 500;
      const message = errorMessage(err);
      log(`PUT ${key} failed (${status}): ${message}`);
      if (params.slug) reportUploadError(state, key, message);
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
      const reg = await registrations.waitFor(key, state.registrationWaitMs);
      if (!reg) {
        await store.remove(key);
        sendJson(res, 409, { error: 'the app never registered route metadata for this upload' });
        return;
      }
      const outcome = await deliverCallback(state, reg, file);
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
    const reply: UploadResponseBody = { ...urlsFor(state, key), fileHash: file.fileHash, serverData };
    sendJson(res, 200, reply);
  } catch (err) {
    if (committed) await store.remove(key).catch(() => undefined);
    else await rm(tempPath, { force: true });
    throw err;
  } finally {
    activeKeys.delete(key);
  }
}
