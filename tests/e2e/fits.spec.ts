import { test, expect, type Page } from '@playwright/test';

// The fits page, signed out: type at the bench, read the limits, share the URL.
const ANSI = 'ANSI B4.2-1978 preferred metric fits, 25 H7/g6 — from memory';
const ANSI_P6 = 'ANSI B4.2-1978 preferred metric fits, 25 H7/p6 — from memory';
const ANSI_K6 = 'ANSI B4.2-1978 preferred metric fits, 25 H7/k6 — from memory';
const INCH = 'international inch: 1 in = 25.4 mm exactly; inch figures divided by hand';
const JS_ROUNDING = 'ISO 286-1:2010, IT7 at 18–30 mm = 21 µm; JS/js of grades 7–11 may be rounded to the even value — from memory';

const entry = (page: Page) => page.getByLabel('Size and zone or fit');

/** Opens the page and waits until the box is wired to React, so typing is not lost to hydration. */
async function open(page: Page, path = '/fits') {
  await page.goto(path);
  await expect(page.locator('form[data-hydrated="true"]')).toBeAttached();
}

test('25 H7/g6: limits, clearance in words, the drawing, the URL, and a reload', async ({ page }) => {
  await open(page);
  await entry(page).fill('25 H7/g6');

  const hole = page.getByTestId('limits-hole');
  const shaft = page.getByTestId('limits-shaft');
  await expect(hole).toContainText('25.000 and 25.021 mm'); // ANSI: hole 25.000 / 25.021
  await expect(hole).toContainText('0.9843 and 0.9851 in'); // INCH: 25 / 25.4 = 0.98425, 25.021 / 25.4 = 0.98508
  await expect(shaft).toContainText('24.980 and 24.993 mm'); // ANSI: shaft 24.980 / 24.993
  await expect(hole.getByRole('row', { name: /Upper deviation ES/ })).toContainText('+0.021'); // ANSI
  await expect(shaft.getByRole('row', { name: /Lower deviation ei/ })).toContainText('-0.020'); // ANSI
  await expect(hole.getByRole('row', { name: /Tolerance IT7/ })).toContainText('21'); // ANSI (IT7 = 21 µm)

  const verdict = page.getByTestId('fit-verdict');
  await expect(verdict).toContainText('Clearance fit');
  await expect(verdict).toContainText('clearance 0.007 to 0.041 mm'); // ANSI: min 0.007, max 0.041
  await expect(verdict).toContainText('clearance 0.0003 to 0.0016 in'); // INCH: 0.007 / 25.4, 0.041 / 25.4
  await expect(page.locator('[data-notice="caution"]')).toHaveCount(0);

  const drawing = page.getByRole('img', { name: /Tolerance zones drawn to scale at 25 mm/ });
  await expect(drawing).toBeVisible();
  await expect(drawing).toHaveAttribute('aria-label', /hole H7 from 0 to \+21 µm/); // ANSI
  await expect(drawing).toHaveAttribute('aria-label', /shaft g6 from -20 to -7 µm, wholly below the zero line/); // ANSI
  await expect(drawing).toHaveAttribute('aria-label', /Clearance fit: the hole zone lies wholly above the shaft zone/);
  await expect(drawing.locator('[data-label="H7-upper"]')).toContainText('+21 µm');
  await expect(drawing.locator('[data-label="g6-lower"]')).toContainText('-20 µm');
  await expect(drawing.locator('[data-band="gap"]')).toContainText('7 µm'); // ANSI: min clearance 7 µm

  await expect(page).toHaveURL(/\/fits\?q=25\+H7%2Fg6$/);
  await page.reload();
  await expect(page.locator('form[data-hydrated="true"]')).toBeAttached();
  await expect(entry(page)).toHaveValue('25 H7/g6');
  await expect(page.getByTestId('fit-verdict')).toContainText('clearance 0.007 to 0.041 mm'); // ANSI
  await expect(page.getByRole('img', { name: /Tolerance zones drawn to scale at 25 mm/ })).toBeVisible();
});

test('an invalid zone is explained beside the box', async ({ page }) => {
  await open(page);
  await entry(page).fill('25 H7/q6');
  const reason = page.locator('[data-field-error="entry"]');
  await expect(reason).toContainText('there is no letter "q"');
  await expect(entry(page)).toHaveAttribute('aria-invalid', 'true');
  await expect(entry(page)).toHaveAttribute('aria-describedby', 'entry-error');
  await expect(page.getByTestId('fit-verdict')).toHaveCount(0);

  // A zone the standard does not define at this size: ISO 286-2:2010, shaft t only above 24 mm — from memory
  await entry(page).fill('20 H7/t6');
  await expect(reason).toContainText('only above 24 mm');

  await entry(page).fill('25 H7/g6');
  await expect(reason).toHaveCount(0);
  await expect(page.getByTestId('fit-verdict')).toContainText('Clearance fit');
});

test('an interference fit shows the caution on pressing and heating parts', async ({ page }) => {
  await open(page);
  // Typed key by key, as at the bench: the page keeps up through the half-typed entries.
  await entry(page).focus();
  await page.keyboard.type('25 H7/p6');
  const verdict = page.getByTestId('fit-verdict');
  await expect(verdict).toContainText('Interference fit');
  await expect(verdict).toContainText('interference 0.001 to 0.035 mm'); // ANSI_P6: max clearance −0.001, min −0.035
  await expect(page.getByRole('img', { name: /Interference fit: the shaft zone lies wholly above the hole zone/ })).toBeVisible();
  const caution = page.locator('[data-notice="caution"]');
  await expect(caution).toBeVisible();
  await expect(caution).toContainText('eye protection');
  await expect(caution).toContainText('Never hammer hardened parts');
  await expect(caution).toContainText('burns');
  await expect(caution).toContainText('manuals, local rules and qualified practice');
});

test('a pasted API-style URL and the common-fits table', async ({ page }) => {
  await open(page, '/fits?size=25&fit=H7/g6');
  await expect(entry(page)).toHaveValue('25 H7/g6');
  await expect(page.getByTestId('fit-verdict')).toContainText('clearance 0.007 to 0.041 mm'); // ANSI

  const table = page.getByRole('table', { name: 'Common hole-basis fits at 25 mm' });
  await expect(table.locator('tr[data-fit="H7/p6"]')).toContainText('Interference fit'); // ANSI_P6
  await expect(table.locator('tr[data-fit="H7/k6"]')).toContainText('Transition fit'); // ANSI_K6
  await table.getByRole('link', { name: 'H7/k6 at 25 mm' }).click();
  await expect(page).toHaveURL(/\/fits\?q=25\+H7%2Fk6$/);
  // A link is a navigation: the page left stays in the document, hidden (DEVELOPERS.md, "Reading a page").
  await expect(entry(page).filter({ visible: true })).toHaveValue('25 H7/k6');
  const verdict = page.getByTestId('fit-verdict').filter({ visible: true });
  await expect(verdict).toContainText('Transition fit');
  await expect(verdict).toContainText('clearance up to 0.019 mm, interference up to 0.015 mm'); // ANSI_K6: +0.019 / −0.015
  await expect(page.locator('[data-notice="caution"]').filter({ visible: true })).toBeVisible();
});

test('inches and the JS/js rounding option', async ({ page }) => {
  await open(page);
  await page.getByRole('radio', { name: 'Inches' }).check();
  await entry(page).fill('1 H7');
  await expect(page.getByText('Nominal 1 in = 25.400 mm')).toBeVisible(); // INCH
  await expect(page.getByTestId('limits-hole')).toContainText('1.0000 and 1.0008 in'); // INCH: 25.421 / 25.4 = 1.00083; IT7 = 21 µm
  await expect(page).toHaveURL(/q=1\+H7&unit=in/);

  await entry(page).fill('25 mm js7');
  const shaft = page.getByTestId('limits-shaft');
  await expect(shaft.getByRole('row', { name: /Upper deviation es/ })).toContainText('+10.5'); // JS_ROUNDING: ±IT7/2 = ±10.5 µm
  await page.getByRole('checkbox', { name: 'Round JS/js to the even micrometre' }).check();
  await expect(shaft.getByRole('row', { name: /Upper deviation es/ })).toContainText('+10'); // JS_ROUNDING: rounded to ±10 µm
  await expect(shaft.getByRole('row', { name: /Upper deviation es/ })).not.toContainText('10.5');
  await expect(page).toHaveURL(/round=1/);
  await page.reload();
  await expect(page.getByRole('checkbox', { name: 'Round JS/js to the even micrometre' })).toBeChecked();
  await expect(page.getByTestId('limits-shaft').getByRole('row', { name: /Upper deviation es/ })).toContainText('+0.010'); // JS_ROUNDING
});

const RC4 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Running and Sliding Fits, RC4 over 1.19 to 1.97 in: clearance 1.0 / 3.6, hole +1.6 / 0, shaft −1.0 / −2.0 thou — from memory";
const FN2 = "Machinery's Handbook 29th ed., ANSI B4.1-1967 (R2009), Force and Shrink Fits, FN2 over 0.71 to 0.95 in: interference 0.6 / 1.9 thou — from memory";

test('an inch class from a link: /fits?q=1.5 RC4, its limits in thou, in and mm, the drawing, the nearest ISO fit and the other classes', async ({ page }) => {
  await open(page, `/fits?q=${encodeURIComponent('1.5 RC4')}`);
  await expect(entry(page)).toHaveValue('1.5 RC4');
  await expect(page.getByTestId('result-title')).toContainText('1.5 in RC4');
  await expect(page.getByText('Nominal 1.5 in = 38.100 mm')).toBeVisible(); // INCH

  const verdict = page.getByTestId('fit-verdict');
  await expect(verdict).toContainText('Clearance fit');
  await expect(verdict).toContainText('clearance 1 to 3.6 thou'); // RC4
  await expect(verdict).toContainText('clearance 0.0010 to 0.0036 in'); // RC4 in inches

  const hole = page.getByTestId('inch-limits-hole');
  const shaft = page.getByTestId('inch-limits-shaft');
  await expect(hole).toContainText('1.5000 and 1.5016 in'); // RC4: hole +1.6 / 0
  await expect(hole).toContainText('38.100 and 38.14064 mm'); // INCH: 1.6 thou = 0.04064 mm
  await expect(shaft).toContainText('1.4980 and 1.4990 in'); // RC4: shaft −1.0 / −2.0
  await expect(shaft.getByRole('row', { name: /Tolerance, grade 7/ })).toContainText('1'); // RC4 shaft grade 7 = 1.0 thou at 1.19–1.97

  const drawing = page.getByRole('img', { name: /Tolerance zones drawn to scale at 1\.5 in/ });
  await expect(drawing).toBeVisible();
  await expect(drawing).toHaveAttribute('aria-label', /hole RC4 from 0 to \+40\.64 µm/); // INCH: 1.6 thou = 40.64 µm

  const iso = page.getByTestId('iso-nearest');
  await expect(iso).toContainText('Nearest ISO 286 fit, approximately: H8/f7');
  await expect(iso).toContainText('comparison');

  const classes = page.getByRole('region', { name: 'Inch classes at 1.5 in' });
  await expect(classes).toBeVisible();
  await classes.getByRole('link', { name: 'FN2' }).click();
  await expect(page).toHaveURL(/q=1\.5\+FN2&unit=in/);
  await expect(page.getByTestId('fit-verdict').filter({ visible: true })).toContainText('Interference fit');
  await expect(page.locator('[data-notice="caution"]').filter({ visible: true })).toBeVisible();
});

test('inch class refusals are said under the box', async ({ page }) => {
  await open(page);
  await entry(page).fill('0.875 FN2');
  await expect(page.getByTestId('fit-verdict')).toContainText('interference 0.6 to 1.9 thou'); // FN2
  await entry(page).fill('25 mm RC4');
  await expect(page.locator('#entry-error')).toContainText('RC4 is an inch class (ANSI B4.1): give the size in inches');
  await entry(page).fill('20 LT1');
  await expect(page.locator('#entry-error')).toContainText('LT1 is tabulated up to 19.69 in'); // Locational Transition Fits table ends at 19.69 in — from memory
  const classes = page.getByRole('region', { name: 'Inch classes at 20 in' });
  await expect(classes.getByRole('row', { name: /^LT1/ })).toContainText('Table ends at 19.69 in');
  await expect(classes.getByRole('row', { name: /^RC4/ })).toContainText('Clearance fit'); // RC tables go to 200 in — from memory
});

test('the page is built ahead for everyone; a shared link is worked out on the server; typing asks the server nothing', async ({ page, request }) => {
  // The plain page is the one built at build time, the same for every visitor.
  const plain = await request.get('/fits');
  expect(plain.status()).toBe(200);
  expect(plain.headers()['x-nextjs-cache']).toBe('HIT');
  expect(await plain.text()).not.toContain('data-testid="fit-verdict"');

  // A link holding a look-up comes with its result in the HTML, before any script runs.
  const shared = await request.get('/fits?q=25+H7%2Fg6');
  const html = await shared.text();
  expect(html).toContain('value="25 H7/g6"');
  expect(html).toContain('data-testid="fit-verdict"');

  // Typing works in the browser and writes the address, with no request for the page.
  const asked: string[] = [];
  page.on('request', (r) => {
    if (new URL(r.url()).pathname.startsWith('/fits')) asked.push(r.url());
  });
  await open(page);
  asked.length = 0;
  await entry(page).fill('40 H7/p6');
  await expect(page.getByTestId('fit-verdict')).toContainText('Interference fit'); // ANSI_P6
  await expect(page).toHaveURL(/\/fits\?q=40\+H7%2Fp6$/);
  await page.waitForTimeout(500);
  expect(asked).toEqual([]);

  // Back and forward still follow the address.
  await page.goto('/calculators');
  await page.goBack();
  await expect(entry(page)).toHaveValue('40 H7/p6');
});
