import { test, expect, type Browser, type Page } from '@playwright/test';

// The reader's entry page is rendered on the server: none of the editor's JavaScript reaches it. The
// marker is a class name the editor's view library writes into its own code; the builder's edit page,
// which does load the editor, shows that the check can see it.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const EDITOR_MARKER = 'ProseMirror-hideselection';
// Strings the player library and the query library keep in their built code: react-player names its
// component, TanStack Query's provider hook explains a missing client.
const PLAYER_MARKER = '"ReactPlayer"';
const QUERY_MARKER = 'No QueryClient set';
// The validation library's English messages (zod's locale), which come with every form of the site.
const VALIDATION_MARKER = 'Invalid input';

/** A page of its own, signed in as the demo's builder. */
async function demoBuilder(browser: Browser): Promise<Page> {
  const builder = await (await browser.newContext()).newPage();
  await builder.goto('/sign-in');
  await builder.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await builder.getByLabel('Password').fill('shop-demo-2026');
  await builder.getByRole('button', { name: 'Sign in' }).click();
  await expect(builder.getByTestId('signed-in-as')).toBeVisible();
  return builder;
}

/** Every script the page loads, with its text (the page's own and what hydration asks for; media may keep streaming). */
async function scriptsOf(page: Page, path: string): Promise<{ url: string; text: string }[]> {
  const pending: Promise<{ url: string; text: string } | null>[] = [];
  page.on('response', (res) => {
    if (res.request().resourceType() === 'script') pending.push(res.text().then((text) => ({ url: res.url(), text })).catch(() => null));
  });
  await page.goto(path, { waitUntil: 'load' });
  await page.waitForTimeout(1_500);
  return (await Promise.all(pending)).filter((s): s is { url: string; text: string } => s !== null);
}

/** Chunks the loaded scripts name (loaded on demand, e.g. through next/dynamic) that the page itself did not load. */
async function chunksNotLoaded(page: Page, loaded: { url: string; text: string }[]): Promise<{ url: string; text: string }[]> {
  const have = new Set(loaded.map((s) => new URL(s.url).pathname));
  const named = new Set<string>();
  for (const s of loaded) for (const m of s.text.matchAll(/static\/chunks\/[\w.-]+\.js/g)) named.add(`/_next/${m[0]}`);
  const out: { url: string; text: string }[] = [];
  for (const p of named) {
    if (have.has(p)) continue;
    const res = await page.request.get(p);
    if (res.ok()) out.push({ url: p, text: await res.text() });
  }
  return out;
}

test('the reader’s entry page loads no editor, player or query library code; the edit page loads the editor and the query library', async ({ page, browser }) => {
  test.setTimeout(120_000);
  // The seeded entry with a clip ("Turning the spigot toward size", a 12 s upload with notes).
  await page.goto(`/logs/${SLUG}`);
  const entryPath = (await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().getAttribute('href'))!;
  expect(entryPath).toMatch(new RegExp(`^/logs/${SLUG}/entries/\\d+`));
  const entryId = entryPath.match(/entries\/(\d+)/)![1];

  const readerScripts = await scriptsOf(page, entryPath);
  expect(readerScripts.length).toBeGreaterThan(0);
  expect(readerScripts.filter((s) => s.text.includes(EDITOR_MARKER)).map((s) => s.url)).toEqual([]);

  // Nor the player library or the query library before the reader does anything: the uploaded clip plays in
  // the browser's own element, and the comments, notes and flags come with the page.
  expect(readerScripts.filter((s) => s.text.includes(PLAYER_MARKER)).map((s) => s.url)).toEqual([]);
  expect(readerScripts.filter((s) => s.text.includes(QUERY_MARKER)).map((s) => s.url)).toEqual([]);
  await expect(page.locator('[data-clip-workbench][data-live] video')).toHaveCount(1);
  // The player library is there on demand (for a clip on a video site): one of the chunks the page's
  // scripts can load holds it, which also shows the check can see it.
  expect((await chunksNotLoaded(page, readerScripts)).some((s) => s.text.includes(PLAYER_MARKER))).toBe(true);
  // Nor, among the scripts the page itself names, the forms' validation: a signed-out reader is shown no form
  // (comment, report, hide, flag), and each form with its checks loads when it is shown — among the chunks
  // the page can load on demand. (Once the page is idle, the router may fetch the code of pages it links to,
  // some of which have forms: that is not this page's load.)
  const html = await (await page.request.get(entryPath)).text();
  const named = new Set([...html.matchAll(/<script src="([^"]+\.js)"(?![^>]*noModule)/g)].map((m) => m[1]));
  expect(named.size).toBeGreaterThan(3);
  const firstLoad = readerScripts.filter((s) => named.has(new URL(s.url).pathname));
  expect(firstLoad.length).toBe(named.size);
  expect(firstLoad.filter((s) => s.text.includes(VALIDATION_MARKER)).map((s) => s.url)).toEqual([]);
  expect((await chunksNotLoaded(page, firstLoad)).some((s) => s.text.includes(VALIDATION_MARKER))).toBe(true);

  const builder = await demoBuilder(browser);
  const editorScripts = await scriptsOf(builder, `/projects/${SLUG}/entries/${entryId}/edit`);
  expect(editorScripts.some((s) => s.text.includes(EDITOR_MARKER))).toBe(true);
  // The edit page's uploads and clips keep their lists in TanStack Query: the check can see that library too.
  expect(editorScripts.some((s) => s.text.includes(QUERY_MARKER))).toBe(true);
});

// Messages only one engine file holds: lib/calculators/indexing.ts (a differential set-up) and threads.ts (a
// high percentage of thread).
const INDEXING_MARKER = 'Add idler gears to get the plate turning the right way';
const THREADS_MARKER = 'is hard to tap: the tap works much harder';

/** Whether any of these scripts holds the marker. */
const has = (scripts: string[], marker: string) => scripts.some((text) => text.includes(marker));

/** The scripts a page's HTML names (its first load), with their text. */
async function firstLoadOf(page: Page, path: string): Promise<string[]> {
  const html = await (await page.request.get(path)).text();
  const named = [...new Set([...html.matchAll(/<script src="([^"]+\.js)"(?![^>]*noModule)/g)].map((m) => m[1]))];
  expect(named.length).toBeGreaterThan(3);
  return Promise.all(named.map(async (src) => (await page.request.get(src)).text()));
}

test('each tool page loads its own code only: a calculator no other calculator’s engine, the fits page no validation library', async ({ page }) => {
  const indexing = await firstLoadOf(page, '/calculators/indexing');
  expect(has(indexing, INDEXING_MARKER)).toBe(true); // the check can see an engine
  expect(has(indexing, THREADS_MARKER)).toBe(false);
  const tapDrill = await firstLoadOf(page, '/calculators/tap-drill');
  expect(has(tapDrill, THREADS_MARKER)).toBe(true);
  expect(has(tapDrill, INDEXING_MARKER)).toBe(false);
  const boltCircle = await firstLoadOf(page, '/calculators/bolt-circle');
  expect(has(boltCircle, THREADS_MARKER) || has(boltCircle, INDEXING_MARKER)).toBe(false);
  expect(has(await firstLoadOf(page, '/calculators'), THREADS_MARKER)).toBe(false);
  expect(has(await firstLoadOf(page, '/fits'), VALIDATION_MARKER)).toBe(false);
});

// A string only the inch fit tables hold (lib/fits/inch-tables.ts) and one only the record and reading forms
// hold (components/measurements/record-form-fields.tsx).
const FIT_TABLES_MARKER = 'Locational interference fits';
const RECORD_FORM_MARKER = 'Smallest step it reads';

test('a reader of a record page or the measurements loads no form, validation library or fit tables; a builder’s record page does', async ({ page, browser }) => {
  test.setTimeout(120_000);
  const list = await (await page.request.get(`/logs/${SLUG}/measurements`)).text();
  const recordPath = list.match(new RegExp(`/logs/${SLUG}/records/\\d+`))?.[0];
  expect(recordPath).toBeTruthy();
  for (const path of [recordPath!, `/logs/${SLUG}/measurements`]) {
    const scripts = await firstLoadOf(page, path);
    expect(has(scripts, VALIDATION_MARKER), `${path}: validation`).toBe(false);
    expect(has(scripts, FIT_TABLES_MARKER), `${path}: fit tables`).toBe(false);
    expect(has(scripts, RECORD_FORM_MARKER), `${path}: record form`).toBe(false);
  }

  // The builder's copy of the same page: the record's buttons come with it, and "Add a reading" brings the
  // form with its checks (which also shows the checks above can see them).
  const builder = await demoBuilder(browser);
  const loaded: Promise<string>[] = [];
  builder.on('response', (res) => {
    if (res.request().resourceType() === 'script') loaded.push(res.text().catch(() => ''));
  });
  await builder.goto(recordPath!);
  await expect(builder.getByRole('button', { name: 'Edit record' })).toBeVisible();
  await builder.getByRole('button', { name: 'Add a reading' }).click();
  await expect(builder.getByRole('form', { name: 'New reading' })).toHaveAttribute('data-hydrated', 'true');
  const texts = await Promise.all(loaded);
  expect(has(texts, RECORD_FORM_MARKER)).toBe(true);
  expect(has(texts, VALIDATION_MARKER)).toBe(true);
  expect(has(texts, FIT_TABLES_MARKER)).toBe(true);
});

test('the sign-in page loads the validation library once its form is used, and checks with it', async ({ page }) => {
  expect((await firstLoadOf(page, '/sign-in')).some((text) => text.includes(VALIDATION_MARKER))).toBe(false);
  const later: Promise<string>[] = [];
  page.on('response', (res) => {
    if (res.request().resourceType() === 'script') later.push(res.text().catch(() => ''));
  });
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').focus();
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.locator('[data-field-error="email"]')).toContainText('Enter your e-mail address');
  expect((await Promise.all(later)).some((text) => text.includes(VALIDATION_MARKER))).toBe(true);
});

test('no public page’s first load carries the validation library: forms bring it when they are used', async ({ page }) => {
  test.setTimeout(120_000);
  const project = `/logs/${SLUG}`;
  const projectHtml = await (await page.request.get(project)).text();
  const session = projectHtml.match(new RegExp(`/logs/${SLUG}/sessions/\\d+`))?.[0];
  const builder = projectHtml.match(/\/builders\/[\w-]+/)?.[0];
  expect(session && builder).toBeTruthy();
  const pages = [
    '/', project, session!, builder!, `/logs/${SLUG}/measurements`, '/search?q=spigot', '/fits', '/calculators', '/calculators/tap-drill',
    '/sign-in', '/sign-up', '/forgot-password', '/reset-password?token=from-the-e-mail',
  ];
  const carrying: string[] = [];
  for (const path of pages) if ((await firstLoadOf(page, path)).some((text) => text.includes(VALIDATION_MARKER))) carrying.push(path);
  expect(carrying).toEqual([]);
});
