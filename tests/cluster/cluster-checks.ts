// npm run test:cluster (scripts/cluster.sh starts MariaDB primary + replica, Redis, nginx, uploads and mail,
// then runs this): starts two app servers itself, checks the several-servers behaviour of issue 16 against
// the real processes, kills and restarts servers on the way, and prints "N passed, N failed".
import { spawn, type ChildProcess } from 'node:child_process';
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { createWriteStream, existsSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import * as mariadb from 'mariadb';
import autocannon from 'autocannon';
import { createClient } from 'redis';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../db/seeders/demo-accounts';

const env = process.env;
const C = env.CLUSTER_DIR!;
const NGINX = `http://127.0.0.1:${env.CLUSTER_NGINX_PORT}`;
const [PORT_A, PORT_B] = env.CLUSTER_APP_PORTS!.split(/\s+/).map(Number);
const url = (port: number) => `http://127.0.0.1:${port}`;

let passed = 0;
let failed = 0;
const figures: string[] = [];
function check(name: string, ok: boolean, detail = ''): void {
  if (ok) passed++;
  else failed++;
  console.log(`${ok ? '  ✓' : '  ✗'} ${name}${detail ? ` — ${detail}` : ''}`);
}
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// ── App servers ──
const apps = new Map<number, ChildProcess>();
function startApp(port: number, extraEnv: Record<string, string> = {}): ChildProcess {
  const log = createWriteStream(`${C}/app-${port}.log`, { flags: 'a' });
  const child = spawn(process.execPath, ['node_modules/next/dist/bin/next', 'start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: env.CLUSTER_APP_DIR,
    env: { ...env, MAIL_WORKER_INTERVAL_MS: '300', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.pipe(log);
  child.stderr!.pipe(log);
  apps.set(port, child);
  // scripts/cluster.sh stops what these files name when it ends, even if this script was killed first.
  writeFileSync(pidFile(port), String(child.pid));
  child.once('exit', () => rmSync(pidFile(port), { force: true }));
  return child;
}
const pidFile = (port: number) => `${C}/run/app-${port}.pid`;
async function waitReady(base: string, tries = 120): Promise<void> {
  for (let i = 0; i < tries; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      // not up yet
    }
    await sleep(500);
  }
  throw new Error(`${base} did not become ready`);
}
async function stopApp(port: number, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  const child = apps.get(port);
  if (!child || child.exitCode !== null) return;
  const exited = new Promise((r) => child.once('exit', r));
  child.kill(signal);
  await exited;
  apps.delete(port);
}
/** Waits until nginx's active check (scripts/cluster.sh) lists exactly these ports as ready. */
async function waitBalancer(ports: number[]): Promise<void> {
  const want = `ready: ${ports.join(' ')}`;
  for (let i = 0; i < 40; i++) {
    const log = execFileSync('bash', ['-c', `tail -1 ${C}/balancer.log 2>/dev/null || true`]).toString().trim();
    if (log.endsWith(want)) return;
    await sleep(250);
  }
  throw new Error(`nginx never listed ${want}`);
}

// ── What a server asked the database (SCRIBELINE_SQL_LOG) and what nginx did (its access log, scripts/cluster.sh) ──
const sqlLog = (port: number) => `${C}/sql-${port}.log`;
/** Queries on the log's own tables (the mail worker, the upload clean-up and the health check use others). */
const pageQueries = (port: number) =>
  existsSync(sqlLog(port)) ? readFileSync(sqlLog(port), 'utf8').split('\n').filter((l) => /\b(projects|shop_sessions|entries|users)\b/.test(l)).length : 0;
const NGINX_LOG = `${C}/nginx/upstream.log`;
const nginxLogSize = () => (existsSync(NGINX_LOG) ? statSync(NGINX_LOG).size : 0);
type Proxied = { at: number; method: string; status: number; upstreams: number[] };
/** The requests nginx logged since `from` (a byte offset): when (ms), the method, the answer, and the app ports tried in turn. */
function proxiedSince(from: number): Proxied[] {
  return readFileSync(NGINX_LOG).subarray(from).toString('utf8').split('\n').filter(Boolean).map((line) => {
    const [at, method, status, ...tried] = line.split(' ');
    return { at: Number(at) * 1000, method, status: Number(status), upstreams: [...tried.join(' ').matchAll(/127\.0\.0\.1:(\d+)/g)].map((m) => Number(m[1])) };
  });
}

// ── Browser-like clients with a cookie jar ──
class Client {
  cookies = new Map<string, string>();
  async fetch(base: string, path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    if (init.method && init.method !== 'GET') headers.set('origin', NGINX);
    const res = await fetch(`${base}${path}`, { ...init, headers, redirect: 'manual' });
    for (const line of res.headers.getSetCookie()) {
      const [pair, ...attrs] = line.split(';');
      const [name, value] = [pair.slice(0, pair.indexOf('=')), pair.slice(pair.indexOf('=') + 1)];
      const gone = attrs.some((a) => /max-age=0\b/i.test(a.trim())) || value === '';
      if (gone) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
    return res;
  }
  async json(base: string, path: string, method: string, body: unknown): Promise<Response> {
    return this.fetch(base, path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  }
  async signIn(base: string, email: string): Promise<void> {
    const csrf = (await (await this.fetch(base, '/api/auth/csrf')).json()) as { csrfToken: string };
    const form = new URLSearchParams({ csrfToken: csrf.csrfToken, email, password: DEMO_PASSWORD, json: 'true' });
    await this.fetch(base, '/api/auth/callback/credentials', { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: form });
    if (![...this.cookies.keys()].some((k) => k.includes('session-token'))) throw new Error(`signing in ${email} failed`);
  }
}

async function main() {
  const db = await mariadb.createConnection({ host: '127.0.0.1', port: Number(env.DB_PORT), user: env.DB_USER, password: env.DB_PASSWORD, database: env.DB_NAME });
  const replicaRoot = () => ['--no-defaults', '-S', env.CLUSTER_REPLICA_SOCK!, '-uroot'];
  const onReplica = (sql: string) => execFileSync('mariadb', [...replicaRoot(), '-e', sql]).toString();

  const builder = DEMO_ACCOUNTS.find((a) => a.key === 'builder')!;
  const [project] = await db.query(
    "SELECT p.id, p.slug, p.title, p.version, u.handle FROM projects p JOIN users u ON u.id = p.owner_id WHERE u.email = ? AND p.published_at IS NOT NULL AND p.visibility = 'published' ORDER BY p.id LIMIT 1",
    [builder.email],
  );
  const [heavy] = await db.query(
    `SELECT e.id FROM entries e JOIN shop_sessions s ON s.id = e.session_id WHERE s.project_id = ? ORDER BY (SELECT COUNT(*) FROM comments c WHERE c.entry_id = e.id) DESC, e.id LIMIT 1`,
    [project.id],
  );
  const entryPath = `/logs/${project.slug}/entries/${heavy.id}`;

  console.log('› Starting two app servers');
  // Each server sends mail from its own address, so the mail check can tell which worker sent what;
  // server B notes its queries, so the first check can tell whether it read the database or the shared cache.
  const mailFrom = (port: number) => ({ MAIL_FROM: `Scribeline <no-reply+${port}@scribeline.test>` });
  writeFileSync(sqlLog(PORT_B), '');
  startApp(PORT_A, mailFrom(PORT_A));
  startApp(PORT_B, { ...mailFrom(PORT_B), SCRIBELINE_SQL_LOG: sqlLog(PORT_B) });
  await Promise.all([waitReady(url(PORT_A)), waitReady(url(PORT_B))]);
  await waitBalancer([PORT_A, PORT_B]);

  const author = new Client();
  await author.signIn(NGINX, builder.email);

  // 1. A write through one server is seen by a signed-out reader on the other on the next request: the signed-out
  // copies (app/(open)/open, whole pages in the shared page cache) and the 'use cache' entries they and the home
  // page's lists are built from (lib/server/public-reads.ts) are expired for every server by a write on one.
  console.log('› A write through one server, read through the other');
  {
    const anon = new Client();
    const [session] = await db.query("SELECT s.id FROM shop_sessions s WHERE s.project_id = ? AND s.visibility = 'published' ORDER BY s.id LIMIT 1", [project.id]);
    const pages = [`/logs/${project.slug}`, entryPath, ...(session ? [`/logs/${project.slug}/sessions/${session.id}`] : []), `/builders/${project.handle}`, '/'];
    // Fill the shared caches through server A only (each page twice: the second answer comes from the cache).
    const cachedOnA = new Map<string, Buffer>();
    for (let round = 0; round < 2; round++) for (const path of pages) cachedOnA.set(path, Buffer.from(await (await anon.fetch(url(PORT_A), path)).arrayBuffer()));
    const cache = createClient({ url: env.REDIS_URL });
    await cache.connect();
    const prefix = env.REDIS_KEY_PREFIX || 'scribeline:';
    const pageKeys = await cache.keys(`${prefix}rc:*`);
    const entryKeys = await cache.keys(`${prefix}uc:*`);
    await cache.quit();
    check('the signed-out copies are in the shared page cache (Redis)', pageKeys.length > 0, `${pageKeys.length} pages`);
    check("the 'use cache' entries are in the shared cache (Redis)", entryKeys.length > 0, `${entryKeys.length} entries`);
    // Server B has rendered none of these pages: its first answers must be the copies A left in Redis.
    const queriesBefore = pageQueries(PORT_B);
    const firstOnB: { path: string; status: number; html: string; same: boolean }[] = [];
    for (const path of pages) {
      const answer = await anon.fetch(url(PORT_B), path);
      const bytes = Buffer.from(await answer.arrayBuffer());
      firstOnB.push({ path, status: answer.status, html: bytes.toString('utf8'), same: bytes.equals(cachedOnA.get(path)!) });
    }
    const queriesOnB = pageQueries(PORT_B) - queriesBefore;
    check(
      'a signed-out reader on server B gets the pages server A cached, B reading nothing from the database',
      firstOnB.every((p) => p.status === 200) && queriesOnB === 0,
      `statuses ${firstOnB.map((p) => p.status).join(',')}; ${queriesOnB} queries on the log's tables from B`,
    );
    check('server B shows the title before the write', firstOnB[0].html.includes(project.title));
    // The shared page cache keeps a page's HTML as bytes (lib/cache-handlers/page-bytes.mjs): B sends A's very bytes.
    check("server B's copies are byte for byte server A's cached answers", firstOnB.every((p) => p.same), firstOnB.filter((p) => !p.same).map((p) => p.path).join(', '));
    const [row] = await db.query('SELECT version FROM projects WHERE id = ?', [project.id]);
    const title = `Backplate for the 160 mm chuck ${randomUUID().slice(0, 6)}`;
    const res = await author.json(url(PORT_A), `/api/projects/${project.id}`, 'PATCH', { title, version: row.version });
    check('the builder renames the project through server A', res.ok, `status ${res.status}`);
    for (const [port, path] of [[PORT_B, `/logs/${project.slug}`], [PORT_A, `/logs/${project.slug}`], [PORT_B, entryPath], ...(session ? [[PORT_A, `/logs/${project.slug}/sessions/${session.id}`]] : []), [PORT_B, `/builders/${project.handle}`], [PORT_B, '/']] as [number, string][]) {
      const answer = await anon.fetch(url(port), path);
      const html = await answer.text();
      check(`a signed-out reader of ${path} on server ${port === PORT_A ? 'A' : 'B'} sees the new title on the next request`, answer.status === 200 && html.includes(title), `status ${answer.status}`);
    }
  }

  // 2. Read-your-own-writes with the replica's SQL thread stopped.
  console.log("› The author reads their own write while the replica's SQL thread is stopped");
  {
    onReplica('STOP SLAVE SQL_THREAD');
    try {
      const title = `Spigot re-check ${randomUUID().slice(0, 6)}`;
      const res = await author.json(url(PORT_A), `/api/projects/${project.id}/sessions`, 'POST', { title, heldOn: '2026-03-14', minutesSpent: 40 });
      check('the builder logs a session through server A', res.status === 201, `status ${res.status}`);
      check('the answer sets the short-lived primary-reads cookie', author.cookies.get('scribeline-primary') === '1');
      const listed = async (client: Client) => JSON.stringify(await (await client.fetch(url(PORT_B), `/api/projects/${project.id}/sessions`)).json()).includes(title);
      check('the builder reading through server B sees the new session at once', await listed(author));
      const [onReplicaRows] = [await db.query('SELECT 1')]; // keep the connection warm; the replica is read below
      void onReplicaRows;
      const replicaHas = onReplica(`SELECT COUNT(*) FROM \`${env.DB_NAME}\`.shop_sessions WHERE title = '${title}'`).includes('\n1');
      check('the replica itself does not have it yet (so the read above went to the primary)', !replicaHas);
      const withoutCookie = new Client();
      withoutCookie.cookies = new Map([...author.cookies].filter(([k]) => k !== 'scribeline-primary'));
      check('the same builder without the cookie reads from the replica and does not see it yet', !(await listed(withoutCookie)));
    } finally {
      onReplica('START SLAVE SQL_THREAD');
    }
  }

  // 3. Kill one app server during a mixed read/write load.
  console.log('› Mixed load through nginx; server B is killed a third of the way in');
  {
    const TOTAL = 300;
    const run = randomUUID().slice(0, 8);
    const outcomes: { title?: string; status: number }[] = [];
    const logFrom = nginxLogSize();
    let next = 0;
    let killed = false;
    let killedAt = Infinity;
    const worker = async () => {
      while (next < TOTAL) {
        const i = next++;
        if (!killed && i >= TOTAL / 3) {
          killed = true;
          killedAt = Date.now();
          void stopApp(PORT_B, 'SIGKILL');
        }
        // A write's title is kept even when its answer is lost (it may still have been committed).
        const title = i % 4 === 0 ? `Load ${run} #${i}` : undefined;
        try {
          if (title) {
            const res = await author.json(NGINX, `/api/projects/${project.id}/sessions`, 'POST', { title, heldOn: '2026-03-15', minutesSpent: 5 });
            await res.arrayBuffer();
            outcomes.push({ title, status: res.status });
          } else {
            const res = await fetch(`${NGINX}${i % 2 ? entryPath : `/logs/${project.slug}`}`);
            await res.arrayBuffer();
            outcomes.push({ status: res.status });
          }
        } catch {
          outcomes.push({ title, status: 0 });
        }
      }
    };
    await Promise.all(Array.from({ length: 8 }, worker));
    const errors = outcomes.filter((o) => o.status === 0 || o.status >= 500);
    const writes = outcomes.filter((o) => o.title);
    const confirmed = writes.filter((o) => o.status === 201).map((o) => o.title!);
    const rows: { title: string; n: bigint }[] = await db.query('SELECT title, COUNT(*) AS n FROM shop_sessions WHERE title LIKE ? GROUP BY title', [`Load ${run} #%`]);
    const counts = new Map(rows.map((r) => [r.title, Number(r.n)]));
    const tally = new Map<string, number>();
    for (const o of errors) tally.set(o.status === 0 ? 'no answer' : String(o.status), (tally.get(o.status === 0 ? 'no answer' : String(o.status)) ?? 0) + 1);
    const byStatus = [...tally].map(([k, n]) => `${n}× ${k}`).join(', ');
    const proxied = proxiedSince(logFrom);
    const servedBy = (port: number, when: (p: Proxied) => boolean) => proxied.filter((p) => when(p) && p.upstreams.at(-1) === port && p.status < 500).length;
    const beforeKill = (p: Proxied) => p.at < killedAt;
    const afterKill = (p: Proxied) => p.at >= killedAt;
    const moved = proxied.filter((p) => p.upstreams.length > 1).length;
    figures.push(
      `kill during load: ${outcomes.length} requests (${writes.length} writes), ${errors.length} failed${byStatus ? ` (${byStatus})` : ''}, ${confirmed.length} writes confirmed, ${rows.length} rows; ` +
        `answered by A/B before the kill ${servedBy(PORT_A, beforeKill)}/${servedBy(PORT_B, beforeKill)}, after it ${servedBy(PORT_A, afterKill)}/${servedBy(PORT_B, afterKill)}; ${moved} tried on B and answered by A`,
    );
    console.log(`    ${figures.at(-1)}`);
    check('both servers answered part of the load before the kill', servedBy(PORT_A, beforeKill) > 0 && servedBy(PORT_B, beforeKill) > 0);
    check('after the kill server A answered the rest', servedBy(PORT_A, afterKill) > 0);
    check('every request got an answer or a reported error', outcomes.length === TOTAL);
    check('no lost writes: every confirmed session is in the database', confirmed.every((t) => counts.get(t) === 1));
    check('no duplicated rows: no session title twice', [...counts.values()].every((n) => n === 1));
    check('no row without a request behind it', [...counts.keys()].every((t) => writes.some((w) => w.title === t)));
    check('the balancer moved the traffic: at most a handful of failures', errors.length <= 10, `${errors.length} failed`);
    await waitBalancer([PORT_A]);
    const after = await Promise.all(Array.from({ length: 20 }, () => fetch(`${NGINX}${entryPath}`).then((r) => r.status)));
    check('with server B dead, every read through nginx answers 200', after.every((s) => s === 200), after.join(','));
  }

  // 4. Two mail workers send each message once.
  console.log('› Two mail workers, one outbox');
  {
    startApp(PORT_B, mailFrom(PORT_B));
    await waitReady(url(PORT_B));
    await waitBalancer([PORT_A, PORT_B]);
    const run = randomUUID().slice(0, 8);
    const N = 40;
    const now = new Date();
    // All at once (one statement), so both workers find them due together.
    await db.batch(
      "INSERT INTO outbox_messages (kind, to_address, subject, text_body, status, attempts, next_attempt_at, created_at, updated_at) VALUES ('cluster-check', ?, ?, 'Checking that each message is sent once.', 'pending', 0, ?, ?, ?)",
      Array.from({ length: N }, (_, i) => [`reader-${run}-${i}@scribeline.test`, `Cluster check ${run} ${i}`, now, now, now]),
    );
    let sent = 0;
    for (let t = 0; t < 360 && sent < N; t++) {
      await sleep(500);
      const [r] = await db.query("SELECT COUNT(*) AS n FROM outbox_messages WHERE subject LIKE ? AND status = 'sent'", [`Cluster check ${run} %`]);
      sent = Number(r.n);
    }
    check('all messages were sent', sent === N, `${sent} of ${N}`);
    await sleep(1_000);
    type Delivered = { subject?: string; from?: string };
    const messages = (await (await fetch(`${env.MAILBOX_URL}/messages`)).json()) as Delivered[] | { messages: Delivered[] };
    const list = (Array.isArray(messages) ? messages : messages.messages).filter((m) => (m.subject ?? '').startsWith(`Cluster check ${run} `));
    const subjects = list.map((m) => m.subject!);
    check('each message reached the mail server exactly once', subjects.length === N && new Set(subjects).size === N, `${subjects.length} delivered, ${new Set(subjects).size} distinct`);
    const bySender = (port: number) => list.filter((m) => (m.from ?? '').includes(`+${port}@`)).length;
    figures.push(`mail: ${N} messages, ${bySender(PORT_A)} sent by server A's worker and ${bySender(PORT_B)} by server B's`);
    console.log(`    ${figures.at(-1)}`);
    check("both servers' mail workers took part", bySender(PORT_A) > 0 && bySender(PORT_B) > 0 && bySender(PORT_A) + bySender(PORT_B) === subjects.length);
  }

  // 5. Throughput of the heavy entry page through nginx, two servers and then one.
  console.log('› Throughput of the heavy entry page through nginx');
  {
    const measure = async () => {
      const result = await autocannon({ url: `${NGINX}${entryPath}`, connections: 16, duration: Number(env.CLUSTER_BENCH_SECONDS ?? 10) });
      return { rps: Math.round(result.requests.average), p99: result.latency.p99, non2xx: result.non2xx + result.errors };
    };
    // Server B was started again for the mail check: warm both up first (its first renders compile and fill memos).
    await autocannon({ url: `${NGINX}${entryPath}`, connections: 4, duration: 3 });
    const two = await measure();
    await stopApp(PORT_B);
    await waitBalancer([PORT_A]);
    const one = await measure();
    figures.push(`entry page through nginx, two servers: ${two.rps} req/s (p99 ${two.p99} ms, ${two.non2xx} not 2xx); one server: ${one.rps} req/s (p99 ${one.p99} ms, ${one.non2xx} not 2xx)`);
    console.log(`    ${figures.at(-1)}`);
    // A figure, not a check (speed targets belong to benchmarks): on a busy 2-core machine requests may time out.
  }

  // 6. Stop the replica: reads go on from the primary.
  console.log('› The replica stops');
  {
    execFileSync('mariadb-admin', [...replicaRoot(), 'shutdown']);
    const reader = new Client();
    reader.cookies = new Map([...author.cookies].filter(([k]) => k !== 'scribeline-primary'));
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++) statuses.push((await reader.fetch(url(PORT_A), `/api/projects/${project.id}/sessions`)).status);
    check('signed-in reads answer 200 with the replica down', statuses.every((s) => s === 200), statuses.join(','));
    const health = (await (await fetch(`${url(PORT_A)}/api/health`)).json()) as { ok: boolean; replicas: Record<string, { usable: boolean }> };
    check('readiness stays up and names the replica as skipped', health.ok && Object.values(health.replicas).some((r) => !r.usable), JSON.stringify(health.replicas));
  }

  await db.end();
  console.log('\nFigures:');
  for (const f of figures) console.log(`  ${f}`);
}

// Stopped from outside (Ctrl-C, or scripts/cluster.sh ending): the app servers this script started go too.
let interrupted = false;
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    console.log(`\n› ${signal}: stopping the app servers`);
    void Promise.all([...apps.keys()].map((port) => stopApp(port))).finally(() => {
      console.log(`\n${passed} passed, ${failed + 1} failed (stopped by ${signal} before the end)`);
      process.exit(1);
    });
  });
}

main()
  .catch((err) => {
    failed++;
    console.error(err);
  })
  .finally(async () => {
    for (const port of [...apps.keys()]) await stopApp(port);
    console.log(`\n${passed} passed, ${failed} failed`);
    process.exit(failed ? 1 : 0);
  });
