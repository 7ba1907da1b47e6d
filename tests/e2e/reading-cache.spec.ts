import { test, expect, type Browser, type Page } from '@playwright/test';

// The published log is cached once for every signed-out reader. These checks prove the cache never shows
// private content or another viewer's controls, and that unpublishing or hiding shows on the very next
// request: the builder fills the pages first, a signed-out reader reads after each change. Uses the
// seeded demo project; removes its session at the end.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const stamp = Date.now().toString(36);
const title = `Cache check session ${stamp}`;
const entryTitle = `Cache check entry ${stamp}`;
const commentText = `Does the spigot still run true after parting? ${stamp}`;

async function signIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('shop-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByTestId('signed-in-as')).toBeVisible();
  return page;
}

async function ok<T>(res: { ok(): boolean; status(): number; json(): Promise<T>; text(): Promise<string> }): Promise<T> {
  expect(res.ok(), `${res.status()} ${res.ok() ? '' : await res.text()}`).toBe(true);
  return res.json();
}

test('a cached page never carries private content or another viewer’s controls; unpublishing and hiding show on the next request', async ({ browser }) => {
  test.setTimeout(180_000);
  const builder = await signIn(browser, 'edda@renwick-shop.test');
  const follower = await signIn(browser, 'tobias@quill.test');
  const reader = await (await browser.newContext()).newPage();
  // A signed-out read, as plain HTTP: status and HTML.
  const read = async (path: string) => {
    const res = await reader.request.get(path, { maxRedirects: 0 });
    return { status: res.status(), html: await res.text(), cache: res.headers()['x-nextjs-cache'] ?? null };
  };

  const { projects } = await ok<{ projects: { id: number; slug: string }[] }>(await builder.request.get('/api/projects?scope=mine'));
  const projectId = projects.find((p) => p.slug === SLUG)!.id;
  const { session } = await ok<{ session: { id: number; version: number } }>(
    await builder.request.post(`/api/projects/${projectId}/sessions`, { data: { title, heldOn: '2026-11-21', minutesSpent: 40, planned: '', done: 'Parted off a slice.', nextSteps: '' } }),
  );
  const sessionPath = `/logs/${SLUG}/sessions/${session.id}`;
  const setVisibility = async (visibility: string) => ok(await builder.request.patch(`/api/sessions/${session.id}/visibility`, { data: { visibility } }));
  try {
    const { entry } = await ok<{ entry: { id: number } }>(await builder.request.post(`/api/sessions/${session.id}/entries`, { data: { title: entryTitle, operation: 'facing' } }));
    const entryPath = `/logs/${SLUG}/entries/${entry.id}`;

    // The builder reads the private session first (their copy has the edit button) …
    await builder.goto(sessionPath);
    await expect(builder.getByRole('heading', { name: title })).toBeVisible();
    await expect(builder.getByRole('link', { name: 'Edit in the log' })).toBeVisible();
    // … and none of it reaches a signed-out reader.
    expect((await read(sessionPath)).status).toBe(404);
    expect((await read(entryPath)).status).toBe(404);
    expect((await read(`/logs/${SLUG}`)).html).not.toContain(title);

    // In the open log: the reader sees it, without the builder's controls — twice (the second from the cache).
    await setVisibility('published');
    for (let i = 0; i < 2; i++) {
      const page = await read(sessionPath);
      expect(page.status).toBe(200);
      expect(page.html).toContain(title);
      expect(page.html).not.toContain('Edit in the log');
      expect(page.html).not.toContain('signed-in-as');
      const project = await read(`/logs/${SLUG}`);
      expect(project.html).toContain(title);
      expect(project.html).not.toContain('Work on the log');
      expect((await read('/')).html).toContain(title);
      // The second read is the stored page, sent whole: no part of it is rendered again for the reader
      // (a dynamic hole anywhere in the tree, even in a not-found page, would make every read a render).
      if (i === 1) {
        expect(page.cache).toBe('HIT');
        expect(project.cache).toBe('HIT');
        expect((await read('/')).cache).toBe('HIT');
      }
    }

    // By link: the page opens for whoever has the link, but no list shows it.
    await setVisibility('unlisted');
    expect((await read(sessionPath)).status).toBe(200);
    expect((await read(`/logs/${SLUG}`)).html).not.toContain(title);
    expect((await read('/')).html).not.toContain(title);

    // Back on the bench: a 404 on the very next request, gone from the lists.
    await setVisibility('private');
    expect((await read(sessionPath)).status).toBe(404);
    expect((await read(entryPath)).status).toBe(404);
    expect((await read(`/logs/${SLUG}`)).html).not.toContain(title);

    // A comment, then hidden by the builder: the next signed-out read shows the note, never the text.
    await setVisibility('published');
    const { comment } = await ok<{ comment: { id: number } }>(await follower.request.post(`/api/entries/${entry.id}/comments`, { data: { body: commentText } }));
    expect((await read(entryPath)).html).toContain(commentText);
    expect((await read(entryPath)).html).toContain(commentText);
    await ok(await builder.request.post(`/api/comments/${comment.id}/hide`, { data: { reason: 'Off the subject of this entry.' } }));
    const hidden = await read(entryPath);
    expect(hidden.html).not.toContain(commentText);
    expect(hidden.html).toContain('Off the subject of this entry.');

    // A signed-in follower (in no project's circle) reads the same stored copy: the HTML has no one's
    // account corner and no hidden text; their browser then fills in what is theirs — their name, the comment form, and
    // the text of their own hidden comment, which its author may still read.
    const followerRead = await follower.request.get(entryPath);
    expect(followerRead.headers()['x-nextjs-cache']).toBe('HIT');
    const followerHtml = await followerRead.text();
    expect(followerHtml).not.toContain('signed-in-as');
    expect(followerHtml).not.toContain(commentText);
    await follower.goto(entryPath);
    await expect(follower.getByRole('heading', { name: entryTitle })).toBeVisible();
    await expect(follower.getByTestId('signed-in-as')).toHaveText('Tobias Quill');
    await expect(follower.getByText(commentText)).toBeVisible();
    await expect(follower.locator('#comments textarea').first()).toBeVisible();
    await expect(follower.getByRole('link', { name: 'Edit entry' })).toHaveCount(0);
    expect((await read(entryPath)).html).not.toContain('signed-in-as');
    // The builder is given their own copy, rendered for them, with their controls in the HTML.
    const builderRead = await builder.request.get(entryPath);
    expect(builderRead.headers()['x-nextjs-cache']).toBeUndefined();
    expect(await builderRead.text()).toContain('Edit entry');
  } finally {
    await builder.request.delete(`/api/sessions/${session.id}`);
  }
  expect((await read(sessionPath)).status).toBe(404);
});

test('a member whose own copy differs is given it, even when their copy cookie says otherwise', async ({ browser }) => {
  // The cookie only picks a copy: the builder with a cookie saying "shared" first gets the copy cached for
  // everyone (nothing of theirs in it), and their browser, told they have a circle, reads their own.
  const builder = await signIn(browser, 'edda@renwick-shop.test');
  const context = builder.context();
  expect((await context.cookies()).find((c) => c.name === 'scribeline-copy')?.value).toBe('own');
  await context.addCookies([{ name: 'scribeline-copy', value: 'shared', url: builder.url() }]);
  const shared = await builder.request.get(`/logs/${SLUG}`);
  expect(shared.headers()['x-nextjs-cache']).toBeDefined();
  expect(await shared.text()).not.toContain('Work on the log');
  await builder.goto(`/logs/${SLUG}`);
  await expect(builder.getByRole('link', { name: 'Work on the log' })).toBeVisible();
  expect((await context.cookies()).find((c) => c.name === 'scribeline-copy')?.value).toBe('own');

  // Signing out clears it: the next read is a signed-out one.
  await builder.getByRole('button', { name: 'Sign out' }).click();
  await expect(builder.getByRole('link', { name: 'Sign in' })).toBeVisible();
  expect((await context.cookies()).find((c) => c.name === 'scribeline-copy')).toBeUndefined();
});
