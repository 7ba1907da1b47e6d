import type { IncomingMessage, ServerResponse } from 'node:http';

import { handleApi } from './handlers/api';
import { handleCallbackResult } from './handlers/callback-result';
import { handleIngestHead, handleIngestPut } from './handlers/ingest';
import { handlePreflight } from './handlers/preflight';
import { handleRouteMetadata } from './handlers/route-metadata';
import { handleServeFile } from './handlers/serve-file';
import { errorMessage, HttpError, sendError, sendJson } from './http';
import type { ServiceState } from './state';
import { isValidKey } from './store';

/** Sends each request to its endpoint's handler (uploads-fake/handlers/*). */
async function route(state: ServiceState, req: IncomingMessage, res: ServerResponse): Promise<void> {
  const method = req.method ?? 'GET';
  const pathname = (req.url ?? '/').split('?')[0] ?? '/';

  if (method === 'OPTIONS') return handlePreflight(req, res);
  if (method === 'POST' && pathname === '/route-metadata') return handleRouteMetadata(state, req, res);
  if (method === 'POST' && pathname === '/callback-result') return handleCallbackResult(state, req, res);
  if (method === 'POST' && pathname.startsWith('/v6/')) return handleApi(state, req, res, pathname.slice('/v6/'.length));

  // `/f/<key>` as uploads return it; `/a/<appId>/<key>` as the SDK's generateSignedURL builds it
  // with ufsAppIdLocation 'path'.
  const fileMatch = /^\/f\/([^/]+)$/.exec(pathname) ?? /^\/a\/([^/]+)\/([^/]+)$/.exec(pathname);
  if (fileMatch && (method === 'GET' || method === 'HEAD')) {
    if (fileMatch.length === 3 && fileMatch[1] !== encodeURIComponent(state.creds.appId)) throw new HttpError(404, 'file not found', false);
    let key: string;
    try {
      key = decodeURIComponent(fileMatch[fileMatch.length - 1] ?? '');
    } catch {
      throw new HttpError(400, 'bad file key', false);
    }
    if (!isValidKey(key)) throw new HttpError(404, 'file not found', false);
    return handleServeFile(state, req, res, key);
  }
  if (/^\/[^/]+$/.test(pathname)) {
    if (method === 'HEAD') return handleIngestHead(state, req, res);
    if (method === 'PUT') return handleIngestPut(state, req, res);
  }
  throw new HttpError(404, `no route for ${method} ${pathname}`);
}

/** The request listener: routes, and turns a thrown HttpError into its answer and anything else into a 500. */
export function requestListener(state: ServiceState): (req: IncomingMessage, res: ServerResponse) => void {
  return (req, res) => {
    route(state, req, res).catch((err: unknown) => {
      if (err instanceof HttpError) return sendError(req, res, err);
      state.log(`internal error on ${req.method} ${req.url?.split('?')[0]}: ${errorMessage(err)}`);
      if (!res.headersSent) sendJson(res, 500, { error: 'internal error in the upload service' });
      else res.destroy();
    });
  };
}
