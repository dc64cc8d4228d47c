import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { inspectionPlans, outbox, workOrders, workOrderTransitions } from '../../apps/api/src/db/schema/index';
import { jobs } from '../../apps/api/src/jobs/scheduler';
import { createDueInspectionOrders } from '../../apps/api/src/modules/plans/due-inspections';
import { sendOverdueDigest } from '../../apps/api/src/modules/work-orders/overdue-digest';
import { createBankWithUnits, createUser, createWorkOrder, sendOutboxThrough, startIsolatedTestApp, type CreatedBank } from '../support/factories';
import { latestMailTo } from '../support/mailbox';
import { startTestApp, unique, type TestApp } from '../support/test-app';


// Two API processes, as behind a load balancer: each runs the scheduler's work at the same time.
let first: TestApp;
let second: TestApp;
let bank: CreatedBank;

// The scheduler's "today" is given, far from the dates other test files use, so their plans
// (due in the 2090s) are never due here and these plans are not due for them.
const today = '2031-04-15';

beforeAll(async () => {
  [first, second] = await Promise.all([startTestApp(), startTestApp()]);
  bank = await createBankWithUnits(first.ctx, { steps: 1 });
});
afterAll(async () => {
  await Promise.all([first.close(), second.close()]);
});

async function plan(values: Partial<typeof inspectionPlans.$inferInsert>): Promise<number> {
  const [created] = await first.ctx.db
    .insert(inspectionPlans)
    .values({ bankId: bank.bankId, name: unique('Plan'), intervalMonths: 6, leadDays: 14, checklist: ['capacitance', 'fuses'], nextDueOn: '2031-04-25', ...values })
    .$returningId();
  return created!.id;
}

const ordersOf = (planId: number) => first.ctx.db.select().from(workOrders).where(eq(workOrders.planId, planId));
const planRow = async (planId: number) => (await first.ctx.db.select().from(inspectionPlans).where(eq(inspectionPlans.id, planId)))[0]!;

describe('inspection orders from plans', () => {
  test('two instances at once create the due order exactly once and move the plan on once', async () => {
    const planId = await plan({ nextDueOn: '2031-04-25', leadDays: 14 });
    const results = await Promise.all([createDueInspectionOrders(first.ctx, today), createDueInspectionOrders(second.ctx, today)]);
    const orders = await ordersOf(planId);
    expect(orders).toHaveLength(1);
    expect(results.flatMap((r) => r.created).filter((id) => id === orders[0]!.id)).toHaveLength(1);
    expect(orders[0]).toMatchObject({
      kind: 'inspection',
      siteId: bank.siteId,
      bankId: bank.bankId,
      dueOn: '2031-04-25',
      state: 'queued',
      locked: false,
      assigneeId: null,
    });
    expect(orders[0]!.instructions).toMatch(/capacitance of every unit, fuses/);
    const after = await planRow(planId);
    expect(after).toMatchObject({ nextDueOn: '2031-10-25', version: 2 });
    const transitions = await first.ctx.db.select().from(workOrderTransitions).where(eq(workOrderTransitions.workOrderId, orders[0]!.id));
    expect(transitions).toMatchObject([{ fromState: null, toState: 'queued', actorId: null }]);

    // Running again the same day (a second cron tick, a restart) makes nothing new.
    await Promise.all([createDueInspectionOrders(first.ctx, today), createDueInspectionOrders(second.ctx, today)]);
    expect(await ordersOf(planId)).toHaveLength(1);
  });

  test('many plans due at once, many concurrent runs: one order per plan', async () => {
    const planIds = await Promise.all(Array.from({ length: 6 }, (_, i) => plan({ nextDueOn: `2031-04-${String(16 + i).padStart(2, '0')}` })));
    await Promise.all([first, second, first, second].map((a) => createDueInspectionOrders(a.ctx, today)));
    for (const id of planIds) expect(await ordersOf(id)).toHaveLength(1);
  });

  test('a plan is not due before its lead time, nor when inactive', async () => {
    const notYet = await plan({ nextDueOn: '2031-05-10', leadDays: 14 }); // lead time starts 26 April
    const inactive = await plan({ nextDueOn: '2031-04-20', active: false });
    await createDueInspectionOrders(first.ctx, today);
    expect(await ordersOf(notYet)).toHaveLength(0);
    expect(await ordersOf(inactive)).toHaveLength(0);
    await createDueInspectionOrders(first.ctx, '2031-04-26');
    expect(await ordersOf(notYet)).toHaveLength(1);
  });

  test('a plan far behind makes one overdue order and moves past today', async () => {
    const behind = await plan({ nextDueOn: '2029-01-31', intervalMonths: 6 });
    await createDueInspectionOrders(first.ctx, today);
    const orders = await ordersOf(behind);
    expect(orders.map((o) => o.dueOn)).toEqual(['2029-01-31']);
    // 31 Jan + 6 months falls on 31 July; on through the calendar until after today.
    expect((await planRow(behind)).nextDueOn).toBe('2031-07-31');
  });

  test('the jobs are scheduled in every instance under their named locks', () => {
    const names = jobs.map((j) => j.name);
    expect(names).toContain('inspection-orders');
    expect(names).toContain('overdue-digest');
  });
});

describe('the overdue digest', () => {
  // An outbox of its own: the digest lists every overdue order, and its mail is delivered at once.
  let own: TestApp;
  let twin: TestApp;
  beforeAll(async () => {
    own = await startIsolatedTestApp('digest');
    twin = await startTestApp({ DATABASE_URL: own.ctx.config.DATABASE_URL });
    // Two instances behind one address, as in production: links name the address users open.
    twin.ctx.config.APP_ORIGIN = own.url;
  }, 60_000);
  afterAll(async () => {
    await twin?.close();
    await own?.close();
  });

  test('tells every planner once a day of the orders past their due date, whatever the number of instances', async () => {
    const [planner, otherPlanner, technician] = await Promise.all([
      createUser(own.ctx, { roles: ['planner'] }),
      createUser(own.ctx, { roles: ['planner'] }),
      createUser(own.ctx, { roles: ['technician'] }),
    ]);
    const on = await createBankWithUnits(own.ctx, { steps: 1 });
    const late = await createWorkOrder(own.ctx, { bank: on, state: 'dispatched', assigneeId: technician.user.id, dueOn: '2026-01-02', title: unique('Late inspection') });
    const later = await createWorkOrder(own.ctx, { bank: on, state: 'queued', dueOn: '2026-02-02', title: unique('Unassigned late') });
    const sealedLate = await createWorkOrder(own.ctx, { bank: on, state: 'sealed', dueOn: '2026-01-02' });
    const notYet = await createWorkOrder(own.ctx, { bank: on, state: 'queued', dueOn: '2099-01-02' });
    const now = new Date();
    const queued = await Promise.all([sendOverdueDigest(own.ctx, now), sendOverdueDigest(twin.ctx, now), sendOverdueDigest(twin.ctx, now)]);
    expect(queued.reduce((a, b) => a + b, 0)).toBe(2);
    const rows = await own.ctx.db.select().from(outbox).where(eq(outbox.kind, 'work-order.overdue-digest'));
    expect(rows.map((r) => r.toAddress).sort()).toEqual([planner.email, otherPlanner.email].sort());
    const text = rows[0]!.textBody;
    expect(text).toContain(`/work-orders/${late}`);
    expect(text).toContain(`/work-orders/${later}`);
    expect(text).not.toContain(`/work-orders/${sealedLate}`);
    expect(text).not.toContain(`/work-orders/${notYet}`);
    expect(text).toMatch(/days overdue, dispatched, Test technician/);
    expect(text).toMatch(/days overdue, queued, nobody assigned/);
    expect(await sendOverdueDigest(own.ctx, now)).toBe(0);

    await sendOutboxThrough(own.ctx, rows[0]!.id);
    const mail = await latestMailTo(own, rows[0]!.toAddress, rows[0]!.subject);
    expect(mail?.text).toContain(`${own.url}/work-orders/${late}`);
  });
});
