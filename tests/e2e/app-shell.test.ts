import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { deskViewport, launchBrowser, newContext, phoneViewport, adoptSession, visit } from '../support/browser';
import { createUser, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
let adminCookie: string;
beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  const admin = await createUser(app.ctx, { roles: ['admin'] });
  adminCookie = await signIn(app, admin.email, admin.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

for (const [name, viewport] of [
  ['desk', deskViewport],
  ['phone', phoneViewport],
] as const) {
  test(`the app shell shows the services' health to an administrator on a ${name}`, async () => {
    const context = await newContext(browser, viewport);
    await adoptSession(context, app.url, adminCookie);
    const page = await context.newPage();
    await visit(page, app.url + '/service-health');
    for (const service of ['database', 'storage', 'mail']) {
      await expect.poll(() => page.getByTestId(`health-${service}`).innerText()).toMatch(/\bup\b/i);
    }
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await context.close();
  });
}

test('an unknown page shows the not-found page, signed in or not', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  await visit(page, app.url + '/no/such/page');
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toMatch(/nothing here/i);
  expect(await page.getByRole('link', { name: 'Go to sign in' }).count()).toBe(1);

  await adoptSession(context, app.url, adminCookie);
  await visit(page, app.url + '/no/such/page');
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toMatch(/nothing here/i);
  expect(await page.getByRole('navigation', { name: 'Sections' }).count()).toBe(1);
  await context.close();
});
