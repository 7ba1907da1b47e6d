import 'server-only';
import { closeSequelize } from '../../db/connection';
import { stopMailWorker } from './mail-worker';
import { stopFileCleanup } from './file-cleanup';
import { env } from '../env';

// A graceful stop on SIGTERM or SIGINT (Ctrl-C on npm start). Next's own handler stops listening and
// waits for the requests in flight, then calls process.exit. Ours, installed beside it, marks the server
// as stopping (readiness answers 503), stops the mail worker after the message it is sending and the
// clean-up after its run, and holds that exit until they are done and the database pool is closed.
// A stop that takes longer than STOP_TIMEOUT_MS (default 25 s) exits anyway.

const globalForLifecycle = globalThis as unknown as { scribelineStopping?: boolean; scribelineSignalsInstalled?: boolean };

export function isStopping(): boolean {
  return globalForLifecycle.scribelineStopping === true;
}

export function installGracefulStop(): void {
  if (globalForLifecycle.scribelineSignalsInstalled) return;
  globalForLifecycle.scribelineSignalsInstalled = true;
  const timeoutMs = env().STOP_TIMEOUT_MS;

  const onSignal = (signal: NodeJS.Signals) => {
    if (globalForLifecycle.scribelineStopping) return;
    globalForLifecycle.scribelineStopping = true;
    console.log(`[scribeline] ${signal}: finishing requests in flight, then stopping`);
    const workersDone = Promise.allSettled([stopMailWorker(), stopFileCleanup()]).then(() => console.log('[scribeline] mail worker and clean-up stopped'));
    const realExit = process.exit.bind(process);
    let exiting = false;
    const finish = (code?: number | string | null) => {
      if (exiting) return;
      exiting = true;
      void workersDone
        .then(() => closeSequelize())
        .then(
          () => console.log('[scribeline] database pool closed; stopped'),
          (err) => console.error('[scribeline] closing the database pool failed', err),
        )
        .finally(() => realExit(code ?? undefined));
    };
    // Next calls process.exit once the server has closed and its requests are done: finish our part first.
    process.exit = ((code?: number | string | null) => finish(code)) as typeof process.exit;
    const deadline = setTimeout(() => {
      console.error(`[scribeline] stop took longer than ${timeoutMs} ms; exiting now`);
      realExit(1);
    }, timeoutMs);
    deadline.unref();
    // Without Next's handler (NEXT_MANUAL_SIG_HANDLE) nobody else would end the process.
    if (process.env.NEXT_MANUAL_SIG_HANDLE) finish(signal === 'SIGINT' ? 130 : 143);
  };
  process.once('SIGTERM', onSignal);
  process.once('SIGINT', onSignal);
}
