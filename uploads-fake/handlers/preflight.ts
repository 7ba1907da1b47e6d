import type { IncomingMessage, ServerResponse } from 'node:http';

import { CORS_HEADERS } from '../http';

/** OPTIONS *: CORS preflight for the browser's uploads. */
export function handlePreflight(req: IncomingMessage, res: ServerResponse): void {
  res.writeHead(204, {
    ...CORS_HEADERS,
    'access-control-allow-methods': 'GET, HEAD, PUT, POST, OPTIONS',
    'access-control-allow-headers': req.headers['access-control-request-headers'] ?? 'content-type, range, x-uploadthing-version, b3, traceparent',
    'access-control-max-age': '600',
    'content-length': '0',
  });
  res.end();
}
