import 'server-only';
import net from 'node:net';
import { QueryTypes } from 'sequelize';
import { initModels } from '../../db/models';
import { replicaHealth } from '../../db/read-routing';
import { isStopping } from './lifecycle';
import { env } from '../env';

export type DependencyState = 'up' | 'down';
export type Readiness = {
  ready: boolean;
  stopping: boolean;
  checks: { database: DependencyState; uploads: DependencyState; smtp: DependencyState };
  /** The dependencies that are down, named for the operator (no addresses, no error text). */
  down: string[];
  message: string;
  /** Read replicas as last checked (none without DB_REPLICAS); one skipped only sends reads to the primary. */
  replicas: Record<string, { usable: boolean; reason: string }>;
};

const CHECK_TIMEOUT_MS = 2_000;
// The outside services are asked at most every 2 s, however often the health route is called.
const CACHE_MS = 2_000;

async function databaseState(): Promise<DependencyState> {
  try {
    await initModels().query('SELECT 1 AS ok', { type: QueryTypes.SELECT });
    return 'up';
  } catch {
    return 'down';
  }
}

/** Any HTTP answer from the upload service's API address means it is there. */
async function uploadsState(): Promise<DependencyState> {
  const base = env().UPLOADTHING_API_URL;
  try {
    const res = await fetch(base, { method: 'HEAD', signal: AbortSignal.timeout(CHECK_TIMEOUT_MS), redirect: 'manual' });
    await res.body?.cancel();
    return 'up';
  } catch {
    return 'down';
  }
}

/** The SMTP server greets with 220 on connect. */
function smtpState(): Promise<DependencyState> {
  const { SMTP_HOST: host, SMTP_PORT: port } = env();
  return new Promise((resolve) => {
    const socket = net.connect({ host, port });
    let settled = false;
    const done = (state: DependencyState) => {
      if (settled) return;
      settled = true;
      socket.destroy();
      resolve(state);
    };
    socket.setTimeout(CHECK_TIMEOUT_MS, () => done('down'));
    socket.once('error', () => done('down'));
    socket.once('data', (chunk) => done(chunk.toString('latin1').startsWith('220') ? 'up' : 'down'));
  });
}

let cached: { at: number; uploads: DependencyState; smtp: DependencyState } | null = null;

/**
 * Readiness: the database is required (without it nothing can be read or saved); the upload service and
 * SMTP are reported but do not make the app unready (uploads wait, mail waits in the outbox). A server that
 * is stopping is not ready, so a balancer stops sending it requests.
 */
export async function readiness(): Promise<Readiness> {
  const now = Date.now();
  const outside = cached && now - cached.at < CACHE_MS ? Promise.resolve(cached) : Promise.all([uploadsState(), smtpState()]).then(([uploads, smtp]) => (cached = { at: Date.now(), uploads, smtp }));
  const [database, { uploads, smtp }] = await Promise.all([databaseState(), outside]);
  const stopping = isStopping();
  const checks = { database, uploads, smtp };
  const names: Record<keyof typeof checks, string> = { database: 'the database', uploads: 'the upload service', smtp: 'the mail (SMTP) server' };
  const down = (Object.keys(checks) as (keyof typeof checks)[]).filter((k) => checks[k] === 'down');
  const ready = database === 'up' && !stopping;
  const waits = [down.includes('uploads') ? 'uploads wait' : '', down.includes('smtp') ? 'mail waits in the outbox' : ''].filter(Boolean).join(' and ');
  let message = 'All dependencies are up.';
  if (stopping) message = 'This server is stopping and takes no new work.';
  else if (database === 'down') message = `Down: ${down.map((k) => names[k]).join(', ')}. Nothing can be read or saved until the database is back.`;
  else if (down.length) message = `Down: ${down.map((k) => names[k]).join(', ')}. Pages and saving work; ${waits}.`;
  return { ready, stopping, checks, down, message, replicas: replicaHealth() };
}
