import { test, expect, type Page } from '@playwright/test';

// The reader's entry page is rendered on the server: none of the editor's JavaScript reaches it. The
// marker is a class name the editor's view library writes into its own code; the builder's edit page,
// which does load the editor, shows that the check can see it.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const EDITOR_MARKER = 'ProseMirror-hideselection';

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

async function firstHref(page: Page, path: string, pattern: RegExp): Promise<string> {
  await page.goto(path);
  const hrefs = await page.locator('a[href]').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
  const href = hrefs.find((h) => pattern.test(h));
  expect(href, `a link matching ${pattern} on ${path}`).toBeTruthy();
  return href!;
}

test('the reader’s entry page loads no editor code; the edit page does', async ({ page, browser }) => {
  test.setTimeout(120_000);
  const sessionPath = await firstHref(page, `/logs/${SLUG}`, new RegExp(`^/logs/${SLUG}/sessions/\\d+$`));
  const entryPath = await firstHref(page, sessionPath, new RegExp(`^/logs/${SLUG}/entries/\\d+`));
  const entryId = entryPath.match(/entries\/(\d+)/)![1];

  const readerScripts = await scriptsOf(page, entryPath);
  expect(readerScripts.length).toBeGreaterThan(0);
  expect(readerScripts.filter((s) => s.text.includes(EDITOR_MARKER)).map((s) => s.url)).toEqual([]);

  const builder = await (await browser.newContext()).newPage();
  await builder.goto('/sign-in');
  await builder.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await builder.getByLabel('Password').fill('shop-demo-2026');
  await builder.getByRole('button', { name: 'Sign in' }).click();
  await expect(builder.getByTestId('signed-in-as')).toBeVisible();
  const editorScripts = await scriptsOf(builder, `/projects/${SLUG}/entries/${entryId}/edit`);
  expect(editorScripts.some((s) => s.text.includes(EDITOR_MARKER))).toBe(true);
});
