import type { Browser, BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { adoptSession, launchBrowser, newContext, phoneViewport } from '../support/browser';
import { createBankWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// A page drawn on the server (tests/integration/first-view.test.ts) is hydrated in the browser:
// the nodes the server sent stay in place (React takes them over rather than drawing the page
// again), no hydration error is reported, and the page then works as one drawn in the browser.
let app: TestApp;
let browser: Browser;
let technicianCookie: string;
let supervisorCookie: string;
let orderId: number;

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  const technician = await createUser(app.ctx, { roles: ['technician'] });
  const supervisor = await createUser(app.ctx, { roles: ['supervisor'] });
  technicianCookie = await signIn(app, technician.email, technician.password);
  supervisorCookie = await signIn(app, supervisor.email, supervisor.password);
  const bank = await createBankWithUnits(app.ctx, { steps: 2 });
  orderId = await createWorkOrder(app.ctx, { bank, state: 'on-site', assigneeId: technician.user.id });
}, 90_000);

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/**
 * Opens the page with the app's entry script held back, marks the server's heading, lets the
 * script go and waits for the app: the same heading node must still be in the page.
 */
async function hydrated(path: string, cookie: string | undefined, given?: BrowserContext) {
  const context = given ?? (await newContext(browser, phoneViewport));
  if (cookie) await adoptSession(context, app.url, cookie);
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(message.text());
  });
  let release = () => {};
  const held = new Promise<void>((resolve) => (release = resolve));
  await page.route(/\/assets\/index-[^/]*\.js$/, async (route) => {
    await held;
    await route.continue();
  });
  await page.goto(app.url + path, { waitUntil: 'commit' });
  const heading = page.locator('#root h1');
  await heading.waitFor({ state: 'attached' });
  const drawnBeforeScript = await heading.textContent();
  await heading.evaluate((node) => ((window as unknown as { serverHeading: Element }).serverHeading = node));
  release();
  await page.waitForLoadState('networkidle');
  // The app is running: the router has made the page's links its own.
  await page.waitForFunction(() => document.querySelector('#root a[data-discover]') !== null);
  const kept = await page.evaluate(() => (window as unknown as { serverHeading: Element }).serverHeading.isConnected);
  return { page, context, problems, drawnBeforeScript, kept };
}

test('sign-in: drawn before the script runs, kept by hydration, and signing in works', async () => {
  const { page, context, problems, drawnBeforeScript, kept } = await hydrated('/sign-in', undefined);
  expect(drawnBeforeScript).toBe('Sign in');
  expect(kept).toBe(true);
  expect(problems).toEqual([]);
  // The form the server drew is the app's: a bad password gets the app's own answer in place.
  await page.getByLabel(/e-mail/i).fill('nobody@example.test');
  await page.getByRole('textbox', { name: 'Password' }).fill('not-the-password');
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect.poll(() => page.getByRole('alert').first().textContent()).toMatch(/./);
  await context.close();
});

test("the technician's order: drawn with its order, kept by hydration, and the walk answers", async () => {
  const { page, context, problems, drawnBeforeScript, kept } = await hydrated(`/field/orders/${orderId}`, technicianCookie);
  expect(drawnBeforeScript).toMatch(/Order/);
  expect(kept).toBe(true);
  expect(problems).toEqual([]);
  // The part picker the server drew now switches parts.
  await page.getByRole('button', { name: /^Step 2/ }).click();
  await expect.poll(() => new URL(page.url()).searchParams.get('part')).toBe('step-2');
  await context.close();
});

test('the fleet dashboard: drawn with its figures and kept by hydration', async () => {
  const { context, problems, drawnBeforeScript, kept } = await hydrated('/fleet', supervisorCookie);
  expect(drawnBeforeScript).toBe('Fleet health');
  expect(kept).toBe(true);
  expect(problems).toEqual([]);
  await context.close();
});

test("a reader in another locale and zone: drawn again at first, then drawn as the browser would and kept", async () => {
  // A German phone in New York; the server runs in its own zone. Playwright sends Accept-Language de-DE.
  const context = await browser.newContext({ viewport: phoneViewport, isMobile: true, hasTouch: true, locale: 'de-DE', timezoneId: 'America/New_York' });
  // First visit: no locale kept yet, so the server wrote dates in its own zone; the browser draws the page again, with no error.
  const first = await hydrated('/sign-in', undefined, context);
  expect(first.drawnBeforeScript).toBe('Sign in');
  expect(first.problems).toEqual([]);
  const kept = (await context.cookies(app.url)).find((c) => c.name === 'varden_reader');
  expect(decodeURIComponent(kept?.value ?? '')).toBe('de-DE America/New_York');
  await first.page.close();

  // From then on the server writes as this browser does, and hydration keeps its markup.
  const { page, problems, drawnBeforeScript, kept: nodeKept } = await hydrated(`/field/orders/${orderId}`, technicianCookie, context);
  expect(drawnBeforeScript).toMatch(/Order/);
  expect(nodeKept).toBe(true);
  expect(problems).toEqual([]);
  const dueOn = await page.evaluate(async (id) => ((await (await fetch(`/api/work-orders/${id}`)).json()) as { dueOn: string }).dueOn, orderId);
  const [year, month, day] = dueOn.slice(0, 10).split('-');
  // German style (ICU), and the due date is its own day, not the day before as midnight UTC would be in New York.
  await expect.poll(() => page.locator('#root').textContent()).toContain(`Due ${day}.${month}.${year}`);
  await context.close();
});
