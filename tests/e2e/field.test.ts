import { and, eq } from 'drizzle-orm';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { photos, readings, workOrders, workOrderTransitions } from '../../apps/api/src/db/schema/index';
import { adoptSession, expectAccessible, launchBrowser, newContext, phoneViewport, visit } from '../support/browser';
import { createStepWithUnits, createUser, createWorkOrder, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

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

// 25 kvar 400 V 50 Hz delta: C_Δ = Q/(3·ω·U²) = 165.79 µF per leg, so a balanced unit reads
// 1.5·C_Δ = 248.7 µF on each terminal pair with the third open.
// Source: [DERIVED] engineering-reference.md §1 and §2(a).
const balancedOpenPairUF = '248.7';

/** A technician on a phone with one dispatched order on a step of two 25 kvar units. */
async function technicianWithOrder(checklist: string[]) {
  const technician = await createUser(app.ctx, { roles: ['technician'], name: unique('Tech') });
  const step = await createStepWithUnits(app.ctx, { units: 2, nameplate: { kvar: 25 }, unit: { dischargeTimeS: 180 } });
  const title = unique('Inspection');
  const orderId = await createWorkOrder(app.ctx, { bank: step, state: 'dispatched', assigneeId: technician.user.id, title });
  await app.ctx.db.update(workOrders).set({ checklist }).where(eq(workOrders.id, orderId));
  const cookie = await signIn(app, technician.email, technician.password);
  const context = await newContext(browser, phoneViewport);
  await adoptSession(context, app.url, cookie);
  const page = await context.newPage();
  return { technician, step, orderId, title, context, page, cookie };
}

/** After a client-side navigation: wait for the page, then check it as visit() does. */
async function arrived(page: Page, path: RegExp) {
  await page.waitForURL((url) => path.test(url.pathname));
  await page.waitForLoadState('networkidle');
  await expectAccessible(page);
}

async function openOrderFromToday(page: Page, title: string, orderId: number) {
  await visit(page, `${app.url}/today`);
  const row = page.getByRole('link', { name: new RegExp(title) });
  await row.waitFor();
  expect(await row.innerText()).toMatch(/Due today/);
  expect(await row.innerText()).toMatch(/To start/);
  await row.click();
  await arrived(page, new RegExp(`^/field/orders/${orderId}$`));
}

async function acknowledgeSafetyCard(page: Page) {
  const card = page.getByTestId('safety-card');
  expect(await card.getByTestId('discharge-wait').innerText()).toMatch(/Wait at least 3 min after isolation/);
  expect(await card.innerText()).toMatch(/Your site’s safety rules, local codes and licensed practice come first\./);
  await page.getByRole('button', { name: 'I have made the bank safe — start' }).click();
  await card.getByRole('heading', { name: 'Safety card acknowledged' }).waitFor();
}

async function enterOpenPairs(card: Locator, values: [string, string, string]) {
  await card.getByLabel('Terminals 1–2, 3 open').fill(values[0]);
  await card.getByLabel('Terminals 2–3, 1 open').fill(values[1]);
  await card.getByLabel('Terminals 3–1, 2 open').fill(values[2]);
}

const bandOf = (card: Locator, testId: 'live-result' | 'server-result') => card.getByTestId(testId).locator('[data-band]').getAttribute('data-band');
const syncState = (page: Page) => page.getByTestId('sync-state').innerText();

async function noSidewaysScroll(page: Page) {
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, client: document.documentElement.clientWidth }));
  expect(widths.scroll).toBeLessThanOrEqual(widths.client);
}

describe('the technician on a phone', () => {
  let context: BrowserContext | undefined;
  afterAll(async () => {
    await context?.close();
  });

  test('records readings with a photo, with the network cut in the middle and restored, and submits', async () => {
    const setup = await technicianWithOrder(['capacitance', 'visual', 'photos']);
    context = setup.context;
    const { page, orderId, step, title } = setup;

    await openOrderFromToday(page, title, orderId);
    await noSidewaysScroll(page);
    expect(await syncState(page)).toBe('All sent');
    await acknowledgeSafetyCard(page);
    await expectAccessible(page);

    // The first unit: a balanced reading, its result at once under the fields, then the server's.
    const first = page.getByTestId(`unit-${step.unitIds[0]}`);
    await enterOpenPairs(first, [balancedOpenPairUF, balancedOpenPairUF, balancedOpenPairUF]);
    expect(await bandOf(first, 'live-result')).toBe('healthy');
    expect(await first.getByTestId('live-result').innerText()).toMatch(/165[.,]8\s*µF/);
    await first.getByRole('button', { name: 'Record reading' }).click();
    await first.getByTestId('server-result').waitFor();
    expect(await bandOf(first, 'server-result')).toBe('healthy');
    expect(await first.getByTestId('server-result').innerText()).not.toMatch(/differs/);

    // A photo from the camera: uploaded, then its thumbnail from the server.
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 156, g: 74, b: 26 } } }).jpeg().toBuffer();
    await first.getByLabel('Photo caption').fill('Nameplate of unit 1');
    await first.locator('input[type="file"]').setInputFiles({ name: 'unit-1.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    const thumbnail = first.getByTestId('stored-photo').getByRole('img', { name: 'Nameplate of unit 1' });
    await thumbnail.waitFor();
    await expect.poll(() => thumbnail.evaluate((img) => (img as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
    expect(await syncState(page)).toBe('All sent');

    // The signal goes: the second reading stays on the phone and says so.
    await context.setOffline(true);
    await expect.poll(() => syncState(page)).toMatch(/^Offline/);
    const second = page.getByTestId(`unit-${step.unitIds[1]}`);
    await enterOpenPairs(second, ['240.1', '239.8', '240.3']);
    expect(await bandOf(second, 'live-result')).toBe('healthy');
    await second.getByRole('button', { name: 'Record reading' }).click();
    await expect.poll(() => syncState(page)).toBe('Offline — 1 waiting');
    expect(await second.locator('[data-sync="waiting"]').innerText()).toMatch(/Saved on this phone/);
    expect(await page.getByTestId('waiting-list').innerText()).toMatch(/Step 1, unit 2 · capacitance/);
    expect(await page.getByTestId('next-action').innerText()).toMatch(/Offline — 1 waiting/);
    await expectAccessible(page);

    // The signal returns: it is sent by itself, and the server's result appears.
    await context.setOffline(false);
    await expect.poll(() => syncState(page), { timeout: 20_000 }).toBe('All sent');
    await second.getByTestId('server-result').waitFor();
    expect(await bandOf(second, 'server-result')).toBe('healthy');
    await page.getByTestId('nothing-waiting').waitFor();

    // Nothing waits: the one next action is to submit.
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('button', { name: 'Submit now' }).click();
    await expect.poll(() => page.getByTestId('next-action').innerText()).toMatch(/Submitted/);
    await expectAccessible(page);

    // Each reading and the photo exist exactly once on the server.
    const stored = await app.ctx.db.select().from(readings).where(eq(readings.workOrderId, orderId));
    expect(stored.map((r) => r.targetId).sort()).toEqual([...step.unitIds].sort());
    expect(new Set(stored.map((r) => r.idempotencyKey)).size).toBe(2);
    expect(await app.ctx.db.select().from(photos).where(eq(photos.workOrderId, orderId))).toHaveLength(1);
    const [order] = await app.ctx.db.select().from(workOrders).where(eq(workOrders.id, orderId));
    expect(order?.state).toBe('awaiting-review');
    expect(order?.safetyAcknowledgedAt).not.toBeNull();
  });

  test('an implausible value is explained and stored once confirmed; a reload keeps what waits', async () => {
    const setup = await technicianWithOrder(['capacitance']);
    const { page, orderId, step, title } = setup;
    try {
      await openOrderFromToday(page, title, orderId);
      await acknowledgeSafetyCard(page);

      // About 37 % above nameplate: the phone says remeasure, the server asks for a confirmation.
      const card = page.getByTestId(`unit-${step.unitIds[0]}`);
      await enterOpenPairs(card, ['340', '340', '340']);
      expect(await bandOf(card, 'live-result')).toBe('remeasure');
      await card.getByRole('button', { name: 'Record reading' }).click();
      const refusal = card.getByRole('alert');
      await refusal.waitFor();
      expect(await refusal.innerText()).toMatch(/implausible/i);
      expect(await syncState(page)).toMatch(/1 needs you/);
      await expectAccessible(page);
      await card.getByRole('button', { name: 'Confirm this value' }).click();
      await card.getByTestId('server-result').waitFor();
      expect(await bandOf(card, 'server-result')).toBe('remeasure');

      // The readings never get an answer (the page itself still loads): the reading waits on the
      // phone, a reload reads it back from IndexedDB, and it goes once answers come again.
      const cutReadings = (route: { abort: (code: string) => Promise<void> }) => route.abort('internetdisconnected');
      await page.route('**/api/work-orders/*/readings', cutReadings);
      const other = page.getByTestId(`unit-${step.unitIds[1]}`);
      await enterOpenPairs(other, [balancedOpenPairUF, balancedOpenPairUF, balancedOpenPairUF]);
      await other.getByRole('button', { name: 'Record reading' }).click();
      await expect.poll(() => syncState(page)).toBe('1 waiting to send');
      await page.reload({ waitUntil: 'networkidle' });
      await expect.poll(() => syncState(page)).toBe('1 waiting to send');
      expect(await page.getByTestId('waiting-list').innerText()).toMatch(/Step 1, unit 2 · capacitance/);
      await page.unroute('**/api/work-orders/*/readings', cutReadings);
      await page.getByRole('button', { name: /^Send now/ }).click();
      await expect.poll(() => syncState(page), { timeout: 20_000 }).toBe('All sent');

      const stored = await app.ctx.db
        .select()
        .from(readings)
        .where(and(eq(readings.workOrderId, orderId), eq(readings.target, 'capacitor-unit')));
      expect(stored).toHaveLength(2);
      const confirmed = stored.find((r) => r.targetId === step.unitIds[0]);
      expect(confirmed?.input.confirmImplausible).toBe(true);
    } finally {
      await setup.context.close();
    }
  });

  test("a returned order shows the supervisor's reason in the list and on the order, and resumes on site", async () => {
    const setup = await technicianWithOrder(['capacitance']);
    const { page, orderId, title } = setup;
    try {
      await app.ctx.db.update(workOrders).set({ state: 'sent-back' }).where(eq(workOrders.id, orderId));
      await app.ctx.db
        .insert(workOrderTransitions)
        .values({ workOrderId: orderId, fromState: 'awaiting-review', toState: 'sent-back', actorId: null, comment: 'Measure unit 2 again with the LCR meter.', at: new Date() });
      await visit(page, `${app.url}/today`);
      const row = page.getByRole('link', { name: new RegExp(title) });
      await expect.poll(() => row.innerText()).toMatch(/Supervisor’s reason: Measure unit 2 again with the LCR meter\./);
      expect(await row.innerText()).toMatch(/Sent back/);
      await row.click();
      await arrived(page, new RegExp(`^/field/orders/${orderId}$`));
      expect(await page.getByTestId('sent-back-reason').innerText()).toMatch(/Measure unit 2 again/);
      await page.getByRole('button', { name: 'I have made the bank safe — resume' }).click();
      await page.getByRole('heading', { name: 'Safety card acknowledged' }).waitFor();
      const [order] = await app.ctx.db.select().from(workOrders).where(eq(workOrders.id, orderId));
      expect(order?.state).toBe('on-site');
    } finally {
      await setup.context.close();
    }
  });
});
