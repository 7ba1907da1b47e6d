// Which database a read goes to when there are replicas (DB_REPLICAS; DEVELOPERS.md, "Several servers").
// Writes and transactions always go to the primary (Sequelize's own `replication` option). A plain read goes
// to a replica unless:
// - this request wrote (a committed transaction or a write query): the rest of the request reads its own write;
// - the browser wrote within DB_PRIMARY_AFTER_WRITE_S: a short-lived cookie set on the writing answer, so the
//   author's next pages, on whichever server, read from the primary;
// - the read fills a cache every reader shares ('use cache', the page cache, a prerender): a replica a few
//   milliseconds behind must never be frozen into the shared copy;
// - a replica is out of reach or further behind than DB_REPLICA_MAX_LAG_S (checked every DB_REPLICA_CHECK_MS).
import { AsyncLocalStorage } from 'node:async_hooks';
import http, { type IncomingMessage, type ServerResponse } from 'node:http';
import * as mariadb from 'mariadb';

export const PRIMARY_COOKIE = 'scribeline-primary';

type Scope = { primary: boolean; res?: ServerResponse; cookieSent?: boolean };
type Replica = { host: string; port: number };
type Health = { usable: boolean; reason: string; nullSince?: number };
type Watcher = { timer: ReturnType<typeof setInterval>; health: Map<string, Health> };

// On globalThis: the request hook (instrumentation) and the pages' copy of this module must share one store.
const g = globalThis as unknown as { scribelineReadScope?: AsyncLocalStorage<Scope>; scribelineReplicaWatcher?: Watcher };
const scopes = (g.scribelineReadScope ??= new AsyncLocalStorage<Scope>());

export function parseReplicas(setting: string, defaultPort: number): Replica[] {
  return setting
    .split(/[\s,]+/)
    .filter(Boolean)
    .map((item) => {
      const [host, port] = item.split(':');
      return { host, port: port ? Number(port) : defaultPort };
    });
}

const hasPrimaryCookie = (cookieHeader: string | undefined) => (cookieHeader ?? '').split(';').some((c) => c.trim() === `${PRIMARY_COOKIE}=1`);

/** Runs one incoming request's handling in its own scope. */
function runInRequestScope<T>(req: IncomingMessage, res: ServerResponse, fn: () => T): T {
  return scopes.run({ primary: hasPrimaryCookie(req.headers.cookie), res }, fn);
}

const SCOPED = Symbol.for('scribeline.readScope');

/** Once per server process: every incoming request is handled inside its own read scope. */
export function scopeRequests(): void {
  const proto = http.Server.prototype as unknown as Record<symbol, unknown> & { emit: (...args: unknown[]) => boolean };
  if (proto[SCOPED]) return;
  proto[SCOPED] = true;
  const emit = proto.emit;
  proto.emit = function (this: unknown, event: unknown, ...args: unknown[]) {
    if (event !== 'request') return emit.call(this, event, ...args);
    return runInRequestScope(args[0] as IncomingMessage, args[1] as ServerResponse, () => emit.call(this, event, ...args));
  };
}

/** Called after a write committed: the rest of this request, and this browser for a while, read from the primary. */
export function noteWrite(afterWriteSeconds: number): void {
  const scope = scopes.getStore();
  if (!scope) return;
  scope.primary = true;
  const res = scope.res;
  if (res && !scope.cookieSent && !res.headersSent) {
    scope.cookieSent = true;
    // Not a secret and not a session: it only sends this browser's reads to the primary for a few seconds.
    res.appendHeader('Set-Cookie', `${PRIMARY_COOKIE}=1; Max-Age=${afterWriteSeconds}; Path=/; HttpOnly; SameSite=Lax`);
  }
}

type WorkUnitStorage = { getStore(): { type?: string } | undefined };
let workUnits: WorkUnitStorage | null | undefined;
/** Next's own store for the work at hand: anything but a per-request render fills a shared cache. */
function fillsSharedCache(): boolean {
  if (workUnits === undefined) {
    try {
      // eslint-disable-next-line @typescript-eslint/no-require-imports -- optional: absent outside Next (scripts, tests)
      workUnits = (require('next/dist/server/app-render/work-unit-async-storage.external') as { workUnitAsyncStorage: WorkUnitStorage }).workUnitAsyncStorage;
    } catch {
      workUnits = null;
    }
  }
  const type = workUnits?.getStore()?.type;
  return type !== undefined && type !== 'request' && type !== 'private-cache';
}

/** Whether a plain read now must go to the primary (see the top of this file). */
export function readsGoToPrimary(): boolean {
  if (scopes.getStore()?.primary) return true;
  if (fillsSharedCache()) return true;
  const watcher = g.scribelineReplicaWatcher;
  if (watcher) for (const h of watcher.health.values()) if (!h.usable) return true;
  return false;
}

/** A replica just failed a connect: skip replicas until the next check finds it back. */
export function markReplicasDown(reason: string): void {
  const watcher = g.scribelineReplicaWatcher;
  if (!watcher) return;
  for (const [key, h] of watcher.health) watcher.health.set(key, { ...h, usable: false, reason });
}

/** The replicas' state as last checked (for the health route and the tests). */
export function replicaHealth(): Record<string, { usable: boolean; reason: string }> {
  const out: Record<string, { usable: boolean; reason: string }> = {};
  for (const [key, h] of g.scribelineReplicaWatcher?.health ?? []) out[key] = { usable: h.usable, reason: h.reason };
  return out;
}

type Credentials = { user: string; password: string; database: string };

async function checkReplica(replica: Replica, creds: Credentials, maxLagS: number, previous: Health | undefined): Promise<Health> {
  let conn: mariadb.Connection | undefined;
  try {
    conn = await mariadb.createConnection({ host: replica.host, port: replica.port, ...creds, connectTimeout: 1_000, socketTimeout: 2_000 });
    let rows: Record<string, unknown>[];
    try {
      rows = await conn.query('SHOW REPLICA STATUS');
    } catch {
      // No REPLICA MONITOR grant: only reachability can be judged.
      return { usable: true, reason: 'reachable (lag not readable)' };
    }
    const row = rows[0];
    if (!row) return { usable: false, reason: 'not replicating' };
    const lag = row.Seconds_Behind_Master;
    if (lag === null || lag === undefined) {
      // A replication thread is stopped: the replica falls further behind from that moment on.
      const nullSince = previous?.nullSince ?? Date.now();
      const behind = (Date.now() - nullSince) / 1000;
      return behind > maxLagS ? { usable: false, reason: `replication stopped ${Math.round(behind)} s ago`, nullSince } : { usable: true, reason: 'replication stopped just now', nullSince };
    }
    return Number(lag) > maxLagS ? { usable: false, reason: `${lag} s behind` } : { usable: true, reason: `${lag} s behind` };
  } catch (err) {
    return { usable: false, reason: `out of reach: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}` };
  } finally {
    await conn?.end().catch(() => undefined);
  }
}

/** Starts checking the replicas once per process (a timer that never keeps the process alive). */
export function watchReplicas(replicas: Replica[], creds: Credentials, maxLagS: number, everyMs: number): void {
  if (g.scribelineReplicaWatcher || !replicas.length) return;
  const health = new Map<string, Health>(replicas.map((r) => [`${r.host}:${r.port}`, { usable: true, reason: 'not checked yet' }]));
  let running = false;
  const check = async () => {
    if (running) return;
    running = true;
    try {
      await Promise.all(
        replicas.map(async (r) => {
          const key = `${r.host}:${r.port}`;
          const before = health.get(key);
          const now = await checkReplica(r, creds, maxLagS, before);
          if (before && before.usable !== now.usable) console.warn(`[db] replica ${key} ${now.usable ? 'back in use' : 'skipped'}: ${now.reason}`);
          health.set(key, now);
        }),
      );
    } finally {
      running = false;
    }
  };
  const timer = setInterval(() => void check(), everyMs);
  timer.unref?.();
  g.scribelineReplicaWatcher = { timer, health };
  void check();
}

export function stopWatchingReplicas(): void {
  const watcher = g.scribelineReplicaWatcher;
  if (!watcher) return;
  clearInterval(watcher.timer);
  g.scribelineReplicaWatcher = undefined;
}
