import { mkdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';
import { signUpAndVerify } from './support/accounts';

// The bench view on a phone (390 × 844, touch): readings on the pad with their verdicts at once; offline,
// three readings and a photo are kept on the phone and sent exactly once, in order, when the connection is
// back; a retry of a queued write does not double it; the page opens offline after one visit.
const ISO286 = 'ISO 286-2:2010: 25 g6 = −7 / −20 µm (over 18 up to 30 mm) — from memory';

test.use({ viewport: { width: 390, height: 844 }, hasTouch: true, isMobile: true, serviceWorkers: 'allow' });

const shots = path.resolve(process.env.E2E_OUTPUT_DIR ?? '.data/test-results', 'bench');

async function press(page: Page, text: string) {
  const pad = page.getByRole('group', { name: 'Number pad' });
  for (const ch of text) await pad.getByRole('button', { name: ch === '.' ? 'Decimal point' : ch, exact: true }).click();
  await page.getByRole('button', { name: 'Save reading' }).click();
}

type ServerRecord = { record: { version: number; readings: { value: number }[]; verdict: { state: string } } };

test('at the bench: pad, verdicts, offline queue sent once in order, retry, offline shell', async ({ page, context, baseURL }) => {
  test.setTimeout(180_000);
  await mkdir(shots, { recursive: true });
  const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
  await signUpAndVerify(page, { name: 'Ilse Brannigan', email: `ilse-${stamp}@example.test`, password: 'spigot by the tenth' });

  // A project of her own with one session, one entry and the spigot's record (first reading well oversize).
  const headers = { origin: baseURL! };
  const project = (await (await page.request.post('/api/projects', { headers, data: { title: `Tailstock quill ${stamp}`, units: 'mm', visibility: 'private' } })).json()).project;
  const session = (await (await page.request.post(`/api/projects/${project.id}/sessions`, { headers, data: { title: 'Spigot for the quill', heldOn: '2026-03-14', minutesSpent: 0 } })).json()).session;
  const entry = (await (await page.request.post(`/api/sessions/${session.id}/entries`, { headers, data: { title: 'Turning the spigot', operation: 'turning' } })).json()).entry;
  const made = await page.request.post(`/api/entries/${entry.id}/measurements`, {
    headers,
    data: { feature: 'Spigot diameter', kind: 'outside', nominal: 25, unit: 'mm', spec: { type: 'zone', zone: 'g6' }, readings: [{ value: 25.2, unit: 'mm', instrument: 'micrometer', resolution: 0.001 }] },
  });
  expect(made.status()).toBe(201);
  const recordId = (await made.json()).record.id as number;

  // Opened from the session's page.
  await page.goto(`/logs/${project.slug}/sessions/${session.id}`);
  await page.getByRole('link', { name: 'At the bench' }).click();
  await expect(page).toHaveURL(new RegExp(`/bench/${session.id}$`));
  const bench = page.locator('[data-bench]');
  await expect(bench).toHaveAttribute('data-queue-loaded', 'yes');
  const card = page.locator(`[data-record="${recordId}"]`);
  await expect(card).toContainText('24.980 to 24.993 mm'); // ISO286
  // 25.2 against the middle of the band (−13.5 µm): 213.5 µm on the diameter, 0.107 mm a side.
  await expect(card.getByTestId('verdict')).toHaveText(/Outside by 0\.207 mm/);
  await expect(card.getByTestId('next-cut')).toHaveText('Next cut: Take off 0.107 mm per side');
  // The display is not a text box: the phone's keyboard never opens.
  await expect(page.getByTestId('pad-display')).not.toHaveAttribute('contenteditable', /.*/);
  await expect(page.locator('[data-bench] input:not([type="file"]), [data-bench] textarea')).toHaveCount(0);

  // Readings on the pad: the verdict and the next cut change at once.
  await press(page, '25.1');
  await expect(card.getByTestId('verdict')).toHaveText(/Outside by 0\.107 mm/);
  await expect(card.getByTestId('next-cut')).toHaveText('Next cut: Take off 0.057 mm per side');
  await press(page, '24.985');
  await expect(card.getByTestId('verdict')).toHaveText(/Inside/);
  await expect(page.locator('[data-queue-status]')).toHaveText(/^Everything is sent\.\s*$/);
  await expect(bench).toHaveAttribute('data-shell', 'ready');
  await page.screenshot({ path: path.join(shots, 'bench-online.png') });

  // Offline: three readings and a photo, kept on the phone.
  await context.setOffline(true);
  await expect(page.getByTestId('connection')).toHaveText(/Offline/);
  for (const v of ['24.99', '24.988', '24.986']) await press(page, v);
  await page.getByLabel('Photo or clip').setInputFiles({ name: 'spigot.png', mimeType: 'image/png', buffer: await readFile(path.resolve(__dirname, '../fixtures/media/scribe-4x3.png')) });
  await page.getByLabel('Note with it (optional)').fill('Spigot after the spring pass');
  await page.getByRole('button', { name: 'Keep photo' }).click();
  await expect(page.getByTestId('not-sent')).toHaveCount(4);
  await expect(page.locator('[data-queue-status]')).toContainText('4 not sent yet');
  await expect(card).toContainText('not sent yet');
  await page.screenshot({ path: path.join(shots, 'bench-offline.png') });

  // What the queue will send, as kept in IndexedDB: one of them is sent again later by hand.
  const queued = await page.evaluate(
    () =>
      new Promise<{ clientId: string; kind: string; reading?: { value: number; unit: string; instrument: string; resolution: number; measuredAt: string } }[]>((resolve, reject) => {
        const open = indexedDB.open('scribeline-bench');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const all = open.result.transaction('writes').objectStore('writes').getAll();
          all.onsuccess = () => resolve(all.result);
        };
      }),
  );
  const firstReading = queued.find((w) => w.kind === 'reading' && w.reading?.value === 24.99)!;
  expect(firstReading).toBeTruthy();

  // Back online: everything goes, once, in order.
  await context.setOffline(false);
  await expect(page.locator('[data-queue-status]')).toHaveText(/^Everything is sent\.\s*$/, { timeout: 30_000 });
  await expect(page.getByTestId('not-sent')).toHaveCount(0);
  const server = (await (await page.request.get(`/api/measurements/${recordId}`)).json()) as ServerRecord;
  expect(server.record.readings.map((r) => r.value)).toEqual([25.2, 25.1, 24.985, 24.99, 24.988, 24.986]);
  expect(server.record.verdict.state).toBe('inside');
  const media = (await (await page.request.get(`/api/entries/${entry.id}/media`)).json()).media as { kind: string; caption: string }[];
  expect(media).toHaveLength(1);
  expect(media[0]).toMatchObject({ kind: 'photo', caption: expect.stringMatching(/^\d\d:\d\d — Spigot after the spring pass$/) });

  // A retry of the same queued write (its answer lost on the way): the same row, not a second one.
  const retry = await page.request.post(`/api/measurements/${recordId}/readings`, {
    headers,
    data: { clientId: firstReading.clientId, ...firstReading.reading, recordVersion: server.record.version },
  });
  expect(retry.status()).toBe(200);
  expect((await retry.json()).created).toBe(false);
  const after = (await (await page.request.get(`/api/measurements/${recordId}`)).json()) as ServerRecord;
  expect(after.record.readings).toHaveLength(6);

  // The page itself opens without a connection after that one visit, with what the phone last knew.
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole('heading', { name: /Spigot for the quill/ })).toBeVisible();
  await expect(page.getByTestId('connection')).toHaveText(/Offline/);
  await expect(card.getByTestId('verdict')).toHaveText(/Inside/);
  await expect(card).toContainText('24.986');
  await press(page, '24.987');
  await expect(page.getByTestId('not-sent')).toHaveCount(1);
  await page.screenshot({ path: path.join(shots, 'bench-offline-reload.png') });
  await context.setOffline(false);
  await expect(page.locator('[data-queue-status]')).toHaveText(/^Everything is sent\.\s*$/, { timeout: 30_000 });
  const last = (await (await page.request.get(`/api/measurements/${recordId}`)).json()) as ServerRecord;
  expect(last.record.readings.map((r) => r.value).slice(-2)).toEqual([24.986, 24.987]);

  // A conflict: offline, a reading judged against g6; meanwhile the record is changed to h6 elsewhere.
  await context.setOffline(true);
  await press(page, '24.989');
  const changed = await page.request.patch(`/api/measurements/${recordId}`, { headers, data: { spec: { type: 'zone', zone: 'h6' }, version: last.record.version } });
  expect(changed.status()).toBe(200);
  await context.setOffline(false);
  const aside = page.getByTestId('set-aside');
  await expect(aside).toContainText('its record was changed meanwhile');
  await expect(page.locator('[data-queue-status]')).toHaveText(/One write waits for your decision below\./);
  // Both versions, the reading judged against each: g6 as measured, h6 (0 / −13 µm) as it is now.
  await expect(aside).toContainText('25 mm g6: 24.980 to 24.993 mm'); // ISO286
  await expect(aside).toContainText('25 mm h6: 24.987 to 25.000 mm'); // ISO 286-2:2010, 25 h6 — from memory
  await expect(aside.getByText('Your reading:')).toHaveCount(2);
  await expect((await (await page.request.get(`/api/measurements/${recordId}`)).json()).record.readings).toHaveLength(7);
  await page.screenshot({ path: path.join(shots, 'bench-conflict.png') });
  await aside.getByRole('button', { name: 'Save against it as it is now' }).click();
  await expect(page.locator('[data-queue-status]')).toHaveText(/^Everything is sent\.\s*$/, { timeout: 30_000 });
  await expect(aside).toHaveCount(0);
  const resolved = (await (await page.request.get(`/api/measurements/${recordId}`)).json()) as ServerRecord;
  expect(resolved.record.readings.map((r) => r.value).slice(-1)).toEqual([24.989]);
  expect(resolved.record.readings).toHaveLength(8);
});

test('the home-screen app: a manifest of our own with its icon, opening on the bench', async ({ page }) => {
  const res = await page.request.get('/manifest.webmanifest');
  expect(res.ok()).toBe(true);
  const manifest = await res.json();
  expect(manifest).toMatchObject({ short_name: 'Bench', start_url: '/bench', display: 'standalone' });
  const icon = await page.request.get(manifest.icons[0].src);
  expect(icon.headers()['content-type']).toContain('image/svg+xml');
  const worker = await page.request.get('/bench-worker.js');
  expect(worker.headers()['content-type']).toContain('javascript');
  expect(worker.headers()['service-worker-allowed']).toBe('/bench');
});
