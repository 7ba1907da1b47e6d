import { readFile } from 'node:fs/promises';
import { test, expect, type Page } from '@playwright/test';
import { parseCsv } from '../../lib/measurements/csv';

// The builder records a spigot with two readings on a demo entry, reads the verdict in words, pairs it
// with the bore it fits, and takes the project's measurements away as a CSV. Creates its own records.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
const SHAFT = `Register spigot ${stamp}`;
const HOLE = `Register bore ${stamp}`;
const ISO286 = 'ISO 286-2:2010: 52 g6 = −10 / −29 µm, 52 H7 = +30 / 0 µm — from memory';
const FIT = 'ISO 286: 52 H7/g6 clearance 0.010 to 0.059 mm (30 − (−29), 0 − (−10)) — worked by hand';
const INCH = 'international inch: 1 in = 25.4 mm exactly; 52.005 / 25.4 = 2.04744';

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible();
}

async function openForm(page: Page) {
  await page.getByRole('button', { name: 'Add a measurement' }).click();
  const form = page.getByRole('form', { name: 'New measurement' });
  await expect(form).toHaveAttribute('data-hydrated', 'true');
  return form;
}

test('add a record with two readings, read the verdict, pair it with its mate, download the CSV', async ({ page }) => {
  await signInAsBuilder(page);
  await page.goto(`/logs/${SLUG}`);
  await page.getByRole('link', { name: /Turning the spigot toward size/ }).first().click();
  await page.getByRole('link', { name: 'Edit entry' }).click();
  await expect(page).toHaveURL(/\/entries\/\d+\/edit$/);

  // The shaft: 52 g6, pass 1 still over size, pass 2 in.
  let form = await openForm(page);
  await form.getByLabel('Feature').fill(SHAFT);
  await form.getByLabel('Nominal size').fill('-52');
  await form.getByLabel('ISO 286 zone', { exact: true }).fill('g6');
  await form.getByRole('group', { name: 'Reading 1' }).getByLabel('Value').fill('52.005');
  await form.getByRole('button', { name: 'Save measurement' }).click();
  // Bad input is refused beside its field, before anything is saved.
  await expect(form.locator('[data-field-error$="-nominal-error"]')).toContainText('greater than zero');

  await form.getByLabel('Nominal size').fill('52');
  await expect(form.getByTestId('limits-preview')).toContainText('51.971 and 51.990 mm'); // ISO286
  const first = form.getByRole('group', { name: 'Reading 1' });
  await first.getByLabel('Pass (optional)').fill('1');
  await expect(first).toContainText('Outside by 0.015 mm'); // ISO286: 52.005 is 15 µm over 51.990
  await form.getByRole('button', { name: 'Add another reading' }).click();
  const second = form.getByRole('group', { name: 'Reading 2' });
  await second.getByLabel('Value').fill('51.985');
  await second.getByLabel('Pass (optional)').fill('2');
  await second.getByLabel('Part temperature °C (optional)').fill('21');
  await expect(second).toContainText('Inside');
  await form.getByRole('button', { name: 'Save measurement' }).click();

  const saved = page.getByTestId('saved-verdict');
  await expect(saved).toContainText('Latest reading: Inside');
  const row = page.getByTestId('entry-measurements').locator(`[data-record="${SHAFT}"]`);
  await expect(row.locator('[data-verdict]')).toHaveText(/✓\s*Inside/);
  await expect(row).toContainText('2 readings');
  await expect(row).toContainText('51.971 – 51.990 mm');

  // The hole it fits: 52 H7, one reading with a bore gauge.
  form = await openForm(page);
  await form.getByLabel('Feature').fill(HOLE);
  await form.getByText('Inside (hole-like)').click();
  await form.getByLabel('Nominal size').fill('52');
  await form.getByLabel('ISO 286 zone', { exact: true }).fill('H7');
  const bore = form.getByRole('group', { name: 'Reading 1' });
  await bore.getByLabel('Instrument').selectOption('bore-gauge');
  await bore.getByLabel('Value').fill('52.012');
  await form.getByRole('button', { name: 'Save measurement' }).click();
  await expect(page.getByTestId('entry-measurements').locator(`[data-record="${HOLE}"] [data-verdict]`)).toHaveText(/✓\s*Inside/);

  // The record page: the verdict in words, each reading judged, the zone picture with both readings.
  await page.getByTestId('entry-measurements').getByRole('link', { name: SHAFT }).click();
  await expect(page.getByRole('heading', { level: 1, name: SHAFT })).toBeVisible();
  const shaftId = page.url().match(/\/records\/(\d+)/)![1];
  await expect(page.getByTestId('record-verdict')).toContainText('Inside the limits, 0.005 mm (5 µm) from the upper limit.'); // ISO286: −15 against −10
  const readings = page.getByTestId('readings-table');
  await expect(readings.locator('[data-reading="1"]')).toContainText('Outside by 0.015 mm');
  await expect(readings.locator('[data-reading="1"]')).toContainText('2.0474 in'); // INCH
  await expect(readings.locator('[data-reading="2"]')).toContainText('Inside');
  await expect(page.getByRole('img', { name: /Readings plotted, oldest first: P1: 52.005 mm \(\+5 µm\), outside; P2: 51.985 mm \(-15 µm\), inside/ })).toBeVisible();

  // Pair with the bore.
  const pairForm = page.getByRole('form', { name: 'Pair as a fit' });
  const option = pairForm.locator('option', { hasText: HOLE });
  await pairForm.getByLabel('Mating record').selectOption({ label: (await option.textContent())! });
  await pairForm.getByRole('button', { name: 'Pair as a fit' }).click();
  const pair = page.getByTestId('pair');
  await expect(pair).toContainText('52 mm H7/g6');
  await expect(pair).toContainText('Clearance fit');
  await expect(pair).toContainText('from clearance 0.010 mm to clearance 0.059 mm'); // FIT
  await expect(pair.getByTestId('pair-actual')).toContainText('Made: clearance 0.027 mm, within the range'); // 52.012 − 51.985, by hand

  // The project's table and its CSV, read back.
  await page.goto(`/logs/${SLUG}/measurements`);
  await page.getByLabel('Filter').fill(stamp);
  const table = page.getByTestId('project-measurements');
  await expect(table.locator('tbody tr')).toHaveCount(2);
  await expect(table.locator(`[data-record="${SHAFT}"]`)).toContainText('H7/g6 · ✓ within');
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
  expect(download.suggestedFilename()).toBe(`${SLUG}-measurements.csv`);
  const text = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '');
  const rows = parseCsv(text);
  const header = rows[0]!;
  const col = (name: string) => {
    const i = header.indexOf(name);
    expect(i, `CSV column ${name}`).toBeGreaterThanOrEqual(0);
    return i;
  };
  const mine = rows.filter((r) => r[col('Feature')] === SHAFT);
  expect(mine).toHaveLength(2);
  expect(mine.map((r) => r[col('Reading')])).toEqual(['52.005', '51.985']);
  expect(mine.map((r) => r[col('Verdict')])).toEqual(['Outside', 'Inside']);
  expect(mine[0]![col('Outside by (mm)')]).toBe('0.015');
  expect(mine[0]![col('Reading (in)')]).toBe('2.0474'); // INCH
  expect(mine[1]![col('Lower limit (mm)')]).toBe('51.971'); // ISO286
  expect(mine[1]![col('Upper limit (mm)')]).toBe('51.990');
  expect(mine[1]![col('Temperature (°C)')]).toBe('21');
  expect(rows.filter((r) => r[col('Feature')] === HOLE).map((r) => r[col('Verdict')])).toEqual(['Inside']);
  expect(shaftId).toMatch(/^\d+$/);
});

// Leave the demo project as it was, whether the test passed or not.
test.afterAll(async ({ browser }) => {
  const page = await (await browser.newContext()).newPage();
  await signInAsBuilder(page);
  await page.goto(`/logs/${SLUG}/measurements`);
  const csv = await page.getByRole('link', { name: 'Download CSV' }).getAttribute('href');
  const projectId = csv!.match(/projects\/(\d+)\//)![1];
  const list = (await (await page.request.get(`/api/projects/${projectId}/measurements`)).json()) as { records: { id: number; feature: string }[] };
  for (const r of list.records.filter((x) => x.feature.includes(stamp))) {
    expect((await page.request.delete(`/api/measurements/${r.id}`)).status()).toBe(204);
  }
  await page.context().close();
});

test('a signed-out reader sees the records but none of the builder’s controls', async ({ page }) => {
  await page.goto(`/logs/${SLUG}/measurements`);
  await expect(page.getByRole('heading', { level: 1, name: 'Measurements' })).toBeVisible();
  const first = page.getByTestId('project-measurements').locator('tbody tr a').first();
  await first.click();
  await expect(page).toHaveURL(/\/records\/\d+/);
  await expect(page.getByTestId('record-verdict')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Edit record' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Add a reading' })).toHaveCount(0);
  await expect(page.getByRole('form', { name: 'Pair as a fit' })).toHaveCount(0);
});

// A session logged afterwards: a reading saved without a time is dated on the session's day, at noon UTC
// (12:00 UTC falls on the same calendar day from UTC−11 to UTC+11), not on the day it was typed in.
const HELD_ON = '2025-03-14';

test('a reading saved without a time gets the session’s day, not today', async ({ page }) => {
  test.setTimeout(120_000);
  await signInAsBuilder(page);
  const api = page.request;
  const made = await api.post('/api/projects', { data: { title: `Collet stop ${stamp}`, summary: '', units: 'mm', visibility: 'private' } });
  expect(made.status()).toBe(201);
  const { project: p } = (await made.json()) as { project: { id: number; slug: string } };
  try {
    const session = await api.post(`/api/projects/${p.id}/sessions`, { data: { title: 'Turning the stop', heldOn: HELD_ON, minutesSpent: 30 } });
    expect(session.status()).toBe(201);
    const { session: s } = (await session.json()) as { session: { id: number } };
    const entry = await api.post(`/api/sessions/${s.id}/entries`, { data: { title: 'Turning the stop to length', operation: 'turning' } });
    expect(entry.status()).toBe(201);
    const { entry: e } = (await entry.json()) as { entry: { id: number } };

    await page.goto(`/projects/${p.slug}/entries/${e.id}/edit`);
    const form = await openForm(page);
    await form.getByLabel('Feature').fill(`Stop diameter ${stamp}`);
    await form.getByLabel('Nominal size').fill('12');
    await form.getByLabel('ISO 286 zone', { exact: true }).fill('h7');
    const reading = form.getByRole('group', { name: 'Reading 1' });
    await expect(reading.getByLabel('Measured at')).toHaveValue('');
    await reading.getByLabel('Value').fill('11.990');
    await form.getByRole('button', { name: 'Save measurement' }).click();
    await page.getByTestId('saved-verdict').getByRole('link', { name: 'Open the record' }).click();
    await expect(page).toHaveURL(/\/records\/\d+/);

    // The stored time is the session's day at 12:00 UTC, and the page shows that day.
    const when = page.getByTestId('readings-table').locator('[data-reading="1"] time');
    await expect(when).toHaveAttribute('datetime', `${HELD_ON}T12:00:00.000Z`);
    await expect(when).toContainText('14 Mar 2025');
  } finally {
    expect((await api.delete(`/api/projects/${p.id}`)).status()).toBe(204);
  }
});

// Every change on a record page is a server action that renders the page again: the record, a reading added,
// corrected and deleted, the fit unpaired, and the record deleted, which goes back to its entry.
test('on the record page the builder edits the record, adds, corrects and deletes a reading, unpairs, deletes the record', async ({ page }) => {
  test.setTimeout(180_000);
  await signInAsBuilder(page);
  const api = page.request;
  const made = await api.post('/api/projects', { data: { title: `Tailstock sleeve ${stamp}`, summary: '', units: 'mm', visibility: 'private' } });
  expect(made.status()).toBe(201);
  const { project: p } = (await made.json()) as { project: { id: number; slug: string } };
  try {
    const { session: s } = (await (await api.post(`/api/projects/${p.id}/sessions`, { data: { title: 'Boring the sleeve', heldOn: HELD_ON, minutesSpent: 45 } })).json()) as { session: { id: number } };
    const { entry: e } = (await (await api.post(`/api/sessions/${s.id}/entries`, { data: { title: 'Sleeve to the bore', operation: 'boring' } })).json()) as { entry: { id: number } };
    const reading = (value: number) => ({ value, unit: 'mm', instrument: 'micrometer', resolution: 0.001 });
    const record = async (data: object) => {
      const res = await api.post(`/api/entries/${e.id}/measurements`, { data });
      expect(res.status()).toBe(201);
      return ((await res.json()) as { record: { id: number } }).record;
    };
    // ISO 286-2:2010 (from memory): 52 g6 = −10 / −29 µm, 52 H7 = +30 / 0 µm.
    const shaft = await record({ feature: `Sleeve ${stamp}`, kind: 'outside', nominal: 52, unit: 'mm', spec: { type: 'zone', zone: 'g6' }, readings: [reading(51.986), reading(51.985)] });
    const hole = await record({ feature: `Housing ${stamp}`, kind: 'inside', nominal: 52, unit: 'mm', spec: { type: 'zone', zone: 'H7' }, readings: [reading(52.012)] });
    expect((await api.post('/api/measurements/pairs', { data: { holeRecordId: hole.id, shaftRecordId: shaft.id } })).status()).toBe(201);

    await page.goto(`/logs/${p.slug}/records/${shaft.id}`);
    await page.getByRole('button', { name: 'Edit record' }).click();
    const edit = page.getByRole('form', { name: 'Edit measurement' });
    await expect(edit).toHaveAttribute('data-hydrated', 'true');
    await edit.getByLabel('Feature').fill(`Sleeve, finished ${stamp}`);
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await expect(page.getByRole('heading', { level: 1, name: `Sleeve, finished ${stamp}` })).toBeVisible();
    await expect(edit).toHaveCount(0);

    const readings = page.getByTestId('readings-table');
    await page.getByRole('button', { name: 'Add a reading' }).click();
    const add = page.getByRole('form', { name: 'New reading' });
    await expect(add).toHaveAttribute('data-hydrated', 'true');
    await add.getByLabel('Value').fill('51.984');
    await add.getByRole('button', { name: 'Add reading' }).click();
    await expect(readings.locator('[data-reading="3"]')).toContainText('51.984 mm');

    await page.getByRole('button', { name: 'Edit reading 3' }).click();
    const fix = page.getByRole('form', { name: 'Edit reading' });
    await expect(fix).toHaveAttribute('data-hydrated', 'true');
    await fix.getByLabel('Value').fill('51.983');
    await fix.getByLabel('Note (optional)').fill('Checked again after it cooled.');
    await fix.getByRole('button', { name: 'Save reading' }).click();
    await expect(readings.locator('[data-reading="3"]')).toContainText('51.983 mm');
    await expect(readings).toContainText('Checked again after it cooled.');

    await page.getByRole('button', { name: 'Delete reading 3' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete reading' }).click();
    await expect(readings.locator('[data-reading="3"]')).toHaveCount(0);
    await expect(readings.locator('[data-reading="2"]')).toContainText('51.985 mm');

    await page.getByTestId('pair').getByRole('button', { name: 'Unpair' }).click();
    await expect(page.getByText('Not paired with a mating record.')).toBeVisible();
    await expect(page.getByRole('form', { name: 'Pair as a fit' })).toBeVisible();

    await page.getByRole('button', { name: 'Delete record' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Delete record' }).click();
    await expect(page).toHaveURL(new RegExp(`/logs/${p.slug}/entries/${e.id}$`));
    expect((await api.get(`/api/measurements/${shaft.id}`)).status()).toBe(404);
  } finally {
    expect((await api.delete(`/api/projects/${p.id}`)).status()).toBe(204);
  }
});
