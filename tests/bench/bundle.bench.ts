/**
 * Light pages: first-load JS (gzip of each page's `<script src>`), layout shift on the phone profile and the
 * note-to-seek time of the demo's clip, for every public page, against a server started by
 * tests/bench/bundle.sh (npm run bench:bundle) on the demo data. No scale data and no load: a quick loop
 * for the page weight targets; npm run bench:pages measures the same on the scale data with throughput.
 *
 * Environment (set by bundle.sh): BENCH_BASE_URL, BENCH_OUT (JSON file); BUNDLE_PHONE=0 skips the browser
 * (first-load JS only); BUNDLE_DETAIL=1 lists each page's scripts.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { CHROMIUM_ARGS, PHONE, clsOf, fetchBytes, firstLoadJs, seekTime, type FirstLoadJs, type SeekTime } from './page-metrics';

const BASE = process.env.BENCH_BASE_URL ?? 'http://127.0.0.1:3409';
const OUT = process.env.BENCH_OUT ?? '.data/bench-bundle.json';
const PHONE_RUNS = process.env.BUNDLE_PHONE !== '0';
const DETAIL = process.env.BUNDLE_DETAIL === '1';

// The targets for every public page.
const TARGETS = { firstLoadJsKb: 130, cls: 0.1, seekFromInteractiveMs: 1000 };

// The demo's published project (db/seeders): its pages are found by following its links.
const DEMO_SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';

async function html(p: string): Promise<string> {
  const r = await fetchBytes(BASE + p);
  if (r.status !== 200) throw new Error(`${p} answered ${r.status}: the benchmark needs every page to render`);
  return r.body.toString('utf8');
}

function links(page: string, pattern: RegExp): string[] {
  const found = new Set<string>();
  for (const match of page.matchAll(/<a\b[^>]*?\shref="([^"]+)"/g)) {
    const href = match[1]!.replace(/&amp;/g, '&');
    if (pattern.test(href)) found.add(href);
  }
  return [...found];
}

function first(page: string, pattern: RegExp, where: string): string {
  const href = links(page, pattern)[0];
  if (!href) throw new Error(`No link matching ${pattern} on ${where}`);
  return href;
}

type Target = { label: string; path: string };

/** Every public page kind, with the demo's entry that has a clip (and its note times). */
async function discover(): Promise<{ pages: Target[]; clipEntry: string; noteMs: number[] }> {
  const project = `/logs/${DEMO_SLUG}`;
  const projectHtml = await html(project);
  const sessions = links(projectHtml, new RegExp(`^/logs/${DEMO_SLUG}/sessions/\\d+$`));
  if (!sessions.length) throw new Error(`No session links on ${project}: is the demo seeded?`);
  let clipEntry: { path: string; clipId: number } | null = null;
  for (const s of sessions) {
    for (const e of links(await html(s), new RegExp(`^/logs/${DEMO_SLUG}/entries/\\d+$`))) {
      const m = /data-clip-workbench="(\d+)"/.exec(await html(e));
      if (m) {
        clipEntry = { path: e, clipId: Number(m[1]) };
        break;
      }
    }
    if (clipEntry) break;
  }
  if (!clipEntry) throw new Error(`No entry of ${project} shows a clip`);
  const notes = (await (await fetch(`${BASE}/api/media/${clipEntry.clipId}/notes`)).json()) as { notes: { startMs: number }[] };
  const measurements = `/logs/${DEMO_SLUG}/measurements`;
  const calculators = links(await html('/calculators'), /^\/calculators\/[a-z0-9-]+$/);
  return {
    clipEntry: clipEntry.path,
    noteMs: notes.notes.map((n) => n.startMs).sort((a, b) => a - b),
    pages: [
      { label: 'home', path: '/' },
      { label: 'project', path: project },
      { label: 'session', path: sessions[0]! },
      { label: 'entry with clip', path: clipEntry.path },
      { label: 'measurements', path: measurements },
      { label: 'record', path: first(await html(measurements), new RegExp(`^/logs/${DEMO_SLUG}/records/\\d+`), measurements) },
      { label: 'builder', path: first(projectHtml, /^\/builders\/[^/?#]+$/, project) },
      { label: 'fits', path: '/fits' },
      { label: 'calculators', path: '/calculators' },
      ...calculators.map((c) => ({ label: c.slice('/calculators/'.length), path: c })),
      { label: 'sign in', path: '/sign-in' },
      { label: 'sign up', path: '/sign-up' },
      { label: 'search', path: '/search?q=spigot' },
      { label: 'forgot password', path: '/forgot-password' },
      // The form a reset link opens (the token is checked when the new password is sent).
      { label: 'new password', path: '/reset-password?token=from-the-e-mail' },
    ],
  };
}

const fmt = (n: number | null | undefined, digits = 0) => (n === null || n === undefined || Number.isNaN(n) ? '–' : n.toFixed(digits));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

async function main(): Promise<void> {
  const { pages, clipEntry, noteMs } = await discover();
  const rows: { label: string; path: string; js: FirstLoadJs; cls: number | null; loadMs: number | null }[] = [];
  for (const pg of pages) rows.push({ ...pg, js: await firstLoadJs(await html(pg.path), BASE), cls: null, loadMs: null });

  const seeks: SeekTime[] = [];
  if (PHONE_RUNS) {
    console.error('› phone profile (CPU ×4, 150 ms, 1.6 Mbps)');
    const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
    try {
      for (const row of rows) {
        const c = await clsOf(browser, BASE, row.path);
        row.cls = c.cls;
        row.loadMs = c.loadMs;
        console.error(`  ${row.label}: CLS ${fmt(c.cls, 3)}, load event at ${fmt(c.loadMs)} ms`);
      }
      // The last note that starts after 1 s: far enough into the clip that the seek is a real one.
      const noteIndex = Math.max(0, noteMs.length - 1);
      if (noteMs.length && noteMs[noteIndex]! > 1000) {
        for (let i = 0; i < 3; i++) {
          const s = await seekTime(browser, BASE, clipEntry, noteIndex, noteMs[noteIndex]! / 1000).catch((err: Error) => {
            console.error(`  note-to-seek failed: ${err.message}`);
            return null;
          });
          if (!s) break;
          seeks.push(s);
          console.error(`  note-to-seek: ${s.ms} ms after DOMContentLoaded; live at ${fmt(s.interactiveMs)} ms, sought ${fmt(s.fromInteractiveMs)} ms later`);
        }
      }
    } finally {
      await browser.close();
    }
  }

  const header = ['page', 'path', 'JS gzip KB', 'scripts', 'CLS (phone)', 'load (phone) ms'];
  const lines = rows.map((r) => [r.label, r.path, fmt(r.js.kb, 1), String(r.js.scripts.length), fmt(r.cls, 3), fmt(r.loadMs)]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const row = (cells: string[]) => '| ' + cells.map((c, i) => (i < 2 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join(' | ') + ' |';
  console.log(`\nScribeline light pages: first-load JS and the phone profile (${BASE})`);
  console.log(row(header));
  console.log('| ' + widths.map((w, i) => (i < 2 ? '-'.repeat(w) : '-'.repeat(w - 1) + ':')).join(' | ') + ' |');
  for (const l of lines) console.log(row(l));
  if (DETAIL) {
    for (const r of rows) {
      console.log(`\n${r.label} (${r.path}):`);
      for (const s of [...r.js.scripts].sort((a, b) => b.gzipKb - a.gzipKb)) console.log(`  ${fmt(s.gzipKb, 1).padStart(6)} KB  ${s.src}`);
    }
  }

  const maxJs = Math.max(...rows.map((r) => r.js.kb));
  const checks = [{ target: `≤ ${TARGETS.firstLoadJsKb} KB gzip first-load JS on every public page`, value: `max ${fmt(maxJs, 1)} KB`, met: maxJs <= TARGETS.firstLoadJsKb }];
  if (PHONE_RUNS) {
    const maxCls = Math.max(...rows.map((r) => r.cls ?? 0));
    checks.push({ target: `CLS ≤ ${TARGETS.cls} on every public page (phone)`, value: `max ${fmt(maxCls, 3)}`, met: maxCls <= TARGETS.cls });
    const live = seeks.map((s) => s.fromInteractiveMs).filter((v): v is number => v !== null);
    checks.push({
      target: `a note seeks the clip within ${TARGETS.seekFromInteractiveMs} ms of the page being interactive (phone, median of ${seeks.length})`,
      value: live.length === seeks.length && live.length ? `${median(live)} ms (DOMContentLoaded to seek ${median(seeks.map((s) => s.ms))} ms)` : 'not measured (no data-live mark)',
      met: live.length === seeks.length && live.length > 0 && median(live) <= TARGETS.seekFromInteractiveMs,
    });
  }
  console.log('\nTargets:');
  for (const c of checks) console.log(`  ${c.met ? 'met   ' : 'NOT met'}  ${c.target}: ${c.value}`);

  mkdirSync(path.dirname(OUT), { recursive: true });
  writeFileSync(OUT, JSON.stringify({ at: new Date().toISOString(), base: BASE, phone: PHONE, targets: TARGETS, rows, seeks, checks }, null, 2));
  console.log(`\nWritten to ${OUT}`);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
});
