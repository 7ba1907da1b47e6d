import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';

// Two edges of clips with their moments, each on an entry made here in a published session of the demo
// builder's project and deleted at the end:
// 1. a clip recorded in the browser (MediaRecorder, WebM) carries no length in its header, so the media
//    element reports Infinity (per the HTML media spec, duration is +Infinity for media of unknown length);
//    the player's clock and the uploads list must still show its real length;
// 2. a moment of the second clip of an entry, opened while the first is on screen, switches the player to
//    that clip and plays from the moment, with the note there marked "Now".
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
const MEDIA = path.join(__dirname, '..', 'fixtures', 'media');
// 12 s, H.264: the demo clip, long enough to hold a note at 0:03.
const LONG_CLIP = path.join(__dirname, '..', '..', 'db', 'seeders', 'media', 'spigot-turning.mp4');

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible({ timeout: 30_000 });
}

async function newEntry(page: Page, title: string): Promise<number> {
  await page.goto(`/logs/${SLUG}`);
  const sessionHref = await page.locator(`a[href^="/logs/${SLUG}/sessions/"]`).first().getAttribute('href');
  const sessionId = sessionHref!.match(/\/sessions\/(\d+)/)![1];
  const made = await page.request.post(`/api/sessions/${sessionId}/entries`, { data: { title, operation: 'turning' } });
  expect(made.status()).toBe(201);
  return (await made.json()).entry.id;
}

const clipInput = (page: Page) => page.locator(`input[type="file"][accept*="video/mp4"]:not([capture])`);
const videoTime = (page: Page) => page.locator('video').first().evaluate((v: HTMLVideoElement) => v.currentTime);
const videoReady = (page: Page) => page.waitForFunction(() => (document.querySelector('video')?.readyState ?? 0) >= 1 && !!document.querySelector('[data-clip-workbench][data-live]'));

test('a clip recorded in the browser (WebM without a length) shows its real length in the player and the uploads list', async ({ browser }) => {
  test.setTimeout(180_000);
  const builder = await (await browser.newContext()).newPage();
  await signIn(builder, 'edda@renwick-shop.test', 'shop-demo-2026');
  const entryId = await newEntry(builder, `Recorded at the lathe ${stamp}`);
  try {
    await builder.goto(`/projects/${SLUG}/entries/${entryId}/edit`);

    // Record about 2 s of a moving canvas, as a phone or laptop camera recording in the browser would.
    const recorded = await builder.evaluate(async () => {
      const canvas = document.createElement('canvas');
      canvas.width = 160;
      canvas.height = 120;
      const g = canvas.getContext('2d')!;
      let frame = 0;
      const timer = setInterval(() => {
        frame++;
        g.fillStyle = frame % 2 ? '#2a4d69' : '#e8b04a';
        g.fillRect(0, 0, 160, 120);
        g.fillStyle = '#fff';
        g.fillRect((frame * 4) % 160, 50, 20, 20);
      }, 40);
      const recorder = new MediaRecorder(canvas.captureStream(25), { mimeType: 'video/webm' });
      const chunks: Blob[] = [];
      recorder.ondataavailable = (e) => chunks.push(e.data);
      const stopped = new Promise((resolve) => (recorder.onstop = resolve));
      recorder.start(250);
      await new Promise((resolve) => setTimeout(resolve, 2200));
      recorder.stop();
      await stopped;
      clearInterval(timer);
      const blob = new Blob(chunks, { type: 'video/webm' });
      // What a media element makes of it before it has been played through.
      const probe = document.createElement('video');
      probe.muted = true;
      probe.preload = 'metadata';
      const url = URL.createObjectURL(blob);
      probe.src = url;
      await new Promise((resolve, reject) => {
        probe.onloadedmetadata = resolve;
        probe.onerror = reject;
      });
      const headerDuration = String(probe.duration);
      URL.revokeObjectURL(url);
      return { bytes: Array.from(new Uint8Array(await blob.arrayBuffer())), headerDuration };
    });
    // The premise: the recorder's file does not say how long it is.
    expect(recorded.headerDuration).toBe('Infinity');

    await clipInput(builder).setInputFiles({ name: 'lathe-recording.webm', mimeType: 'video/webm', buffer: Buffer.from(recorded.bytes) });
    await expect(builder.getByRole('form', { name: 'Caption for “lathe-recording.webm”' })).toBeVisible({ timeout: 30_000 });

    // The uploads list gives the length in the player's clock form: 2.2 s of recording → 0:02 (0:01 if the
    // recorder dropped its first frames), never "length unknown".
    const row = builder.locator('li[data-media-id]').filter({ has: builder.getByRole('form', { name: 'Caption for “lathe-recording.webm”' }) });
    await expect(row).toContainText(/(?<![\d:])0:0[12] · /);
    await expect(row).not.toContainText('length unknown');
    const listed = (await row.textContent())!.match(/(?<![\d:])(0:0[12]) · /)![1];

    // The player under the uploads agrees, on the edit page and on the reader's page.
    const clipId = (await builder.locator('[data-clip-workbench]').first().getAttribute('data-clip-workbench'))!;
    const clock = (page: Page) => page.locator(`[data-clip-workbench="${clipId}"]`).getByText(/^\d+:\d\d \/ /);
    await videoReady(builder);
    await expect(clock(builder)).toHaveText(new RegExp(`^0:0\\d / ${listed}\\b`));

    const reader = await (await browser.newContext()).newPage();
    await reader.goto(`/logs/${SLUG}/entries/${entryId}`);
    await videoReady(reader);
    await expect(clock(reader)).toHaveText(new RegExp(`^0:00 / ${listed}\\b`));
    await expect(clock(reader)).not.toContainText('Infinity');
    // Its moments play from where they say, once the length is known.
    await reader.goto(`/logs/${SLUG}/entries/${entryId}?clip=${clipId}#t=1`);
    await videoReady(reader);
    await expect.poll(() => videoTime(reader)).toBeCloseTo(1, 0);
    await expect(clock(reader)).toHaveText(new RegExp(`^0:01 / ${listed}\\b`));
  } finally {
    expect((await builder.request.delete(`/api/entries/${entryId}`)).status()).toBe(204);
  }
});

test('a reader’s question about the second clip, asked while the first is showing, switches clips and plays from that moment', async ({ browser }) => {
  test.setTimeout(180_000);
  const builder = await (await browser.newContext()).newPage();
  await signIn(builder, 'edda@renwick-shop.test', 'shop-demo-2026');
  const entryId = await newEntry(builder, `Two clips of the spigot ${stamp}`);
  try {
    await builder.goto(`/projects/${SLUG}/entries/${entryId}/edit`);
    await clipInput(builder).setInputFiles(path.join(MEDIA, 'tiny-1s.mp4'));
    await expect(builder.getByRole('form', { name: 'Caption for “tiny-1s.mp4”' })).toBeVisible({ timeout: 30_000 });
    await clipInput(builder).setInputFiles(LONG_CLIP);
    await expect(builder.getByRole('form', { name: 'Caption for “spigot-turning.mp4”' })).toBeVisible({ timeout: 30_000 });

    const listed = await builder.request.get(`/api/entries/${entryId}/media`);
    expect(listed.status()).toBe(200);
    const clips: { id: number; name: string; kind: string }[] = (await listed.json()).media.filter((m: { kind: string }) => m.kind === 'clip');
    expect(clips.map((c) => c.name)).toEqual(['tiny-1s.mp4', 'spigot-turning.mp4']);
    const [first, second] = clips;

    // A note on the second clip at 0:03, and a question pinned to that same moment.
    const noteText = `Second pass starts here ${stamp}`;
    const note = await builder.request.post(`/api/media/${second.id}/notes`, { data: { startMs: 3000, text: noteText, kind: 'note' } });
    expect(note.status()).toBe(201);
    const questionText = `What feed did you use on this pass? ${stamp}`;
    const asked = await builder.request.post(`/api/entries/${entryId}/comments`, { data: { body: questionText, mediaId: second.id, atMs: 3000 } });
    expect(asked.status()).toBe(201);

    // A signed-out reader opens the entry: the first clip is on screen.
    const reader = await (await browser.newContext()).newPage();
    await reader.goto(`/logs/${SLUG}/entries/${entryId}`);
    const stage = reader.getByRole('navigation', { name: 'Clips of this entry' });
    await expect(stage.getByRole('link', { name: /tiny-1s\.mp4/ })).toHaveAttribute('aria-current', 'true');
    await expect(reader.locator(`[data-clip-workbench="${first.id}"]`)).toBeVisible();
    await videoReady(reader);
    // (Only on screen: the printed copy lists every clip's moments in markup hidden from the screen.)
    await expect(reader.getByText(noteText).filter({ visible: true })).toHaveCount(0);

    // The question about the second clip plays it from 0:03, in place.
    await reader.evaluate(() => ((window as unknown as { stayed: boolean }).stayed = true));
    const thread = reader.locator('#comments article').filter({ hasText: questionText });
    await thread.getByRole('button', { name: /^Asked at 0:03/ }).click();

    const workbench = reader.locator(`[data-clip-workbench="${second.id}"]`);
    await expect(workbench).toBeVisible();
    await expect(reader.locator(`[data-clip-workbench="${first.id}"]`)).toHaveCount(0);
    await expect(stage.getByRole('link', { name: /spigot-turning\.mp4/ })).toHaveAttribute('aria-current', 'true');
    await videoReady(reader);
    await expect.poll(() => videoTime(reader)).toBeCloseTo(3, 0);
    await expect(workbench.getByText(/^0:03 \/ 0:1[12]/)).toBeVisible();
    // The note and the question both start at 0:03: what is marked "Now" is one of them, at 0:03.
    await expect(workbench.locator('[aria-live="polite"]')).toContainText(/Now, .* at 0:03/);
    const notes = workbench.getByRole('list', { name: 'Notes in time order' });
    await expect(notes.getByRole('button', { name: new RegExp(`^0:03, Note.*${noteText}`) })).toBeVisible();
    await expect(notes.locator('[aria-current="true"]')).toHaveCount(1);
    await expect(notes.locator('[aria-current="true"]')).toHaveAttribute('aria-label', /^0:03, .*, Now: /);
    await expect(reader).toHaveURL(new RegExp(`\\?clip=${second.id}#t=3$`));
    expect(await reader.evaluate(() => (window as unknown as { stayed?: boolean }).stayed)).toBe(true);
  } finally {
    expect((await builder.request.delete(`/api/entries/${entryId}`)).status()).toBe(204);
  }
});
