import type { IncomingMessage, ServerResponse } from 'node:http';

import { HttpError, isRecord, readJsonObject, sendJson, stringArray } from '../http';
import { fileUrl, requireApiKey, signedFileUrl, type ServiceState } from '../state';
import type { StoredFile } from '../store';

// POST /v6/<name>: the server-side API the SDK's UTApi calls, one function per endpoint.

type ApiEndpoint = (state: ServiceState, body: Record<string, unknown>) => Promise<unknown>;

async function resolveKeys(state: ServiceState, body: Record<string, unknown>): Promise<string[]> {
  if (body.fileKeys !== undefined) return stringArray(body.fileKeys, 'fileKeys');
  if (body.customIds !== undefined) {
    const ids = new Set(stringArray(body.customIds, 'customIds'));
    return (await state.store.list()).filter((f) => f.customId !== null && ids.has(f.customId)).map((f) => f.key);
  }
  throw new HttpError(400, 'expected fileKeys or customIds');
}

async function resolveOne(state: ServiceState, entry: unknown): Promise<StoredFile> {
  if (!isRecord(entry)) throw new HttpError(400, 'expected an object per update');
  const file =
    typeof entry.fileKey === 'string'
      ? await state.store.read(entry.fileKey)
      : typeof entry.customId === 'string'
        ? await state.store.findByCustomId(entry.customId)
        : null;
  if (!file) throw new HttpError(404, `file not found: ${String(entry.fileKey ?? entry.customId)}`);
  return file;
}

const deleteFiles: ApiEndpoint = async (state, body) => {
  let deletedCount = 0;
  for (const key of await resolveKeys(state, body)) if (await state.store.remove(key)) deletedCount += 1;
  return { success: true, deletedCount };
};

const getFileUrl: ApiEndpoint = async (state, body) => {
  const data: Array<{ key: string; url: string }> = [];
  for (const key of await resolveKeys(state, body)) if (await state.store.read(key)) data.push({ key, url: fileUrl(state, key) });
  return { data };
};

const listFiles: ApiEndpoint = async (state, body) => {
  const limit = typeof body.limit === 'number' && body.limit > 0 ? Math.floor(body.limit) : 500;
  const offset = typeof body.offset === 'number' && body.offset > 0 ? Math.floor(body.offset) : 0;
  const all = await state.store.list();
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
};

const renameFiles: ApiEndpoint = async (state, body) => {
  if (!Array.isArray(body.updates)) throw new HttpError(400, 'expected updates');
  for (const entry of body.updates) {
    const file = await resolveOne(state, entry);
    const newName = isRecord(entry) ? entry.newName : undefined;
    if (typeof newName !== 'string' || newName === '') throw new HttpError(400, 'newName must be a non-empty string');
    await state.store.update(file.key, { name: newName });
  }
  return { success: true };
};

const updateACL: ApiEndpoint = async (state, body) => {
  if (!Array.isArray(body.updates)) throw new HttpError(400, 'expected updates');
  for (const entry of body.updates) {
    const file = await resolveOne(state, entry);
    const acl = isRecord(entry) ? entry.acl : undefined;
    if (acl !== 'public-read' && acl !== 'private') throw new HttpError(400, 'acl must be public-read or private');
    await state.store.update(file.key, { acl });
  }
  return { success: true };
};

const getUsageInfo: ApiEndpoint = async (state) => {
  const files = (await state.store.list()).filter((f) => f.status === 'Uploaded');
  const totalBytes = files.reduce((sum, f) => sum + f.size, 0);
  return { totalBytes, appTotalBytes: totalBytes, filesUploaded: files.length, limitBytes: state.limitBytes };
};

const requestFileAccess: ApiEndpoint = async (state, body) => {
  const file = await resolveOne(state, body);
  const seconds = typeof body.expiresIn === 'number' && body.expiresIn > 0 ? body.expiresIn : 300;
  const url = signedFileUrl(state, file.key, seconds * 1000);
  return { url, ufsUrl: url };
};

/** A maintenance call of ours, not the hosted service's: removes leftovers of abandoned uploads. */
const sweepAbandoned: ApiEndpoint = async (state, body) => {
  const olderThanMs = typeof body.olderThanMs === 'number' && body.olderThanMs >= 0 ? body.olderThanMs : 60 * 60 * 1000;
  const removed = await state.store.sweep(olderThanMs, state.activeKeys);
  return { success: true, removedCount: removed.length };
};

const ENDPOINTS: Record<string, ApiEndpoint> = { deleteFiles, getFileUrl, listFiles, renameFiles, updateACL, getUsageInfo, requestFileAccess, sweepAbandoned };

export async function handleApi(state: ServiceState, req: IncomingMessage, res: ServerResponse, name: string): Promise<void> {
  const endpoint = Object.hasOwn(ENDPOINTS, name) ? ENDPOINTS[name] : undefined;
  if (!endpoint) throw new HttpError(404, `unknown endpoint /v6/${name}`);
  requireApiKey(state, req);
  const body = await readJsonObject(req);
  sendJson(res, 200, await endpoint(state, body));
}
