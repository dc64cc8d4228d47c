import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { createBankWithUnits, createUser, createWorkOrder, sessionCookieFor, type CreatedBank } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

// Plans here fall due in the 2090s, so the scheduler tests running beside this file never pick them up.

let app: TestApp;
let planner: string;
let technician: string;
let admin: string;
let viewer: string;
let bank: CreatedBank;
let otherBank: CreatedBank;

beforeAll(async () => {
  app = await startTestApp();
  bank = await createBankWithUnits(app.ctx, { steps: 1 });
  otherBank = await createBankWithUnits(app.ctx, { steps: 1 });
  const users = await Promise.all([
    createUser(app.ctx, { roles: ['planner'] }),
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['admin'] }),
    createUser(app.ctx, { roles: ['viewer'], siteIds: [bank.siteId] }),
  ]);
  const cookies = await Promise.all(users.map((u) => sessionCookieFor(app.ctx, u.user.id)));
  [planner, technician, admin, viewer] = cookies as [string, string, string, string];
});
afterAll(async () => {
  await app.close();
});

async function api(method: string, path: string, cookie: string, json?: unknown) {
  const res = await app.request(path, { method, cookie, ...(json === undefined ? {} : { json }) });
  return { status: res.status, body: res.status === 204 ? null : await res.json() };
}

const planBody = (over: Record<string, unknown> = {}) => ({
  bankId: bank.bankId,
  name: unique('Half-yearly inspection'),
  intervalMonths: 6,
  leadDays: 21,
  checklist: ['capacitance', 'contactor', 'fuses'],
  nextDueOn: '2091-03-01',
  ...over,
});

describe('inspection plans', () => {
  test('a planner creates a plan and everyone who reads work orders can read it', async () => {
    const body = planBody();
    const created = await api('POST', '/api/inspection-plans', planner, body);
    expect(created.status).toBe(201);
    expect(created.body).toEqual({
      ...body,
      id: expect.any(Number),
      bankName: expect.any(String),
      siteId: bank.siteId,
      siteName: expect.any(String),
      active: true,
      version: 1,
    });
    for (const cookie of [technician, admin, viewer]) {
      const read = await api('GET', `/api/inspection-plans/${created.body.id}`, cookie);
      expect(read.status).toBe(200);
      expect(read.body.name).toBe(body.name);
    }
  });

  test('the list filters by bank, site and activity, sorts by next due date and pages', async () => {
    const listBank = await createBankWithUnits(app.ctx, { steps: 1 });
    const late = await api('POST', '/api/inspection-plans', planner, planBody({ bankId: listBank.bankId, nextDueOn: '2092-01-01' }));
    const early = await api('POST', '/api/inspection-plans', planner, planBody({ bankId: listBank.bankId, nextDueOn: '2091-06-01' }));
    const off = await api('POST', '/api/inspection-plans', planner, planBody({ bankId: listBank.bankId, nextDueOn: '2091-09-01', active: false }));
    const all = await api('GET', `/api/inspection-plans?bankId=${listBank.bankId}`, planner);
    expect(all.body.total).toBe(3);
    expect(all.body.items.map((p: { id: number }) => p.id)).toEqual([early.body.id, off.body.id, late.body.id]);
    const active = await api('GET', `/api/inspection-plans?siteId=${listBank.siteId}&active=true&sort=-nextDueOn`, planner);
    expect(active.body.items.map((p: { id: number }) => p.id)).toEqual([late.body.id, early.body.id]);
    const paged = await api('GET', `/api/inspection-plans?bankId=${listBank.bankId}&pageSize=1&page=2`, planner);
    expect(paged.body).toMatchObject({ total: 3, items: [{ id: off.body.id }] });
  });

  test('a viewer reads only the plans of the sites granted to them', async () => {
    const theirs = await api('POST', '/api/inspection-plans', planner, planBody({ bankId: otherBank.bankId }));
    expect((await api('GET', `/api/inspection-plans/${theirs.body.id}`, viewer)).status).toBe(404);
    const list = await api('GET', `/api/inspection-plans?bankId=${otherBank.bankId}`, viewer);
    expect(list.body).toEqual({ items: [], total: 0 });
  });

  test('only planners write plans', async () => {
    for (const cookie of [technician, admin, viewer]) {
      expect((await api('POST', '/api/inspection-plans', cookie, planBody())).status).toBe(403);
    }
    const plan = (await api('POST', '/api/inspection-plans', planner, planBody())).body;
    expect((await api('PATCH', `/api/inspection-plans/${plan.id}`, technician, { version: 1, intervalMonths: 3 })).status).toBe(403);
    expect((await api('DELETE', `/api/inspection-plans/${plan.id}`, admin)).status).toBe(403);
  });

  test('input is validated', async () => {
    const res = await api('POST', '/api/inspection-plans', planner, planBody({ intervalMonths: 0, checklist: [], nextDueOn: '1 March' }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['checklist', 'intervalMonths', 'nextDueOn']);
    const noBank = await api('POST', '/api/inspection-plans', planner, planBody({ bankId: 999_999_999 }));
    expect(noBank.status).toBe(400);
    expect(noBank.body.error.fields).toHaveProperty('bankId');
  });

  test('an update carries the version: a stale one gets 409', async () => {
    const plan = (await api('POST', '/api/inspection-plans', planner, planBody())).body;
    const first = await api('PATCH', `/api/inspection-plans/${plan.id}`, planner, { version: 1, intervalMonths: 3, leadDays: 7 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ intervalMonths: 3, leadDays: 7, version: 2, name: plan.name });
    const stale = await api('PATCH', `/api/inspection-plans/${plan.id}`, planner, { version: 1, intervalMonths: 12 });
    expect(stale.status).toBe(409);
    expect((await api('PATCH', '/api/inspection-plans/999999999', planner, { version: 1, intervalMonths: 12 })).status).toBe(404);
  });

  test('a plan without orders is deleted; one with orders is kept and set inactive instead', async () => {
    const unused = (await api('POST', '/api/inspection-plans', planner, planBody())).body;
    expect((await api('DELETE', `/api/inspection-plans/${unused.id}`, planner)).status).toBe(204);
    expect((await api('GET', `/api/inspection-plans/${unused.id}`, planner)).status).toBe(404);
    const used = (await api('POST', '/api/inspection-plans', planner, planBody())).body;
    await createWorkOrder(app.ctx, { bank, planId: used.id, dueOn: '2091-03-01' });
    const refused = await api('DELETE', `/api/inspection-plans/${used.id}`, planner);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/inactive/);
  });
});

describe('the inspection interval helper', () => {
  test('multiplies the base interval by the NETA factor for reliability need and condition', async () => {
    // NETA MTS Appendix B [STD], engineering-reference.md §7: high need, poor condition → 0.25.
    const high = await api('GET', '/api/inspection-plans/interval?baseIntervalMonths=12&reliability=high&condition=poor', planner);
    expect(high.status).toBe(200);
    expect(high.body).toMatchObject({ baseIntervalMonths: 12, reliability: 'high', condition: 'poor', factor: 0.25, exactMonths: 3, intervalMonths: 3 });
    // Low need, good condition → 2.5: 6 months become 15.
    const low = await api('GET', '/api/inspection-plans/interval?baseIntervalMonths=6&reliability=low&condition=good', viewer);
    expect(low.body).toMatchObject({ factor: 2.5, exactMonths: 15, intervalMonths: 15 });
    // Medium need, poor condition → 0.5: 3 months become 1.5, rounded to 2 for the plan.
    const half = await api('GET', '/api/inspection-plans/interval?baseIntervalMonths=3&reliability=medium&condition=poor', planner);
    expect(half.body).toMatchObject({ factor: 0.5, exactMonths: 1.5, intervalMonths: 2 });
    const bad = await api('GET', '/api/inspection-plans/interval?baseIntervalMonths=0&reliability=extreme&condition=poor', planner);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['baseIntervalMonths', 'reliability']);
  });
});
