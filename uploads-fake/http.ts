import type { IncomingMessage, ServerResponse } from 'node:http';

// What every endpoint of the local upload service shares: the error type, JSON in and out, CORS.

const MAX_JSON_BYTES = 1024 * 1024;

// For the browser's uploads (HEAD/PUT from the app's pages). File reads get none of these: a page shows
// a photo or plays a clip without CORS, and no other site's script may read a private file's bytes.
export const CORS_HEADERS: Record<string, string> = {
  'access-control-allow-origin': '*',
  'access-control-expose-headers': 'x-ut-range-start, content-range, content-length, accept-ranges, x-uploadthing-version',
};
export const NOSNIFF = { 'x-content-type-options': 'nosniff' };

export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    /** False for file reads, which never carry CORS headers. */
    readonly cors = true,
  ) {
    super(message);
  }
}

export function sendJson(res: ServerResponse, status: number, body: unknown, extra: Record<string, string> = {}): void {
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

export async function readJson(req: IncomingMessage): Promise<unknown> {
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

/** The request's JSON body, which must be an object. */
export async function readJsonObject(req: IncomingMessage): Promise<Record<string, unknown>> {
  const body = await readJson(req);
  if (!isRecord(body)) throw new HttpError(400, 'expected a JSON object');
  return body;
}

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

export function stringArray(value: unknown, field: string): string[] {
  if (!Array.isArray(value) || !value.every((v): v is string => typeof v === 'string')) {
    throw new HttpError(400, `${field} must be an array of strings`);
  }
  return value;
}

export function errorMessage(err: unknown): string {
  return err instanceof Error ? err.message : String(err);
}

/** Answers a failed request: JSON with CORS, without for file reads, headers only for HEAD. */
export function sendError(req: IncomingMessage, res: ServerResponse, err: HttpError): void {
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
}
