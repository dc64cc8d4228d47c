import { randomUUID } from 'node:crypto';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { adoptSession, deskViewport, expectAccessible, launchBrowser, newContext, visit } from '../support/browser';
import { createStepWithUnits, createUser, createWorkOrder, sessionCookieFor } from '../support/factories';
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

/** Text as a reader sees it: the no-break spaces between numbers and units read as spaces. */
const plain = (text: string) => text.replace(/\u00A0/g, ' ').replace(/\s+/g, ' ').trim();

test('a unit’s page shows its readings newest first, its condition from the newest and the trend’s points', { timeout: 120_000 }, async () => {
  const technician = await createUser(app.ctx, { roles: ['technician'] });
  const techCookie = await sessionCookieFor(app.ctx, technician.user.id);
  const supervisor = await createUser(app.ctx, { roles: ['supervisor'] });
  const step = await createStepWithUnits(app.ctx);
  const unitId = step.unitIds[0]!;
  // [DERIVED] engineering-reference.md §1: a 50 kvar 400 V delta unit has C_Δ = 331.57 µF per leg.
  const legUF = (50e3 / (3 * 2 * Math.PI * 50 * 400 * 400)) * 1e6;
  const taken = [
    { at: '2025-06-03T09:00:00Z', share: 0.98 },
    { at: '2026-06-03T09:00:00Z', share: 0.88 },
  ];
  for (const { at, share } of taken) {
    const orderId = await createWorkOrder(app.ctx, { bank: step, state: 'on-site', assigneeId: technician.user.id });
    const res = await app.request(`/api/work-orders/${orderId}/readings`, {
      method: 'POST',
      cookie: techCookie,
      json: { idempotencyKey: `r${randomUUID().replace(/-/g, '')}`, target: 'capacitor-unit', targetId: unitId, method: 'per-element', elementsUF: [1, 2, 3].map(() => share * legUF), recordedAt: at },
    });
    expect(res.status).toBe(201);
  }

  const context = await newContext(browser, deskViewport);
  await adoptSession(context, app.url, await sessionCookieFor(app.ctx, supervisor.user.id));
  const page = await context.newPage();
  await visit(page, `${app.url}/capacitor-units/${unitId}`);
  const history = page.getByRole('region', { name: 'Reading history of this unit' });
  await expect.poll(async () => history.locator('tbody tr').count()).toBe(2);
  const rows = (await history.locator('tbody tr').allInnerTexts()).map(plain);
  // Newest first: −12 % is past the replace line (−10 %), −2 % is healthy [COMMON] §3.
  expect(rows[0]).toMatch(/Jun \d, 2026.*Per element.*291\.8 · 291\.8 · 291\.8 µF.*−12\.0 %.*Replace/);
  expect(rows[1]).toMatch(/Jun \d, 2025.*−2\.0 %.*Healthy/);
  const condition = page.locator('dl > div').filter({ has: page.locator('dt', { hasText: /^Condition$/ }) });
  expect(plain(await condition.innerText())).toMatch(/Condition Replace on Jun \d, 2026/);
  expect(await page.getByRole('img', { name: 'Deviation from nameplate over time' }).locator('.recharts-line-dot, .recharts-dot').count()).toBeGreaterThanOrEqual(2);
  await expectAccessible(page);
  await context.close();
});
