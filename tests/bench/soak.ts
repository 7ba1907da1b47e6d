// npm run soak: a long run of mixed traffic at a steady rate against a Scribeline of its own (tests/faults/harness.ts),
// reporting errors, p50/p99 per minute and the app's memory per minute. A benchmark, not a test: it prints the
// figures and whether they reach the goals (0 errors; last minute's p99 within 1.5× of the first; memory after
// warm-up growing less than 10 %), and writes them to .data/soak/report.json.
// Memory is judged by the app's heap after full garbage collections (the app runs with --trace-gc; the lowest
// heap after a mark-compact in each minute is what it holds live); the resident size is shown beside it, but it
// also counts heap V8 has grown and not yet given back, and whatever else the machine's load does to it.
// SOAK_MINUTES (10), SOAK_RPS (20 requests a second), SOAK_WARMUP_MINUTES (1).
import { readFileSync, writeFileSync, readdirSync } from 'node:fs';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import { genUploader } from 'uploadthing/client';
import type { OurFileRouter } from '../../app/api/uploadthing/core';
import { installFetchXhr } from '../support/upload-harness';
import { DEMO, doc, record, Stack, type ApiResult } from '../faults/harness';

const MINUTES = Number(process.env.SOAK_MINUTES ?? 10);
const RPS = Number(process.env.SOAK_RPS ?? 20);
const WARMUP = Number(process.env.SOAK_WARMUP_MINUTES ?? 1);
const COMMENTERS = 60;
/** Entries a session holds before the builder starts the next session (a shop day's worth). */
const ENTRIES_PER_SESSION = 24;
// V8's --trace-gc line for a full collection: "… 123456 ms: Mark-Compact 310.2 (340.1) -> 250.3 (335.0) MB, …".
const MARK_COMPACT = /Mark-Compact(?: \(reduce\))? [\d.]+ \([\d.]+\) -> ([\d.]+) \([\d.]+\) MB/;

type Sample = { at: number; kind: string; ms: number; status: number };

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return 0;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

/** Resident memory of a process and its children, in MB (Linux /proc). */
function rssMb(pid: number): number {
  let kb = 0;
  const visit = (p: number) => {
    try {
      const status = readFileSync(`/proc/${p}/status`, 'utf8');
      kb += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
      for (const task of readdirSync(`/proc/${p}/task`)) {
        const kids = readFileSync(`/proc/${p}/task/${task}/children`, 'utf8').trim();
        for (const k of kids ? kids.split(/\s+/) : []) visit(Number(k));
      }
    } catch {
      /* gone */
    }
  };
  visit(pid);
  return Math.round(kb / 1024);
}

async function main() {
  const n = (k: string, d: number) => Number(process.env[k] ?? d);
  const stack = new Stack({
    name: 'soak',
    dbPort: n('SOAK_DB_PORT', 3516),
    appPort: n('SOAK_APP_PORT', 3517),
    uploadsPort: n('SOAK_UPLOADS_PORT', 3518),
    smtpPort: n('SOAK_SMTP_PORT', 3519),
    mailHttpPort: n('SOAK_MAIL_HTTP_PORT', 3520),
    distDir: process.env.SOAK_DIST_DIR ?? '.next-soak',
    appEnv: { MAIL_WORKER_INTERVAL_MS: '2000' },
    appNodeArgs: ['--trace-gc'],
  });
  const restoreXhr = installFetchXhr();
  const stopAll = async () => {
    restoreXhr();
    await stack.down();
  };
  process.once('SIGINT', () => void stopAll().then(() => process.exit(130)));
  try {
    console.log('› Starting a stack of its own (database, upload and mail services, app)');
    await stack.up();
    const builder = await stack.cookieFor(DEMO.builder);

    // Readers' accounts for comments (the limit is 5 a minute and 30 an hour per member).
    const hash = await bcrypt.hash('soak-reader-pass', 4);
    const commenters: string[] = [];
    for (let i = 0; i < COMMENTERS; i++) {
      const email = `soak-reader-${i}@example.test`;
      await stack.query(
        `INSERT INTO users (email, name, handle, password_hash, site_role, email_verified_at, session_version, created_at, updated_at) VALUES (?, ?, ?, ?, 'member', NOW(), 0, NOW(), NOW())`,
        [email, `Soak reader ${i}`, `soak-reader-${i}`, hash],
      );
      commenters.push(await stack.cookieFor(email));
    }

    // The builder's own published project for the writes, and the demo's published pages for the readers (not the
    // bench project itself, whose pages grow with every write: the readers' work stays the same all run).
    const ok = (r: ApiResult, what: string) => {
      if (r.status < 200 || r.status > 299) throw new Error(`${what}: ${r.status} ${r.text.slice(0, 200)}`);
      return r.json!;
    };
    const project = ok(await stack.api('POST', '/api/projects', builder, { title: 'Soak bench', summary: 'A busy evening.', units: 'mm', visibility: 'published' }), 'project').project as { id: number; slug: string };
    // The builder's shop days: a new session (published, so its entries are read in the open) once the current
    // one holds ENTRIES_PER_SESSION entries.
    let sessionId = 0;
    let sessionNo = 0;
    let inSession = 0;
    const openSession = async () => {
      const day = `2026-11-${String(1 + (sessionNo % 28)).padStart(2, '0')}`;
      const id = (ok(await stack.api('POST', `/api/projects/${project.id}/sessions`, builder, { title: `Busy evening ${++sessionNo}`, heldOn: day, minutesSpent: 90 }), 'session').session as { id: number }).id;
      ok(await stack.api('PATCH', `/api/sessions/${id}/visibility`, builder, { visibility: 'published' }), 'publish');
      sessionId = id;
      inSession = 0;
    };
    await openSession();
    // Eight entries open at a time; every minute the builder moves on to eight fresh ones, so an entry ends with
    // what one minute brings it (about 18 records, 7 photos and 12 comments at 20 requests a second).
    // SOAK_ROTATE=0 keeps the same eight all run, so each gathers hundreds of records and photos: a test of how
    // writes to one big entry hold up, not of a realistic evening.
    let entries: { id: number; version: number; busy: boolean }[] = [];
    let stepNo = 0;
    const openEntries = async () => {
      const fresh: typeof entries = [];
      for (let i = 0; i < 8; i++) {
        if (inSession >= ENTRIES_PER_SESSION) await openSession();
        const e = ok(await stack.api('POST', `/api/sessions/${sessionId}/entries`, builder, { title: `Step ${++stepNo}`, operation: 'turning' }), 'entry').entry as { id: number; version: number };
        inSession++;
        fresh.push({ id: e.id, version: e.version, busy: false });
      }
      entries = fresh;
    };
    await openEntries();
    const pages = (
      await stack.query<{ slug: string; entry_id: number; session_id: number }>(
        `SELECT p.slug, e.id AS entry_id, s.id AS session_id FROM projects p JOIN shop_sessions s ON s.project_id = p.id JOIN entries e ON e.session_id = s.id
         WHERE p.visibility = 'published' AND s.visibility = 'published' AND p.id <> ?`,
        [project.id],
      )
    ).flatMap((r) => [`/logs/${r.slug}`, `/logs/${r.slug}/sessions/${r.session_id}`, `/logs/${r.slug}/entries/${r.entry_id}`]);
    pages.push('/', '/fits?size=25&fit=H7/g6');
    const png = await readFile(path.join(__dirname, '../fixtures/media/scribe-4x3.png'));
    const uploader = genUploader<OurFileRouter>({ url: new URL(`${stack.baseUrl}/api/uploadthing`), package: 'uploadthing/client', fetch });

    const samples: Sample[] = [];
    const errors: string[] = [];
    let skipped = 0;
    let seq = 0;
    let commentTurn = 0;
    const t0 = Date.now();
    const note = (kind: string, r: { status: number; ms: number; text?: string }) => {
      samples.push({ at: Date.now() - t0, kind, ms: r.ms, status: r.status });
      if (r.status < 200 || r.status >= 400) errors.push(`${kind} ${r.status} ${(r.text ?? '').slice(0, 160)}`);
    };

    const actions: [number, () => Promise<void>][] = [
      // Readers on published pages: half the traffic.
      [50, async () => {
        const page = pages[seq % pages.length];
        const started = performance.now();
        try {
          const res = await fetch(stack.baseUrl + page, { signal: AbortSignal.timeout(30_000) });
          const text = await res.text();
          note('read', { status: res.status, ms: performance.now() - started, text: res.ok ? '' : text });
        } catch (err) {
          note('read', { status: 0, ms: performance.now() - started, text: String(err) });
        }
      }],
      // Builders' autosaves (one at a time per entry, with its version, as the editor does).
      [25, async () => {
        const e = entries.find((x) => !x.busy);
        if (!e) {
          skipped++;
          return;
        }
        e.busy = true;
        try {
          const r = await stack.api('PATCH', `/api/entries/${e.id}`, builder, { body: doc(`Autosave ${seq}: faced to 24.98, one spring pass.`), version: e.version });
          note('autosave', r);
          if (r.status === 200) e.version = (r.json!.entry as { version: number }).version;
        } finally {
          e.busy = false;
        }
      }],
      [12, async () => note('reading', await stack.api('POST', `/api/entries/${entries[seq % entries.length].id}/measurements`, builder, record(`Bore ${seq}`)))],
      // Readers take turns, so none passes the comment limits (5 a minute, 30 an hour).
      [8, async () => note('comment', await stack.api('POST', `/api/entries/${entries[seq % entries.length].id}/comments`, commenters[commentTurn++ % COMMENTERS], { body: `How did the finish come out on pass ${seq}?` }))],
      [5, async () => {
        const started = performance.now();
        try {
          const [res] = await uploader.uploadFiles('entryPhoto', { files: [new File([png], `shot-${seq}.png`, { type: 'image/png' })], input: { entryId: entries[seq % entries.length].id }, headers: { cookie: builder } });
          const okData = (res.serverData as { ok: boolean }).ok;
          note('upload', { status: okData ? 201 : 422, ms: performance.now() - started, text: JSON.stringify(res.serverData) });
        } catch (err) {
          note('upload', { status: 0, ms: performance.now() - started, text: String(err) });
        }
      }],
    ];
    const total = actions.reduce((s, [w]) => s + w, 0);
    const pick = (): (() => Promise<void>) => {
      let r = Math.random() * total;
      for (const [w, f] of actions) if ((r -= w) < 0) return f;
      return actions[0][1];
    };

    const memory: { minute: number; rssMb: number }[] = [];
    const appPid = stack.app!.pid!;
    const memTimer = setInterval(() => memory.push({ minute: (Date.now() - t0) / 60_000, rssMb: rssMb(appPid) }), 10_000);
    // The heap after each full collection, as the app reports it (--trace-gc on its stdout), and the app's own errors.
    const heap: { minute: number; mb: number }[] = [];
    const appErrors: string[] = [];
    let partial = '';
    const readAppOutput = (b: Buffer) => {
      const lines = (partial + b.toString()).split('\n');
      partial = lines.pop() ?? '';
      for (const line of lines) {
        const m = MARK_COMPACT.exec(line);
        if (m) heap.push({ minute: (Date.now() - t0) / 60_000, mb: Number(m[1]) });
        else if (/error|⨯/i.test(line) && appErrors.length < 40) appErrors.push(line.slice(0, 400));
      }
    };
    stack.app!.stdout!.on('data', readAppOutput);
    stack.app!.stderr!.on('data', readAppOutput);
    console.log(`› ${MINUTES} minute(s) at ${RPS} requests a second (reads 50 %, autosaves 25 %, readings 12 %, comments 8 %, uploads 5 %)`);
    const inFlight = new Set<Promise<void>>();
    const end = t0 + MINUTES * 60_000;
    for (let i = 0; Date.now() < end; i++) {
      const due = t0 + (i * 1000) / RPS;
      const wait = due - Date.now();
      if (wait > 0) await new Promise((r) => setTimeout(r, wait));
      seq++;
      const p = pick()().catch((err) => void errors.push(String(err)));
      inFlight.add(p);
      void p.finally(() => inFlight.delete(p));
      if (i % (RPS * 60) === 0 && i > 0 && process.env.SOAK_ROTATE !== '0') void openEntries().catch((err) => errors.push(`new entries: ${String(err)}`));
      if (i % (RPS * 60) === 0 && i > 0) console.log(`  minute ${Math.round((Date.now() - t0) / 60_000)}: ${samples.length} requests, ${errors.length} errors, ${rssMb(appPid)} MB`);
    }
    await Promise.all(inFlight);
    clearInterval(memTimer);

    const minutes = [];
    for (let m = 0; m < MINUTES; m++) {
      const inMinute = samples.filter((s) => s.at >= m * 60_000 && s.at < (m + 1) * 60_000);
      const ms = inMinute.map((s) => s.ms).sort((a, b) => a - b);
      const mem = memory.filter((x) => x.minute >= m && x.minute < m + 1).map((x) => x.rssMb);
      minutes.push({
        minute: m + 1,
        requests: inMinute.length,
        errors: inMinute.filter((s) => s.status < 200 || s.status >= 400).length,
        p50: Math.round(percentile(ms, 50)),
        p99: Math.round(percentile(ms, 99)),
        rssMb: mem.length ? Math.max(...mem) : null,
        heapAfterGcMb: (() => {
          const h = heap.filter((x) => x.minute >= m && x.minute < m + 1).map((x) => x.mb);
          return h.length ? Math.round(Math.min(...h)) : null;
        })(),
        fullGcs: heap.filter((x) => x.minute >= m && x.minute < m + 1).length,
      });
    }
    const first = minutes[0];
    const last = minutes[minutes.length - 1];
    const growthOf = (values: number[]) => (values.length > 1 ? (values[values.length - 1] - values[0]) / values[0] : 0);
    const afterWarmup = minutes.filter((m) => m.minute > WARMUP);
    const heapAfterWarmup = afterWarmup.filter((m) => m.heapAfterGcMb !== null).map((m) => m.heapAfterGcMb as number);
    const rssAfterWarmup = afterWarmup.filter((m) => m.rssMb !== null).map((m) => m.rssMb as number);
    // Judged by the heap after full collections; by the resident size only when no full collection was seen.
    const growth = heapAfterWarmup.length > 1 ? growthOf(heapAfterWarmup) : growthOf(rssAfterWarmup);
    const report = {
      minutes: MINUTES,
      rps: RPS,
      requests: samples.length,
      errors: errors.length,
      skippedAutosaves: skipped,
      perMinute: minutes,
      p99Ratio: first.p99 ? +(last.p99 / first.p99).toFixed(2) : null,
      memoryGrowthAfterWarmup: +(growth * 100).toFixed(1),
      memoryJudgedBy: heapAfterWarmup.length > 1 ? 'heap after full GC' : 'RSS',
      rssGrowthAfterWarmup: +(growthOf(rssAfterWarmup) * 100).toFixed(1),
      sessions: sessionNo,
      entries: stepNo,
      goals: {
        noErrors: errors.length === 0,
        p99Steady: first.p99 ? last.p99 <= 1.5 * first.p99 : true,
        memoryFlat: growth <= 0.1,
      },
      firstErrors: errors.slice(0, 10),
      appErrors,
      byKind: Object.fromEntries(
        [...new Set(samples.map((s) => s.kind))].map((k) => {
          const ms = samples.filter((s) => s.kind === k).map((s) => s.ms).sort((a, b) => a - b);
          return [k, { n: ms.length, p50: Math.round(percentile(ms, 50)), p99: Math.round(percentile(ms, 99)) }];
        }),
      ),
    };
    writeFileSync(path.join(stack.dataDir, 'report.json'), JSON.stringify(report, null, 2));
    console.log('\nminute  requests  errors  p50 ms  p99 ms  app RSS MB  heap after GC MB  full GCs');
    for (const m of minutes) {
      console.log(
        `${String(m.minute).padStart(6)}  ${String(m.requests).padStart(8)}  ${String(m.errors).padStart(6)}  ${String(m.p50).padStart(6)}  ${String(m.p99).padStart(6)}  ${String(m.rssMb ?? '-').padStart(10)}  ${String(m.heapAfterGcMb ?? '-').padStart(16)}  ${String(m.fullGcs).padStart(8)}`,
      );
    }
    console.log(`\nby kind: ${JSON.stringify(report.byKind)}`);
    console.log(`${report.sessions} sessions, ${report.entries} entries written to`);
    console.log(
      `errors ${report.errors} · p99 last/first ${report.p99Ratio} · memory growth after warm-up (minute ${WARMUP + 1} on) ${report.memoryGrowthAfterWarmup} % by ${report.memoryJudgedBy} (RSS ${report.rssGrowthAfterWarmup} %)`,
    );
    console.log(`goals: ${JSON.stringify(report.goals)}${report.firstErrors.length ? `\nfirst errors:\n  ${report.firstErrors.join('\n  ')}` : ''}`);
    if (appErrors.length) console.log(`the app's error lines:\n  ${appErrors.slice(0, 10).join('\n  ')}`);
    console.log(`report: ${path.join(stack.dataDir, 'report.json')}`);
  } finally {
    await stopAll();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
