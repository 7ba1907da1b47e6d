import path from 'node:path';
import { test, expect, type Page } from '@playwright/test';

// The builder never loses words and a new clip is usable at once. Each test makes its own entry in the
// demo builder's first session and deletes it at the end.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
// 12 s, H.264: the demo clip, uploaded through the real upload path.
const CLIP = path.join(__dirname, '..', '..', 'db', 'seeders', 'media', 'spigot-turning.mp4');

async function signInAsBuilder(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('edda@renwick-shop.test');
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible({ timeout: 30_000 });
}

async function newEntry(page: Page, title: string): Promise<number> {
  await page.goto(`/projects/${SLUG}/log`);
  const sessionId = (await page.locator('li[data-testid^="session-"]').first().getAttribute('data-testid'))!.replace('session-', '');
  const made = await page.request.post(`/api/sessions/${sessionId}/entries`, { data: { title, operation: 'turning' } });
  expect(made.status()).toBe(201);
  return (await made.json()).entry.id;
}

test('a title the server would refuse never blocks saving the body, and an in-app link asks before leaving unsaved work', async ({ page }) => {
  test.setTimeout(120_000);
  await signInAsBuilder(page);
  const entryId = await newEntry(page, `Facing the backplate ${stamp}`);
  try {
    await page.goto(`/projects/${SLUG}/entries/${entryId}/edit`);
    const title = page.getByLabel('Title', { exact: true });
    // The box takes no more than the server allows (one schema on both sides).
    await expect(title).toHaveAttribute('maxlength', '120');

    await title.fill('F');
    const paragraph = `Took 0.2 mm off the face with the plate on its own spindle ${stamp}`;
    await page.locator('.ProseMirror').click();
    await page.keyboard.type(paragraph);
    await expect(page.getByText('The title needs at least 2 characters.')).toBeVisible({ timeout: 15_000 });
    // The body is saved although the title is held back.
    await expect
      .poll(async () => JSON.stringify((await (await page.request.get(`/api/entries/${entryId}`)).json()).entry.body), { timeout: 15_000 })
      .toContain(paragraph);
    expect((await (await page.request.get(`/api/entries/${entryId}`)).json()).entry.title).toBe(`Facing the backplate ${stamp}`);

    // Leaving by an in-app link with the title unsaved asks first; saying no stays on the page.
    let asked = '';
    page.once('dialog', (d) => {
      asked = d.message();
      void d.dismiss();
    });
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link', { name: /— log/ }).click();
    await expect.poll(() => asked).toContain('not saved');
    await expect(page).toHaveURL(new RegExp(`/entries/${entryId}/edit$`));

    // A valid title saves, and then the link leaves without a question.
    await title.fill(`Facing the backplate, done ${stamp}`);
    await expect(page.getByRole('status').filter({ hasText: /Saved/ })).toBeVisible({ timeout: 15_000 });
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link', { name: /— log/ }).click();
    await expect(page).toHaveURL(new RegExp(`/projects/${SLUG}/log$`));
  } finally {
    expect((await page.request.delete(`/api/entries/${entryId}`)).status()).toBe(204);
  }
});

test('a new clip plays with its note button in place as soon as the upload is accepted; deleting a note keeps focus in the list', async ({ page }) => {
  test.setTimeout(180_000);
  await signInAsBuilder(page);
  const entryId = await newEntry(page, `Spigot clip ${stamp}`);
  try {
    await page.goto(`/projects/${SLUG}/entries/${entryId}/edit`);
    await page.locator(`input[type="file"][accept*="video/mp4"]:not([capture])`).setInputFiles(CLIP);
    await expect(page.getByRole('form', { name: 'Caption for “spigot-turning.mp4”' })).toBeVisible({ timeout: 30_000 });

    // No reload: the player and the note button are there, above the measurements.
    const workbench = page.locator('[data-clip-workbench]');
    await expect(workbench).toBeVisible();
    await page.waitForFunction(() => ((document.querySelector('[data-clip-workbench][data-live] video') as HTMLVideoElement | null)?.readyState ?? 0) >= 1);
    const noteButton = page.getByRole('button', { name: /Note at 0:00/ });
    await expect(noteButton).toBeVisible();
    const clipTop = (await workbench.boundingBox())!.y;
    const measurementsTop = (await page.getByRole('heading', { level: 2, name: 'Measurements' }).boundingBox())!.y;
    expect(clipTop).toBeLessThan(measurementsTop);
    // The media list and the player give the same length (12 s clip).
    await expect(page.getByText(/0:12 ·/)).toBeVisible();
    await expect(workbench.getByText(/\/ 0:12/)).toBeVisible();

    // The clip's tile in the uploads list plays it in its player.
    await page.getByRole('button', { name: 'Play clip “spigot-turning.mp4” in its player below' }).click();
    await expect.poll(() => page.locator('[data-clip-workbench] video').evaluate((v: HTMLVideoElement) => !v.paused && v.currentTime > 0)).toBe(true);
    await page.locator('[data-clip-workbench] video').evaluate((v: HTMLVideoElement) => {
      v.pause();
      v.currentTime = 0;
    });
    await expect(noteButton).toBeVisible();

    // Two notes; Enter in the note box is a new line, the button saves.
    await noteButton.click();
    let form = page.getByRole('form', { name: 'New note at 0:00' });
    await form.getByLabel('What is happening here').fill('First pass');
    await form.getByLabel('What is happening here').press('Enter');
    await form.getByLabel('What is happening here').pressSequentially('second line');
    await expect(form).toBeVisible();
    await form.getByRole('button', { name: 'Save note' }).click();
    await page.locator('video').first().evaluate((v: HTMLVideoElement) => {
      v.currentTime = 3;
    });
    await page.getByRole('button', { name: /Note at 0:03/ }).click();
    form = page.getByRole('form', { name: 'New note at 0:03' });
    await form.getByLabel('What is happening here').fill('Measure the spigot');
    await form.getByRole('button', { name: 'Save note' }).click();
    const list = page.getByRole('list', { name: 'Notes in time order' });
    await expect(list.getByRole('button', { name: /^0:00, Note: First pass\s+second line/ })).toBeVisible();
    await expect(page.getByRole('textbox', { name: 'Timestamp list, one line per note' })).toHaveValue(/0:00 First pass second line\n0:03 Measure the spigot/);

    // Deleting the first note moves focus to the next one, not to the top of the page.
    await list.getByRole('button', { name: 'Delete the note at 0:00' }).click();
    await page.getByRole('button', { name: 'Delete note' }).click();
    await expect(list.getByRole('button', { name: /^0:03.*Measure the spigot/ })).toBeFocused();
  } finally {
    expect((await page.request.delete(`/api/entries/${entryId}`)).status()).toBe(204);
  }
});
