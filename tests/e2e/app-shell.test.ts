import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { deskViewport, launchBrowser, newContext, phoneViewport, visit } from '../support/browser';
import { startTestApp, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

for (const [name, viewport] of [
  ['desk', deskViewport],
  ['phone', phoneViewport],
] as const) {
  test(`the app shell shows the services' health on a ${name}`, async () => {
    const context = await newContext(browser, viewport);
    const page = await context.newPage();
    await visit(page, app.url + '/');
    for (const service of ['database', 'storage', 'mail']) {
      await expect.poll(() => page.getByTestId(`health-${service}`).innerText()).toMatch(/\bup\b/i);
    }
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await context.close();
  });
}

test('an unknown page shows the not-found page', async () => {
  const context = await newContext(browser);
  const page = await context.newPage();
  await visit(page, app.url + '/no/such/page');
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toMatch(/nothing here/i);
  await context.close();
});
