import type { IncomingMessage, ServerResponse } from 'node:http';

import { CORS_HEADERS, HttpError, isRecord, readJsonObject, sendJson, stringArray } from '../http';
import type { RouteMetadata } from '../registrations';
import { requireApiKey, type ServiceState } from '../state';
import { isValidKey } from '../store';

/** POST /route-metadata: the app registering a batch of uploads. */
export async function handleRouteMetadata(state: ServiceState, req: IncomingMessage, res: ServerResponse): Promise<void> {
  requireApiKey(state, req);
  const body = await readJsonObject(req);
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
  state.log(`route-metadata ${meta.isDev ? 'dev' : 'prod'} slug=${meta.callbackSlug} files=${fileKeys.length}`);
  if (!meta.isDev) {
    state.registrations.register(meta, null);
    sendJson(res, 200, { ok: true });
    return;
  }
  // Dev mode: the reply stays open; one JSON line per finished file is
  // written on it, and it ends when the batch is done.
  res.writeHead(200, { ...CORS_HEADERS, 'content-type': 'application/x-ndjson; charset=utf-8', 'cache-control': 'no-store' });
  res.flushHeaders();
  state.registrations.register(meta, res);
}
