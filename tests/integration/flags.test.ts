import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { flags, outbox } from '../../apps/api/src/db/schema/index';
import { notifyReplaceFlag } from '../../apps/api/src/modules/flags/flag-mail';
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
  cookie: string;
}
let planner: Person;
let technician: Person;
let supervisor: Person;
let viewer: Person;
let bank: CreatedBank;
let otherBank: CreatedBank;

async function person(roles: Parameters<typeof createUser>[1]['roles'], siteIds: number[] = []): Promise<Person> {
  const { user, email } = await createUser(app.ctx, { roles, siteIds });
  return { id: user.id, email, cookie: await sessionCookieFor(app.ctx, user.id) };
}

beforeAll(async () => {
  app = await startTestApp();
  bank = await createBankWithUnits(app.ctx, { steps: 2 });
  otherBank = await createBankWithUnits(app.ctx, { steps: 1 });
  [planner, technician, supervisor, viewer] = await Promise.all([
    person(['planner']),
    person(['technician']),
    person(['supervisor']),
    person(['viewer'], [bank.siteId]),
  ]);
});
afterAll(async () => {
  await app.close();
});

async function api(method: string, path: string, who: Person, json?: unknown) {
  const res = await app.request(path, { method, cookie: who.cookie, ...(json === undefined ? {} : { json }) });
  return { status: res.status, body: await res.json() };
}

/** A flag row as the readings module writes it, straight to the database. */
async function raiseFlag(values: Partial<typeof flags.$inferInsert> = {}, on: CreatedBank = bank): Promise<number> {
  const [created] = await app.ctx.db
    .insert(flags)
    .values({
      kind: 'replace',
      severity: 'action',
      siteId: on.siteId,
      bankId: on.bankId,
      target: 'capacitor-unit',
      targetId: on.unitIds[0]!,
      message: `Step 1 unit 1 delivers 11.8 % below nameplate: replace it. ${unique('ref')}`,
      raisedAt: new Date(),
      ...values,
    })
    .$returningId();
  return created!.id;
}

const daysFromToday = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

async function move(who: Person, id: number, to: string, version: number, extra: Record<string, unknown> = {}) {
  return api('POST', `/api/work-orders/${id}/transitions`, who, { to, version, ...extra });
}

describe('the flag queue', () => {
  test('lists flags by state, site, bank, kind and severity, newest first, paged', async () => {
    const listBank = await createBankWithUnits(app.ctx, { steps: 1 });
    const older = await raiseFlag({ kind: 'watch', severity: 'advisory', raisedAt: new Date(Date.now() - 3_600_000) }, listBank);
    const newer = await raiseFlag({}, listBank);
    const cleared = await raiseFlag({ state: 'cleared', clearedAt: new Date() }, listBank);
    const open = await api('GET', `/api/flags?state=open&siteId=${listBank.siteId}`, planner);
    expect(open.status).toBe(200);
    expect(open.body.total).toBe(2);
    expect(open.body.items.map((f: { id: number }) => f.id)).toEqual([newer, older]);
    expect(open.body.items[0]).toMatchObject({
      id: newer,
      kind: 'replace',
      severity: 'action',
      siteId: listBank.siteId,
      bankId: listBank.bankId,
      siteName: expect.any(String),
      bankName: expect.any(String),
      target: 'capacitor-unit',
      targetId: listBank.unitIds[0],
      state: 'open',
      correctiveOrderId: null,
      readingId: null,
    });
    expect((await api('GET', `/api/flags?bankId=${listBank.bankId}&kind=watch`, planner)).body.items.map((f: { id: number }) => f.id)).toEqual([older]);
    expect((await api('GET', `/api/flags?bankId=${listBank.bankId}&severity=action&state=cleared`, planner)).body.items.map((f: { id: number }) => f.id)).toEqual([cleared]);
    expect((await api('GET', `/api/flags?bankId=${listBank.bankId}&sort=raisedAt&pageSize=1&page=1`, planner)).body).toMatchObject({ total: 3, items: [{ id: older }] });
    expect((await api('GET', '/api/flags?state=closed', planner)).status).toBe(400);
  });

  test('a viewer sees only the flags of the sites granted to them', async () => {
    const mine = await raiseFlag();
    const theirs = await raiseFlag({}, otherBank);
    const seen = (await api('GET', '/api/flags?pageSize=200', viewer)).body.items.map((f: { id: number }) => f.id);
    expect(seen).toContain(mine);
    expect(seen).not.toContain(theirs);
    expect((await api('POST', `/api/flags/${mine}/corrective-order`, viewer, {})).status).toBe(403);
  });
});

describe('a corrective order from a flag, in one action', () => {
  test('an action flag: due in a week, high priority, checklist for the kind; the flag goes in hand', async () => {
    const flagId = await raiseFlag({ kind: 'replace', message: 'Step 2 unit 1: a leg reads near zero; the disconnector has operated. Replace the unit.' });
    const res = await api('POST', `/api/flags/${flagId}/corrective-order`, planner, {});
    expect(res.status).toBe(201);
    expect(res.body.workOrder).toMatchObject({
      kind: 'corrective',
      bankId: bank.bankId,
      siteId: bank.siteId,
      flagId,
      state: 'queued',
      priority: 'high',
      dueOn: daysFromToday(7),
      title: 'Replace a capacitor unit: Step 2 unit 1',
      checklist: ['capacitance', 'visual', 'discharge-resistor', 'photos'],
    });
    expect(res.body.workOrder.instructions).toMatch(/^Step 2 unit 1: a leg reads near zero.*\n\nConfirm the loss/s);
    expect(res.body.flag).toMatchObject({ id: flagId, state: 'in-hand', correctiveOrderId: res.body.workOrder.id });

    const again = await api('POST', `/api/flags/${flagId}/corrective-order`, planner, {});
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(new RegExp(`already in hand: corrective order ${res.body.workOrder.id}`));
  });

  test('an advisory flag: due in a month at normal priority; the planner may choose assignee, date and priority', async () => {
    const flagId = await raiseFlag({ kind: 'blown-fuse', severity: 'advisory', target: 'fuse-set', targetId: bank.fuseSetIds[0]! });
    const plain = await api('POST', `/api/flags/${flagId}/corrective-order`, planner, {});
    expect(plain.body.workOrder).toMatchObject({ priority: 'normal', dueOn: daysFromToday(30), checklist: ['fuses', 'capacitance', 'visual', 'photos'] });
    expect(plain.body.workOrder.instructions).toMatch(/do not just re-fuse/);

    const chosen = await raiseFlag({ kind: 'contactor-endurance', severity: 'advisory', target: 'contactor', targetId: bank.contactorIds[0]! });
    const res = await api('POST', `/api/flags/${chosen}/corrective-order`, planner, { assigneeId: technician.id, dueOn: '2027-01-15', priority: 'urgent' });
    expect(res.body.workOrder).toMatchObject({ assigneeId: technician.id, dueOn: '2027-01-15', priority: 'urgent', checklist: ['contactor', 'visual', 'photos'] });
    const wrong = await api('POST', `/api/flags/${await raiseFlag()}/corrective-order`, planner, { assigneeId: supervisor.id });
    expect(wrong.status).toBe(400);
  });

  test('only planners raise them; a missing flag answers 404', async () => {
    const flagId = await raiseFlag();
    for (const who of [technician, supervisor]) expect((await api('POST', `/api/flags/${flagId}/corrective-order`, who, {})).status).toBe(403);
    expect((await api('POST', '/api/flags/999999999/corrective-order', planner, {})).status).toBe(404);
    expect((await api('POST', `/api/flags/${flagId}/corrective-order`, planner, { priority: 'soon' })).status).toBe(400);
  });

  test('two planners at once: one order, the other gets 409', async () => {
    const flagId = await raiseFlag();
    const [a, b] = await Promise.all([
      api('POST', `/api/flags/${flagId}/corrective-order`, planner, {}),
      api('POST', `/api/flags/${flagId}/corrective-order`, planner, {}),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
  });

  test('sealing the corrective order clears its flag', async () => {
    const flagId = await raiseFlag();
    const { workOrder } = (await api('POST', `/api/flags/${flagId}/corrective-order`, planner, { assigneeId: technician.id })).body;
    let r = await move(planner, workOrder.id, 'dispatched', workOrder.version);
    r = await move(technician, workOrder.id, 'on-site', r.body.version);
    await insertUnitReading(app.ctx, { workOrderId: workOrder.id, unitId: bank.unitIds[0]!, recordedById: technician.id, deviationPct: 0.5, band: 'healthy' });
    r = await move(technician, workOrder.id, 'awaiting-review', r.body.version);
    r = await move(supervisor, workOrder.id, 'sealed', r.body.version);
    expect(r.status).toBe(200);
    const cleared = await api('GET', `/api/flags?state=cleared&bankId=${bank.bankId}&pageSize=200`, planner);
    expect(cleared.body.items.find((f: { id: number }) => f.id === flagId)).toMatchObject({ state: 'cleared', correctiveOrderId: workOrder.id });
    const [row] = await app.ctx.db.select().from(flags).where(eq(flags.id, flagId));
    expect(row!.clearedAt).not.toBeNull();
  });

  test('withdrawing the corrective order puts its flag back in the queue', async () => {
    const flagId = await raiseFlag();
    const { workOrder } = (await api('POST', `/api/flags/${flagId}/corrective-order`, planner, {})).body;
    const w = await move(planner, workOrder.id, 'withdrawn', workOrder.version, { comment: 'Raised on the wrong bank' });
    expect(w.status).toBe(200);
    const [row] = await app.ctx.db.select().from(flags).where(eq(flags.id, flagId));
    expect(row).toMatchObject({ state: 'open', correctiveOrderId: null });
    expect((await api('POST', `/api/flags/${flagId}/corrective-order`, planner, {})).status).toBe(201);
  });
});

describe('the replace-flag mail', () => {
  // An outbox of its own, so the mail fake receives this mail without waiting behind other files'.
  let own: TestApp;
  beforeAll(async () => {
    own = await startIsolatedTestApp('flag_mail');
  }, 60_000);
  afterAll(async () => {
    await own?.close();
  });

  test('goes to every planner and supervisor through the outbox, linking the order of the reading', async () => {
    const [planner, supervisor, technician] = await Promise.all([
      createUser(own.ctx, { roles: ['planner'] }),
      createUser(own.ctx, { roles: ['supervisor'] }),
      createUser(own.ctx, { roles: ['technician'] }),
    ]);
    const on = await createBankWithUnits(own.ctx, { steps: 2 });
    const order = await createWorkOrder(own.ctx, { bank: on, state: 'on-site', assigneeId: technician.user.id });
    const readingId = await insertUnitReading(own.ctx, { workOrderId: order, unitId: on.unitIds[1]!, recordedById: technician.user.id, deviationPct: -12, band: 'replace' });
    const [created] = await own.ctx.db
      .insert(flags)
      .values({
        kind: 'replace',
        severity: 'action',
        siteId: on.siteId,
        bankId: on.bankId,
        target: 'capacitor-unit',
        targetId: on.unitIds[1]!,
        readingId,
        message: 'Step 2, unit 1: 44.0 kvar at rated conditions, 12.0 % below nameplate. Plan a replacement.',
        raisedAt: new Date(),
      })
      .$returningId();
    const [flag] = await own.ctx.db.select().from(flags).where(eq(flags.id, created!.id));
    await notifyReplaceFlag(own.ctx, flag!);
    const rows = await own.ctx.db.select().from(outbox).where(eq(outbox.kind, 'flag.replace'));
    expect(rows.map((r) => r.toAddress).sort()).toEqual([planner.email, supervisor.email].sort());
    for (const row of rows) {
      expect(row.textBody).toContain(flag!.message);
      expect(row.textBody).toContain(`${own.url}/work-orders/${order}`);
    }
    await sendOutboxThrough(own.ctx, rows[0]!.id);
    const mail = await latestMailTo(own, rows[0]!.toAddress, rows[0]!.subject);
    expect(mail?.text).toContain(flag!.message);
  });
});
