// Fault scenarios: real writes through the running app while a dependency (or the app itself) is killed,
// then the database and the upload store are checked directly. Run with `npm run test:faults`, which
// builds the app and gives this file a whole stack of its own (tests/faults/harness.ts).
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { readFile, readdir } from 'node:fs/promises';
import path from 'node:path';
import { genUploader } from 'uploadthing/client';
import type { OurFileRouter } from '@/app/api/uploadthing/core';
import { installFetchXhr } from '../support/upload-harness';
import { DEMO, doc, record, stackFromEnv, waitFor, type ApiResult, type Stack } from './harness';

let stack: Stack;
let builder: string;
let follower: string;
let restoreXhr: () => void;

// Created through the API in beforeAll: a published project that Tobias follows, with sessions and entries.
let projectId: number;
let entryId: number;
let entryVersion: number;
let commentEntryId: number;
const spareSessions: number[] = [];

const idOf = (r: ApiResult, key: string): number => {
  const v = (r.json?.[key] as { id?: number } | undefined)?.id ?? (r.json as { id?: number } | null)?.id;
  if (typeof v !== 'number') throw new Error(`no ${key} id in ${r.status} ${r.text.slice(0, 300)}`);
  return v;
};

async function ok(r: Promise<ApiResult>, what: string): Promise<ApiResult> {
  const res = await r;
  if (res.status < 200 || res.status > 299) throw new Error(`${what}: ${res.status} ${res.text.slice(0, 300)}`);
  return res;
}

async function newSession(title: string): Promise<number> {
  return idOf(await ok(stack.api('POST', `/api/projects/${projectId}/sessions`, builder, { title, heldOn: '2026-11-20', minutesSpent: 30 }), 'session'), 'session');
}

async function newEntry(sessionId: number, title: string): Promise<number> {
  return idOf(await ok(stack.api('POST', `/api/sessions/${sessionId}/entries`, builder, { title, operation: 'turning' }), 'entry'), 'entry');
}

async function entryWithPhoto(sessionId: number, title: string): Promise<{ entryId: number; key: string }> {
  const id = await newEntry(sessionId, title);
  const key = await uploadPhoto(id);
  return { entryId: id, key };
}

function uploader() {
  return genUploader<OurFileRouter>({ url: new URL(`${stack.baseUrl}/api/uploadthing`), package: 'uploadthing/client', fetch });
}

async function uploadPhoto(entry: number): Promise<string> {
  const png = await readFile(path.join(__dirname, '../fixtures/media/scribe-4x3.png'));
  const [res] = await uploader().uploadFiles('entryPhoto', { files: [new File([png], 'bench.png', { type: 'image/png' })], input: { entryId: entry }, headers: { cookie: builder } });
  const data = res.serverData as { ok: boolean; media?: { id: number } };
  if (!data.ok) throw new Error(`photo refused: ${JSON.stringify(data)}`);
  return res.key;
}

/** Every media row that names a stored file has that file; returns the keys the rows name. */
async function rowsPointAtFiles(): Promise<Set<string>> {
  const rows = await stack.query<{ file_key: string }>(`SELECT file_key FROM media WHERE source = 'upload' AND file_key IS NOT NULL`);
  const stored = new Set((await stack.storedFiles()).map((f) => f.key));
  const missing = rows.filter((r) => !stored.has(r.file_key)).map((r) => r.file_key);
  expect(missing, 'media rows whose file is missing').toEqual([]);
  return new Set(rows.map((r) => r.file_key));
}

/** No finished stored file without a row (files still 'Uploading' are the service's own to expire). */
async function noFileWithoutRow(): Promise<void> {
  const keys = new Set((await stack.query<{ file_key: string }>(`SELECT file_key FROM media WHERE file_key IS NOT NULL`)).map((r) => r.file_key));
  const orphans = (await stack.storedFiles()).filter((f) => f.status === 'Uploaded' && !keys.has(f.key));
  expect(orphans, 'stored files without a media row').toEqual([]);
}

beforeAll(async () => {
  restoreXhr = installFetchXhr();
  // A short sweep age, so the scheduled clean-up's orphan sweep can be watched within the test.
  stack = stackFromEnv('faults', { UPLOAD_SWEEP_INTERVAL_MS: '2000', UPLOAD_SWEEP_AGE_MS: '4000', STOP_TIMEOUT_MS: '20000' });
  await stack.up();
  builder = await stack.cookieFor(DEMO.builder);
  follower = await stack.cookieFor(DEMO.follower);
  const p = await ok(stack.api('POST', '/api/projects', builder, { title: 'Fault bench', summary: 'Writes under trouble.', units: 'mm', visibility: 'published' }), 'project');
  projectId = idOf(p, 'project');
  await ok(stack.api('POST', `/api/projects/${projectId}/follow`, follower, {}), 'follow');
  const s = await newSession('Main session');
  entryId = await newEntry(s, 'Autosaved entry');
  const published = await newSession('Published for comments');
  commentEntryId = await newEntry(published, 'Ask here');
  await ok(stack.api('PATCH', `/api/sessions/${published}/visibility`, builder, { visibility: 'published' }), 'publish');
  for (let i = 0; i < 40; i++) spareSessions.push(await newSession(`Spare ${i}`));
  const e = await ok(stack.api('GET', `/api/entries/${entryId}`, builder), 'entry');
  entryVersion = (e.json!.entry as { version: number }).version;
}, 300_000);

afterAll(async () => {
  restoreXhr?.();
  await stack?.down();
}, 120_000);

describe('faults', () => {
  test('health tells liveness from readiness and names what is down', async () => {
    const ready = await stack.api('GET', '/api/health', null);
    expect(ready.status).toBe(200);
    expect(ready.json).toMatchObject({ ready: true, checks: { database: 'up', uploads: 'up', smtp: 'up' }, down: [] });

    await stack.killMail();
    const noSmtp = await waitFor('smtp down in health', async () => {
      const r = await stack.api('GET', '/api/health', null);
      return (r.json?.down as string[] | undefined)?.includes('smtp') ? r : null;
    }, 10_000, 500);
    // Mail waits in the outbox: still ready.
    expect(noSmtp.status).toBe(200);
    expect(noSmtp.json).toMatchObject({ ready: true, checks: { database: 'up', smtp: 'down' } });
    expect(String(noSmtp.json!.message)).toContain('mail (SMTP) server');
    await stack.startMail();

    await stack.killDb();
    const noDb = await stack.api('GET', '/api/health', null);
    expect(noDb.status).toBe(503);
    expect(noDb.retryAfter).toBeTruthy();
    expect(noDb.json).toMatchObject({ ready: false, checks: { database: 'down' } });
    expect(noDb.json!.down).toContain('database');
    const live = await stack.api('GET', '/api/health/live', null);
    expect(live.status).toBe(200);
    await stack.startDb();
    await waitFor('ready again', async () => (await stack.api('GET', '/api/health', null)).status === 200, 30_000, 250);
  }, 120_000);

  test('MariaDB killed during a burst of writes: every 2xx is kept, nothing half-written, 503s say so, the app reconnects', async () => {
    type Acked = { kind: string; id?: number; version?: number; sessionId?: number };
    const acked: Acked[] = [];
    const refused: ApiResult[] = [];
    const unexpected: string[] = [];
    let stop = false;
    let phase: 'before' | 'down' | 'after' = 'before';
    const afterOk: Record<string, number> = {};
    const note = (kind: string, r: ApiResult, extra: Omit<Acked, 'kind'> = {}) => {
      if (r.status >= 200 && r.status < 300) {
        acked.push({ kind, ...extra });
        if (phase === 'after') afterOk[kind] = (afterOk[kind] ?? 0) + 1;
      } else if (r.status === 503) refused.push(r);
      else if (!(kind === 'autosave' && r.status === 409)) unexpected.push(`${kind}: ${r.status} ${r.text.slice(0, 200)}`);
    };

    let version = entryVersion;
    let n = 0;
    const autosaver = async () => {
      while (!stop) {
        const title = `Autosave ${++n}`;
        const r = await stack.api('PATCH', `/api/entries/${entryId}`, builder, { title, body: doc(`text ${n}`), version });
        note('autosave', r, r.status === 200 ? { version: (r.json!.entry as { version: number }).version } : {});
        if (r.status === 200) version = (r.json!.entry as { version: number }).version;
        else if (r.status === 409 || r.status === 503) {
          // An answer lost with the database may still have committed: read the version again, as the editor's reload does.
          const fresh = await stack.api('GET', `/api/entries/${entryId}`, builder);
          if (fresh.status === 200) version = (fresh.json!.entry as { version: number }).version;
          await new Promise((r2) => setTimeout(r2, 200));
        }
      }
    };
    const recorder = async () => {
      let i = 0;
      while (!stop) {
        const r = await stack.api('POST', `/api/entries/${entryId}/measurements`, builder, record(`Spigot ${++i}`));
        note('record', r, r.status === 201 ? { id: (r.json!.record as { id: number }).id } : {});
        if (r.status !== 201) await new Promise((r2) => setTimeout(r2, 200));
      }
    };
    const publisher = async () => {
      while (!stop && spareSessions.length) {
        const sessionId = spareSessions.shift()!;
        const r = await stack.api('PATCH', `/api/sessions/${sessionId}/visibility`, builder, { visibility: 'published' });
        note('publish', r, { sessionId });
        if (r.status !== 200) await new Promise((r2) => setTimeout(r2, 200));
        await new Promise((r2) => setTimeout(r2, 150));
      }
    };
    const commenter = async () => {
      // At most 5 a minute per member (the comment limit): a few, spread over the run.
      for (let i = 0; i < 5 && !stop; i++) {
        const r = await stack.api('POST', `/api/entries/${commentEntryId}/comments`, follower, { body: `Question ${i} during the burst` });
        note('comment', r, r.status === 201 || r.status === 200 ? { id: (r.json!.comment as { id: number }).id } : {});
        await new Promise((r2) => setTimeout(r2, 1500));
      }
    };

    const workers = Promise.all([autosaver(), recorder(), recorder(), publisher(), commenter()]);
    await new Promise((r) => setTimeout(r, 2500));
    phase = 'down';
    await stack.killDb();
    await new Promise((r) => setTimeout(r, 3000));
    await stack.startDb();
    phase = 'after';
    await waitFor('writes to succeed again without an app restart', async () => (afterOk.autosave ?? 0) >= 2 && (afterOk.record ?? 0) >= 2, 60_000, 250);
    stop = true;
    await workers;

    expect(unexpected, 'answers other than 2xx, 503 (or a 409 for a stale autosave)').toEqual([]);
    expect(refused.length, 'some writes met the stopped database').toBeGreaterThan(0);
    for (const r of refused) {
      expect(Number(r.retryAfter)).toBeGreaterThan(0);
      expect(r.json).toMatchObject({ error: 'unavailable' });
      expect(String(r.json!.message)).toMatch(/try again/i);
      expect(r.text).not.toMatch(/\bat \S+:\d+:\d+|Sequelize|SqlError|stack/);
    }

    // Every 2xx record is there with all three readings; no record anywhere lacks its readings.
    const recordIds = acked.filter((a) => a.kind === 'record').map((a) => a.id!);
    expect(recordIds.length).toBeGreaterThan(0);
    const counts = await stack.query<{ id: number; n: number }>(
      `SELECT r.id, COUNT(g.id) AS n FROM measurement_records r LEFT JOIN measurement_readings g ON g.record_id = r.id WHERE r.entry_id = ? GROUP BY r.id`,
      [entryId],
    );
    const byId = new Map(counts.map((c) => [Number(c.id), Number(c.n)]));
    for (const id of recordIds) expect(byId.get(id), `record ${id}`).toBe(3);
    expect(counts.filter((c) => Number(c.n) !== 3), 'records without all their readings').toEqual([]);

    // The entry holds at least the last acknowledged autosave.
    const lastVersion = Math.max(...acked.filter((a) => a.kind === 'autosave').map((a) => a.version!));
    const [entry] = await stack.query<{ version: number }>('SELECT version FROM entries WHERE id = ?', [entryId]);
    expect(entry.version).toBeGreaterThanOrEqual(lastVersion);

    // Every published session (acknowledged or not) has its message to the follower in the outbox.
    const published = await stack.query<{ id: number }>(`SELECT id FROM shop_sessions WHERE project_id = ? AND visibility = 'published'`, [projectId]);
    for (const a of acked.filter((x) => x.kind === 'publish')) expect(published.map((p) => Number(p.id))).toContain(a.sessionId);
    const outbox = new Set((await stack.query<{ dedupe_key: string }>(`SELECT dedupe_key FROM outbox_messages WHERE dedupe_key LIKE 'session-published:%'`)).map((r) => r.dedupe_key));
    const [tobias] = await stack.query<{ id: number }>('SELECT id FROM users WHERE email = ?', [DEMO.follower]);
    for (const p of published) expect(outbox.has(`session-published:${p.id}:${tobias.id}`), `outbox row for session ${p.id}`).toBe(true);

    for (const a of acked.filter((x) => x.kind === 'comment')) {
      const [c] = await stack.query('SELECT id FROM comments WHERE id = ?', [a.id]);
      expect(c, `comment ${a.id}`).toBeTruthy();
    }
  }, 180_000);

  test('upload service stopped mid-upload: no row without its file, no file without a row after the clean-up', async () => {
    const s = await newSession('Uploads under trouble');
    const entry = await newEntry(s, 'Clip that never arrived');
    await uploadPhoto(entry);
    // A clip big enough to be caught in flight: a real MP4 head, then padding.
    const head = await readFile(path.join(__dirname, '../fixtures/media/tiny-1s.mp4'));
    const big = new Uint8Array(48 * 1024 * 1024);
    big.set(head, 0);
    const attempt = uploader()
      .uploadFiles('entryClip', { files: [new File([big], 'long-cut.mp4', { type: 'video/mp4' })], input: { entryId: entry }, headers: { cookie: builder } })
      .then(() => 'uploaded', (err: Error) => `failed: ${err.message}`);
    await waitFor('the clip to be in flight', async () => (await readdir(path.join(stack.uploadsDir, 'tmp')).catch(() => [])).length > 0, 20_000, 10);
    await stack.killUploads();
    const outcome = await attempt;
    expect(outcome).toMatch(/^failed/);

    // While it is down, adding a photo fails plainly, and health names the upload service.
    const health = await stack.api('GET', '/api/health', null);
    expect(health.json!.down).toContain('uploads');
    await expect(uploadPhoto(entry)).rejects.toThrow();

    await stack.startUploads();
    await rowsPointAtFiles();
    // A file stored behind the app's back (recorded by nobody) is removed by the scheduled sweep.
    const { UTApi, UTFile } = await import('uploadthing/server');
    const utapi = new UTApi({ token: stack.token, apiUrl: `http://127.0.0.1:${stack.o.uploadsPort}`, ingestUrl: `http://127.0.0.1:${stack.o.uploadsPort}`, logLevel: 'Error' } as never);
    const stray = await utapi.uploadFiles(new UTFile([new TextEncoder().encode('left behind')], 'stray.bin'));
    const strayKey = stray.data!.key;
    await waitFor('the sweep to remove the stray file', async () => !(await stack.storedFiles()).some((f) => f.key === strayKey), 30_000, 500);
    await noFileWithoutRow();
    await rowsPointAtFiles();
  }, 180_000);

  test('deleting an entry, a session or a project removes its files even if the process dies before deleting them', async () => {
    const s1 = await newSession('To delete: entry');
    const e1 = await entryWithPhoto(s1, 'Entry to delete');
    const s2 = await newSession('To delete: session');
    const e2 = await entryWithPhoto(s2, 'In a session to delete');
    const p = await ok(stack.api('POST', '/api/projects', builder, { title: 'Project to delete', summary: '', units: 'mm', visibility: 'private' }), 'project');
    const pid = idOf(p, 'project');
    const ps = idOf(await ok(stack.api('POST', `/api/projects/${pid}/sessions`, builder, { title: 'Its session', heldOn: '2026-11-21', minutesSpent: 0 }), 'session'), 'session');
    const e3 = await entryWithPhoto(ps, 'In a project to delete');
    const keys = [e1.key, e2.key, e3.key];

    // The app dies between each commit and its file deletion: the service is away, then the app is killed.
    await stack.killUploads();
    await ok(stack.api('DELETE', `/api/entries/${e1.entryId}`, builder), 'delete entry');
    await ok(stack.api('DELETE', `/api/sessions/${s2}`, builder), 'delete session');
    await ok(stack.api('DELETE', `/api/projects/${pid}`, builder), 'delete project');
    const queued = (await stack.query<{ file_key: string }>('SELECT file_key FROM file_deletions')).map((r) => r.file_key);
    expect(queued).toEqual(expect.arrayContaining(keys));
    await stack.killApp('SIGKILL');
    // If the clean-up ticked while the upload service was away, it put those rows off for a minute (its
    // back-off): here that minute is passed at once, as for the mail lease below.
    await stack.query('UPDATE file_deletions SET next_attempt_at = NOW() - INTERVAL 1 SECOND');

    // Back up, with the orphan sweep out of the way (an hour's age): only the queue can remove them.
    await stack.startUploads();
    expect((await stack.storedFiles()).map((f) => f.key)).toEqual(expect.arrayContaining(keys));
    await stack.startApp({ UPLOAD_SWEEP_AGE_MS: String(3_600_000) });
    await waitFor('the queued deletions to finish', async () => {
      const left = await stack.query('SELECT id FROM file_deletions');
      const stored = new Set((await stack.storedFiles()).map((f) => f.key));
      return left.length === 0 && keys.every((k) => !stored.has(k));
    }, 30_000, 500);
    await rowsPointAtFiles();
  }, 180_000);

  test('the app killed mid-work and started again: every message goes out (at most once more), uploads reconcile', async () => {
    await fetch(`http://127.0.0.1:${stack.o.mailHttpPort}/messages`, { method: 'DELETE' });
    // Messages to send: sessions published for the follower, while the app is killed mid-way through sending.
    const sessions: number[] = [];
    for (let i = 0; i < 12; i++) sessions.push(await newSession(`Mail run ${i}`));
    await Promise.all(sessions.map((id) => ok(stack.api('PATCH', `/api/sessions/${id}/visibility`, builder, { visibility: 'published' }), 'publish')));
    // An upload in flight too, killed with the app.
    const s = await newSession('Upload cut by a crash');
    const entry = await newEntry(s, 'Photo cut by a crash');
    const png = await readFile(path.join(__dirname, '../fixtures/media/scribe-4x3.png'));
    const attempt = uploader()
      .uploadFiles('entryPhoto', { files: [new File([png], 'cut.png', { type: 'image/png' })], input: { entryId: entry }, headers: { cookie: builder } })
      .then(() => 'done', () => 'failed');
    await new Promise((r) => setTimeout(r, 700));
    await stack.killApp('SIGKILL');
    await attempt;

    // A row claimed by the dead process waits for its lease (5 min) to run out: here that time is passed at once.
    await stack.query(`UPDATE outbox_messages SET next_attempt_at = NOW(3) WHERE status = 'pending' AND claim_token IS NOT NULL`);
    await stack.startApp();
    const ids = (await stack.query<{ id: number }>(`SELECT id FROM outbox_messages WHERE dedupe_key LIKE 'session-published:%' AND created_at > NOW() - INTERVAL 10 MINUTE`)).map((r) => Number(r.id));
    await waitFor('every message sent', async () => (await stack.query(`SELECT id FROM outbox_messages WHERE status <> 'sent'`)).length === 0, 60_000, 500);
    const box = await stack.mailbox();
    const seen = new Map<number, number>();
    for (const m of box) {
      const id = Number(/outbox-(\d+)@/.exec(JSON.stringify(m))?.[1]);
      if (id) seen.set(id, (seen.get(id) ?? 0) + 1);
    }
    for (const id of ids) {
      if (!seen.has(id)) {
        // Sent before the mailbox was emptied (the worker is quick): its row says sent.
        const [row] = await stack.query<{ status: string }>('SELECT status FROM outbox_messages WHERE id = ?', [id]);
        expect(row.status).toBe('sent');
      }
      expect(seen.get(id) ?? 1, `outbox ${id} delivered at most twice`).toBeLessThanOrEqual(2);
    }
    await waitFor('uploads to reconcile', async () => {
      await rowsPointAtFiles();
      await noFileWithoutRow();
      return true;
    }, 30_000, 1000);
  }, 180_000);

  test('SIGTERM: no new requests, the one in flight finishes, the mail worker and the pool stop, exit 143', async () => {
    const [before] = await stack.query<{ version: number }>('SELECT version FROM entries WHERE id = ?', [entryId]);
    // Hold the entry's row so an autosave waits in flight.
    const holder = await stack.db();
    await holder.beginTransaction();
    await holder.query('SELECT id FROM entries WHERE id = ? FOR UPDATE', [entryId]);
    const inFlight = stack.api('PATCH', `/api/entries/${entryId}`, builder, { title: 'Saved while stopping', version: before.version });
    await new Promise((r) => setTimeout(r, 800));
    const exit = stack.killApp('SIGTERM');
    await new Promise((r) => setTimeout(r, 800));
    const refused = await stack.api('GET', '/api/health/live', null);
    expect(refused.status, 'a new connection is refused while stopping').toBe(0);
    await holder.commit();
    await holder.end();
    const answered = await inFlight;
    expect(answered.status).toBe(200);
    expect(await exit).toBe(143);
    const log = stack.appLog().join('\n');
    expect(log).toContain('mail worker and clean-up stopped');
    expect(log).toContain('database pool closed');
    const [after] = await stack.query<{ version: number; title: string }>('SELECT version, title FROM entries WHERE id = ?', [entryId]);
    expect(after).toMatchObject({ version: before.version + 1, title: 'Saved while stopping' });
    // Ctrl-C (SIGINT) takes the same path.
    await stack.startApp();
    expect(await stack.killApp('SIGINT')).toBe(130);
    expect(stack.appLog().join('\n')).toContain('database pool closed');
    await stack.startApp();
  }, 120_000);
});
