// npm run screenshots: pictures of the main screens for the README, taken from the demo on a running server
// (SCREENSHOT_BASE_URL, default http://127.0.0.1:3000, i.e. `npm start`). Pages are found by following the
// demo's own links, so the pictures stay current as the demo changes. Writes docs/screens/*.png.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Page } from 'playwright-core';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../db/seeders/demo-accounts';

const BASE = (process.env.SCREENSHOT_BASE_URL ?? 'http://127.0.0.1:3000').replace(/\/$/, '');
const OUT = path.join(__dirname, '..', 'docs', 'screens');
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
// Small pictures: one laptop-sized view each, not the whole page.
const VIEW = { width: 1100, height: 720 };

async function settle(page: Page, url: string): Promise<void> {
  const res = await page.goto(url, { waitUntil: 'networkidle' });
  if (!res || !res.ok()) throw new Error(`${url} answered ${res?.status() ?? 'nothing'}`);
  await page.evaluate(() => document.fonts.ready);
}

/** `ready`: wait for it; `top`: scroll so it starts near the top of the picture. */
async function shot(page: Page, name: string, url: string, opts: { ready?: string; top?: string } = {}): Promise<void> {
  await settle(page, url);
  if (opts.ready) await page.locator(opts.ready).first().waitFor();
  if (opts.top) {
    await page.locator(opts.top).first().evaluate((el) => window.scrollTo(0, el.getBoundingClientRect().top + window.scrollY - 24));
    await page.waitForTimeout(300);
  }
  const file = path.join(OUT, `${name}.png`);
  await page.screenshot({ path: file });
  console.log(`${file}  ←  ${url}`);
}

/** The first link on the page whose path matches, as a path. */
async function firstLink(page: Page, pattern: RegExp): Promise<string> {
  const hrefs = await page.locator('a[href]').evaluateAll((links) => links.map((a) => a.getAttribute('href') ?? ''));
  const found = hrefs.find((h) => pattern.test(h));
  if (!found) throw new Error(`No link matching ${pattern} on ${page.url()}`);
  return found.split('#')[0];
}

async function main(): Promise<void> {
  mkdirSync(OUT, { recursive: true });
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  try {
    const reader = await browser.newPage({ viewport: VIEW, baseURL: BASE, colorScheme: 'light' });
    await shot(reader, '1-home', '/');
    const log = await firstLink(reader, /^\/logs\/[^/]+$/);
    await shot(reader, '2-timeline', log, { top: 'h2:text-is("Shop sessions")' });

    // The entry with a clip: its page has a player with the builder's notes.
    const entries = await reader.locator(`a[href^="${log}/entries/"]`).evaluateAll((links) => [...new Set(links.map((a) => (a.getAttribute('href') ?? '').split(/[?#]/)[0]))]);
    let clipEntry = entries[0];
    for (const e of entries) {
      await settle(reader, e);
      if ((await reader.locator('video').count()) > 0) {
        clipEntry = e;
        break;
      }
    }
    if (!clipEntry) throw new Error(`No entries on ${log}`);
    await shot(reader, '3-entry-with-clip', clipEntry, { ready: 'video', top: 'video' });
    await shot(reader, '4-measurements', `${log}/measurements`);
    await shot(reader, '5-fits', '/fits?q=25+H7%2Fg6');

    // The builder's side: the editor of the same entry.
    const builder = DEMO_ACCOUNTS.find((a) => a.role === 'builder');
    if (!builder) throw new Error('No demo builder');
    const own = await browser.newPage({ viewport: VIEW, baseURL: BASE, colorScheme: 'light' });
    await settle(own, '/sign-in');
    await own.getByLabel('E-mail').fill(builder.email);
    await own.getByLabel('Password').fill(DEMO_PASSWORD);
    await own.getByRole('button', { name: 'Sign in' }).click();
    await own.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const slug = log.split('/')[2];
    const entryId = clipEntry.split('/')[4];
    await shot(own, '6-project-log', `/projects/${slug}/log`);
    await shot(own, '7-entry-editor', `/projects/${slug}/entries/${entryId}/edit`, { ready: '[data-save-state]', top: '[data-entry-editor]' });
  } finally {
    await browser.close();
  }
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
