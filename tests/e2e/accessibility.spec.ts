import { test, expect, type Browser, type BrowserContext, type Page } from '@playwright/test';
import { AxeBuilder } from '@axe-core/playwright';

// Every main page checked with axe-core against WCAG 2.1 A and AA, at a desk width and a phone width, in the
// light and the dark scheme. A serious or critical violation fails the page's test; the message names the
// variant, the rule, how many elements and the first few selectors, so a regression points at its place.
// Uses the seeded demo project and the demo builder; reads only.
const SLUG = 'cast-iron-backplate-for-the-160-mm-three-jaw-chuck';
const BUILDER = { email: 'edda@renwick-shop.test', password: 'shop-demo-2026' };
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const FAILING_IMPACTS = new Set(['serious', 'critical']);

const SIZES = [
  { name: 'desk 1280 px', width: 1280, height: 900 },
  { name: 'phone 390 px', width: 390, height: 844 },
] as const;
const SCHEMES = ['light', 'dark'] as const;

type Found = {
  session: string;
  entry: string;
  clipEntry: string;
  record: string;
  editEntry: string;
};

type PageCase = { name: string; signedIn: boolean; path: (f: Found) => string };

const PAGES: PageCase[] = [
  { name: 'home', signedIn: false, path: () => '/' },
  { name: 'fits look-up', signedIn: false, path: () => '/fits?hole=H7&shaft=g6&size=25' },
  { name: 'calculators', signedIn: false, path: () => '/calculators' },
  { name: 'tap drill calculator', signedIn: false, path: () => '/calculators/tap-drill' },
  { name: 'bolt circle calculator', signedIn: false, path: () => '/calculators/bolt-circle' },
  { name: 'sign-in', signedIn: false, path: () => '/sign-in' },
  { name: 'sign-up', signedIn: false, path: () => '/sign-up' },
  { name: 'project timeline', signedIn: false, path: () => `/logs/${SLUG}` },
  { name: 'session', signedIn: false, path: (f) => f.session },
  { name: 'entry with a clip', signedIn: false, path: (f) => f.clipEntry },
  { name: 'measurement record', signedIn: false, path: (f) => f.record },
  { name: 'measurements table', signedIn: false, path: () => `/logs/${SLUG}/measurements` },
  { name: 'builder profile', signedIn: false, path: () => '/builders/edda-renwick' },
  { name: 'my projects', signedIn: true, path: () => '/projects' },
  { name: 'log workspace', signedIn: true, path: () => `/projects/${SLUG}/log` },
  { name: 'entry editor', signedIn: true, path: (f) => f.editEntry },
  { name: 'settings', signedIn: true, path: () => '/settings' },
];

let builderState: Awaited<ReturnType<BrowserContext['storageState']>> | null = null;
let found: Found | null = null;

async function signIn(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(BUILDER.email);
  await page.getByLabel('Password').fill(BUILDER.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My projects' })).toBeVisible({ timeout: 30_000 });
  await page.waitForLoadState('networkidle', { timeout: 8_000 }).catch(() => undefined);
}

/** The demo pages whose ids are made by the seeder, found by following the links a reader would follow. */
async function discover(browser: Browser): Promise<{ found: Found; state: NonNullable<typeof builderState> }> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signIn(page);
  const state = await context.storageState();

  await page.goto(`/logs/${SLUG}`, { waitUntil: 'domcontentloaded' });
  const sessions = await page.locator(`a[href^="/logs/${SLUG}/sessions/"]`).evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
  expect(sessions.length, 'the demo timeline links to its sessions').toBeGreaterThan(1);
  let clipEntry = '';
  let entry = '';
  let record = '';
  for (const session of sessions) {
    await page.goto(session, { waitUntil: 'domcontentloaded' });
    const entries = await page.locator(`a[href^="/logs/${SLUG}/entries/"]`).evaluateAll((as) => as.map((a) => [a.getAttribute('href')!, a.textContent ?? ''] as const));
    if (!entry && entries.length) entry = entries[0][0].split(/[?#]/)[0];
    const spigot = entries.find(([, text]) => text.includes('Turning the spigot toward size'));
    if (spigot) clipEntry = spigot[0].split(/[?#]/)[0];
    if (clipEntry && entry) break;
  }
  await page.goto(`/logs/${SLUG}/measurements`, { waitUntil: 'domcontentloaded' });
  record = (await page.locator(`a[href^="/logs/${SLUG}/records/"]`).first().getAttribute('href')) ?? '';
  await context.close();

  expect(clipEntry, 'the demo entry with the spigot clip is linked from its session').not.toBe('');
  expect(record, 'the measurements table links to a record').not.toBe('');
  const entryId = clipEntry.match(/\/entries\/(\d+)/)![1];
  return {
    state,
    found: { session: sessions[0].split(/[?#]/)[0], entry, clipEntry, record, editEntry: `/projects/${SLUG}/entries/${entryId}/edit` },
  };
}

type Finding = { variant: string; rule: string; impact: string; help: string; count: number; targets: string[] };

function describeFindings(path: string, findings: Finding[]): string {
  const lines = findings.map(
    (f) => `  [${f.variant}] ${f.impact} ${f.rule}: ${f.help} — ${f.count} element(s): ${f.targets.slice(0, 4).join(' | ')}${f.count > 4 ? ' …' : ''}`,
  );
  return `${path}: ${findings.length} serious or critical axe finding(s)\n${lines.join('\n')}`;
}

test.describe('axe-core, WCAG 2.1 A/AA, both sizes and both schemes', () => {
  // Each page is its own test: one page's findings never hide another's.
  test.beforeAll(async ({ browser }) => {
    test.setTimeout(120_000);
    const d = await discover(browser);
    found = d.found;
    builderState = d.state;
  });

  for (const pageCase of PAGES) {
    test(`${pageCase.name} has no serious or critical violations`, async ({ browser }) => {
      test.setTimeout(120_000);
      const path = pageCase.path(found!);
      const context = await browser.newContext(pageCase.signedIn ? { storageState: builderState! } : {});
      const page = await context.newPage();
      const findings: Finding[] = [];
      try {
        for (const size of SIZES) {
          for (const scheme of SCHEMES) {
            const variant = `${size.name}, ${scheme}`;
            await test.step(variant, async () => {
              await page.setViewportSize({ width: size.width, height: size.height });
              await page.emulateMedia({ colorScheme: scheme });
              const res = await page.goto(path, { waitUntil: 'domcontentloaded' });
              expect(res?.status(), `${path} answers`).toBeLessThan(400);
              await expect(page.locator('main').first()).toBeVisible();
              // Let client components settle; a photo or clip still loading must not hold the check up.
              await page.waitForLoadState('networkidle', { timeout: 8_000 }).catch(() => undefined);
              // Colours read by axe are the settled ones, not a transition's midpoint.
              await page.addStyleTag({ content: '*,*::before,*::after{transition:none!important;animation:none!important}' });
              const result = await new AxeBuilder({ page })
                // Names that do not start with the visible text (WCAG 2.5.3): axe keeps this rule among its experimental ones.
                .options({ rules: { 'label-content-name-mismatch': { enabled: true } } })
                .withTags(WCAG_TAGS)
                .analyze();
              for (const v of result.violations) {
                if (!v.impact || !FAILING_IMPACTS.has(v.impact)) continue;
                findings.push({
                  variant,
                  rule: v.id,
                  impact: v.impact,
                  help: v.help,
                  count: v.nodes.length,
                  targets: v.nodes.map((n) => n.target.map(String).join(' ')),
                });
              }
            });
          }
        }
      } finally {
        await context.close();
      }
      expect(findings, describeFindings(path, findings)).toEqual([]);
    });
  }
});

test.describe('keyboard', () => {
  test('every header control shows its focus ring uncut, at both sizes', async ({ page }) => {
    for (const size of SIZES) {
      await page.setViewportSize({ width: size.width, height: size.height });
      await page.goto('/', { waitUntil: 'domcontentloaded' });
      await page.waitForLoadState('networkidle', { timeout: 8_000 }).catch(() => undefined);
      // Every control shown at this size (the search box on a desk, its icon link elsewhere), each reached once.
      const n = await page.locator('header').first().locator('a:visible, button:visible, input:visible').count();
      expect(n).toBeGreaterThan(3);
      let checked = 0;
      // Tab from the top of the page through every control in the header (a skip link may come first).
      for (let presses = 0; presses < n + 4; presses++) {
        await page.keyboard.press('Tab');
        const ring = await page.evaluate(() => {
          const el = document.activeElement as HTMLElement | null;
          if (!el || !el.closest('header')) return null;
          const style = getComputedStyle(el);
          const r = el.getBoundingClientRect();
          const width = parseFloat(style.outlineWidth) || 0;
          const reach = width + (parseFloat(style.outlineOffset) || 0);
          // The ring must not be cut off by an ancestor that clips its overflow (a scrolling strip does).
          let cutBy = '';
          for (let p = el.parentElement; p; p = p.parentElement) {
            const ps = getComputedStyle(p);
            if (ps.overflowX === 'visible' && ps.overflowY === 'visible') continue;
            const pr = p.getBoundingClientRect();
            if (r.left - reach < pr.left - 0.5 || r.right + reach > pr.right + 0.5 || r.top - reach < pr.top - 0.5 || r.bottom + reach > pr.bottom + 0.5) {
              cutBy = p.tagName.toLowerCase();
            }
          }
          return { text: el.textContent?.trim() ?? '', outline: style.outlineStyle, width, cutBy };
        });
        if (!ring) {
          if (checked > 0) break;
          continue;
        }
        checked++;
        expect(ring.outline, `${size.name}: focus ring on “${ring.text}”`).not.toBe('none');
        expect(ring.width, `${size.name}: focus ring width on “${ring.text}”`).toBeGreaterThanOrEqual(2);
        expect(ring.cutBy, `${size.name}: focus ring on “${ring.text}” is cut off by its <${ring.cutBy}>`).toBe('');
      }
      expect(checked, `${size.name}: header controls reached by Tab`).toBe(n);
    }
  });
});
