// A whole Scribeline of its own for the fault scenarios and the soak run: its own MariaDB (own data folder,
// socket and port), its own upload and mail services and its own app server, each started here and stopped
// or killed only by the process id this harness holds. It never touches the shared database on 3406.
import { spawn, execFile, type ChildProcess } from 'node:child_process';
import { promisify } from 'node:util';
import { createWriteStream, existsSync, readFileSync } from 'node:fs';
import { mkdir, readdir, readFile, rm } from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import * as mariadb from 'mariadb';
import { encode } from 'next-auth/jwt';

const run = promisify(execFile);
export const ROOT = path.resolve(__dirname, '../..');

export type StackOptions = {
  /** Folder under .data for this stack (wiped at start). */
  name: string;
  dbPort: number;
  appPort: number;
  uploadsPort: number;
  smtpPort: number;
  mailHttpPort: number;
  /** The built app (NEXT_DIST_DIR), built beforehand by scripts/faults/run.sh or the soak script. */
  distDir: string;
  /** Extra settings for the app process. */
  appEnv?: Record<string, string>;
  /** Node options for the app process before Next's own (the soak's --trace-gc). */
  appNodeArgs?: string[];
  /** More (empty) databases to create on this stack's MariaDB. */
  extraDatabases?: string[];
};

export const DB_NAME = 'scribeline_faults_test';
const DB_USER = 'scribeline';
const DB_PASSWORD = 'scribeline-local';
const SHARED_DB_PORT = 3406;

function sleep(ms: number) {
  return new Promise((r) => setTimeout(r, ms));
}

export async function waitFor<T>(what: string, probe: () => Promise<T | undefined | null | false>, timeoutMs = 60_000, everyMs = 200): Promise<T> {
  const until = Date.now() + timeoutMs;
  let last: unknown;
  for (;;) {
    try {
      const v = await probe();
      if (v) return v;
    } catch (err) {
      last = err;
    }
    if (Date.now() > until) throw new Error(`Timed out waiting for ${what}${last ? `: ${String(last)}` : ''}`);
    await sleep(everyMs);
  }
}

async function portAnswers(port: number): Promise<boolean> {
  const net = await import('node:net');
  return new Promise((resolve) => {
    const s = net.connect({ host: '127.0.0.1', port });
    s.once('connect', () => {
      s.destroy();
      resolve(true);
    });
    s.once('error', () => resolve(false));
  });
}

export class Stack {
  readonly dataDir: string;
  readonly uploadsDir: string;
  readonly mailDir: string;
  readonly logsDir: string;
  readonly baseUrl: string;
  readonly token: string;
  readonly secret: string;
  app: ChildProcess | null = null;
  uploads: ChildProcess | null = null;
  mail: ChildProcess | null = null;
  appExit: Promise<number | null> | null = null;
  private appLogLines: string[] = [];

  constructor(readonly o: StackOptions) {
    if (o.dbPort === SHARED_DB_PORT) throw new Error('The fault stack must not use the shared MariaDB port 3406.');
    // STACK_DATA_ROOT: where the stacks' folders go when the code runs from a copy (the soak's .data/soak-src).
    this.dataDir = path.join(process.env.STACK_DATA_ROOT ?? path.join(ROOT, '.data'), o.name);
    this.uploadsDir = path.join(this.dataDir, 'uploads');
    this.mailDir = path.join(this.dataDir, 'mail');
    this.logsDir = path.join(this.dataDir, 'logs');
    this.baseUrl = `http://127.0.0.1:${o.appPort}`;
    this.token = Buffer.from(JSON.stringify({ apiKey: 'sk_' + randomBytes(32).toString('base64url'), appId: 'faults-' + randomBytes(6).toString('hex'), regions: ['local'] })).toString('base64');
    this.secret = 'faults-secret-' + randomBytes(24).toString('base64url');
  }

  /** Environment for db/mariadb.sh: this stack's data folder and port only. */
  private dbEnv(): NodeJS.ProcessEnv {
    return { ...process.env, SCRIBELINE_DATA_DIR: this.dataDir, DB_PORT: String(this.o.dbPort), DB_DATABASES: [DB_NAME, ...(this.o.extraDatabases ?? [])].join(' ') };
  }

  env(): Record<string, string> {
    const o = this.o;
    return {
      PATH: process.env.PATH ?? '',
      HOME: process.env.HOME ?? '/root',
      NEXT_TELEMETRY_DISABLED: '1',
      NODE_ENV: 'production',
      NEXT_DIST_DIR: o.distDir,
      DB_HOST: '127.0.0.1',
      DB_PORT: String(o.dbPort),
      DB_NAME,
      DB_USER,
      DB_PASSWORD,
      NEXTAUTH_SECRET: this.secret,
      NEXTAUTH_URL: this.baseUrl,
      UPLOADTHING_TOKEN: this.token,
      UPLOADTHING_INGEST_URL: `http://127.0.0.1:${o.uploadsPort}`,
      UPLOADTHING_API_URL: `http://127.0.0.1:${o.uploadsPort}`,
      UPLOADTHING_CALLBACK_URL: `${this.baseUrl}/api/uploadthing`,
      UPLOADTHING_UFS_HOST: `localhost:${o.uploadsPort}`,
      UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
      UPLOADS_FILE_ORIGINS: `http://localhost:${o.uploadsPort}`,
      UPLOADTHING_IS_DEV: 'false',
      UPLOADTHING_LOG_LEVEL: 'Error',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(o.smtpPort),
      SMTP_SECURE: 'false',
      MAIL_FROM: 'Scribeline <no-reply@scribeline.test>',
      MAILBOX_URL: `http://127.0.0.1:${o.mailHttpPort}`,
    };
  }

  // ── MariaDB (this stack's own) ──────────────────────────────────────────────────────────────
  async startDb(): Promise<void> {
    await run('bash', [path.join(ROOT, 'db/mariadb.sh'), 'start'], { env: this.dbEnv(), cwd: ROOT });
  }

  dbPid(): number {
    const pid = Number(readFileSync(path.join(this.dataDir, 'run', 'mariadb.pid'), 'utf8').trim());
    if (!Number.isInteger(pid) || pid <= 1) throw new Error('no MariaDB pid for the fault stack');
    return pid;
  }

  /** SIGKILL to this stack's mariadbd, by the pid in its own data folder. */
  async killDb(): Promise<void> {
    const pid = this.dbPid();
    process.kill(pid, 'SIGKILL');
    await waitFor('MariaDB to die', async () => !(await portAnswers(this.o.dbPort)), 10_000, 50);
  }

  async stopDb(): Promise<void> {
    if (!existsSync(path.join(this.dataDir, 'run'))) return;
    await run('bash', [path.join(ROOT, 'db/mariadb.sh'), 'stop'], { env: this.dbEnv(), cwd: ROOT }).catch(() => undefined);
  }

  async db(database = DB_NAME): Promise<mariadb.Connection> {
    return mariadb.createConnection({ host: '127.0.0.1', port: this.o.dbPort, user: DB_USER, password: DB_PASSWORD, database, bigIntAsNumber: true, insertIdAsNumber: true, decimalAsNumber: true });
  }

  async query<T = Record<string, unknown>>(sql: string, values?: unknown[], database = DB_NAME): Promise<T[]> {
    const c = await this.db(database);
    try {
      return (await c.query(sql, values)) as T[];
    } finally {
      await c.end();
    }
  }

  // ── the upload and mail services ────────────────────────────────────────────────────────────
  private spawnLogged(name: string, args: string[], env: Record<string, string>): ChildProcess {
    const out = createWriteStream(path.join(this.logsDir, `${name}.log`), { flags: 'a' });
    // A process group of its own: tsx runs the service in a child process, and a kill must reach both.
    const child = spawn(process.execPath, args, { cwd: ROOT, env: env as unknown as NodeJS.ProcessEnv, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
    child.stdout!.pipe(out, { end: false });
    child.stderr!.pipe(out, { end: false });
    return child;
  }

  async startUploads(): Promise<void> {
    this.uploads = this.spawnLogged('uploads', [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), path.join(ROOT, 'uploads-fake/server.ts')], {
      ...this.env(),
      UPLOADS_FAKE_PORT: String(this.o.uploadsPort),
      UPLOADS_FAKE_DIR: this.uploadsDir,
    });
    await waitFor('the upload service', () => portAnswers(this.o.uploadsPort), 30_000);
  }

  async killUploads(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    await killChild(this.uploads, signal);
    this.uploads = null;
    await waitFor('the upload service to stop', async () => !(await portAnswers(this.o.uploadsPort)), 10_000, 50);
  }

  async startMail(): Promise<void> {
    this.mail = this.spawnLogged('mail', [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), path.join(ROOT, 'scripts/mail-service/server.ts')], {
      ...this.env(),
      MAIL_SMTP_PORT: String(this.o.smtpPort),
      MAIL_HTTP_PORT: String(this.o.mailHttpPort),
      MAIL_DIR: this.mailDir,
    });
    await waitFor('the mail service', async () => (await portAnswers(this.o.smtpPort)) && (await portAnswers(this.o.mailHttpPort)), 30_000);
  }

  async killMail(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    await killChild(this.mail, signal);
    this.mail = null;
  }

  async mailbox(): Promise<{ messageId?: string; headers?: Record<string, unknown>; subject?: string; envelope: { to: string[] } }[]> {
    const res = await fetch(`http://127.0.0.1:${this.o.mailHttpPort}/messages`);
    return ((await res.json()) as { messages: never[] }).messages;
  }

  // ── the app ─────────────────────────────────────────────────────────────────────────────────
  async startApp(extra: Record<string, string> = {}): Promise<void> {
    const env = { ...this.env(), MAIL_WORKER_INTERVAL_MS: '500', FILE_CLEANUP_INTERVAL_MS: '1000', ...(this.o.appEnv ?? {}), ...extra };
    const child = this.spawnLogged('app', [...(this.o.appNodeArgs ?? []), path.join(ROOT, 'node_modules/next/dist/bin/next'), 'start', '-H', '127.0.0.1', '-p', String(this.o.appPort)], env);
    this.appLogLines = [];
    child.stdout!.on('data', (b: Buffer) => this.appLogLines.push(...b.toString().split('\n').filter(Boolean)));
    child.stderr!.on('data', (b: Buffer) => this.appLogLines.push(...b.toString().split('\n').filter(Boolean)));
    this.app = child;
    this.appExit = new Promise((resolve) => child.once('exit', (code, signal) => resolve(code ?? (signal ? -1 : null))));
    await waitFor('the app', async () => (await fetch(`${this.baseUrl}/api/health/live`)).ok, 90_000, 250);
  }

  appLog(): string[] {
    return [...this.appLogLines];
  }

  async killApp(signal: NodeJS.Signals = 'SIGKILL'): Promise<number | null> {
    const exit = this.appExit;
    await killChild(this.app, signal);
    this.app = null;
    return exit;
  }

  // ── set-up and tear-down ────────────────────────────────────────────────────────────────────
  async up({ app = true }: { app?: boolean } = {}): Promise<void> {
    await this.down();
    await rm(this.dataDir, { recursive: true, force: true });
    await mkdir(this.logsDir, { recursive: true });
    await this.startDb();
    await this.startUploads();
    await this.startMail();
    const env = { ...this.env(), NODE_ENV: 'test' } as unknown as NodeJS.ProcessEnv;
    await run(process.execPath, [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), 'db/migrate.ts', 'up'], { cwd: ROOT, env });
    await run(process.execPath, [path.join(ROOT, 'node_modules/tsx/dist/cli.mjs'), 'db/seeders/seed.ts'], { cwd: ROOT, env, maxBuffer: 8 * 1024 * 1024 });
    if (app) await this.startApp();
  }

  async down(): Promise<void> {
    await killChild(this.app, 'SIGKILL');
    await killChild(this.uploads, 'SIGTERM');
    await killChild(this.mail, 'SIGTERM');
    this.app = this.uploads = this.mail = null;
    await this.stopDb();
  }

  // ── people and requests ─────────────────────────────────────────────────────────────────────
  /** A session cookie for a demo account, as sign-in would issue it (account id and session version). */
  async cookieFor(email: string): Promise<string> {
    const [u] = await this.query<{ id: number; session_version: number }>('SELECT id, session_version FROM users WHERE email = ?', [email]);
    if (!u) throw new Error(`no demo account ${email}`);
    const token = await encode({ token: { sub: String(u.id), sv: u.session_version ?? 0 }, secret: this.secret });
    return `next-auth.session-token=${token}`;
  }

  async api(method: string, p: string, cookie: string | null, body?: unknown): Promise<ApiResult> {
    const headers: Record<string, string> = {};
    if (cookie) headers.cookie = cookie;
    if (body !== undefined) headers['content-type'] = 'application/json';
    const started = performance.now();
    try {
      const res = await fetch(this.baseUrl + p, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(30_000) });
      const text = await res.text();
      let json: unknown = null;
      try {
        json = text ? JSON.parse(text) : null;
      } catch {
        json = null;
      }
      return { status: res.status, json: json as Record<string, never>, text, retryAfter: res.headers.get('retry-after'), ms: performance.now() - started };
    } catch (err) {
      return { status: 0, json: null, text: String(err), retryAfter: null, ms: performance.now() - started };
    }
  }

  /** The stored files' keys and their sidecar status, read from the upload service's folder. */
  async storedFiles(): Promise<{ key: string; status: string }[]> {
    const dir = path.join(this.uploadsDir, 'files');
    const names = await readdir(dir).catch(() => [] as string[]);
    const out: { key: string; status: string }[] = [];
    for (const n of names.filter((n) => !n.endsWith('.json'))) {
      const side = await readFile(path.join(dir, `${n}.json`), 'utf8').then((t) => JSON.parse(t) as { status?: string }).catch(() => ({ status: 'no sidecar' }));
      out.push({ key: n, status: side.status ?? 'unknown' });
    }
    return out;
  }
}

export type ApiResult = { status: number; json: Record<string, never> | null; text: string; retryAfter: string | null; ms: number };

async function killChild(child: ChildProcess | null, signal: NodeJS.Signals): Promise<void> {
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const gone = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  // The group this harness created for it (detached): the process and what it started, nothing else.
  const group = (sig: NodeJS.Signals) => {
    try {
      process.kill(-child.pid!, sig);
    } catch {
      child.kill(sig);
    }
  };
  group(signal);
  await Promise.race([gone, sleep(15_000)]);
  if (child.exitCode === null && child.signalCode === null) {
    group('SIGKILL');
    await gone;
  }
  // A child the group leader leaves behind (tsx's) goes with the group.
  if (signal === 'SIGKILL') group('SIGKILL');
}

export const DEMO = { builder: 'edda@renwick-shop.test', follower: 'tobias@quill.test', mentor: 'agnes@farrow.test', admin: 'juno@scribeline.test' };

export function stackFromEnv(name = 'faults', appEnv: Record<string, string> = {}, extraDatabases: string[] = []): Stack {
  const n = (k: string, d: number) => Number(process.env[k] ?? d);
  return new Stack({
    name,
    dbPort: n('FAULTS_DB_PORT', 3506),
    appPort: n('FAULTS_APP_PORT', 3507),
    uploadsPort: n('FAULTS_UPLOADS_PORT', 3508),
    smtpPort: n('FAULTS_SMTP_PORT', 3509),
    mailHttpPort: n('FAULTS_MAIL_HTTP_PORT', 3510),
    distDir: process.env.FAULTS_DIST_DIR ?? '.next-faults',
    appEnv,
    extraDatabases,
  });
}

/** A small, valid ProseMirror document carrying a marker text. */
export function doc(text: string) {
  return { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] };
}

export function reading(value: number) {
  return { value, unit: 'mm', instrument: 'micrometer', resolution: 0.001 };
}

/** A measurement record of three readings (spec ± 0.02 mm). */
export function record(feature: string) {
  return { feature, kind: 'outside', nominal: 25, unit: 'mm', spec: { type: 'plusMinus', tolerance: 0.02 }, readings: [reading(25.001), reading(25.004), reading(24.998)] };
}
