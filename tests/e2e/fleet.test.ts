import { ratedCapacitanceUF } from '@varden/engineering';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { banks, capacitorUnits, flags, readings, steps, unitLatestEvaluations, workOrders } from '../../apps/api/src/db/schema/index';
import { adoptSession, deskViewport, expectAccessible, launchBrowser, newContext, visit } from '../support/browser';
import { createSite, createUser, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
let technicianId: number;
let supervisorCookie: string;

beforeAll(async () => {
  app = await startTestApp();
  browser = await launchBrowser();
  technicianId = (await createUser(app.ctx, { roles: ['technician'] })).user.id;
  const supervisor = await createUser(app.ctx, { roles: ['supervisor'] });
  supervisorCookie = await signIn(app, supervisor.email, supervisor.password);
});
afterAll(async () => {
  await browser?.close();
  await app?.close();
});

const dayMs = 86_400_000;
const isoDay = (date: Date) => date.toISOString().slice(0, 10);
/** Text as a reader sees it: the no-break spaces between numbers and units read as spaces. */
const plain = (text: string) => text.replace(/\u00A0/g, ' ').replace(/\s+/g, ' ').trim();
const textOf = async (page: Page, testId: string) => plain(await page.getByTestId(testId).innerText());

/**
 * A 400 V, 50 Hz site with a planned load of 500 kW at PF 0.80 and one undetuned bank of four
 * 25 kvar steps, each one 400 V delta unit. Units 1 and 2 have latest readings at 60 % and 80 %
 * of their nameplate capacitance (both in the replace band); 3 and 4 have none. An inspection
 * order for the bank was due 20 days ago and is still dispatched.
 */
async function siteThatLostCorrection(name: string) {
  const { db } = app.ctx;
  const siteId = await createSite(app.ctx, {
    name,
    transformerKva: 1000,
    transformerImpedancePct: 6,
    targetPf: 0.95,
    tariffBasis: 'pf-threshold',
    tariffLimit: 0.9,
    pricePerKvarh: 0.02,
    plannedLoadKw: 500,
    plannedLoadPf: 0.8,
  });
  const [bank] = await db.insert(banks).values({ siteId, name: 'Bank B' }).$returningId();
  const [order] = await db
    .insert(workOrders)
    .values({
      kind: 'inspection',
      siteId,
      bankId: bank!.id,
      title: 'Half-yearly inspection',
      instructions: '',
      checklist: ['capacitance'],
      dueOn: isoDay(new Date(Date.now() - 20 * dayMs)),
      state: 'dispatched',
      assigneeId: technicianId,
    })
    .$returningId();
  const legUF = ratedCapacitanceUF({ kvar: 25, voltageV: 400, frequencyHz: 50, connection: 'delta' });
  const shareOfNameplate = [0.6, 0.8, null, null];
  for (const [i, share] of shareOfNameplate.entries()) {
    const [step] = await db.insert(steps).values({ bankId: bank!.id, number: i + 1, ratedKvar: 25 }).$returningId();
    const [unit] = await db
      .insert(capacitorUnits)
      .values({ stepId: step!.id, position: 1, nameplateKvar: 25, nameplateVoltageV: 400, nameplateFrequencyHz: 50, connection: 'delta', capacitanceUF: legUF, serial: unique('HB') })
      .$returningId();
    if (share === null) continue;
    const recordedAt = new Date(Date.now() - 2 * dayMs);
    const deviationPct = 100 * (share - 1);
    const [reading] = await db
      .insert(readings)
      .values({
        workOrderId: order!.id,
        idempotencyKey: unique('key').replace(/[^A-Za-z0-9_-]/g, ''),
        target: 'capacitor-unit',
        targetId: unit!.id,
        input: {},
        evaluation: {},
        engineeringVersion: 'test',
        band: 'replace',
        deviationPct,
        recordedById: technicianId,
        recordedAt,
      })
      .$returningId();
    await db.insert(unitLatestEvaluations).values({
      unitId: unit!.id,
      readingId: reading!.id,
      band: 'replace',
      deviationPct,
      kvarAtRated: 25 * share,
      legsUF: [share * legUF, share * legUF, share * legUF],
      recordedAt,
    });
  }
  return { siteId, bankId: bank!.id, orderId: order!.id };
}

test('a supervisor opens the fleet dashboard, drills into the site that lost correction and sees the lost kvar, the reached PF and the power triangle', { timeout: 120_000 }, async () => {
  const siteName = unique('Harbour Cold Store');
  const { siteId, bankId, orderId } = await siteThatLostCorrection(siteName);
  // An advisory flag (no risk points) for the site's own list of open flags.
  await app.ctx.db.insert(flags).values({ kind: 'unbalance', severity: 'advisory', siteId, bankId, target: 'bank', targetId: bankId, message: 'Legs differ by 9 % on step 2', raisedAt: new Date() });
  const health = await (await app.request(`/api/sites/${siteId}/health`, { cookie: supervisorCookie })).json();
  const fleet = await (await app.request('/api/fleet', { cookie: supervisorCookie })).json();

  // Hand computation from the seeded values:
  // [DERIVED] engineering-reference.md §1: a delta unit gives Q = 3·ω·C_Δ·U², proportional to C,
  // so units at 0.6·C and 0.8·C deliver 15 and 20 kvar: effective 15 + 20 + 25 + 25 = 85 kvar of
  // 100 installed, 15 kvar (15 %) lost.
  expect(health.installedKvar).toBeCloseTo(100, 6);
  expect(health.effectiveKvar).toBeCloseTo(85, 6);
  expect(health.lostKvar).toBeCloseTo(15, 6);
  // [DERIVED] §6: Q_load = 500·tan(acos 0.8) = 375 kvar. Now Q = 375 − 85 = 290 kvar,
  // S = √(500² + 290²) = 578.0 kVA, PF = 500/578.0 = 0.865, φ = atan(290/500) = 30.1°.
  // As installed Q = 375 − 100 = 275 kvar, S = 570.6 kVA, PF = 0.876, φ = 28.8°.
  const hand = {
    now: { kvar: 290, kva: Math.hypot(500, 290), pf: 500 / Math.hypot(500, 290), phiDeg: (Math.atan(290 / 500) * 180) / Math.PI },
    asInstalled: { kvar: 275, kva: Math.hypot(500, 275), pf: 500 / Math.hypot(500, 275), phiDeg: (Math.atan(275 / 500) * 180) / Math.PI },
  };
  expect(health.reachedPf).toBeCloseTo(hand.now.pf, 9);
  expect(health.triangle.now).toMatchObject({ kw: 500, leading: false });
  for (const key of ['kvar', 'kva', 'pf', 'phiDeg'] as const) {
    expect(health.triangle.now[key]).toBeCloseTo(hand.now[key], 6);
    expect(health.triangle.asInstalled[key]).toBeCloseTo(hand.asInstalled[key], 6);
  }
  // Risk points (common practice weights in the fleet contract): 2 units to replace × 10 + 1 overdue order × 3.
  const row = fleet.sites.find((s: { siteId: number }) => s.siteId === siteId);
  expect(row).toMatchObject({ risk: 23, overdueOrders: 1, bands: { replace: 2, noReading: 2 } });

  const context = await newContext(browser, deskViewport);
  await adoptSession(context, app.url, supervisorCookie);
  const page = await context.newPage();

  await visit(page, `${app.url}/fleet`);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe('Fleet health');
  const siteRow = page.getByRole('region', { name: 'Sites ranked by risk' }).getByRole('row').filter({ hasText: siteName });
  expect(plain(await siteRow.innerText())).toContain(String(row.risk));
  // Every item links to its page: the overdue order to the order.
  expect(await page.getByRole('region', { name: 'Overdue work orders' }).locator(`a[href="/work-orders/${orderId}"]`).innerText()).toBe('Half-yearly inspection');
  expect(await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href')).toBe('/api/fleet/export.csv');

  // Drill into the site.
  await siteRow.getByRole('link', { name: siteName }).click();
  await page.waitForURL(`**/sites/${siteId}/health`);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(siteName);
  await page.waitForLoadState('networkidle');
  await expectAccessible(page);
  // The rail marks the section the page belongs to: fleet health, not the register it lives under.
  const rail = page.getByRole('navigation', { name: 'Sections' });
  expect(await rail.getByRole('link', { name: 'Fleet health' }).getAttribute('aria-current')).toBe('page');
  expect(await rail.getByRole('link', { name: 'Register' }).getAttribute('aria-current')).toBeNull();
  // The page's own open flags and when its newest reading was taken.
  const openFlags = page.getByRole('region', { name: 'Open flags of this site' });
  expect(plain(await openFlags.innerText())).toContain('Legs differ by 9 % on step 2');
  expect(health.openFlags).toHaveLength(1);
  expect(health.overdueOrders.map((o: { id: number }) => o.id)).toEqual([orderId]);
  expect(health.newestReadingAt).not.toBeNull();
  expect(plain(await page.getByRole('heading', { level: 1 }).locator('xpath=..').innerText())).toContain('readings up to');

  // The figures on the page are the API's own, and the hand computation's.
  const oneDecimal = (v: number) => v.toLocaleString('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
  const lost = await textOf(page, 'figure-lost');
  expect(lost).toContain(`${oneDecimal(health.lostKvar)} kvar`);
  expect(lost).toContain('15.0 kvar');
  expect(lost).toContain('15.0 % of the installed kvar');
  expect(await textOf(page, 'figure-effective')).toContain('85.0 kvar of 100.0 kvar installed');
  const pf = await textOf(page, 'figure-pf');
  expect(pf).toContain(health.reachedPf.toFixed(3));
  expect(pf).toContain('0.865');
  expect(pf).toContain('Below the target');
  expect(await textOf(page, 'figure-load')).toContain('As the planner entered it');

  // The power triangle, as drawn: P, Q, S and φ of both triangles.
  const triangle = page.getByRole('img', { name: 'Power triangle before and after the lost correction' });
  // Each label of the drawing, its lines joined.
  const drawn = (await triangle.locator('text').evaluateAll((texts) => texts.map((t) => Array.from(t.querySelectorAll('tspan'), (line) => line.textContent).join(' ')))).map(plain);
  for (const label of ['P 500 kW', 'Q now 290 kvar', 'Q as installed 275 kvar', 'S now 578 kVA', 'S as installed 571 kVA', 'φ now 30.1°', 'φ as installed 28.8°']) {
    expect(drawn).toContain(label);
  }
  const described = await triangle.getAttribute('aria-describedby');
  expect(plain(await page.locator(`[id="${described}"]`).innerText())).toContain('The 15.0 kvar lost raise Q and widen φ');

  // Its table view holds the same figures.
  await page.getByRole('group', { name: 'Show the power triangle as' }).getByRole('button', { name: 'Table' }).click();
  const pfRow = page.getByRole('region', { name: 'Power triangle as installed and now' }).getByRole('row', { name: /Power factor PF/ });
  const pfCells = (await pfRow.getByRole('cell').allInnerTexts()).map(plain);
  expect(pfCells.slice(0, 2)).toEqual([health.triangle.asInstalled.pf.toFixed(3), health.triangle.now.pf.toFixed(3)]);
  expect(pfCells.slice(0, 2)).toEqual(['0.876', '0.865']);
  await expectAccessible(page);

  // What to do next, in plain words, with the way to do it.
  const next = page.getByRole('list', { name: 'What to do next' });
  expect(plain(await next.innerText())).toContain('2 units in the replace band — open the flag queue');
  const replaceStep = next.getByRole('listitem').filter({ hasText: 'in the replace band' });
  expect(await replaceStep.getByRole('link', { name: 'open the flag queue' }).getAttribute('href')).toBe(`/flags?siteId=${siteId}&kind=replace`);
  // An open flag the bands do not count is a step of its own, leading to its kind in the queue.
  const unbalanceStep = next.getByRole('listitem').filter({ hasText: 'Unbalance on Bank B' });
  expect(plain(await unbalanceStep.innerText())).toContain('Legs differ by 9 % on step 2');
  expect(await unbalanceStep.getByRole('link').getAttribute('href')).toBe(`/flags?siteId=${siteId}&kind=unbalance`);
  expect(plain(await next.innerText())).toContain('“Half-yearly inspection” was due on');

  // The cost estimate follows the hours a month. [COMMON] §6 tariff: charged beyond P·tan(acos 0.9)
  // = 242.2 kvar; both 275 and 290 kvar lie above it, so the lost 15 kvar are all charged:
  // 15 kvar × 300 h × 0.02 EUR/kvarh = 90 EUR a month.
  await page.getByLabel('Hours of load a month').fill('300');
  await page.getByRole('button', { name: 'Recalculate' }).click();
  await page.waitForURL(`**/sites/${siteId}/health?hoursPerMonth=300`);
  const at300 = await (await app.request(`/api/sites/${siteId}/health?hoursPerMonth=300`, { cookie: supervisorCookie })).json();
  expect(at300.cost.lostMonthlyCost).toBeCloseTo(15 * 300 * 0.02, 6);
  await expect.poll(async () => textOf(page, 'cost-estimate')).toBe(`${Math.round(at300.cost.lostMonthlyCost)} EUR a month`);
  expect(await textOf(page, 'figure-cost')).toContain('estimate');
  await context.close();
});

test('a site with no readings yet reads "no reading yet", effective equal to installed, and fits a 360 px phone', async () => {
  const { db } = app.ctx;
  const siteId = await createSite(app.ctx, { name: unique('Quiet Works'), plannedLoadKw: 200, plannedLoadPf: 0.85 });
  const [bank] = await db.insert(banks).values({ siteId, name: 'Bank 1' }).$returningId();
  const legUF = ratedCapacitanceUF({ kvar: 25, voltageV: 400, frequencyHz: 50, connection: 'delta' });
  for (const number of [1, 2]) {
    const [step] = await db.insert(steps).values({ bankId: bank!.id, number, ratedKvar: 25 }).$returningId();
    await db.insert(capacitorUnits).values({ stepId: step!.id, position: 1, nameplateKvar: 25, nameplateVoltageV: 400, nameplateFrequencyHz: 50, connection: 'delta', capacitanceUF: legUF });
  }
  const context = await newContext(browser, { width: 360, height: 800 });
  await adoptSession(context, app.url, supervisorCookie);
  const page = await context.newPage();
  await visit(page, `${app.url}/sites/${siteId}/health`);
  await page.getByTestId('figure-effective').waitFor();
  expect(await textOf(page, 'figure-effective')).toContain('50.0 kvar of 50.0 kvar installed (no reading yet');
  expect(await textOf(page, 'figure-lost')).toContain('0.0 kvar');
  expect(plain(await page.getByRole('list', { name: 'What to do next' }).innerText())).toContain('No reading yet');
  expect(plain(await page.getByRole('region', { name: 'Open flags of this site' }).innerText())).toContain('No open flag');
  // On a phone the triangle carries letters and its key the values.
  expect(plain(await page.getByTestId('triangle-key').innerText())).toContain('P 200 kW');
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await context.close();
});

test('a viewer’s site health shows the fleet dashboard limited to their granted sites', async () => {
  const mine = await siteThatLostCorrection(unique('Granted Quay'));
  const otherName = unique('Someone Else');
  await siteThatLostCorrection(otherName);
  const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [mine.siteId] });
  const cookie = await signIn(app, viewer.email, viewer.password);
  const context = await newContext(browser);
  await adoptSession(context, app.url, cookie);
  const page = await context.newPage();
  await visit(page, `${app.url}/site-health`);
  const table = page.getByRole('region', { name: 'Sites ranked by risk' });
  await table.waitFor();
  const links = await table.getByRole('link').all();
  expect(await Promise.all(links.map((l) => l.getAttribute('href')))).toEqual([`/sites/${mine.siteId}/health`]);
  expect(await page.getByText(otherName).count()).toBe(0);
  await context.close();
});
