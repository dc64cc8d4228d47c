import { defaultSignatureMeaning } from '@varden/schemas';
import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { outbox, photos, users, workOrders, workOrderTransitions } from '../../apps/api/src/db/schema/index';
import { seedDemoIfEmpty } from '../../apps/api/src/seed/demo';
import {
  createBankWithUnits,
  createUser,
  createWorkOrder,
  insertUnitReading,
  sendOutboxThrough,
  sessionCookieFor,
  startIsolatedTestApp,
  type CreatedBank,
} from '../support/factories';
import { latestMailTo } from '../support/mailbox';
import { startTestApp, unique, type TestApp } from '../support/test-app';


let app: TestApp;
interface Person {
  id: number;
  email: string;
  name: string;
  cookie: string;
}
let planner: Person;
let technician: Person;
let otherTechnician: Person;
let supervisor: Person;
let otherSupervisor: Person;
let admin: Person;
let bank: CreatedBank;
let otherBank: CreatedBank;
let viewer: Person;

async function person(roles: Parameters<typeof createUser>[1]['roles'], siteIds: number[] = []): Promise<Person> {
  const name = unique(`Test ${roles.join(' ')}`);
  const { user, email } = await createUser(app.ctx, { roles, siteIds, name });
  return { id: user.id, email, name, cookie: await sessionCookieFor(app.ctx, user.id) };
}

beforeAll(async () => {
  app = await startTestApp();
  bank = await createBankWithUnits(app.ctx, { dischargeTimesS: [180, 300] });
  otherBank = await createBankWithUnits(app.ctx, { steps: 1 });
  [planner, technician, otherTechnician, supervisor, otherSupervisor, admin, viewer] = await Promise.all([
    person(['planner']),
    person(['technician']),
    person(['technician']),
    person(['supervisor']),
    person(['supervisor']),
    person(['admin']),
    person(['viewer'], [bank.siteId]),
  ]);
});
afterAll(async () => {
  await app.close();
});

async function api(method: string, path: string, who: Person, json?: unknown) {
  const res = await app.request(path, { method, cookie: who.cookie, ...(json === undefined ? {} : { json }) });
  // JSON answers parse; the CSV and PDF bodies stay text.
  const body = res.headers.get('content-type')?.startsWith('application/json') ? await res.json() : await res.text();
  return { status: res.status, body, headers: res.headers };
}

const today = () => new Date().toISOString().slice(0, 10);
const daysFromNow = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

async function newOrder(over: Record<string, unknown> = {}, on: CreatedBank = bank) {
  const res = await api('POST', '/api/work-orders', planner, {
    kind: 'inspection',
    bankId: on.bankId,
    title: unique('Half-yearly inspection'),
    instructions: 'Measure every unit.',
    checklist: ['capacitance', 'contactor', 'fuses'],
    dueOn: daysFromNow(10),
    ...over,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

async function move(who: Person, id: number, to: string, version: number, extra: Record<string, unknown> = {}) {
  return api('POST', `/api/work-orders/${id}/transitions`, who, { to, version, ...extra });
}

/** Walks an order from queued to awaiting review with one reading, as the people would. */
async function orderAwaitingReview(assignee: Person = technician) {
  const order = await newOrder({ assigneeId: assignee.id });
  let r = await move(planner, order.id, 'dispatched', order.version);
  expect(r.status).toBe(200);
  r = await move(assignee, order.id, 'on-site', r.body.version);
  expect(r.status).toBe(200);
  await insertUnitReading(app.ctx, { workOrderId: order.id, unitId: bank.unitIds[0]!, recordedById: assignee.id, deviationPct: -3, band: 'healthy' });
  r = await move(assignee, order.id, 'awaiting-review', r.body.version);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body;
}

/** The messages of a refused query and its causes (Drizzle wraps the driver's error). */
async function refusal(query: PromiseLike<unknown>): Promise<string> {
  try {
    await query;
  } catch (error) {
    const messages: string[] = [];
    for (let e: unknown = error; e instanceof Error; e = e.cause) messages.push(e.message);
    return messages.join(' | ');
  }
  return 'not refused';
}

async function outboxTo(email: string, kind: string) {
  return app.ctx.db
    .select()
    .from(outbox)
    .where(and(eq(outbox.toAddress, email), eq(outbox.kind, kind)));
}

describe('creating work orders', () => {
  test('a planner creates a queued order; it carries state, locked and overdue, and its creation is recorded', async () => {
    const order = await newOrder({ priority: 'high', assigneeId: technician.id });
    expect(order).toMatchObject({
      kind: 'inspection',
      siteId: bank.siteId,
      bankId: bank.bankId,
      state: 'queued',
      locked: false,
      overdue: false,
      priority: 'high',
      assigneeId: technician.id,
      assigneeName: technician.name,
      checklist: ['capacitance', 'contactor', 'fuses'],
      version: 1,
      planId: null,
      flagId: null,
    });
    const detail = await api('GET', `/api/work-orders/${order.id}`, planner);
    expect(detail.body.transitions).toEqual([
      { fromState: null, toState: 'queued', actorName: planner.name, comment: 'Created by hand', at: expect.any(String) },
    ]);
    expect(detail.body.createdByName).toBe(planner.name);
  });

  test('input is validated: an unknown bank and a non-technician assignee get 400 with the field', async () => {
    const noBank = await api('POST', '/api/work-orders', planner, {
      kind: 'inspection',
      bankId: 999_999_999,
      title: 'x',
      checklist: ['capacitance'],
      dueOn: today(),
    });
    expect(noBank.status).toBe(400);
    expect(noBank.body.error.fields).toHaveProperty('bankId');
    const wrongAssignee = await api('POST', '/api/work-orders', planner, {
      kind: 'inspection',
      bankId: bank.bankId,
      title: 'x',
      checklist: ['capacitance'],
      dueOn: today(),
      assigneeId: supervisor.id,
    });
    expect(wrongAssignee.status).toBe(400);
    expect(wrongAssignee.body.error.fields).toHaveProperty('assigneeId');
    const bad = await api('POST', '/api/work-orders', planner, { kind: 'repair', bankId: bank.bankId, title: '', checklist: [], dueOn: '2026-13-01' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['checklist', 'dueOn', 'kind', 'title']);
  });

  test('only planners create orders', async () => {
    for (const who of [technician, supervisor, admin, viewer]) {
      const res = await api('POST', '/api/work-orders', who, { kind: 'inspection', bankId: bank.bankId, title: 'x', checklist: ['capacitance'], dueOn: today() });
      expect(res.status).toBe(403);
    }
  });
});

describe('listing work orders', () => {
  let listBank: CreatedBank;
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    listBank = await createBankWithUnits(app.ctx, { steps: 1 });
    const on = { siteId: listBank.siteId, bankId: listBank.bankId };
    ids.overdue = await createWorkOrder(app.ctx, { bank: on, state: 'dispatched', assigneeId: technician.id, dueOn: '2026-01-05' });
    ids.onSite = await createWorkOrder(app.ctx, { bank: on, state: 'on-site', assigneeId: otherTechnician.id, dueOn: '2026-02-10' });
    ids.queued = await createWorkOrder(app.ctx, { bank: on, state: 'queued', dueOn: '2026-03-15', kind: 'corrective' });
    ids.sealed = await createWorkOrder(app.ctx, { bank: on, state: 'sealed', assigneeId: technician.id, dueOn: '2026-01-20' });
  });

  const list = async (query: string, who: Person = planner) => api('GET', `/api/work-orders?bankId=${listBank.bankId}&${query}`, who);

  test('filters by state (one or several), assignee (id, me, none), kind and due dates, server-side', async () => {
    expect((await list('state=queued')).body.items.map((o: { id: number }) => o.id)).toEqual([ids.queued]);
    const several = await list('state=dispatched,on-site');
    expect(several.body.total).toBe(2);
    expect((await list(`assigneeId=${technician.id}`)).body.total).toBe(2);
    expect((await list('assigneeId=none')).body.items.map((o: { id: number }) => o.id)).toEqual([ids.queued]);
    expect((await list('assigneeId=me', otherTechnician)).body.items.map((o: { id: number }) => o.id)).toEqual([ids.onSite]);
    expect((await list('kind=corrective')).body.total).toBe(1);
    const january = await list('dueFrom=2026-01-01&dueTo=2026-01-31');
    expect(january.body.items.map((o: { id: number }) => o.id)).toEqual([ids.overdue, ids.sealed]);
    expect((await list(`siteId=${listBank.siteId}`)).body.total).toBe(4);
  });

  test('sorts and pages; the calendar asks for 200 at once', async () => {
    const desc = await list('sort=-dueOn&pageSize=2&page=1');
    expect(desc.body.total).toBe(4);
    expect(desc.body.items.map((o: { id: number }) => o.id)).toEqual([ids.queued, ids.onSite]);
    const page2 = await list('sort=-dueOn&pageSize=2&page=2');
    expect(page2.body.items.map((o: { id: number }) => o.id)).toEqual([ids.sealed, ids.overdue]);
    const calendar = await list('dueFrom=2026-01-01&dueTo=2026-03-31&pageSize=200');
    expect(calendar.status).toBe(200);
    expect(calendar.body.items).toHaveLength(4);
    expect((await list('pageSize=201')).status).toBe(400);
    expect((await list('state=finished,queued')).status).toBe(400);
    expect((await list('sort=title')).status).toBe(400);
  });

  test('an order past its due date is overdue until sealed', async () => {
    const items = (await list('sort=dueOn')).body.items as Array<{ id: number; overdue: boolean; locked: boolean; state: string }>;
    expect(items.find((o) => o.id === ids.overdue)).toMatchObject({ overdue: true, locked: false, state: 'dispatched' });
    expect(items.find((o) => o.id === ids.sealed)).toMatchObject({ overdue: false, locked: true, state: 'sealed' });
  });

  test('a viewer sees only the orders of the sites granted to them', async () => {
    const mine = await newOrder();
    const theirs = await newOrder({}, otherBank);
    const seen = await api('GET', '/api/work-orders?pageSize=200&sort=-createdAt', viewer);
    const seenIds = (seen.body.items as Array<{ id: number; siteId: number }>).map((o) => o.id);
    expect(seenIds).toContain(mine.id);
    expect(seenIds).not.toContain(theirs.id);
    expect((seen.body.items as Array<{ siteId: number }>).every((o) => o.siteId === bank.siteId)).toBe(true);
    expect((await api('GET', `/api/work-orders/${theirs.id}`, viewer)).status).toBe(404);
    expect((await api('GET', `/api/work-orders/${mine.id}`, viewer)).status).toBe(200);
  });

  test('exports the filtered list as CSV', async () => {
    const res = await api('GET', `/api/work-orders/export.csv?bankId=${listBank.bankId}&sort=dueOn`, planner);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment; filename="work-orders-\d{4}-\d{2}-\d{2}\.csv"$/);
    const lines = (res.body as string).replace(/^\uFEFF/, '').trim().split('\r\n');
    expect(lines[0]).toBe('id,kind,site,bank,title,dueOn,priority,state,overdue,assignee,submittedAt,signedAt,signedBy,createdAt');
    expect(lines).toHaveLength(5);
    expect(lines[1]).toContain(`${ids.overdue},inspection,`);
    expect(lines[1]).toContain(',yes,');
    const filtered = await api('GET', `/api/work-orders/export.csv?bankId=${listBank.bankId}&state=queued`, viewer);
    expect(filtered.status).toBe(200);
    expect((filtered.body as string).trim().split('\r\n')).toHaveLength(1); // the viewer's scope: header only
  });
});

describe('an order opened for the walkthrough', () => {
  test('carries its bank as built, the safety card with the longest discharge time, readings, photos and transitions', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const res = await api('GET', `/api/work-orders/${order.id}`, technician);
    expect(res.status).toBe(200);
    const detail = res.body;
    expect(detail.bank).toMatchObject({ id: bank.bankId, siteId: bank.siteId, siteVoltageV: 400, siteFrequencyHz: 50 });
    expect(detail.bank.steps).toHaveLength(2);
    expect(detail.bank.steps[0]).toMatchObject({
      number: 1,
      units: [{ id: bank.unitIds[0], nameplateKvar: 50, connection: 'delta', dischargeTimeS: 180 }],
      contactor: { id: bank.contactorIds[0], ratedOperations: 100_000 },
      reactor: null,
      fuseSet: { id: bank.fuseSetIds[0], ratedCurrentA: 100 },
    });
    expect(detail.safetyCard).toMatchObject({ dischargeWaitS: 300, dischargeWaitFromNameplates: true, acknowledgedAt: null, acknowledgedByName: null });
    // ½·C·(√2·U)² for a 331.57 µF leg at 400 V: about 53 J (engineering-reference.md §8, derived).
    expect(detail.safetyCard.maxStoredEnergyJ).toBeCloseTo(53.05, 1);
    expect(detail.safetyCard.steps.map((s: { title: string }) => s.title)).toEqual([
      'Isolate and lock out',
      'Wait 5 min',
      'Verify absence of voltage',
      'Discharge, short and earth',
      'Wear the right PPE',
    ]);
    expect(detail.safetyCard.ppeNote).toMatch(/arc-flash/);
    expect(detail.safetyCard.deferral).toMatch(/local codes/i);
    expect(detail.readings).toEqual([]);
    expect(detail.photos).toEqual([]);
    expect(detail.transitions).toHaveLength(1);
  });

  test('a missing order answers 404', async () => {
    expect((await api('GET', '/api/work-orders/999999999', planner)).status).toBe(404);
  });
});

describe('editing an order', () => {
  test('reschedules with the version; a stale version gets 409 and the first change stays', async () => {
    const order = await newOrder();
    const first = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: 1, dueOn: '2027-02-01', priority: 'urgent' });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ dueOn: '2027-02-01', priority: 'urgent', version: 2 });
    const stale = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: 1, dueOn: '2027-03-01' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect((await api('GET', `/api/work-orders/${order.id}`, planner)).body.dueOn).toBe('2027-02-01');
  });

  test('reassigns to technicians only; a dispatched order’s new technician is told by mail', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const dispatched = await move(planner, order.id, 'dispatched', 1);
    const notTech = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: dispatched.body.version, assigneeId: admin.id });
    expect(notTech.status).toBe(400);
    expect(notTech.body.error.fields).toHaveProperty('assigneeId');
    const unassign = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: dispatched.body.version, assigneeId: null });
    expect(unassign.status).toBe(400);
    const res = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: dispatched.body.version, assigneeId: otherTechnician.id });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ assigneeId: otherTechnician.id, assigneeName: otherTechnician.name, state: 'dispatched' });
    const mails = await outboxTo(otherTechnician.email, 'work-order.assigned');
    expect(mails.some((m) => m.textBody.includes(`/work-orders/${order.id}`))).toBe(true);
  });

  test('the technician cannot change while the order is on site', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const d = await move(planner, order.id, 'dispatched', 1);
    const o = await move(technician, order.id, 'on-site', d.body.version);
    const res = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: o.body.version, assigneeId: otherTechnician.id });
    expect(res.status).toBe(409);
    const due = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: o.body.version, dueOn: daysFromNow(3) });
    expect(due.status).toBe(200);
  });

  test('only planners edit orders', async () => {
    const order = await newOrder();
    for (const who of [technician, supervisor, admin, viewer]) {
      expect((await api('PATCH', `/api/work-orders/${order.id}`, who, { version: 1, title: 'Mine now' })).status).toBe(403);
    }
  });
});

describe('the state machine', () => {
  test('the whole way: dispatch, safety card, submit, send back with a reason, resume, submit, seal', async () => {
    const order = await newOrder();
    let r = await move(planner, order.id, 'dispatched', 1, { assigneeId: technician.id, comment: 'Take it this week' });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ state: 'dispatched', assigneeId: technician.id, version: 2 });

    r = await move(technician, order.id, 'on-site', 2);
    expect(r.status).toBe(200);
    expect(r.body.state).toBe('on-site');
    expect(r.body.safetyAcknowledgedAt).not.toBeNull();
    const opened = await api('GET', `/api/work-orders/${order.id}`, technician);
    expect(opened.body.safetyCard).toMatchObject({ acknowledgedByName: technician.name, acknowledgedAt: r.body.safetyAcknowledgedAt });

    const empty = await move(technician, order.id, 'awaiting-review', 3);
    expect(empty.status).toBe(409);
    expect(empty.body.error.message).toMatch(/no readings yet/i);

    await insertUnitReading(app.ctx, { workOrderId: order.id, unitId: bank.unitIds[0]!, recordedById: technician.id, deviationPct: -2, band: 'healthy' });
    r = await move(technician, order.id, 'awaiting-review', 3);
    expect(r.status).toBe(200);
    expect(r.body.submittedAt).not.toBeNull();

    const noReason = await move(supervisor, order.id, 'sent-back', 4);
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('comment');
    r = await move(supervisor, order.id, 'sent-back', 4, { comment: 'Step 2 was not measured: measure it.' });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ state: 'sent-back', returnReason: 'Step 2 was not measured: measure it.' });
    // The technician's list and the planner's table carry why, without opening the order.
    const mine = await api('GET', '/api/work-orders?assigneeId=me&state=sent-back', technician);
    expect(mine.body.items.find((o: { id: number }) => o.id === order.id)).toMatchObject({ state: 'sent-back', returnReason: 'Step 2 was not measured: measure it.' });
    const desk = await api('GET', `/api/work-orders?bankId=${bank.bankId}&state=sent-back`, planner);
    expect(desk.body.items.find((o: { id: number }) => o.id === order.id).returnReason).toBe('Step 2 was not measured: measure it.');

    r = await move(technician, order.id, 'on-site', 5);
    expect(r.status).toBe(200);
    r = await move(technician, order.id, 'awaiting-review', 6);
    expect(r.status).toBe(200);
    r = await move(supervisor, order.id, 'sealed', 7);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ state: 'sealed', locked: true, signedByName: supervisor.name, signatureMeaning: defaultSignatureMeaning, version: 8 });
    expect(r.body.signedAt).not.toBeNull();

    const detail = await api('GET', `/api/work-orders/${order.id}`, planner);
    expect(detail.body.signedById).toBe(supervisor.id);
    expect(detail.body.transitions.map((t: { fromState: string | null; toState: string; actorName: string }) => [t.fromState, t.toState, t.actorName])).toEqual([
      [null, 'queued', planner.name],
      ['queued', 'dispatched', planner.name],
      ['dispatched', 'on-site', technician.name],
      ['on-site', 'awaiting-review', technician.name],
      ['awaiting-review', 'sent-back', supervisor.name],
      ['sent-back', 'on-site', technician.name],
      ['on-site', 'awaiting-review', technician.name],
      ['awaiting-review', 'sealed', supervisor.name],
    ]);
    expect(detail.body.transitions[1].comment).toBe('Take it this week');
    expect(detail.body.transitions[4].comment).toBe('Step 2 was not measured: measure it.');
    expect(detail.body.readings).toHaveLength(1);

    // The mails, queued in the outbox.
    expect((await outboxTo(technician.email, 'work-order.assigned')).some((m) => m.textBody.includes(`/work-orders/${order.id}`))).toBe(true);
    for (const s of [supervisor, otherSupervisor]) {
      expect((await outboxTo(s.email, 'work-order.submitted')).filter((m) => m.textBody.includes(`/work-orders/${order.id}`))).toHaveLength(2);
    }
    const returned = (await outboxTo(technician.email, 'work-order.returned')).filter((m) => m.textBody.includes(`/work-orders/${order.id}`));
    expect(returned).toHaveLength(1);
    expect(returned[0]!.textBody).toContain('Step 2 was not measured: measure it.');
    expect((await outboxTo(planner.email, 'work-order.sealed')).some((m) => m.textBody.includes(`/work-orders/${order.id}`))).toBe(true);
  });

  test('a supervisor words the signature’s meaning', async () => {
    const order = await orderAwaitingReview();
    const r = await move(supervisor, order.id, 'sealed', order.version, { signatureMeaning: 'Reviewed against the site’s 2026 test plan.' });
    expect(r.body.signatureMeaning).toBe('Reviewed against the site’s 2026 test plan.');
  });

  test('planner moves need a planner', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    for (const who of [technician, supervisor, admin]) expect((await move(who, order.id, 'dispatched', 1)).status).toBe(403);
    expect((await move(viewer, order.id, 'dispatched', 1)).status).toBe(403);
    const out = await move(viewer, (await newOrder({}, otherBank)).id, 'dispatched', 1);
    expect(out.status).toBe(404); // out of the viewer's scope: as if missing
  });

  test('assignee moves need the order’s own technician', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const d = await move(planner, order.id, 'dispatched', 1);
    expect((await move(otherTechnician, order.id, 'on-site', d.body.version)).status).toBe(403);
    expect((await move(planner, order.id, 'on-site', d.body.version)).status).toBe(403);
    expect((await move(technician, order.id, 'on-site', d.body.version)).status).toBe(200);
  });

  test('supervisor moves need a supervisor who did not perform the order', async () => {
    const both = await person(['technician', 'supervisor']);
    const own = await orderAwaitingReview(both);
    const selfSeal = await move(both, own.id, 'sealed', own.version);
    expect(selfSeal.status).toBe(403);
    expect(selfSeal.body.error.message).toMatch(/another supervisor/);
    expect((await move(planner, own.id, 'sealed', own.version)).status).toBe(403);
    expect((await move(technician, own.id, 'sent-back', own.version, { comment: 'no' })).status).toBe(403);
    expect((await move(supervisor, own.id, 'sealed', own.version)).status).toBe(200);
  });

  test('a move the table does not have is a conflict', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const res = await move(supervisor, order.id, 'sealed', 1);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/queued and cannot move to sealed.*dispatched, withdrawn/);
    expect((await move(planner, order.id, 'queued', 1)).status).toBe(409);
  });

  test('dispatching needs a technician', async () => {
    const order = await newOrder();
    const none = await move(planner, order.id, 'dispatched', 1);
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toHaveProperty('assigneeId');
    const wrong = await move(planner, order.id, 'dispatched', 1, { assigneeId: supervisor.id });
    expect(wrong.status).toBe(400);
    const inactive = await createUser(app.ctx, { roles: ['technician'], active: false });
    expect((await move(planner, order.id, 'dispatched', 1, { assigneeId: inactive.user.id })).status).toBe(400);
  });

  test('back to queued keeps the pencilled-in technician', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    const d = await move(planner, order.id, 'dispatched', 1);
    const q = await move(planner, order.id, 'queued', d.body.version, { comment: 'Not this week' });
    expect(q.status).toBe(200);
    expect(q.body).toMatchObject({ state: 'queued', assigneeId: technician.id });
  });

  test('withdrawing needs a reason; a withdrawn order moves and changes no further', async () => {
    const order = await newOrder();
    const noReason = await move(planner, order.id, 'withdrawn', 1);
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('comment');
    const w = await move(planner, order.id, 'withdrawn', 1, { comment: 'Bank replaced by the client' });
    expect(w.status).toBe(200);
    expect(w.body).toMatchObject({ state: 'withdrawn', locked: false, overdue: false });
    const again = await move(planner, order.id, 'queued', w.body.version);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/moves no further/);
    expect((await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: w.body.version, title: 'Back' })).status).toBe(409);
  });

  test('a stale version gets 409 and changes nothing', async () => {
    const order = await newOrder({ assigneeId: technician.id });
    await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: 1, title: 'Renamed' });
    const stale = await move(planner, order.id, 'dispatched', 1);
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect((await api('GET', `/api/work-orders/${order.id}`, planner)).body.state).toBe('queued');
  });

  test('bad requests get 400', async () => {
    const order = await newOrder();
    expect((await move(planner, order.id, 'done', 1)).status).toBe(400);
    expect((await api('POST', `/api/work-orders/${order.id}/transitions`, planner, { to: 'dispatched' })).status).toBe(400);
  });
});

describe('a sealed order is locked', () => {
  test('in the API: edits and moves answer 409 locked', async () => {
    const order = await orderAwaitingReview();
    const sealed = await move(supervisor, order.id, 'sealed', order.version);
    expect(sealed.status).toBe(200);
    const edit = await api('PATCH', `/api/work-orders/${order.id}`, planner, { version: sealed.body.version, title: 'Changed' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe('locked');
    const moveOn = await move(planner, order.id, 'withdrawn', sealed.body.version, { comment: 'x' });
    expect(moveOn.status).toBe(409);
    expect(moveOn.body.error.code).toBe('locked');
  });

  test('in the database: an UPDATE or DELETE straight through ctx.db is refused', async () => {
    const id = await createWorkOrder(app.ctx, { bank, state: 'sealed', assigneeId: technician.id });
    expect(await refusal(app.ctx.db.update(workOrders).set({ title: 'Tampered' }).where(eq(workOrders.id, id)))).toMatch(/VARDEN_LOCKED/);
    expect(await refusal(app.ctx.db.update(workOrders).set({ locked: false }).where(eq(workOrders.id, id)))).toMatch(/VARDEN_LOCKED/);
    expect(await refusal(app.ctx.db.delete(workOrders).where(eq(workOrders.id, id)))).toMatch(/VARDEN_LOCKED/);
    const [row] = await app.ctx.db.select().from(workOrders).where(eq(workOrders.id, id));
    expect(row).toMatchObject({ locked: true, state: 'sealed' });
    expect(row!.title).not.toBe('Tampered');
  });

  test('two supervisors sealing at once: one seals, the other gets 409', async () => {
    const order = await orderAwaitingReview();
    const results = await Promise.all([
      move(supervisor, order.id, 'sealed', order.version),
      move(otherSupervisor, order.id, 'sealed', order.version),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
    const winner = results.find((r) => r.status === 200)!;
    const detail = await api('GET', `/api/work-orders/${order.id}`, planner);
    expect(detail.body.signedByName).toBe(winner.body.signedByName);
    const seals = await app.ctx.db
      .select()
      .from(workOrderTransitions)
      .where(and(eq(workOrderTransitions.workOrderId, order.id), eq(workOrderTransitions.toState, 'sealed')));
    expect(seals).toHaveLength(1);
  });

  test('a seal and a send-back at once: exactly one wins', async () => {
    const order = await orderAwaitingReview();
    const results = await Promise.all([
      move(supervisor, order.id, 'sealed', order.version),
      move(otherSupervisor, order.id, 'sent-back', order.version, { comment: 'Redo step 1' }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
  });
});

describe('the supervisor’s review', () => {
  test('shows each unit’s result beside its previous one from an earlier order', async () => {
    const reviewBank = await createBankWithUnits(app.ctx, { steps: 2 });
    const [unit1, unit2] = reviewBank.unitIds as [number, number];
    // An earlier inspection with readings, sealed afterwards (readings cannot be added to a sealed order).
    const earlier = await createWorkOrder(app.ctx, { bank: reviewBank, state: 'on-site', assigneeId: technician.id, dueOn: '2026-01-10' });
    await insertUnitReading(app.ctx, { workOrderId: earlier, unitId: unit1, recordedById: technician.id, deviationPct: -4, band: 'healthy', recordedAt: new Date('2026-01-10T09:00:00Z') });
    await insertUnitReading(app.ctx, { workOrderId: earlier, unitId: unit1, recordedById: technician.id, deviationPct: -4.5, band: 'healthy', recordedAt: new Date('2026-01-10T09:30:00Z') });
    await app.ctx.db.update(workOrders).set({ state: 'sealed', locked: true, signedAt: new Date(), signedByName: 'Earlier signer' }).where(eq(workOrders.id, earlier));
    // A withdrawn order's reading does not count as history.
    const withdrawn = await createWorkOrder(app.ctx, { bank: reviewBank, state: 'on-site', assigneeId: technician.id });
    await insertUnitReading(app.ctx, { workOrderId: withdrawn, unitId: unit1, recordedById: technician.id, deviationPct: -30, band: 'replace', recordedAt: new Date('2026-03-01T09:00:00Z') });
    await app.ctx.db.update(workOrders).set({ state: 'withdrawn' }).where(eq(workOrders.id, withdrawn));

    const current = await createWorkOrder(app.ctx, { bank: reviewBank, state: 'on-site', assigneeId: technician.id });
    await insertUnitReading(app.ctx, { workOrderId: current, unitId: unit1, recordedById: technician.id, deviationPct: -11, band: 'replace' });
    await app.ctx.db.update(workOrders).set({ state: 'awaiting-review', submittedAt: new Date() }).where(eq(workOrders.id, current));

    const res = await api('GET', `/api/work-orders/${current}/review`, supervisor);
    expect(res.status).toBe(200);
    expect(res.body.readings).toHaveLength(1);
    expect(res.body.bank.steps).toHaveLength(2);
    const [first, second] = res.body.comparisons;
    expect(first).toMatchObject({
      unitId: unit1,
      stepNumber: 1,
      position: 1,
      current: { workOrderId: current, band: 'replace', deviationPct: -11 },
      previous: { workOrderId: earlier, band: 'healthy', deviationPct: -4.5, recordedAt: '2026-01-10T09:30:00.000Z' },
    });
    expect(first.deviationChangePct).toBeCloseTo(-6.5, 6);
    expect(first.current.legsUF).toHaveLength(3);
    expect(second).toMatchObject({ unitId: unit2, current: null, previous: null, deviationChangePct: null });

    const queue = await api('GET', `/api/work-orders?state=awaiting-review&bankId=${reviewBank.bankId}`, supervisor);
    expect(queue.body.items.map((o: { id: number }) => o.id)).toEqual([current]);
  });
});

describe('the signed record', () => {
  test('a sealed order downloads as a PDF with its results, flags, photos and signature', async () => {
    const order = await orderAwaitingReview();
    // A photo with a thumbnail in the S3 fake, and a flag raised by the order's reading.
    const thumbnail = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#17706A' } }).webp().toBuffer();
    const thumbnailKey = `test/${unique('thumb')}.webp`;
    await app.ctx.store.put(thumbnailKey, thumbnail, 'image/webp');
    await app.ctx.db.insert(photos).values({
      workOrderId: order.id,
      idempotencyKey: unique('photo'),
      caption: 'Step 1 nameplate',
      displayKey: thumbnailKey,
      thumbnailKey,
      widthPx: 64,
      heightPx: 48,
      bytes: thumbnail.length,
      takenById: technician.id,
    });
    const sealed = await move(supervisor, order.id, 'sealed', order.version);
    expect(sealed.status).toBe(200);

    const res = await app.request(`/api/work-orders/${order.id}/record.pdf`, { cookie: viewer.cookie });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename="work-order-${order.id}-signed-record.pdf"`);
    const pdf = Buffer.from(await res.arrayBuffer());
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF/);
    expect(pdf.toString('latin1')).toMatch(/\/Subtype \/Image/);
  });

  test('only for sealed orders, only for people who may see the order', async () => {
    const open = await newOrder();
    const notSealed = await api('GET', `/api/work-orders/${open.id}/record.pdf`, planner);
    expect(notSealed.status).toBe(409);
    const elsewhere = await createWorkOrder(app.ctx, { bank: otherBank, state: 'sealed', assigneeId: technician.id });
    expect((await api('GET', `/api/work-orders/${elsewhere}/record.pdf`, viewer)).status).toBe(404);
    const ok = await app.request(`/api/work-orders/${elsewhere}/record.pdf`, { cookie: planner.cookie });
    expect(ok.status).toBe(200);
    expect(Buffer.from(await ok.arrayBuffer()).subarray(0, 4).toString('latin1')).toBe('%PDF');
  });
});

describe('workload', () => {
  test('counts each technician’s open orders by state, those due in the range and those overdue', async () => {
    const busy = await person(['technician']);
    const on = { siteId: otherBank.siteId, bankId: otherBank.bankId };
    await createWorkOrder(app.ctx, { bank: on, state: 'dispatched', assigneeId: busy.id, dueOn: '2026-06-10' });
    await createWorkOrder(app.ctx, { bank: on, state: 'on-site', assigneeId: busy.id, dueOn: '2026-06-20' });
    await createWorkOrder(app.ctx, { bank: on, state: 'sent-back', assigneeId: busy.id, dueOn: '2099-01-01' });
    await createWorkOrder(app.ctx, { bank: on, state: 'sealed', assigneeId: busy.id, dueOn: '2026-06-15' });
    const idle = await person(['technician']);
    const res = await api('GET', '/api/work-orders/workload?from=2026-06-01&to=2026-06-30', planner);
    expect(res.status).toBe(200);
    const rows = res.body.technicians as Array<{ userId: number }>;
    expect(rows.find((r) => r.userId === busy.id)).toEqual({
      userId: busy.id,
      name: busy.name,
      openByState: { queued: 0, dispatched: 1, 'on-site': 1, 'awaiting-review': 0, 'sent-back': 1 },
      openTotal: 3,
      dueInRange: 2,
      overdue: 2,
    });
    expect(rows.find((r) => r.userId === idle.id)).toMatchObject({ openTotal: 0, dueInRange: 0 });
    expect(rows.some((r) => r.userId === supervisor.id)).toBe(false);
    expect(res.body.unassigned).toMatchObject({ userId: null });
    expect((await api('GET', '/api/work-orders/workload?from=2026-06-30&to=2026-06-01', planner)).status).toBe(400);
    expect((await api('GET', '/api/work-orders/workload?from=2026-06-01&to=2026-06-30', viewer)).status).toBe(403);
  });
});

describe('GET /api/technicians', () => {
  test('lists active technicians to planners with id, name and e-mail only', async () => {
    const gone = await person(['technician']);
    await app.ctx.db.update(users).set({ active: false }).where(eq(users.id, gone.id));
    const res = await api('GET', '/api/technicians', planner);
    expect(res.status).toBe(200);
    const items = res.body.items as Array<{ id: number; name: string; email: string }>;
    expect(res.body.total).toBe(items.length);
    expect(items.find((t) => t.id === technician.id)).toEqual({ id: technician.id, name: technician.name, email: technician.email });
    expect(items.some((t) => t.id === gone.id)).toBe(false);
    expect(items.some((t) => t.id === supervisor.id || t.id === planner.id)).toBe(false);
    expect(items.every((t) => Object.keys(t).sort().join() === 'email,id,name')).toBe(true);
    for (const who of [technician, supervisor, viewer, admin]) expect((await api('GET', '/api/technicians', who)).status).toBe(403);
  });
});

describe('the demo', () => {
  // A database of its own: the demo's sites have fixed names, and seeding checks for an empty
  // database. Its outbox holds only the demo's mail, so delivering it is quick.
  let demo: TestApp;

  beforeAll(async () => {
    demo = await startIsolatedTestApp('demo');
    // How long seeding takes is a benchmark matter, not a test's; here only that it seeds.
    expect(await seedDemoIfEmpty(demo.ctx)).toBe(true);
  }, 120_000);
  afterAll(async () => {
    await demo?.close();
  });

  const as = async (email: string) => {
    const [user] = await demo.ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email));
    return sessionCookieFor(demo.ctx, user!.id);
  };
  const get = async (path: string, cookie: string) => {
    const res = await demo.request(path, { cookie });
    return { status: res.status, body: await res.json() };
  };

  test('has orders in every state over three years, with readings', async () => {
    const planner = await as('planner@demo.varden.test');
    const counts: Record<string, number> = {};
    for (const state of ['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back', 'sealed', 'withdrawn']) {
      counts[state] = (await get(`/api/work-orders?state=${state}&pageSize=1`, planner)).body.total;
    }
    expect(counts).toMatchObject({ 'awaiting-review': 2, 'sent-back': 1, withdrawn: 1 });
    for (const n of Object.values(counts)) expect(n).toBeGreaterThan(0);
    expect(counts.sealed).toBeGreaterThanOrEqual(24);
    const oldest = (await get('/api/work-orders?state=sealed&sort=dueOn&pageSize=1', planner)).body.items[0];
    expect(oldest.dueOn <= new Date(Date.now() - 2.9 * 365 * 86_400_000).toISOString().slice(0, 10)).toBe(true);
    const plans = (await get('/api/inspection-plans?pageSize=50', planner)).body;
    expect(plans.total).toBe(4);
    expect(plans.items.every((p: { intervalMonths: number }) => p.intervalMonths === 6)).toBe(true);
  });

  test('tells the scenario’s story in its flags and its review', async () => {
    const planner = await as('planner@demo.varden.test');
    const flagsNow = (await get('/api/flags?pageSize=200', planner)).body.items as Array<{ kind: string; state: string; bankName: string; siteName: string; message: string; correctiveOrderId: number | null }>;
    const find = (kind: string, bankName: string) => flagsNow.filter((f) => f.kind === kind && f.bankName === bankName);
    // Alder Quay Bank A: step 3 past the replace threshold, its tuning crept from 189 Hz towards 200 Hz.
    expect(find('replace', 'Bank A').map((f) => f.message)).toEqual([expect.stringMatching(/^Step 3, unit \d/), expect.stringMatching(/^Step 3, unit \d/)]);
    const tuning = find('tuning-drift', 'Bank A')[0]!;
    const hz = Number(/tuning (\d+(\.\d+)?) Hz/.exec(tuning.message)![1]);
    expect(hz).toBeGreaterThan(196);
    expect(hz).toBeLessThan(203);
    // Bank B: the operated disconnector, with its corrective order dispatched.
    const failed = find('replace', 'Bank B');
    expect(failed).toMatchObject([{ state: 'in-hand', message: expect.stringMatching(/disconnector has operated/) }]);
    const corrective = (await get(`/api/work-orders/${failed[0]!.correctiveOrderId}`, planner)).body;
    expect(corrective).toMatchObject({ kind: 'corrective', state: 'dispatched', assigneeName: 'Kasimir Ondrey' });
    // Brinmoor: a contactor at about 85 % of its endurance; last month's blown fuse in hand, the technician on site.
    expect(find('contactor-endurance', 'Pump hall bank')[0]!.message).toMatch(/8[45]\.\d % of its rated 100000 operations/);
    const fuse = find('blown-fuse', 'Pump hall bank')[0]!;
    expect(fuse.state).toBe('in-hand');
    expect((await get(`/api/work-orders/${fuse.correctiveOrderId}`, planner)).body.state).toBe('on-site');
    // Castellan: one unit's legs unbalanced at about 1.09.
    expect(find('unbalance', 'Extruder bank')[0]!.message).toMatch(/max\/min 1\.0[89]/);

    // The supervisor reviews Bank A's inspection beside the previous one.
    const supervisor = await as('supervisor@demo.varden.test');
    const queue = (await get('/api/work-orders?state=awaiting-review', supervisor)).body.items as Array<{ id: number; bankName: string }>;
    const bankA = queue.find((o) => o.bankName === 'Bank A')!;
    const review = (await get(`/api/work-orders/${bankA.id}/review`, supervisor)).body;
    const step3 = review.comparisons.filter((c: { stepNumber: number }) => c.stepNumber === 3);
    expect(step3).toHaveLength(2);
    for (const c of step3) {
      expect(c.current.band).toBe('replace');
      expect(c.previous.band).toBe('watch');
      expect(c.deviationChangePct).toBeLessThan(-1);
    }
    expect(review.photos.length).toBeGreaterThan(0);
  });

  test('a viewer sees only their client site; a sealed record prints', async () => {
    const viewer = await as('viewer@demo.varden.test');
    const seen = (await get('/api/work-orders?pageSize=200', viewer)).body.items as Array<{ siteName: string; id: number; state: string }>;
    expect(new Set(seen.map((o) => o.siteName))).toEqual(new Set(['Alder Quay Cold Store']));
    const sealed = seen.find((o) => o.state === 'sealed')!;
    const pdf = await demo.request(`/api/work-orders/${sealed.id}/record.pdf`, { cookie: viewer });
    expect(pdf.status).toBe(200);
    expect(Buffer.from(await pdf.arrayBuffer()).subarray(0, 4).toString('latin1')).toBe('%PDF');
  });

  test('mail reaches the mail fake: a supervisor sends Bank B’s inspection back', async () => {
    const supervisor = await as('amadou.whitloe@demo.varden.test');
    const queue = (await get('/api/work-orders?state=awaiting-review', supervisor)).body.items as Array<{ id: number; bankName: string; version: number; assigneeName: string }>;
    const bankB = queue.find((o) => o.bankName === 'Bank B')!;
    const reason = 'Photograph the nameplate of the failed unit before it leaves site.';
    const res = await demo.request(`/api/work-orders/${bankB.id}/transitions`, { method: 'POST', cookie: supervisor, json: { to: 'sent-back', version: bankB.version, comment: reason } });
    expect(res.status).toBe(200);
    const [row] = await demo.ctx.db.select().from(outbox).where(eq(outbox.kind, 'work-order.returned'));
    expect(row!.toAddress).toBe('bex.ardalan@demo.varden.test');
    await sendOutboxThrough(demo.ctx, row!.id);
    const mail = await latestMailTo(demo, 'bex.ardalan@demo.varden.test', row!.subject);
    expect(mail?.text).toContain(`${demo.url}/work-orders/${bankB.id}`);
    expect(mail?.text).toContain(reason);
  });
});
