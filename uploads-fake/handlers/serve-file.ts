import { createReadStream } from 'node:fs';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pipeline } from 'node:stream/promises';

import { HttpError, NOSNIFF } from '../http';
import { parseRange } from '../ranges';
import { verifySignedRead } from '../signing';
import { signingOrigins, type ServiceState } from '../state';
import type { StoredFile } from '../store';

// GET/HEAD /f/<fileKey> and /a/<appId>/<fileKey>: a stored file, with ranges; a private one only signed.

function contentDispositionHeader(disposition: string, name: string): string {
  const kind = disposition === 'attachment' ? 'attachment' : 'inline';
  const ascii = name.replace(/[^\x20-\x7e]/g, '_').replace(/["\\]/g, '_');
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

const isPrivate = (state: ServiceState, file: StoredFile): boolean => (file.acl ?? state.defaultAcl) !== 'public-read';

export async function handleServeFile(state: ServiceState, req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
  const file = await state.store.read(key);
  // Still 'Uploading' while the app's onUploadComplete reads it back; a signature is needed either way.
  if (!file) throw new HttpError(404, 'file not found', false);
  if (isPrivate(state, file)) {
    // As the hosted service does: a private file is read only through a signed URL that has not expired.
    const check = verifySignedRead(req.url ?? '/', signingOrigins(state, req), state.creds.apiKey);
    if (!check.ok) throw new HttpError(403, check.error, false);
  }
  const headers: Record<string, string> = {
    ...NOSNIFF,
    'cache-control': isPrivate(state, file) ? 'private, no-store' : 'public, max-age=3600',
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
    await pipeline(createReadStream(state.store.dataPath(key), { start, end }), res);
  } catch (err) {
    // Players drop range requests all the time while seeking; that is not an error.
    if (res.destroyed && !res.writableFinished) return;
    throw err;
  }
}
