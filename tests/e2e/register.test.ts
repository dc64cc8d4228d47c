import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { adoptSession, expectAccessible, launchBrowser, newContext, visit } from '../support/browser';
import { createUser, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
let plannerCookie: string;

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  const planner = await createUser(app.ctx, { roles: ['planner'], name: 'Register planner' });
  plannerCookie = await signIn(app, planner.email, planner.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).innerText();

/** After a client-side navigation (a link or a saved form): wait for the page, then check it as visit() does. */
async function arrived(page: Page, path: RegExp, title: string | RegExp) {
  await page.waitForURL((url) => path.test(url.pathname));
  await expect.poll(() => heading(page)).toMatch(title);
  await page.waitForLoadState('networkidle');
  await expectAccessible(page);
}

test('a planner builds a site, a bank, its steps and units through the forms and sees the rated capacitance', async () => {
  const context = await newContext(browser);
  await adoptSession(context, app.url, plannerCookie);
  const page = await context.newPage();
  const siteName = unique('Alder Quay');

  await visit(page, `${app.url}/sites`);
  await expect.poll(() => heading(page)).toBe('Sites');
  await page.getByRole('link', { name: 'New site' }).click();
  await arrived(page, /^\/sites\/new$/, 'New site');

  // A required field left empty is refused inline, beside its field.
  await page.getByRole('button', { name: 'Add the site' }).click();
  await expect.poll(() => page.getByText('Required').first().isVisible()).toBe(true);

  await page.getByLabel('Name').fill(siteName);
  await page.getByLabel('Address').fill('1 Cold Store Road');
  expect(await page.getByLabel('Network voltage').inputValue()).toBe('400');
  await page.getByLabel('Transformer rating').fill('1600');
  await page.getByLabel('Tariff basis').selectOption('tan-phi-limit');
  await page.getByLabel('tan φ limit').fill('0.4');
  await page.getByLabel('Price per kvarh').fill('0.02');
  await page.getByRole('button', { name: 'Add the site' }).click();
  await arrived(page, /^\/sites\/\d+$/, siteName);

  await page.getByRole('link', { name: 'New bank' }).click();
  await arrived(page, /^\/sites\/\d+\/banks\/new$/, 'New bank');
  await page.getByLabel('Name').fill('Bank B');
  await page.getByLabel('Location in the site').fill('Plant room 2');
  await page.getByRole('button', { name: 'Add the bank' }).click();
  await arrived(page, /^\/banks\/\d+$/, 'Bank B');

  // The build panel starts with a step when the bank has none.
  const build = page.getByRole('region', { name: 'Build the bank' });
  await build.getByLabel('Rated output').fill('50');
  await build.getByRole('button', { name: 'Add the step' }).click();
  await expect.poll(() => build.getByRole('status').innerText()).toMatch(/Step 1 added/);
  // The next number and the last rating are suggested.
  expect(await build.getByLabel('Step number').inputValue()).toBe('2');
  await build.getByRole('button', { name: 'Add the step' }).click();
  await expect.poll(() => build.getByRole('status').innerText()).toMatch(/Step 2 added/);

  await build.getByLabel('Add', { exact: true }).selectOption('unit');
  await build.getByLabel('To step').selectOption({ label: 'Step 1 (50 kvar)' });
  // The site's network is the new unit's default nameplate voltage and frequency.
  expect(await build.getByLabel('Rated voltage').inputValue()).toBe('400');
  expect(await build.getByLabel('Rated frequency').inputValue()).toBe('50');
  await build.getByLabel('Rated output').fill('50');
  // [DERIVED] engineering-reference.md §1: 50 kvar 400 V 50 Hz delta → C_Δ = 331.57 µF per leg.
  await expect.poll(() => build.getByTestId('rated-capacitance-preview').innerText()).toMatch(/331\.57\s*µF\s*per delta leg/);
  // A typed capacitance 2.5 % above the nameplate's is flagged at once (the API warns beyond 2 %).
  await build.getByLabel('Capacitance as marked').fill('339.86');
  await expect.poll(() => build.getByTestId('capacitance-difference').innerText()).toMatch(/\+2\.5\s*% from the nameplate's value\. More than 2 %/);
  await build.getByLabel('Capacitance as marked').fill('');
  await build.getByLabel('Serial number').fill('AQ-B-0001');
  await build.getByRole('button', { name: 'Add the unit' }).click();
  await expect.poll(() => build.getByRole('status').innerText()).toMatch(/position 1 of step 1 added: 331\.57 µF rated/);
  expect(await build.getByLabel('Position in the step').inputValue()).toBe('2');

  // The drawing shows the new unit with its "no reading yet" glyph, and opens its record.
  const drawing = page.getByTestId('panel-drawing');
  const unitSymbol = drawing.getByRole('link', { name: 'Unit 1 50 kvar 400 V No reading yet, step 1' });
  await expect.poll(() => unitSymbol.count()).toBe(1);
  await expectAccessible(page);
  await unitSymbol.click();
  await arrived(page, /^\/capacitor-units\/\d+$/, 'Unit AQ-B-0001');
  // [DERIVED] engineering-reference.md §1: 50 kvar 400 V 50 Hz delta → 331.57 µF per leg, from the API's ratedCapacitanceUF.
  expect(await page.getByTestId('rated-capacitance').innerText()).toMatch(/331\.57\s*µF\s*per delta leg/);
  expect(await page.getByText('No readings recorded yet').first().isVisible()).toBe(true);

  // On a 360 px phone the bank page keeps its width: only the drawing scrolls sideways.
  const bankUrl = page.url().replace(/\/capacitor-units\/\d+$/, '');
  await page.goBack();
  await page.waitForURL((url) => /^\/banks\/\d+$/.test(url.pathname));
  await page.setViewportSize({ width: 360, height: 800 });
  await page.waitForLoadState('networkidle');
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow, `page scrolls sideways at 360 px (${bankUrl})`).toBeLessThanOrEqual(0);
  await context.close();
});

test('a viewer cannot see a site they are not granted', async () => {
  const res = await app.request('/api/sites', {
    cookie: plannerCookie,
    json: {
      name: unique('Brinmoor'),
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1000,
      transformerImpedancePct: 6,
      targetPf: 0.9,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      pricePerKvarh: 0.03,
    },
  });
  expect(res.status).toBe(201);
  const ungranted = (await res.json()) as { id: number; name: string };
  const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [] });
  const context = await newContext(browser);
  await adoptSession(context, app.url, await signIn(app, viewer.email, viewer.password));
  const page = await context.newPage();

  await visit(page, `${app.url}/sites/${ungranted.id}`);
  await expect.poll(() => heading(page)).toBe('Nothing here');
  expect(await page.getByText(ungranted.name).count()).toBe(0);

  // Nor does it appear in their list, where write commands are not offered.
  await visit(page, `${app.url}/sites?q=${encodeURIComponent(ungranted.name)}`);
  await expect.poll(() => page.getByText(`No site matches “${ungranted.name}”.`).isVisible()).toBe(true);
  expect(await page.getByRole('link', { name: 'New site' }).count()).toBe(0);
  await context.close();
});

test('a planner imports a bank register from CSV after a preview, then prints its labels', async () => {
  const site = await app.request('/api/sites', {
    cookie: plannerCookie,
    json: {
      name: unique('Castellan Polymers'),
      voltageV: 480,
      frequencyHz: 60,
      transformerKva: 1250,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      pricePerKvarh: 0.01,
      currency: 'USD',
    },
  });
  const { id: siteId } = (await site.json()) as { id: number };
  const bankRes = await app.request('/api/banks', { cookie: plannerCookie, json: { siteId, name: 'Bank 1', detuned: false } });
  const { id: bankId } = (await bankRes.json()) as { id: number };

  const context = await newContext(browser);
  await adoptSession(context, app.url, plannerCookie);
  const page = await context.newPage();
  await visit(page, `${app.url}/banks/${bankId}/import`);
  const header = 'step,step_kvar,position,kvar,voltage_v,frequency_hz,connection,capacitance_uf,serial,maker,model,installed_on';

  // A row with an error: listed on its line, and nothing can be imported.
  await page.getByLabel('Paste the CSV').fill([header, '1,50,1,25,480,60,delta,,CP-1,,,', '1,50,2,25,480,60,zigzag,,CP-2,,,'].join('\n'));
  await page.getByRole('button', { name: 'Preview the import' }).click();
  await expect.poll(() => page.getByTestId('import-summary').innerText()).toMatch(/1 of 2 rows have errors/);
  expect(await page.getByTestId('import-preview').innerText()).toMatch(/connection: Connection is delta, star or single-phase/);
  expect(await page.getByRole('button', { name: 'Import', exact: true }).count()).toBe(0);
  await expectAccessible(page);

  // Fixed: the server's dry run confirms, then the import writes both units and their step.
  await page.getByLabel('Paste the CSV').fill([header, '1,50,1,25,480,60,delta,,CP-1,,,', '1,50,2,25,480,60,delta,,CP-2,,,'].join('\n'));
  await page.getByRole('button', { name: 'Preview the import' }).click();
  await expect.poll(() => page.getByTestId('import-summary').innerText()).toMatch(/will add 1 step and 2 capacitor units/);
  await page.getByRole('button', { name: 'Import', exact: true }).click();
  await expect.poll(() => page.getByRole('status').filter({ hasText: 'Imported' }).innerText()).toMatch(/1 new step and 2 capacitor units/);
  await expectAccessible(page);

  await visit(page, `${app.url}/banks/${bankId}`);
  const drawing = page.getByTestId('panel-drawing');
  await expect.poll(() => drawing.getByRole('link', { name: /^Unit \d 25 kvar 480 V No reading yet, step 1$/ }).count()).toBe(2);

  // One label for the bank and one per unit, each QR code holding the absolute address of its page.
  await visit(page, `${app.url}/banks/${bankId}/labels`);
  const labels = page.getByTestId('register-label');
  await expect.poll(() => labels.count()).toBe(3);
  expect(await labels.first().getAttribute('data-address')).toBe(`${app.url}/banks/${bankId}`);
  await expect.poll(() => page.locator('[data-testid="register-label"] img[src^="data:image/svg+xml"]').count()).toBe(3);
  await context.close();
});
