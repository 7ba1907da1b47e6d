/**
 * Reading benchmark: throughput, SQL per render, first-load JS and phone-profile layout shift / seek time
 * of the public pages, against a server started by tests/bench/pages.sh (npm run bench:pages) on the
 * scale data set of tests/bench/scale-seed.ts. Prints one table and writes it as JSON.
 *
 * Environment (set by pages.sh): BENCH_BASE_URL, BENCH_SQL_LOG (the server's SCRIBELINE_SQL_LOG file),
 * BENCH_DIST_DIR (the build folder), BENCH_OUT (JSON file), BENCH_DURATION (seconds per page, default 8), BENCH_WARMUP
 * (seconds of load on each page, the static file too, before it is measured: default 3).
 */
import { mkdirSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import autocannon from 'autocannon';
import { chromium, type Browser } from 'playwright-core';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../db/seeders/demo-accounts';
import { CHROMIUM_ARGS, PHONE, clsOf as phoneCls, fetchBytes as get, firstLoadJs as scriptsOf, seekTime as phoneSeek, sleep } from './page-metrics';

// ---- Paths of the pages measured: change them here when a route moves. ----
const ROUTES = {
  home: () => '/',
  project: (slug: string) => `/logs/${slug}`,
  session: (slug: string, sessionId: number) => `/logs/${slug}/sessions/${sessionId}`,
  entry: (slug: string, entryId: number) => `/logs/${slug}/entries/${entryId}`,
  profile: (handle: string) => `/builders/${handle}`,
  fits: () => '/fits',
  calculator: () => '/calculators/tap-drill',
  signIn: () => '/sign-in',
  staticChunk: (file: string) => `/_next/static/chunks/${file}`,
};

// ---- The issue's targets, reported beside the figures. ----
const TARGETS = {
  signedOutEntryThroughput: 0.4, // × the static file's req/s
  signedOutEntryP99: 5, // × the static file's p99
  signedInEntryThroughput: 0.1,
  sqlSignedIn: 6, // queries per render of a signed-in user, any page
  sqlCachedSignedOut: 0,
  firstLoadJsKb: 130, // gzip, every public page
};

const CONNECTIONS = 32;

const BASE = process.env.BENCH_BASE_URL ?? 'http://127.0.0.1:3408';
const SQL_LOG = process.env.BENCH_SQL_LOG ?? '';
const DIST = process.env.BENCH_DIST_DIR ?? '.next-bench';
const OUT = process.env.BENCH_OUT ?? '.data/bench-pages.json';
const DURATION = Number(process.env.BENCH_DURATION ?? 8);
const WARMUP = Number(process.env.BENCH_WARMUP ?? 3);
/** The static file to compare with: pages.sh serves a copy of the heavy entry's HTML; without it, the build's chunk nearest in size. */
const STATIC_PATH = process.env.BENCH_STATIC_PATH || null;
const MANIFEST = JSON.parse(readFileSync(path.join(__dirname, '..', '..', '.data', 'bench-scale.json'), 'utf8')) as {
  builderHandle: string; projectSlug: string; sessionId: number; entryId: number; noteMs: number[]; scale: Record<string, number>;
};

/** open: next.config.mjs rewrites a signed-out reader (and a member outside every circle) of this page to the copy cached for everyone (app/(open)/open). */
type Page = { key: string; label: string; path: string; signedIn: boolean; public: boolean; open?: boolean };

const m = MANIFEST;
const PAGES: Page[] = [
  { key: 'entry-out', label: 'heavy entry, signed out', path: ROUTES.entry(m.projectSlug, m.entryId), signedIn: false, public: true, open: true },
  { key: 'entry-in', label: 'heavy entry, follower', path: ROUTES.entry(m.projectSlug, m.entryId), signedIn: true, public: false },
  { key: 'project', label: 'its project', path: ROUTES.project(m.projectSlug), signedIn: false, public: true, open: true },
  { key: 'session', label: 'its session', path: ROUTES.session(m.projectSlug, m.sessionId), signedIn: false, public: true, open: true },
  { key: 'home', label: 'home', path: ROUTES.home(), signedIn: false, public: true, open: true },
  { key: 'fits', label: 'fits look-up', path: ROUTES.fits(), signedIn: false, public: true },
  { key: 'calculator', label: 'tap-drill calculator', path: ROUTES.calculator(), signedIn: false, public: true },
  { key: 'profile', label: `big builder's profile`, path: ROUTES.profile(m.builderHandle), signedIn: false, public: true, open: true },
];

type Load = { reqPerSec: number; p50Ms: number; p99Ms: number; non2xx: number; errors: number; timeouts: number };
type Row = {
  key: string; label: string; path: string; signedIn: boolean; htmlBytes: number | null;
  load: Load; reqPerSecVsStatic: number; p99VsStatic: number;
  /** signedIn: the follower (the shared copy on log pages); own: a builder, given their own copy. */
  sql: { signedOutFirst: number; signedOutAgain: number; signedIn: number; own: number } | null;
  /** Next's x-nextjs-cache answer to a repeated request, signed out and signed in (null: no such header, rendered for the request). */
  cache: { signedOut: string | null; signedIn: string | null } | null;
  firstLoadJsGzipKb: number | null; scripts: number | null; cls: number | null; phoneLoadMs: number | null;
};

async function expectOkWith(p: string, cookie?: string): Promise<{ body: Buffer; cache: string | null }> {
  const r = await get(BASE + p, cookie);
  if (r.status !== 200) throw new Error(`${p} answered ${r.status}${cookie ? ' (signed in)' : ''}: the benchmark needs every page to render`);
  return { body: r.body, cache: r.headers.get('x-nextjs-cache') };
}

const expectOk = async (p: string, cookie?: string) => (await expectOkWith(p, cookie)).body;

const sqlLines = () => (SQL_LOG ? readFileSync(SQL_LOG, 'utf8').split('\n').filter(Boolean).length : NaN);

/** Queries the server logged for one request made alone (with a pause for anything it does after answering), and its x-nextjs-cache. */
async function sqlFor(p: string, cookie?: string): Promise<{ queries: number; cache: string | null }> {
  await sleep(300);
  const before = sqlLines();
  const { cache } = await expectOkWith(p, cookie);
  await sleep(500);
  return { queries: sqlLines() - before, cache };
}

async function firstLoadJs(html: string): Promise<{ kb: number; scripts: number }> {
  const js = await scriptsOf(html, BASE);
  return { kb: js.kb, scripts: js.scripts.length };
}

function load(p: string, cookie?: string, duration = DURATION): Promise<Load> {
  return new Promise((resolve, reject) => {
    autocannon(
      // A slow page still counts: answers up to 30 s late are waited for, not dropped as timeouts.
      { url: BASE + p, connections: CONNECTIONS, duration, timeout: 30, headers: cookie ? { cookie } : {} },
      (err, r) => {
        if (err) return reject(err);
        resolve({ reqPerSec: r.requests.total / r.duration, p50Ms: r.latency.p50, p99Ms: r.latency.p99, non2xx: r.non2xx, errors: r.errors, timeouts: r.timeouts });
      },
    );
  });
}

/** A file from the build's static folder about as large as the heavy entry's HTML, served by the same server (when no copy of the page is served). */
function staticFileNear(bytes: number): string {
  const dir = path.join(DIST, 'static', 'chunks');
  const files = readdirSync(dir).filter((f) => f.endsWith('.js')).map((f) => ({ f, size: statSync(path.join(dir, f)).size }));
  files.sort((a, b) => Math.abs(a.size - bytes) - Math.abs(b.size - bytes));
  if (!files[0]) throw new Error(`No static chunks in ${dir}`);
  return files[0].f;
}

/**
 * A demo member's cookies after signing in through the form: the session, and the scribeline-copy cookie the
 * form has asked for — 'shared' for the follower (in no project's circle), 'own' for the builder.
 */
async function signInCookie(browser: Browser, follower: (typeof DEMO_ACCOUNTS)[number], expected: 'shared' | 'own'): Promise<string> {
  const context = await browser.newContext({ baseURL: BASE });
  const page = await context.newPage();
  await page.goto(ROUTES.signIn());
  await page.getByLabel('E-mail').fill(follower.email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  for (let i = 0; i < 120; i++) {
    const cookies = await context.cookies();
    const session = cookies.find((x) => x.name.endsWith('next-auth.session-token'));
    const copy = cookies.find((x) => x.name === 'scribeline-copy');
    if (session && copy) {
      await context.close();
      if (copy.value !== expected) throw new Error(`${follower.email} was given scribeline-copy=${copy.value}, not ${expected}`);
      return `${session.name}=${session.value}; ${copy.name}=${copy.value}`;
    }
    await sleep(250);
  }
  throw new Error(`Signing in as ${follower.email} through ${ROUTES.signIn()} gave no session cookie and scribeline-copy cookie`);
}

const clsOf = (browser: Browser, p: string) => phoneCls(browser, BASE, p);

/** The note at 60 % of the heavy clip's notes, clicked on the phone profile (see seekTime in page-metrics.ts). */
function seekTime(browser: Browser, p: string) {
  const noteIndex = Math.floor(m.noteMs.length * 0.6);
  return phoneSeek(browser, BASE, p, noteIndex, m.noteMs[noteIndex]! / 1000);
}

const fmt = (n: number | null | undefined, digits = 0) => (n === null || n === undefined || Number.isNaN(n) ? '–' : n.toFixed(digits));

async function main(): Promise<void> {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  try {
    const cookie = await signInCookie(browser, DEMO_ACCOUNTS[1], 'shared');
    // A builder reads their own copy of every log page, rendered for them: their SQL per render is counted too.
    const ownCookie = await signInCookie(browser, DEMO_ACCOUNTS[0], 'own');
    // 1. SQL per render, each request alone, before any load: signed out twice (the second should be a cache hit:
    //    next.config.mjs rewrites a signed-out log page to its cached copy), then the follower and the builder
    //    twice each (the second counted).
    const sql = new Map<string, Row['sql']>();
    const cache = new Map<string, Row['cache']>();
    const html = new Map<string, Buffer>();
    for (const pg of PAGES.filter((x) => !x.signedIn)) {
      const signedOutFirst = await sqlFor(pg.path);
      const signedOutAgain = await sqlFor(pg.path);
      await sqlFor(pg.path, cookie);
      const signedIn = await sqlFor(pg.path, cookie);
      await sqlFor(pg.path, ownCookie);
      const own = await sqlFor(pg.path, ownCookie);
      sql.set(pg.path, { signedOutFirst: signedOutFirst.queries, signedOutAgain: signedOutAgain.queries, signedIn: signedIn.queries, own: own.queries });
      cache.set(pg.path, { signedOut: signedOutAgain.cache, signedIn: signedIn.cache });
      html.set(pg.path, await expectOk(pg.path));
    }
    // Sized after the SQL counts, so the signed-out entry's first render is counted as a first.
    const entryHtml = html.get(PAGES[0]!.path)!;
    const staticPath = STATIC_PATH ?? ROUTES.staticChunk(staticFileNear(entryHtml.length));
    const staticBytes = (await expectOk(staticPath)).length;
    // The signed-in follower reads the copy cached for everyone (their corner and controls come from their
    // browser): it must be a cache hit and name no one signed in.
    const entryPath = PAGES[0]!.path;
    const followerRead = await expectOkWith(entryPath, cookie);
    const followerName = DEMO_ACCOUNTS[1].name;
    if (followerRead.cache !== 'HIT') throw new Error(`The follower's entry page answered x-nextjs-cache: ${followerRead.cache}: not the shared copy`);
    if (followerRead.body.toString('utf8').includes(followerName) || html.get(entryPath)!.toString('utf8').includes(followerName)) {
      throw new Error(`An entry page cached for everyone names ${followerName}: a viewer's copy was stored`);
    }

    // 2. First-load JS of each page's HTML, gzip.
    const js = new Map<string, { kb: number; scripts: number }>();
    for (const [p, body] of html) js.set(p, await firstLoadJs(body.toString('utf8')));

    // 3. Phone profile (before any load, on an idle server): CLS on each public page, and the note-to-seek time on the heavy entry.
    console.error('› phone profile (CPU ×4, 150 ms, 1.6 Mbps)');
    const cls = new Map<string, Awaited<ReturnType<typeof clsOf>>>();
    for (const pg of PAGES.filter((x) => x.public)) {
      cls.set(pg.path, await clsOf(browser, pg.path));
      console.error(`  ${pg.label}: CLS ${fmt(cls.get(pg.path)!.cls, 3)}, load event at ${fmt(cls.get(pg.path)!.loadMs)} ms`);
    }
    const seek = await seekTime(browser, PAGES[0]!.path);
    console.error(`  note-to-seek: ${seek.ms} ms after DOMContentLoaded, ${fmt(seek.fromInteractiveMs)} ms after the clip went live`);

    // 4. Throughput at 32 connections, the static file first, then each page.
    // Each one, the static file too, under the same load for WARMUP seconds first (the server's compiler has then
    // optimized that page's path, as it has for a page read all day), then measured.
    console.error(`› autocannon: ${CONNECTIONS} connections, ${DURATION} s per page after ${WARMUP} s of warm-up`);
    const warm = (p: string, c?: string) => (WARMUP > 0 ? load(p, c, WARMUP).catch(() => undefined) : Promise.resolve(undefined));
    await warm(staticPath);
    const staticLoad = await load(staticPath);
    const loads = new Map<string, Load>();
    for (const pg of PAGES) {
      const c = pg.signedIn ? cookie : undefined;
      await expectOk(pg.path, c);
      await warm(pg.path, c);
      loads.set(pg.key, await load(pg.path, c));
      console.error(`  ${pg.label}: ${fmt(loads.get(pg.key)!.reqPerSec, 1)} req/s`);
    }

    const rows: Row[] = [
      {
        key: 'static', label: 'static file', path: staticPath, signedIn: false, htmlBytes: staticBytes, load: staticLoad,
        reqPerSecVsStatic: 1, p99VsStatic: 1, sql: null, cache: null, firstLoadJsGzipKb: null, scripts: null, cls: null, phoneLoadMs: null,
      },
      ...PAGES.map((pg): Row => {
        const l = loads.get(pg.key)!;
        const s = sql.get(pg.path)!;
        return {
          key: pg.key, label: pg.label, path: pg.path, signedIn: pg.signedIn, htmlBytes: html.get(pg.path)?.length ?? null, load: l,
          reqPerSecVsStatic: l.reqPerSec / staticLoad.reqPerSec,
          p99VsStatic: l.p99Ms / Math.max(staticLoad.p99Ms, 1),
          sql: s,
          cache: cache.get(pg.path) ?? null,
          firstLoadJsGzipKb: pg.signedIn ? null : js.get(pg.path)?.kb ?? null,
          scripts: pg.signedIn ? null : js.get(pg.path)?.scripts ?? null,
          cls: pg.public ? cls.get(pg.path)?.cls ?? null : null,
          phoneLoadMs: pg.public ? cls.get(pg.path)?.loadMs ?? null : null,
        };
      }),
    ];

    const entryOut = rows.find((r) => r.key === 'entry-out')!;
    const entryIn = rows.find((r) => r.key === 'entry-in')!;
    const pageRows = rows.filter((r) => r.sql);
    const openRows = rows.filter((r) => PAGES.find((pg) => pg.key === r.key)?.open);
    const checks = [
      { target: `signed-out entry ≥ ${TARGETS.signedOutEntryThroughput * 100} % of the static file's req/s`, value: `${fmt(entryOut.reqPerSecVsStatic * 100, 1)} %`, met: entryOut.reqPerSecVsStatic >= TARGETS.signedOutEntryThroughput },
      { target: `signed-out entry p99 ≤ ${TARGETS.signedOutEntryP99}× the static file's`, value: `${fmt(entryOut.p99VsStatic, 1)}×`, met: entryOut.p99VsStatic <= TARGETS.signedOutEntryP99 },
      { target: `signed-in entry ≥ ${TARGETS.signedInEntryThroughput * 100} % of the static file's req/s`, value: `${fmt(entryIn.reqPerSecVsStatic * 100, 1)} %`, met: entryIn.reqPerSecVsStatic >= TARGETS.signedInEntryThroughput },
      { target: `≤ ${TARGETS.sqlSignedIn} SQL queries per signed-in render, any page`, value: `max ${Math.max(...pageRows.map((r) => Math.max(r.sql!.signedIn, r.sql!.own)))}`, met: pageRows.every((r) => Math.max(r.sql!.signedIn, r.sql!.own) <= TARGETS.sqlSignedIn) },
      { target: `${TARGETS.sqlCachedSignedOut} SQL queries for a cached signed-out hit`, value: `max ${Math.max(...pageRows.map((r) => r.sql!.signedOutAgain))}`, met: pageRows.every((r) => r.sql!.signedOutAgain <= TARGETS.sqlCachedSignedOut) },
      { target: `≤ ${TARGETS.firstLoadJsKb} KB gzip first-load JS on every public page`, value: `max ${fmt(Math.max(...pageRows.filter((r) => r.firstLoadJsGzipKb !== null).map((r) => r.firstLoadJsGzipKb!)), 1)} KB`, met: pageRows.every((r) => r.firstLoadJsGzipKb === null || r.firstLoadJsGzipKb <= TARGETS.firstLoadJsKb) },
    ];

    const header = ['page', 'req/s', 'p50 ms', 'p99 ms', '× static req/s', 'p99 × static', 'non-2xx', 'SQL out 1st', 'SQL out again', 'SQL follower', 'SQL builder', 'cache out/in', 'JS gzip KB', 'CLS (phone)', 'load (phone) ms'];
    const lines = rows.map((r) => [
      r.label, fmt(r.load.reqPerSec, 1), fmt(r.load.p50Ms), fmt(r.load.p99Ms), fmt(r.reqPerSecVsStatic, 2), fmt(r.p99VsStatic, 1), String(r.load.non2xx + r.load.errors),
      fmt(r.sql?.signedOutFirst), fmt(r.sql?.signedOutAgain), fmt(r.sql?.signedIn), fmt(r.sql?.own), r.cache ? `${r.cache.signedOut ?? '–'}/${r.cache.signedIn ?? '–'}` : '–', fmt(r.firstLoadJsGzipKb, 1), fmt(r.cls, 3), fmt(r.phoneLoadMs),
    ]);
    const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
    const row = (cells: string[]) => '| ' + cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join(' | ') + ' |';
    console.log(`\nScribeline page benchmark: ${CONNECTIONS} connections, ${DURATION} s per page, ${m.scale.projects} projects / ${m.scale.sessions} sessions`);
    console.log(row(header));
    console.log('| ' + widths.map((w, i) => (i === 0 ? '-'.repeat(w) : '-'.repeat(w - 1) + ':')).join(' | ') + ' |');
    for (const l of lines) console.log(row(l));
    console.log(`\nStatic file: ${staticPath} (${staticBytes} bytes; the heavy entry's HTML is ${entryHtml.length} bytes).`);
    console.log(
      `Phone profile, heavy entry: a click on the note at ${seek.targetS} s had sought the clip ${seek.ms} ms after DOMContentLoaded (${seek.clicks} click${seek.clicks === 1 ? '' : 's'}); ` +
        `the clip was interactive ${fmt(seek.interactiveMs)} ms after DOMContentLoaded and had sought ${fmt(seek.fromInteractiveMs)} ms after that.`,
    );
    console.log(
      `x-nextjs-cache on a repeated request, signed out/signed in: ${openRows.map((r) => `${r.key} ${r.cache!.signedOut ?? 'none'}/${r.cache!.signedIn ?? 'none'}`).join(', ')} ` +
        '(HIT: the whole page from the cache; none: rendered for the request, or a partial prerender whose shell comes from the cache and whose dynamic holes are rendered for each request).',
    );
    console.log('\nTargets:');
    for (const c of checks) console.log(`  ${c.met ? 'met   ' : 'NOT met'}  ${c.target}: ${c.value}`);

    mkdirSync(path.dirname(OUT), { recursive: true });
    writeFileSync(
      OUT,
      JSON.stringify({ at: new Date().toISOString(), base: BASE, connections: CONNECTIONS, durationSeconds: DURATION, phone: PHONE, scale: m.scale, rows, seek, targets: TARGETS, checks }, null, 2),
    );
    console.log(`\nWritten to ${OUT}`);
  } finally {
    await browser.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
