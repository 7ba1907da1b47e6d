import 'server-only';
import { QueryTypes } from 'sequelize';
import { initModels } from '../../db/models';
import { getUtapi, sweepOrphanUploads } from './upload-service';
import { env } from '../env';

// The scheduled upload clean-up, one per process (the handle lives on globalThis like the mail worker's):
// - every minute it finishes the queued file deletions (file_deletions, written in the transaction that
//   deleted the rows), so a process that died between the commit and the service call loses nothing;
// - every hour it removes stored files no media row points to that are older than an hour: leftovers of
//   uploads whose recording crashed, failed or was abandoned (the admin button runs the same sweep).
// FILE_CLEANUP=off switches it off; FILE_CLEANUP_INTERVAL_MS, UPLOAD_SWEEP_INTERVAL_MS and
// UPLOAD_SWEEP_AGE_MS change the rhythm (the fault tests shorten them).

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const MAX_DELAY_MS = HOUR;

export type DeletionReport = { deleted: number; kept: number; retrying: number; error?: string };

/**
 * Deletes the queued files that are due. A key that a media row points to again is never deleted (its queue
 * row is dropped); a failed call is tried again later, waiting longer each time (at most an hour).
 */
export async function runFileDeletions({ limit = 200, now = new Date() }: { limit?: number; now?: Date } = {}): Promise<DeletionReport> {
  const report: DeletionReport = { deleted: 0, kept: 0, retrying: 0 };
  const sequelize = initModels();
  let due: { id: number; fileKey: string; attempts: number }[];
  try {
    due = await sequelize.query<{ id: number; fileKey: string; attempts: number }>(
      'SELECT id, file_key AS fileKey, attempts FROM file_deletions WHERE next_attempt_at <= :now ORDER BY next_attempt_at, id LIMIT :limit',
      { replacements: { now, limit }, type: QueryTypes.SELECT },
    );
  } catch (err) {
    report.error = err instanceof Error ? err.message : String(err);
    return report;
  }
  if (!due.length) return report;
  const keys = due.map((d) => d.fileKey);
  const inUse = new Set(
    (await sequelize.query<{ fileKey: string }>('SELECT file_key AS fileKey FROM media WHERE file_key IN (:keys)', { replacements: { keys }, type: QueryTypes.SELECT })).map((r) => r.fileKey),
  );
  if (inUse.size) {
    await sequelize.query('DELETE FROM file_deletions WHERE file_key IN (:keys)', { replacements: { keys: [...inUse] } });
    report.kept = inUse.size;
  }
  const toDelete = keys.filter((k) => !inUse.has(k));
  if (!toDelete.length) return report;
  try {
    await getUtapi().deleteFiles(toDelete);
  } catch (err) {
    report.error = err instanceof Error ? err.message : String(err);
    for (const row of due.filter((d) => !inUse.has(d.fileKey))) {
      const attempts = row.attempts + 1;
      const wait = Math.min(MINUTE * 2 ** Math.min(attempts - 1, 10), MAX_DELAY_MS);
      await sequelize.query('UPDATE file_deletions SET attempts = :attempts, next_attempt_at = :next, last_error = :error WHERE id = :id', {
        replacements: { attempts, next: new Date(now.getTime() + wait), error: report.error.slice(0, 1000), id: row.id },
      });
    }
    report.retrying = toDelete.length;
    return report;
  }
  await sequelize.query('DELETE FROM file_deletions WHERE file_key IN (:keys)', { replacements: { keys: toDelete } });
  report.deleted = toDelete.length;
  return report;
}

type CleanupHandle = { stop: () => Promise<void> };
const globalForCleanup = globalThis as unknown as { scribelineFileCleanup?: CleanupHandle };

/** Starts the scheduled clean-up unless one runs or FILE_CLEANUP=off; returns whether one runs now. */
export function startFileCleanup(): boolean {
  if (globalForCleanup.scribelineFileCleanup) return true;
  const settings = env();
  if (!settings.FILE_CLEANUP) return false;
  const every = settings.FILE_CLEANUP_INTERVAL_MS;
  const sweepEvery = settings.UPLOAD_SWEEP_INTERVAL_MS;
  const sweepAge = settings.UPLOAD_SWEEP_AGE_MS;
  let lastSweep = 0;
  let current: Promise<void> | null = null;
  let lastProblem = '';

  const say = (problem: string) => {
    if (problem === lastProblem) return;
    lastProblem = problem;
    console.warn(`[clean-up] ${problem}`);
  };

  const tick = async () => {
    const deletions = await runFileDeletions();
    if (deletions.error) say(`queued file deletions wait: ${deletions.error}`);
    else if (deletions.deleted) console.log(`[clean-up] deleted ${deletions.deleted} queued file(s)`);
    if (Date.now() - lastSweep >= sweepEvery) {
      try {
        const swept = await sweepOrphanUploads(sweepAge);
        lastSweep = Date.now();
        if (swept.deleted.length) console.log(`[clean-up] removed ${swept.deleted.length} stored file(s) without a row`);
        lastProblem = '';
      } catch (err) {
        say(`upload sweep waits: ${err instanceof Error ? err.message : String(err)}`);
      }
    }
  };

  const timer = setInterval(() => {
    if (current) return;
    current = tick()
      .catch((err) => say(`clean-up run failed: ${err instanceof Error ? err.message : String(err)}`))
      .finally(() => {
        current = null;
      });
  }, every);
  timer.unref?.();
  globalForCleanup.scribelineFileCleanup = {
    stop: async () => {
      clearInterval(timer);
      globalForCleanup.scribelineFileCleanup = undefined;
      await current;
    },
  };
  return true;
}

/** Stops the schedule; resolves when a run in progress has finished. */
export async function stopFileCleanup(): Promise<void> {
  await globalForCleanup.scribelineFileCleanup?.stop();
}
