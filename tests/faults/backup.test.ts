// npm run backup / npm run restore: the demo is backed up, restored into a fresh database and upload store on
// a MariaDB of this test's own, and every table (structure and rows) and every file is compared.
import { afterAll, beforeAll, expect, test } from 'vitest';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { createHash } from 'node:crypto';
import { readdir, readFile, writeFile, rm } from 'node:fs/promises';
import path from 'node:path';
import { DB_NAME, ROOT, stackFromEnv, type Stack } from './harness';

const run = promisify(execFile);
const RESTORED = 'scribeline_restored_test';
let stack: Stack;

beforeAll(async () => {
  stack = stackFromEnv('faults-backup', {}, [RESTORED]);
  await stack.up({ app: false });
}, 300_000);

afterAll(async () => {
  await stack?.down();
}, 120_000);

function scriptEnv(database: string, uploadsDir: string): NodeJS.ProcessEnv {
  return { ...process.env, DB_NAME: database, DB_HOST: '127.0.0.1', DB_PORT: String(stack.o.dbPort), DB_USER: 'scribeline', DB_PASSWORD: 'scribeline-local', UPLOADS_DIR: uploadsDir };
}

async function tableDump(database: string): Promise<Record<string, { create: string; rows: string }>> {
  const tables = (await stack.query<{ t: string }>(`SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name`, [database], database)).map((r) => r.t);
  const out: Record<string, { create: string; rows: string }> = {};
  for (const t of tables) {
    const [create] = await stack.query<Record<string, string>>(`SHOW CREATE TABLE \`${t}\``, [], database);
    const rows = await stack.query(`SELECT * FROM \`${t}\` ORDER BY 1`, [], database);
    out[t] = { create: create['Create Table'], rows: JSON.stringify(rows, (_k, v) => (Buffer.isBuffer(v) ? v.toString('hex') : v)) };
  }
  return out;
}

async function fileHashes(dir: string): Promise<Record<string, string>> {
  const names = (await readdir(dir).catch(() => [] as string[])).sort();
  const out: Record<string, string> = {};
  for (const n of names) out[n] = createHash('sha256').update(await readFile(path.join(dir, n))).digest('hex');
  return out;
}

test('the demo backed up and restored into a fresh database and upload store is the same, table by table and file by file', async () => {
  const backup = path.join(stack.dataDir, 'backup-demo');
  await rm(backup, { recursive: true, force: true });
  await run('bash', [path.join(ROOT, 'scripts/backup.sh'), backup], { env: scriptEnv(DB_NAME, stack.uploadsDir), cwd: ROOT });

  const original = await tableDump(DB_NAME);
  expect(Object.keys(original).length).toBeGreaterThan(15);
  // The demo has rows worth comparing: accounts, a log with uploads, mail.
  for (const t of ['users', 'projects', 'shop_sessions', 'entries', 'media', 'measurement_readings', 'comments']) expect(JSON.parse(original[t].rows).length, t).toBeGreaterThan(0);
  const originalFiles = await fileHashes(path.join(stack.uploadsDir, 'files'));
  expect(Object.keys(originalFiles).length).toBeGreaterThan(1);

  const restoredUploads = path.join(stack.dataDir, 'uploads-restored');
  await rm(restoredUploads, { recursive: true, force: true });
  await run('bash', [path.join(ROOT, 'scripts/restore.sh'), backup], { env: scriptEnv(RESTORED, restoredUploads), cwd: ROOT });

  const restored = await tableDump(RESTORED);
  expect(Object.keys(restored)).toEqual(Object.keys(original));
  for (const t of Object.keys(original)) {
    expect(restored[t].create, `structure of ${t}`).toBe(original[t].create);
    expect(restored[t].rows, `rows of ${t}`).toBe(original[t].rows);
  }
  expect(await fileHashes(path.join(restoredUploads, 'files'))).toEqual(originalFiles);

  // A second restore over it is refused: nothing is overwritten.
  await expect(run('bash', [path.join(ROOT, 'scripts/restore.sh'), backup], { env: scriptEnv(RESTORED, restoredUploads), cwd: ROOT })).rejects.toMatchObject({ stderr: expect.stringMatching(/empty database/) });
}, 180_000);

test('a damaged backup is refused before anything is restored', async () => {
  const backup = path.join(stack.dataDir, 'backup-damaged');
  await rm(backup, { recursive: true, force: true });
  await run('bash', [path.join(ROOT, 'scripts/backup.sh'), backup], { env: scriptEnv(DB_NAME, stack.uploadsDir), cwd: ROOT });
  const files = (await readdir(path.join(backup, 'uploads/files'))).filter((n) => !n.endsWith('.json'));
  await writeFile(path.join(backup, 'uploads/files', files[0]), 'not the stored bytes');
  const target = path.join(stack.dataDir, 'uploads-never');
  await expect(run('bash', [path.join(ROOT, 'scripts/restore.sh'), backup], { env: scriptEnv('scribeline_never_test', target), cwd: ROOT })).rejects.toMatchObject({ stderr: expect.stringMatching(/damaged/) });
  await expect(readdir(target)).rejects.toThrow();
}, 120_000);
