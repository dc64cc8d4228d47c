import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { adoptSession, launchBrowser, newContext } from '../support/browser';
import { createBankWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

// The web app runs under the API's content security policy without a single violation: every
// page below is loaded in chromium with the policy on, and the browser's own
// securitypolicyviolation events (and console reports) are collected. A control proves the
// collector sees a violation when there is one.
let app: TestApp;
let browser: Browser;
let cookie: string;
let pages: string[];

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  // One person with every role but viewer, so each page opens with its content.
  const person = await createUser(app.ctx, { roles: ['admin', 'planner', 'technician', 'supervisor'] });
  cookie = await signIn(app, person.email, person.password);
  const bank = await createBankWithUnits(app.ctx, { steps: 2 });
  const onSite = await createWorkOrder(app.ctx, { bank, state: 'on-site', assigneeId: person.user.id });
  const sealed = await createWorkOrder(app.ctx, { bank, state: 'sealed', assigneeId: person.user.id });
  pages = [
    '/',
    '/fleet',
    `/sites/${bank.siteId}`,
    `/sites/${bank.siteId}/health`,
    `/banks/${bank.bankId}`,
    `/capacitor-units/${bank.unitIds[0]}`,
    '/work-orders',
    '/work-orders/calendar',
    `/work-orders/${onSite}`,
    `/work-orders/${sealed}/record`,
    `/field/orders/${onSite}`,
    '/today',
    '/review',
    '/flags',
    '/plans',
    '/people',
    '/audit-log',
    '/service-health',
    '/account',
  ];
}, 90_000);

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/** A page whose CSP violations (event and console) land in the returned list. */
async function watchedPage(context: BrowserContext): Promise<{ page: Page; violations: string[] }> {
  const violations: string[] = [];
  await context.exposeBinding('reportCspViolation', (_source, text: string) => {
    violations.push(text);
  });
  // Init scripts run through the DevTools protocol, so the policy does not block this listener.
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { reportCspViolation: (t: string) => void }).reportCspViolation(
        `${e.violatedDirective} blocked ${e.blockedURI || 'inline'} on ${location.pathname} (${e.sourceFile}:${e.lineNumber}:${e.columnNumber})`,
      );
    });
  });
  const page = await context.newPage();
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) violations.push(`console on ${page.url()}: ${message.text()}`);
  });
  return { page, violations };
}

test('the collector sees a violation when the policy blocks something (control)', async () => {
  const context = await newContext(browser);
  const { page, violations } = await watchedPage(context);
  await page.goto(app.url + '/sign-in', { waitUntil: 'networkidle' });
  await page.evaluate(() => {
    const script = document.createElement('script');
    script.textContent = 'window.inlineRan = true';
    document.body.append(script);
  });
  await expect.poll(() => violations.length).toBeGreaterThan(0);
  expect(await page.evaluate(() => (window as unknown as { inlineRan?: boolean }).inlineRan)).toBeUndefined();
  await context.close();
});

test('every page of the web app loads under the policy without a violation', async () => {
  const context = await newContext(browser);
  const { page, violations } = await watchedPage(context);
  const signInPage = await page.goto(app.url + '/sign-in', { waitUntil: 'networkidle' });
  const policy = signInPage!.headers()['content-security-policy'] ?? '';
  expect(policy).toContain("script-src 'self'");
  expect(policy).toContain("object-src 'none'");
  expect(policy).toContain("frame-ancestors 'none'");
  await adoptSession(context, app.url, cookie);
  for (const path of pages) {
    const res = await page.goto(app.url + path, { waitUntil: 'networkidle' });
    expect(res?.status(), path).toBe(200);
    expect(res?.headers()['content-security-policy'], path).toBe(policy);
    // The page rendered something (not a blank screen from a blocked script).
    await expect.poll(() => page.locator('#root').innerText(), { message: path }).not.toBe('');
  }
  expect(violations).toEqual([]);
  await context.close();
}, 120_000);
