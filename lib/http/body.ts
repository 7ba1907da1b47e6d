// Reading a request body with a size cap: refused on its Content-Length before anything is read,
// and counted while streaming (a body sent without a length, or lying about it, stops at the cap).
import { AppError } from '../errors';

/** What a JSON route accepts unless it says otherwise: far above any form or autosave of ours. */
export const DEFAULT_MAX_BODY_BYTES = 256 * 1024;

const human = (bytes: number) => (bytes >= 1024 * 1024 ? `${Math.round(bytes / (1024 * 1024))} MB` : `${Math.round(bytes / 1024)} KB`);

export const tooLarge = (maxBytes: number) => new AppError('too_large', `The request body is larger than ${human(maxBytes)}; nothing was saved.`);

/** application/json, or any application/…+json, with or without parameters. */
export function isJsonContentType(value: string | null): boolean {
  if (!value) return false;
  const type = value.split(';')[0].trim().toLowerCase();
  return type === 'application/json' || (type.startsWith('application/') && type.endsWith('+json'));
}

/** The body as text, refusing (413) past maxBytes without reading the rest. */
export async function readTextCapped(req: Request, maxBytes: number): Promise<string> {
  const declared = req.headers.get('content-length');
  if (declared !== null && /^\d+$/.test(declared.trim()) && Number(declared) > maxBytes) throw tooLarge(maxBytes);
  if (!req.body) return '';
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** A JSON object body: 415 when it is not declared JSON, 413 past maxBytes, 400 when empty, not JSON or not an object. */
export async function readJsonCapped(req: Request, maxBytes: number): Promise<unknown> {
  if (!isJsonContentType(req.headers.get('content-type'))) {
    throw new AppError('unsupported_media_type', 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = await readTextCapped(req, maxBytes);
  if (!text.trim()) throw new AppError('validation', 'The request body is empty: send a JSON object.');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    throw new AppError('validation', 'The request body is not valid JSON.');
  }
  // Every JSON route of ours takes an object: null, a list or a bare value is refused here, by name.
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    const what = value === null ? 'null' : Array.isArray(value) ? 'a list' : `a ${typeof value}`;
    throw new AppError('validation', `The request body must be a JSON object, not ${what}.`);
  }
  return value;
}
