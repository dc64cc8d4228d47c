import axe from 'axe-core';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { expect } from 'vitest';

/** Debian's chromium, headless, with the flags this machine's closed network needs. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}

export const phoneViewport = { width: 390, height: 844 };
export const deskViewport = { width: 1280, height: 800 };

export async function newContext(browser: Browser, viewport = deskViewport): Promise<BrowserContext> {
  return browser.newContext({ viewport, ...(viewport.width < 500 ? { isMobile: true, hasTouch: true } : {}) });
}

/** Runs axe-core on the page and fails on any serious or critical violation. */
export async function expectAccessible(page: Page): Promise<void> {
  // Evaluated through the DevTools protocol, so the app's CSP (no inline scripts) stays on.
  await page.evaluate(axe.source);
  const violations = await page.evaluate(async () => {
    const result = await (window as unknown as { axe: typeof axe }).axe.run(document, {
      resultTypes: ['violations'],
    });
    return result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.id} (${v.impact}): ${v.help} — ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
  });
  expect(violations, `accessibility violations on ${page.url()}`).toEqual([]);
}

/** Every journey goes through here, so every page it visits gets the accessibility check. */
export async function visit(page: Page, url: string): Promise<void> {
  await page.goto(url, { waitUntil: 'networkidle' });
  await expectAccessible(page);
}

/**
 * Gives a browser context the session behind a Cookie header value (from factories' signIn), so
 * a journey that is not about signing in can start on its page.
 */
export async function adoptSession(context: BrowserContext, appUrl: string, cookie: string): Promise<void> {
  const separator = cookie.indexOf('=');
  await context.addCookies([{ name: cookie.slice(0, separator), value: cookie.slice(separator + 1), url: appUrl }]);
}
