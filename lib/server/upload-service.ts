import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { UTApi } from 'uploadthing/server';
import { initModels, Media } from '../../db/models';
import { AppError } from '../errors';

// The client of the hosted upload service (the upload SDK's UTApi): signed read URLs, reading stored
// bytes back, listing and deleting files, and the queue of deletions that outlives a crash.
// Which file belongs to which row is lib/server/media.ts's business.

// The SDK sets no timeouts: a hung upload service must not hang a request of ours with it.
const SERVICE_TIMEOUT_MS = 15_000;
const timedFetch = (input: RequestInfo | URL, init?: RequestInit): Promise<Response> => {
  const timeout = AbortSignal.timeout(SERVICE_TIMEOUT_MS);
  return fetch(input, { ...init, signal: init?.signal ? AbortSignal.any([init.signal, timeout]) : timeout });
};

const reason = (err: unknown): string => (err instanceof Error ? `${err.message}${err.cause instanceof Error ? ` (${err.cause.message})` : ''}` : String(err));

let utapi: UTApi | undefined;
/** The server-side client of the upload service; token and URLs come from the UPLOADTHING_* environment. */
export function getUtapi(): UTApi {
  utapi ??= new UTApi({ fetch: timedFetch });
  return utapi;
}

/** A short-lived address on the upload service for a stored file's bytes. */
export async function signedFileUrl(fileKey: string, expiresInSeconds: number): Promise<string> {
  const { ufsUrl } = await getUtapi().generateSignedURL(fileKey, { expiresIn: expiresInSeconds });
  return ufsUrl;
}

/** Reads at most `limit` bytes of a response body, then lets the rest go. */
async function readAtMost(res: Response, limit: number): Promise<Uint8Array> {
  if (!res.body) return new Uint8Array(0);
  const reader = res.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  try {
    while (total < limit) {
      const { done, value } = await reader.read();
      if (done) break;
      chunks.push(value);
      total += value.byteLength;
    }
  } finally {
    await reader.cancel().catch(() => undefined);
  }
  const out = new Uint8Array(Math.min(total, limit));
  let at = 0;
  for (const c of chunks) {
    const part = c.subarray(0, Math.min(c.byteLength, out.length - at));
    out.set(part, at);
    at += part.byteLength;
    if (at >= out.length) break;
  }
  return out;
}

/**
 * Reads a stored file's bytes back through a short-lived signed URL built from its key (never from an
 * address someone handed us): at most `maxBytes`, asking the service for only that head when `head` is set.
 */
export async function readStoredFile(fileKey: string, { maxBytes, head = false }: { maxBytes: number; head?: boolean }): Promise<Uint8Array> {
  const url = await signedFileUrl(fileKey, 60);
  const res = await timedFetch(url, { redirect: 'error', ...(head ? { headers: { range: `bytes=0-${maxBytes - 1}` } } : {}) });
  if (!res.ok) {
    await res.body?.cancel();
    throw new Error(`the upload service answered ${res.status} for ${fileKey}`);
  }
  return readAtMost(res, maxBytes);
}

/**
 * A stored file's bytes as a stream (an archive's media), through a signed URL built from its key. Only
 * the wait for the answer is timed: a long clip may take longer than SERVICE_TIMEOUT_MS to pass through.
 */
export async function streamStoredFile(fileKey: string): Promise<ReadableStream<Uint8Array>> {
  const url = await signedFileUrl(fileKey, 3600);
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(new Error('the upload service did not answer in time')), SERVICE_TIMEOUT_MS);
  let res: Response;
  try {
    res = await fetch(url, { redirect: 'error', signal: controller.signal });
  } finally {
    clearTimeout(timer);
  }
  if (!res.ok || !res.body) {
    await res.body?.cancel();
    throw new Error(`the upload service answered ${res.status} for ${fileKey}`);
  }
  return res.body;
}

/**
 * Records stored files to delete, inside the transaction that deletes their rows: if the process dies
 * after the commit, the clean-up (lib/server/file-cleanup.ts) finds them here and finishes the job.
 */
export async function queueFileDeletions(fileKeys: string[], transaction: Transaction): Promise<string[]> {
  const keys = [...new Set(fileKeys.filter((k): k is string => typeof k === 'string' && k.length > 0))];
  if (!keys.length) return keys;
  const sequelize = initModels();
  const now = new Date();
  // INSERT IGNORE: a key already waiting stays queued once.
  await sequelize.query(
    `INSERT IGNORE INTO file_deletions (file_key, attempts, next_attempt_at, created_at) VALUES ${keys.map(() => '(?, 0, ?, ?)').join(', ')}`,
    { replacements: keys.flatMap((k) => [k, now, now]), transaction },
  );
  return keys;
}

/**
 * Removes stored files whose rows are gone (and their queue rows once the service confirms). Never
 * throws: when the upload service is down the queued keys stay, and the scheduled clean-up retries them.
 */
export async function deleteStoredFiles(fileKeys: string[]): Promise<void> {
  const keys = [...new Set(fileKeys.filter((k): k is string => typeof k === 'string' && k.length > 0))];
  if (!keys.length) return;
  try {
    await getUtapi().deleteFiles(keys);
  } catch (err) {
    console.error(`[scribeline] could not delete ${keys.length} stored file(s), left for the scheduled clean-up: ${reason(err)}`);
    return;
  }
  try {
    await initModels().query('DELETE FROM file_deletions WHERE file_key IN (:keys)', { replacements: { keys } });
  } catch (err) {
    // Deleted but still queued: the clean-up deletes them again, which the service answers as done.
    console.error(`[scribeline] stored files deleted but their queue rows stay: ${reason(err)}`);
  }
}

export type SweepResult = { checked: number; deleted: string[] };

/** Deletes stored files older than the cut-off that no media row points to: leftovers of refused, abandoned or crashed uploads. */
export async function sweepOrphanUploads(olderThanMs: number): Promise<SweepResult> {
  initModels();
  const api = getUtapi();
  const cutoff = Date.now() - olderThanMs;
  type Listed = Awaited<ReturnType<UTApi['listFiles']>>['files'][number];
  const listed: Listed[] = [];
  try {
    for (let offset = 0; ; ) {
      const page = await api.listFiles({ limit: 500, offset });
      listed.push(...page.files);
      if (!page.hasMore || page.files.length === 0) break;
      offset += page.files.length;
    }
  } catch (err) {
    console.error(`[scribeline] orphan sweep could not list stored files: ${reason(err)}`);
    throw new AppError('internal', 'The upload service could not be reached; nothing was removed. Try again later.');
  }
  // Files still "Uploading" are mid-callback (or the service's own leftovers, which it sweeps itself).
  const candidates = listed.filter((f) => f.status === 'Uploaded' && f.uploadedAt <= cutoff).map((f) => f.key);
  const known = new Set<string>();
  for (let i = 0; i < candidates.length; i += 500) {
    const rows = await Media.findAll({ where: { fileKey: { [Op.in]: candidates.slice(i, i + 500) } }, attributes: ['fileKey'] });
    for (const r of rows) if (r.fileKey) known.add(r.fileKey);
  }
  const orphans = candidates.filter((k) => !known.has(k));
  if (orphans.length) {
    try {
      await api.deleteFiles(orphans);
    } catch (err) {
      console.error(`[scribeline] orphan sweep could not delete files: ${reason(err)}`);
      throw new AppError('internal', 'The upload service could not be reached while removing files. Try again later.');
    }
  }
  return { checked: listed.length, deleted: orphans };
}
