import { appendFileSync } from 'node:fs';
import { Sequelize, type Transaction } from 'sequelize';
import * as mariadb from 'mariadb';
import { env } from '../lib/env';
import { markReplicasDown, noteWrite, parseReplicas, readsGoToPrimary, stopWatchingReplicas, watchReplicas } from './read-routing';

// One pool per process: Next's dev server reloads modules, so the instance lives on globalThis.
const globalForDb = globalThis as unknown as { scribelineSequelize?: Sequelize };

// Opt-in, for the page benchmark: SCRIBELINE_SQL_LOG=<file> appends one line per query to that file.
function sqlLogger(): false | ((sql: string) => void) {
  const file = process.env.SCRIBELINE_SQL_LOG;
  if (!file) return false;
  return (sql) => appendFileSync(file, sql.replace(/\s+/g, ' ').slice(0, 500) + '\n');
}

/** Query types that change rows outside a transaction: the request then reads its own write (db/read-routing.ts). */
const WRITE_TYPES = new Set(['INSERT', 'UPDATE', 'UPSERT', 'DELETE', 'BULKUPDATE', 'BULKDELETE']);

export function getSequelize(): Sequelize {
  if (!globalForDb.scribelineSequelize) {
    const e = env();
    const replicas = parseReplicas(e.DB_REPLICAS, e.DB_PORT);
    const sequelize = new Sequelize(e.DB_NAME, e.DB_USER, e.DB_PASSWORD, {
      host: e.DB_HOST,
      port: e.DB_PORT,
      // With replicas, Sequelize sends writes and transactions to `write` and plain SELECTs to `read`
      // (round robin); the hook below sends a read to the primary when it must see the latest rows.
      ...(replicas.length ? { replication: { write: { host: e.DB_HOST, port: e.DB_PORT }, read: replicas } } : {}),
      dialect: 'mariadb',
      dialectModule: mariadb,
      logging: sqlLogger(),
      // When MariaDB is out of reach a request waits at most `acquire` for a connection and is then answered
      // 503 (lib/http/errors.ts); dead connections fail validation and are replaced, so the app reconnects
      // by itself once the server is back. `evict` drops idle ones the server may have closed meanwhile.
      pool: { max: e.DB_POOL_MAX, min: 0, idle: 10_000, acquire: 8_000, evict: 5_000 },
      dialectOptions: { connectTimeout: 3_000, socketTimeout: 60_000 },
      define: { underscored: true },
    });
    if (replicas.length) routeReads(sequelize, e.DB_PRIMARY_AFTER_WRITE_S);
    if (replicas.length) watchReplicas(replicas, { user: e.DB_USER, password: e.DB_PASSWORD, database: e.DB_NAME }, e.DB_REPLICA_MAX_LAG_S, e.DB_REPLICA_CHECK_MS);
    globalForDb.scribelineSequelize = sequelize;
  }
  return globalForDb.scribelineSequelize;
}

type AcquireOptions = { type?: string; useMaster?: boolean; transaction?: unknown };

/** Reads to the primary when db/read-routing.ts says so, and again there when a replica cannot be reached. */
function routeReads(sequelize: Sequelize, afterWriteSeconds: number): void {
  sequelize.addHook('beforePoolAcquire', (options: AcquireOptions) => {
    if (options.type === 'SELECT' && !options.useMaster && readsGoToPrimary()) options.useMaster = true;
    if (options.type && WRITE_TYPES.has(options.type)) noteWrite(afterWriteSeconds);
  });
  const manager = sequelize.connectionManager as unknown as { getConnection: (options?: AcquireOptions) => Promise<unknown> };
  const acquire = manager.getConnection.bind(manager);
  manager.getConnection = async (options: AcquireOptions = {}) => {
    try {
      return await acquire(options);
    } catch (err) {
      if (options.type !== 'SELECT' || options.useMaster) throw err;
      // A dead replica: this read and the next ones go to the primary until the check finds it back.
      markReplicasDown(err instanceof Error ? err.message.split('\n')[0] : String(err));
      return acquire({ ...options, useMaster: true });
    }
  };
}

export async function closeSequelize(): Promise<void> {
  const s = globalForDb.scribelineSequelize;
  globalForDb.scribelineSequelize = undefined;
  stopWatchingReplicas();
  if (s) await s.close();
}

// ── Transactions that survive contention ─────────────────────────────────────────────────────

/** MariaDB's "deadlock found" (1213) and "lock wait timeout" (1205): the transaction may simply be run again. */
const RETRYABLE_ERRNOS = new Set([1213, 1205]);

type DbError = { name?: string; errno?: number; parent?: { errno?: number }; original?: { errno?: number } };

export function isRetryableLockError(err: unknown): boolean {
  if (typeof err !== 'object' || err === null) return false;
  const e = err as DbError;
  const errno = e.parent?.errno ?? e.original?.errno ?? e.errno;
  return errno !== undefined && RETRYABLE_ERRNOS.has(errno);
}

export function isUniqueViolation(err: unknown): boolean {
  return typeof err === 'object' && err !== null && (err as DbError).name === 'SequelizeUniqueConstraintError';
}

export type TransactionOptions = {
  /** How many times to run the whole transaction again after a deadlock or lock wait timeout (default 5). */
  retries?: number;
  /**
   * Also run it again after a unique-key violation: for "find, else create" paths where a parallel request
   * created the row first; the next attempt starts a fresh snapshot and finds it.
   */
  retryOnUnique?: boolean;
};

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Runs fn in one transaction and, when the database gives up on it because of lock contention, runs the
 * whole of it again after a short jittered pause. fn must touch nothing but the database through the
 * transaction it is given (mail goes through the outbox in the same transaction), so running it twice is safe.
 */
export async function withTransaction<T>(fn: (transaction: Transaction) => Promise<T>, options: TransactionOptions = {}): Promise<T> {
  const retries = options.retries ?? 5;
  for (let attempt = 0; ; attempt++) {
    try {
      const result = await getSequelize().transaction((transaction) => fn(transaction));
      // Committed: the rest of this request (and this browser for a while) reads from the primary.
      if (env().DB_REPLICAS) noteWrite(env().DB_PRIMARY_AFTER_WRITE_S);
      return result;
    } catch (err) {
      const again = isRetryableLockError(err) || (options.retryOnUnique === true && isUniqueViolation(err));
      if (!again || attempt >= retries) throw err;
      // 5–15 ms, then doubling, at most about a quarter of a second: enough for the other side to commit.
      const base = Math.min(250, 5 * 2 ** attempt);
      await sleep(base + Math.random() * base * 2);
    }
  }
}
