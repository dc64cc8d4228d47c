import { ratedCapacitanceUF } from '@varden/engineering';
import { workOrder, type WorkOrder } from '@varden/schemas';
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { adoptSession, expectAccessible, launchBrowser, newContext, visit } from '../support/browser';
import { createBankWithUnits, createUser, signIn, startIsolatedTestApp, type CreatedBank, type CreatedUser } from '../support/factories';
import { latestMailTo } from '../support/mailbox';
import { unique, type TestApp } from '../support/test-app';

let app: TestApp;
let browser: Browser;
let planner: CreatedUser;
let technician: CreatedUser;
let supervisor: CreatedUser;
let plannerCookie: string;
let technicianCookie: string;
let supervisorCookie: string;
let bank: CreatedBank;
let siteName: string;
let bankName: string;

beforeAll(async () => {
  // An outbox of its own: the journeys check mails, which must not wait behind other files'.
  app = await startIsolatedTestApp('work_orders_e2e');
  browser = await launchBrowser();
  planner = await createUser(app.ctx, { roles: ['planner'], name: unique('Planner Ilse') });
  technician = await createUser(app.ctx, { roles: ['technician'], name: unique('Technician Bram') });
  supervisor = await createUser(app.ctx, { roles: ['supervisor'], name: unique('Supervisor Maren') });
  [plannerCookie, technicianCookie, supervisorCookie] = await Promise.all([
    signIn(app, planner.email, planner.password),
    signIn(app, technician.email, technician.password),
    signIn(app, supervisor.email, supervisor.password),
  ]);
  bank = await createBankWithUnits(app.ctx, { steps: 2 });
  const bankRes = await app.request(`/api/banks/${bank.bankId}`, { cookie: plannerCookie });
  const bankBody = (await bankRes.json()) as { name: string; siteName: string };
  bankName = bankBody.name;
  siteName = bankBody.siteName;
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

/** A call to the API as one of the test's people; fails the test on an unexpected status. */
async function api<T = unknown>(cookie: string, path: string, init: { method?: string; json?: unknown; form?: FormData } = {}, status = [200, 201]): Promise<T> {
  const res = await app.request(path, {
    cookie,
    ...(init.method ? { method: init.method } : {}),
    ...(init.json !== undefined ? { json: init.json } : {}),
    ...(init.form ? { method: 'POST', body: init.form } : {}),
  });
  const text = await res.text();
  expect(status, `${init.method ?? (init.json ? 'POST' : 'GET')} ${path}: ${res.status} ${text}`).toContain(res.status);
  return (text ? JSON.parse(text) : undefined) as T;
}

const order = async (cookie: string, id: number): Promise<WorkOrder> => workOrder.parse(await api(cookie, `/api/work-orders/${id}`));
const move = async (cookie: string, id: number, to: string, comment = '') => {
  const current = await order(cookie, id);
  return api<WorkOrder>(cookie, `/api/work-orders/${id}/transitions`, { json: { to, version: current.version, comment } });
};

/** The technician's visit through the API: on site, one unit measured 7 % low, a photo, submitted. */
async function fieldVisit(id: number, deviation: number) {
  await move(technicianCookie, id, 'on-site');
  const legUF = ratedCapacitanceUF({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' }) * (1 + deviation);
  await api(technicianCookie, `/api/work-orders/${id}/readings`, {
    json: {
      idempotencyKey: unique('reading-key').replace(/[^A-Za-z0-9_-]/g, ''),
      target: 'capacitor-unit',
      targetId: bank.unitIds[0],
      method: 'per-element',
      elementsUF: [legUF, legUF, legUF],
      notes: 'Unit 1 of step 1 reads low on all three legs.',
    },
  });
  const form = new FormData();
  form.append('idempotencyKey', unique('photo-key').replace(/[^A-Za-z0-9_-]/g, ''));
  form.append('caption', 'Step 1 nameplate');
  const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: '#2a6f8f' } }).jpeg().toBuffer();
  form.append('file', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'IMG_0001.jpg');
  await api(technicianCookie, `/api/work-orders/${id}/photos`, { form });
  await move(technicianCookie, id, 'awaiting-review');
}

async function pageFor(cookie: string, viewport?: { width: number; height: number }): Promise<Page> {
  const context = await newContext(browser, viewport);
  await adoptSession(context, app.url, cookie);
  return context.newPage();
}

const horizontalOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

test('the planner schedules an order for a bank and assigns it to a technician', { timeout: 120_000 }, async () => {
  const page = await pageFor(plannerCookie);
  await visit(page, `${app.url}/planning`);
  await expect.poll(() => page.getByRole('heading', { name: 'Technician load' }).count()).toBe(1);
  await expect.poll(() => page.getByRole('row', { name: new RegExp(technician.user.name) }).count()).toBeGreaterThan(0);

  // The form: kind, site then bank, title, checklist, due date, priority, technician.
  await visit(page, `${app.url}/work-orders/new`);
  const title = unique('Half-yearly inspection');
  await page.getByLabel('Kind', { exact: true }).selectOption('inspection');
  await page.getByLabel('Site', { exact: true }).selectOption({ label: siteName });
  await expect.poll(() => page.getByLabel('Bank', { exact: true }).locator('option', { hasText: bankName }).count()).toBe(1);
  await page.getByLabel('Bank', { exact: true }).selectOption(String(bank.bankId));
  await page.getByLabel('Title', { exact: true }).fill(title);
  await page.getByLabel('Instructions', { exact: true }).fill('Key from the gatehouse. Switch-room 2.');
  await page.getByLabel('Due on', { exact: true }).fill('2031-03-14');
  await page.getByLabel('Priority', { exact: true }).selectOption('high');
  await page.getByLabel('Technician', { exact: true }).selectOption({ label: technician.user.name });
  expect(await page.getByLabel('Dispatch to the technician now').isChecked()).toBe(true);
  await page.getByRole('button', { name: 'Create work order' }).click();

  await page.waitForURL(/\/work-orders\/\d+$/);
  const id = Number(new URL(page.url()).pathname.split('/').pop());
  await expectAccessible(page);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).innerText()).toBe(title);
  const log = page.getByRole('region', { name: 'Order log entries' });
  await expect.poll(() => log.innerText()).toMatch(/Queued[\s\S]*Dispatched/);
  const created = await order(plannerCookie, id);
  expect(created).toMatchObject({ state: 'dispatched', assigneeId: technician.user.id, bankId: bank.bankId, dueOn: '2031-03-14', priority: 'high' });

  // The table, filtered by technician in the URL, lists it with its state and technician in words.
  await visit(page, `${app.url}/work-orders?assigneeId=${technician.user.id}&state=dispatched`);
  const row = page.locator('tbody tr', { hasText: title });
  await expect.poll(() => row.count()).toBe(1);
  const rowText = await row.innerText();
  expect(rowText).toContain('Dispatched');
  expect(rowText).toContain(technician.user.name);
  expect(rowText).toContain(siteName);
  const exportHref = await page.getByRole('link', { name: 'Export CSV' }).getAttribute('href');
  expect(exportHref).toBe(`/api/work-orders/export.csv?state=dispatched&assigneeId=${technician.user.id}`);
  const csv = await app.request(exportHref!, { cookie: plannerCookie });
  expect(await csv.text()).toContain(title);

  // Reschedule with the version the page read; a stale version is refused and explained.
  await visit(page, `${app.url}/work-orders/${id}`);
  const reschedule = page.getByRole('form', { name: 'Reschedule' });
  await api(plannerCookie, `/api/work-orders/${id}`, { method: 'PATCH', json: { priority: 'urgent', version: created.version } });
  await reschedule.getByLabel('Due on').fill('2031-03-21');
  await reschedule.getByRole('button', { name: 'Reschedule' }).click();
  await expect.poll(() => reschedule.getByRole('alert').innerText()).toMatch(/changed by someone else[\s\S]*check it and try again/);
  await reschedule.getByRole('button', { name: 'Reschedule' }).click();
  await expect.poll(() => reschedule.getByRole('status').innerText()).toMatch(/Saved: due (Mar 21, 2031|21 Mar 2031), urgent priority/);
  expect(await order(plannerCookie, id)).toMatchObject({ dueOn: '2031-03-21', priority: 'urgent' });

  // The calendar of that month shows it on its day, linked.
  await visit(page, `${app.url}/work-orders/calendar?month=2031-03`);
  const grid = page.getByRole('region', { name: /Month grid/ });
  await expect.poll(() => grid.getByRole('link', { name: new RegExp(title) }).count()).toBe(1);
  expect(await grid.getByRole('columnheader').count()).toBe(7);

  await visit(page, `${app.url}/work-orders/workload`);
  await expect.poll(() => page.getByRole('row', { name: new RegExp(technician.user.name) }).innerText()).toMatch(/Dispatched|1/);

  // An inspection plan with the interval helper: 12 months, high need, poor condition → 3.
  await visit(page, `${app.url}/plans/new?bankId=${bank.bankId}`);
  await page.getByLabel('Reliability need').selectOption('high');
  await page.getByLabel('Equipment condition').selectOption('poor');
  await expect.poll(() => page.locator('output').innerText()).toMatch(/12 months × 0\.25 = 3 months/);
  await page.getByRole('button', { name: 'Use 3 months' }).click();
  expect(await page.getByLabel('Interval (months)', { exact: true }).inputValue()).toBe('3');
  await page.getByRole('button', { name: 'Create the plan' }).click();
  await page.waitForURL(/\/plans\?bankId=/);
  await expectAccessible(page);
  await expect.poll(() => page.locator('tbody tr', { hasText: 'Half-yearly inspection' }).innerText()).toMatch(/every 3 months/);

  const mail = await latestMailTo(app, technician.email, `Work order ${id} is yours: ${title}`);
  expect(mail?.text).toContain(`/work-orders/${id}`);
  await page.context().close();

  // On a 360 px phone every planner page fits the screen: tables scroll in their own region or become cards.
  const phone = await pageFor(plannerCookie, { width: 360, height: 800 });
  for (const path of ['/planning', '/work-orders', '/work-orders/calendar?month=2031-03', '/work-orders/workload', `/work-orders/${id}`, '/work-orders/new', '/plans', '/flags']) {
    await visit(phone, app.url + path);
    expect(await horizontalOverflow(phone), path).toBeLessThanOrEqual(0);
  }
  await phone.context().close();
});

test('the supervisor returns an order with a reason, then seals it and sees the signature block', { timeout: 180_000 }, async () => {
  const title = unique('Inspection for review');
  const created = await api<WorkOrder>(plannerCookie, '/api/work-orders', {
    json: { kind: 'inspection', bankId: bank.bankId, title, checklist: ['capacitance', 'photos'], dueOn: '2031-04-02', assigneeId: technician.user.id },
  });
  const id = created.id;
  await move(plannerCookie, id, 'dispatched');
  await fieldVisit(id, -0.07);
  expect(await latestMailTo(app, supervisor.email, `For review: work order ${id}, ${siteName}`)).toBeDefined();

  const page = await pageFor(supervisorCookie);
  await visit(page, `${app.url}/review`);
  const queued = page.locator('tbody tr', { hasText: title });
  await expect.poll(() => queued.count()).toBe(1);
  expect(await queued.getByRole('link', { name: `Review #${id} ${title}` }).getAttribute('href')).toBe(`/work-orders/${id}/review`);

  await visit(page, `${app.url}/work-orders/${id}/review`);
  const results = page.getByRole('region', { name: /beside its previous reading/ });
  await expect.poll(() => results.locator('tbody tr').first().innerText()).toMatch(/Step 1, unit 1[\s\S]*Per element[\s\S]*Watch/);
  await expect.poll(() => page.getByRole('img', { name: 'Step 1 nameplate' }).count()).toBe(1);
  expect(await page.getByText('Unit 1 of step 1 reads low on all three legs.').count()).toBeGreaterThan(0);

  // Send back: the reason is required.
  const sendBack = page.getByRole('form', { name: 'Send back to the field' });
  await sendBack.getByRole('button', { name: 'Send back to the field' }).click();
  await expect.poll(() => sendBack.getByText('Give the reason for sending it back').count()).toBe(1);
  const reason = 'Remeasure unit 1 of step 1 with the bridge; the clamp meter reads low.';
  await sendBack.getByLabel('Reason').fill(reason);
  await sendBack.getByRole('button', { name: 'Send back to the field' }).click();
  await expect.poll(() => page.getByRole('status').filter({ hasText: 'Sent back to the field' }).count()).toBe(1);
  await expectAccessible(page);
  expect((await order(supervisorCookie, id)).state).toBe('sent-back');
  const returned = await latestMailTo(app, technician.email, `Sent back: work order ${id}, ${siteName}`);
  expect(returned?.text).toContain(reason);
  // The planner's table says why it came back, without opening the order.
  const desk = await pageFor(plannerCookie);
  await visit(desk, `${app.url}/work-orders?state=sent-back&q=${encodeURIComponent(title)}`);
  const sentBackRow = desk.locator('tbody tr', { hasText: title });
  await expect.poll(() => sentBackRow.count()).toBe(1);
  expect(await sentBackRow.innerText()).toContain(`Why: ${reason}`);
  await desk.close();

  // The technician goes back, measures again and resubmits.
  await fieldVisit(id, -0.03);

  await visit(page, `${app.url}/work-orders/${id}/review`);
  const seal = page.getByRole('form', { name: 'Seal this order' });
  await expect.poll(() => seal.getByLabel('Meaning of your signature').inputValue()).toMatch(/^I have reviewed the readings/);
  expect(await page.getByText(supervisor.user.name, { exact: true }).count()).toBeGreaterThan(0);
  const meaning = 'I have reviewed the readings, results, flags and photos and accept them as the maintenance record under site rule 4.2.';
  await seal.getByLabel('Meaning of your signature').fill(meaning);
  await seal.getByRole('button', { name: 'Seal this order' }).click();

  const signature = page.getByTestId('signature-block');
  await expect.poll(() => signature.innerText()).toContain(supervisor.user.name);
  expect(await signature.innerText()).toContain(meaning);
  await expectAccessible(page);
  expect(await page.getByRole('button', { name: 'Seal this order' }).count()).toBe(0);
  expect(await page.getByRole('button', { name: 'Send back to the field' }).count()).toBe(0);
  const sealed = await order(supervisorCookie, id);
  expect(sealed).toMatchObject({ state: 'sealed', locked: true, signedByName: supervisor.user.name, signatureMeaning: meaning });

  // Locked: the order page offers no changes.
  await visit(page, `${app.url}/work-orders/${id}`);
  await expect.poll(() => page.getByText('Sealed: this record no longer changes.').count()).toBe(1);
  expect(await page.getByRole('form').count()).toBe(0);

  // The signed record: results, signature and the PDF.
  await visit(page, `${app.url}/work-orders/${id}/record`);
  await expect.poll(() => page.getByTestId('signature-block').innerText()).toContain(supervisor.user.name);
  const pdfHref = await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
  expect(pdfHref).toBe(`/api/work-orders/${id}/record.pdf`);
  const pdf = await app.request(pdfHref!, { cookie: supervisorCookie });
  expect(pdf.status).toBe(200);
  expect(pdf.headers.get('content-type')).toContain('application/pdf');

  expect(await latestMailTo(app, planner.email, `Sealed: work order ${id}, ${siteName}`)).toBeDefined();
  await page.context().close();

  // On a 360 px phone the review and the record fit the screen; their tables become cards.
  const phone = await pageFor(supervisorCookie, { width: 360, height: 800 });
  for (const path of [`/work-orders/${id}/review`, `/work-orders/${id}/record`, '/review']) {
    await visit(phone, app.url + path);
    expect(await horizontalOverflow(phone), path).toBeLessThanOrEqual(0);
  }
  await phone.context().close();
});
