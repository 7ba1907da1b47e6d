import 'server-only';
import { sendDueMail } from './mail';
import { env } from '../env';

// One sender per process: the handle lives on globalThis, so a dev reload or a second copy of this
// module (Next bundles server code more than once) finds the running one instead of starting another.
type WorkerHandle = { timer: ReturnType<typeof setInterval>; stop: () => Promise<void> };
const globalForWorker = globalThis as unknown as { scribelineMailWorker?: WorkerHandle };

const QUIET_REPEAT_MS = 60_000;

const intervalFromEnv = (): number => env().MAIL_WORKER_INTERVAL_MS;

/** Starts the outbox sender unless one is running or MAIL_WORKER=off; returns whether one runs now. */
export function startMailWorker(options: { intervalMs?: number } = {}): boolean {
  if (globalForWorker.scribelineMailWorker) return true;
  if (!env().MAIL_WORKER) return false;

  let lastProblem = '';
  let lastProblemAt = 0;
  // The same trouble (a missing table, a stopped SMTP server) is said once a minute, not every tick.
  const say = (problem: string) => {
    const at = Date.now();
    if (problem === lastProblem && at - lastProblemAt < QUIET_REPEAT_MS) return;
    lastProblem = problem;
    lastProblemAt = at;
    console.warn(`[mail] ${problem}`);
  };

  let stopping = false;
  let current: Promise<void> | null = null;
  const BATCH = 20;

  // One message per claim, so a stop waits for the message being sent and no longer.
  const run = async () => {
    try {
      let sentThisTick = 0;
      let retrying = 0;
      let failed = 0;
      while (!stopping && sentThisTick + retrying + failed < BATCH) {
        const report = await sendDueMail({ limit: 1 });
        if (report.error) say(`outbox run stopped: ${report.error}`);
        sentThisTick += report.sent;
        retrying += report.retrying;
        failed += report.failed;
        if (report.claimed === 0 || report.error) break;
      }
      if (retrying) say(`${retrying} message(s) could not be sent; they will be tried again later`);
      if (failed) console.warn(`[mail] ${failed} message(s) failed too often and were given up`);
    } catch (err) {
      // sendDueMail does not throw; this guards the interval all the same.
      say(`outbox run failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  };

  const tick = () => {
    if (current || stopping) return;
    current = run().finally(() => {
      current = null;
    });
  };

  const timer = setInterval(tick, options.intervalMs ?? intervalFromEnv());
  // Never keeps a process alive on its own.
  timer.unref?.();
  globalForWorker.scribelineMailWorker = {
    timer,
    stop: async () => {
      stopping = true;
      clearInterval(timer);
      globalForWorker.scribelineMailWorker = undefined;
      // The message being sent is finished and marked; nothing new is claimed.
      await current;
    },
  };
  return true;
}

/** Stops the sender after the message it is sending (if any); resolves when that one is done. */
export async function stopMailWorker(): Promise<void> {
  await globalForWorker.scribelineMailWorker?.stop();
}
