/**
 * What the page benchmarks measure in a browser or from a page's HTML, shared by tests/bench/pages.bench.ts
 * (npm run bench:pages) and tests/bench/bundle.bench.ts (npm run bench:bundle): first-load JS, layout shift
 * and the note-to-seek time on a mid-range phone profile.
 */
import { gzipSync } from 'node:zlib';
import type { Browser } from 'playwright-core';

// A mid-range phone: CPU slowed 4×, 150 ms latency, 1.6 Mbps down (750 kbps up).
export const PHONE = { cpuSlowdown: 4, latencyMs: 150, downBytesPerSec: 1.6e6 / 8, upBytesPerSec: 750e3 / 8 };
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function fetchBytes(url: string, cookie?: string): Promise<{ status: number; body: Buffer; headers: Headers }> {
  const res = await fetch(url, { headers: cookie ? { cookie } : {}, redirect: 'manual' });
  return { status: res.status, body: Buffer.from(await res.arrayBuffer()), headers: res.headers };
}

export type FirstLoadJs = { kb: number; scripts: { src: string; gzipKb: number }[] };

/**
 * First-load JS of a page: the gzip size of every `<script src>` in its HTML, each counted once. A `nomodule`
 * script (the framework's polyfills for browsers without modules) is left out: a browser that runs modules
 * never downloads it.
 */
export async function firstLoadJs(html: string, base: string): Promise<FirstLoadJs> {
  const srcs = new Set<string>();
  for (const match of html.matchAll(/<script\b([^>]*?)\ssrc="([^"]+)"([^>]*)>/g)) {
    if (/\snomodule\b/i.test(`${match[1]} ${match[3]}`)) continue;
    srcs.add(match[2]!.replace(/&amp;/g, '&'));
  }
  const scripts: FirstLoadJs['scripts'] = [];
  for (const src of srcs) scripts.push({ src, gzipKb: gzipSync((await fetchBytes(new URL(src, base).toString())).body).length / 1024 });
  return { kb: scripts.reduce((sum, s) => sum + s.gzipKb, 0), scripts };
}

/** Layout shift as the web's CLS: the largest session window (gaps under 1 s, at most 5 s) of shifts without recent input. */
const CLS_SCRIPT = `
  window.__cls = 0;
  (() => {
    let win = 0, first = 0, last = 0;
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) {
        if (e.hadRecentInput) continue;
        if (win && e.startTime - last < 1000 && e.startTime - first < 5000) { win += e.value; } else { win = e.value; first = e.startTime; }
        last = e.startTime;
        window.__cls = Math.max(window.__cls, win);
      }
    }).observe({ type: 'layout-shift', buffered: true });
  })();
`;

export async function phonePage(browser: Browser, base: string) {
  const context = await browser.newContext({ baseURL: base, viewport: { width: 412, height: 915 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  await context.addInitScript(CLS_SCRIPT);
  const page = await context.newPage();
  const cdp = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: PHONE.latencyMs, downloadThroughput: PHONE.downBytesPerSec, uploadThroughput: PHONE.upBytesPerSec });
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: PHONE.cpuSlowdown });
  page.setDefaultTimeout(120_000);
  return { context, page };
}

/** CLS after the load event (or 60 s, whichever comes first) and 3 s more; with the page's own load timings. */
export async function clsOf(browser: Browser, base: string, p: string): Promise<{ cls: number; domContentLoadedMs: number | null; loadMs: number | null }> {
  const { context, page } = await phonePage(browser, base);
  try {
    await page.goto(p, { waitUntil: 'domcontentloaded', timeout: 180_000 });
    await page.waitForLoadState('load', { timeout: 60_000 }).catch(() => undefined);
    await sleep(3_000);
    const timing = (await page.evaluate(
      `(() => { const n = performance.getEntriesByType('navigation')[0]; return n ? [n.domContentLoadedEventEnd, n.loadEventEnd] : [0, 0]; })()`,
    )) as [number, number];
    const ms = (v: number) => (v > 0 ? Math.round(v) : null);
    return { cls: (await page.evaluate('window.__cls')) as number, domContentLoadedMs: ms(timing[0]), loadMs: ms(timing[1]) };
  } finally {
    await context.close();
  }
}

export type SeekTime = {
  /** From DOMContentLoaded to the clip having sought to the note's moment. */
  ms: number;
  clicks: number;
  targetS: number;
  /** When the clip's workbench became interactive (hydrated, `data-live`), after DOMContentLoaded; null on a page without the mark. */
  interactiveMs: number | null;
  /** From that moment to the seek, with the first click made as soon as the workbench was live. */
  fromInteractiveMs: number | null;
};

/**
 * A click on a timestamped note on a phone. Where the clip's workbench marks itself live (`data-live`), the
 * note is clicked as soon as it is; elsewhere a click is made every half second from DOMContentLoaded until
 * one takes. The page's own clock records when the workbench went live and when the video had sought.
 */
export async function seekTime(browser: Browser, base: string, p: string, noteIndex: number, targetS: number): Promise<SeekTime> {
  const { context, page } = await phonePage(browser, base);
  await context.addInitScript(`
    window.__seek = { live: null, done: null };
    (() => {
      const poll = () => {
        if (document.querySelector('[data-clip-workbench][data-live]')) window.__seek.live = performance.now();
        else setTimeout(poll, 10);
      };
      document.addEventListener('DOMContentLoaded', poll);
      document.addEventListener('seeked', (e) => {
        const v = e.target;
        if (window.__seek.done === null && Math.abs(v.currentTime - ${targetS}) < 0.05) window.__seek.done = performance.now();
      }, true);
    })();
  `);
  try {
    await page.goto(p, { waitUntil: 'domcontentloaded', timeout: 180_000 });
    const started = Date.now();
    // The note's own seek button: the first in its row (a row may hold more, such as a flag's marker).
    const button = page.locator('[data-note-id]').nth(noteIndex).locator('button').first();
    const marked = await page
      .waitForFunction('window.__seek.live !== null', null, { timeout: 60_000, polling: 20 })
      .then(() => true, () => false);
    let clicks = 0;
    while (Date.now() - started < 120_000) {
      await button.click();
      clicks++;
      // Sought: the clip's own `seeked` event at the note's moment (recorded above). Not the clip's position now: a note
      // plays on from its moment, so by the next poll the position may be past it and the click looked lost.
      const ok = await page
        .waitForFunction('window.__seek.done !== null', null, { timeout: marked ? 10_000 : 500, polling: 20 })
        .then(() => true, () => false);
      if (!ok) continue;
      const [dcl, live, done] = (await page.evaluate(
        `(() => { const n = performance.getEntriesByType('navigation')[0]; return [n ? n.domContentLoadedEventEnd : 0, window.__seek.live, window.__seek.done]; })()`,
      )) as [number, number | null, number | null];
      return {
        ms: done !== null ? Math.round(done - dcl) : Date.now() - started,
        clicks,
        targetS,
        interactiveMs: live !== null ? Math.round(live - dcl) : null,
        fromInteractiveMs: live !== null && done !== null ? Math.round(done - live) : null,
      };
    }
    throw new Error(`The clip on ${p} never reached ${targetS} s after clicking its note`);
  } finally {
    await context.close();
  }
}
