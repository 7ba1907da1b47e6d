import { test, expect, type Page } from '@playwright/test';
import { signUpAndVerify } from './support/accounts';

// The calculators at the bench: a signed-out visitor works out a tap drill and shares the link; a
// builder saves it into an entry and reopens it from the card. Creates its own builder and log.
const MH_TAP = "Machinery's Handbook tap drill table: M8x1.25 with a 6.8 mm drill ≈ 74 % (73.9 % by % = (8 − 6.8) / (1.299 × 1.25)) — from memory";
const INCH = 'international inch: 6.8 / 25.4 = 0.2677 in';
const stamp = Date.now().toString(36);

/** Opens a calculator and waits until its boxes are wired to React, so typing is not lost to hydration. */
async function open(page: Page, path: string) {
  await page.goto(path);
  await expect(page.locator('form[data-hydrated="true"]')).toBeAttached();
}

// Visible only: a page left by navigation stays in the document, hidden, to come back as it was.
const threadBox = (page: Page) => page.getByLabel('Thread', { exact: true }).filter({ visible: true });

test('signed out: M8x1.25 gives the 6.8 mm drill at about 74 %, the URL keeps it, a bad thread is refused beside the box', async ({ page }) => {
  await open(page, '/calculators/tap-drill');
  await threadBox(page).fill('M8x1.25');

  const choice = page.getByTestId('tap-drill-choice');
  await expect(choice).toContainText('6.8 mm'); // MH_TAP
  await expect(page.getByTestId('tap-drill-percent')).toContainText('73.9 % of thread'); // MH_TAP
  await expect(choice).toContainText('0.2677 in'); // INCH
  await expect(page.getByTestId('best-metric')).toContainText('6.8 mm');
  await expect(page.getByRole('img', { name: /Section through the M8x1\.25 tapped hole: major diameter 8\.000 mm, drilled 6\.800 mm/ })).toBeVisible();
  await expect(page.getByTestId('sources')).toContainText('Tables: version 2026.1');

  // The query follows the boxes, and a reload reopens the same calculation.
  await expect(page).toHaveURL(/\/calculators\/tap-drill\?thread=M8x1\.25$/);
  await page.reload();
  await expect(page.locator('form[data-hydrated="true"]')).toBeAttached();
  await expect(threadBox(page)).toHaveValue('M8x1.25');
  await expect(page.getByTestId('tap-drill-percent')).toContainText('73.9 %');

  // Saving needs an account; the link comes back to this very calculation.
  const signIn = page.getByRole('link', { name: 'Sign in to save this into your log' });
  await expect(signIn).toHaveAttribute('href', '/sign-in?next=%2Fcalculators%2Ftap-drill%3Fthread%3DM8x1.25');

  // A box emptied on purpose stays empty on a reload: that address is the page built ahead, which reads it in the browser.
  await open(page, '/calculators/tap-drill?target=');
  await expect(page.getByLabel('Target percentage of thread').filter({ visible: true })).toHaveValue('');

  // A pitch M8 does not come in: said beside the box, tied to it for screen readers, and nothing crashes.
  await threadBox(page).fill('M8x3');
  const error = page.locator('[data-field-error="thread"]');
  await expect(error).toContainText('M8 comes in 1.25 mm (coarse) or 1 mm, 0.75 mm (fine) pitch here; 3 mm is not one of them.'); // ISO 261 — from memory
  await expect(threadBox(page)).toHaveAttribute('aria-invalid', 'true');
  await expect(threadBox(page)).toHaveAttribute('aria-describedby', 'thread-error');
  await expect(page.getByTestId('tap-drill-choice')).toHaveCount(0);
});

test('a builder saves a tap drill into an entry, sees the card in both units, and reopens it', async ({ page }) => {
  // Sign-up, a log made through the API, the save, the entry page and the calculator again: give it room.
  test.setTimeout(120_000);
  const email = `calc-${stamp}@example.test`;
  const password = 'scribed line 2026';
  // Signed up with a verified address, as every new builder is.
  await signUpAndVerify(page, { name: 'Ines Calder-Voss', email, password });

  const title = `Dividing head stand ${stamp}`;
  const project = await page.request.post('/api/projects', { data: { title, summary: 'A stand for the dividing head.', units: 'mm', visibility: 'published' } });
  expect(project.status()).toBe(201);
  const { project: p } = (await project.json()) as { project: { id: number; slug: string } };
  const session = await page.request.post(`/api/projects/${p.id}/sessions`, { data: { title: 'Tapping the base', heldOn: '2026-11-07', minutesSpent: 60 } });
  expect(session.status()).toBe(201);
  const { session: s } = (await session.json()) as { session: { id: number } };
  const entry = await page.request.post(`/api/sessions/${s.id}/entries`, { data: { title: 'Tapping the four M8 holes', operation: 'tapping' } });
  expect(entry.status()).toBe(201);
  const { entry: e } = (await entry.json()) as { entry: { id: number } };

  try {
    await open(page, '/calculators/tap-drill');
    await threadBox(page).fill('M8x1.25');
    await expect(page.getByTestId('tap-drill-percent')).toContainText('73.9 %'); // MH_TAP
    await page.getByRole('button', { name: 'Save to an entry' }).click();
    const form = page.getByRole('form', { name: 'Save to an entry' });
    await form.getByLabel('Project').selectOption({ label: title });
    await form.getByLabel('Session').selectOption({ label: '1. Tapping the base' });
    await form.getByLabel('Entry').selectOption({ label: 'Tapping the four M8 holes' });
    await expect(form.getByLabel('Label (optional)')).toHaveAttribute('placeholder', 'Tap drill for M8x1.25');
    await form.getByRole('button', { name: 'Save', exact: true }).click();
    const saved = form.locator('[data-notice="success"]');
    await expect(saved).toContainText('“Tap drill for M8x1.25” is now in Tapping the four M8 holes.');

    await saved.getByRole('link', { name: 'Tapping the four M8 holes' }).click();
    await expect(page).toHaveURL(new RegExp(`/logs/${p.slug}/entries/${e.id}$`), { timeout: 30_000 });
    const card = page.getByTestId('saved-calculation').filter({ hasText: 'Tap drill for M8x1.25' });
    await expect(card).toBeVisible();
    await expect(card.getByTestId('saved-inputs')).toContainText('M8x1.25');
    const results = card.getByTestId('saved-results');
    await expect(results).toContainText('6.800 mm'); // MH_TAP
    await expect(results).toContainText('0.2677 in'); // INCH
    await expect(results).toContainText('73.9 % of thread'); // MH_TAP
    await expect(card).toContainText('Tables 2026.1');

    await card.getByTestId('reopen-calculation').click();
    await expect(page).toHaveURL(/\/calculators\/tap-drill\?thread=M8x1\.25$/, { timeout: 30_000 });
    await expect(page.locator('form[data-hydrated="true"]').filter({ visible: true })).toBeAttached();
    await expect(threadBox(page)).toHaveValue('M8x1.25');
    await expect(page.getByTestId('tap-drill-choice').filter({ visible: true })).toContainText('6.8 mm');
  } finally {
    await page.request.delete(`/api/projects/${p.id}`);
  }
});

test('the bolt circle is drawn with one circle per hole, and squares for the midway pattern', async ({ page }) => {
  await open(page, '/calculators/bolt-circle?d=100&holes=6');
  await expect(page.getByRole('img', { name: /Bolt circle drawing: 6 holes/ })).toBeVisible();
  const drawing = page.getByTestId('bolt-circle-drawing');
  await expect(drawing).toBeVisible();
  await expect(drawing.locator('circle[data-hole]')).toHaveCount(6);
  await expect(drawing.locator('[data-midway-hole]')).toHaveCount(0);

  await page.getByLabel('Number of holes').fill('8');
  await expect(drawing.locator('circle[data-hole]')).toHaveCount(8);
  await page.getByLabel('Add a second pattern midway between the holes').check();
  await expect(drawing.locator('rect[data-midway-hole]')).toHaveCount(8);
  await expect(page).toHaveURL(/holes=8&midway=1/);
  // Handbook hole-coordinate table, 8 holes on a unit circle, hole 2 at 45°: x = y = 0.35355 × d — from memory.
  await expect(page.getByTestId('hole-table').locator('[data-row="2"]')).toContainText('35.355');

  await page.getByLabel('Number of holes').fill('1');
  await expect(page.locator('[data-field-error="holes"]')).toContainText('The number of holes must be at least 2.');
});

// Machinery's Handbook, "Differential indexing": 127 divisions on a 40:1 head, indexed as for 120 with
// gears 56 (driver) and 24 (driven), the plate turning against the crank — from memory.
const MH_127 = 'differential indexing of 127: A = 120, gears 56/24';

test('indexing leads with the answer: 127 divisions headline the differential set-up, and 40/127 is not written twice', async ({ page }) => {
  await open(page, '/calculators/indexing?n=127');
  const move = page.getByTestId('indexing-move');
  await expect(move).toContainText('By differential indexing');
  await expect(move).toContainText('Index as for 120'); // MH_127
  await expect(move).toContainText('change gears 56/24'); // MH_127
  await expect(move).toContainText('40/127 crank turns a division');
  await expect(move).not.toContainText('40/127 = 40/127');
  // The answer comes first in the box, the arithmetic after it.
  const text = (await move.innerText()).replace(/\s+/g, ' ');
  expect(text.indexOf('Index as for 120')).toBeLessThan(text.indexOf('40/127'));
  await expect(page.getByTestId('differential')).toBeVisible();

  // 36 divisions: 40/36 = 1 1/9 turn (40 ÷ 36, simple indexing — arithmetic).
  await open(page, '/calculators/indexing?n=36');
  await expect(page.getByTestId('indexing-move')).toContainText('40/36 = 1 1/9 crank turns a division');
});

test('save to an entry: the latest project, session and entry are chosen already, and Save rests after saving', async ({ page }) => {
  test.setTimeout(120_000);
  const email = `calc-latest-${stamp}@example.test`;
  const password = 'scribed line 2026';
  await signUpAndVerify(page, { name: 'Oskar Brede-Lind', email, password });

  const made = await page.request.post('/api/projects', { data: { title: `Tailstock die holder ${stamp}`, summary: '', units: 'mm', visibility: 'private' } });
  const { project: p } = (await made.json()) as { project: { id: number } };
  const first = (await (await page.request.post(`/api/projects/${p.id}/sessions`, { data: { title: 'Facing the blank', heldOn: '2026-11-01', minutesSpent: 40 } })).json()) as { session: { id: number } };
  const last = (await (await page.request.post(`/api/projects/${p.id}/sessions`, { data: { title: 'Threading the shank', heldOn: '2026-11-08', minutesSpent: 50 } })).json()) as { session: { id: number } };
  await page.request.post(`/api/sessions/${first.session.id}/entries`, { data: { title: 'Facing', operation: 'facing' } });
  await page.request.post(`/api/sessions/${last.session.id}/entries`, { data: { title: 'Drilling for the tap', operation: 'drilling' } });
  const e = (await (await page.request.post(`/api/sessions/${last.session.id}/entries`, { data: { title: 'Tapping M8 for the screw', operation: 'tapping' } })).json()) as { entry: { id: number } };

  try {
    await open(page, '/calculators/tap-drill?thread=M8x1.25');
    await page.getByRole('button', { name: 'Save to an entry' }).click();
    const form = page.getByRole('form', { name: 'Save to an entry' });
    // Nothing to choose when the latest is what is wanted.
    await expect(form.getByLabel('Project')).toHaveValue(String(p.id));
    await expect(form.getByLabel('Session')).toHaveValue(String(last.session.id));
    await expect(form.getByLabel('Entry')).toHaveValue(String(e.entry.id));
    const save = form.getByRole('button', { name: 'Save', exact: true });
    await save.click();
    await expect(form.locator('[data-notice="success"]')).toContainText('is now in Tapping M8 for the screw');
    // Save rests until something changes: a second click cannot add a twin card.
    const rested = form.getByRole('button', { name: 'Saved', exact: true });
    await expect(rested).toBeDisabled();
    await rested.click({ force: true });
    const list = await page.request.get(`/api/entries/${e.entry.id}/calculations`);
    expect(((await list.json()) as { calculations: unknown[] }).calculations).toHaveLength(1);
    // A new label is a new thing to save.
    await form.getByLabel('Label (optional)').fill('Tap drill, second look');
    await expect(save).toBeEnabled();
  } finally {
    await page.request.delete(`/api/projects/${p.id}`);
  }
});
