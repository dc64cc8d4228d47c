import { openWorkOrderStates, type TechnicianList, type Workload, type workloadQuery } from '@varden/schemas';
import { eq, inArray } from 'drizzle-orm';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import { sites, workOrders } from '../../db/schema/index';
import { isOverdue } from './calendar';
import { activePeopleWithRole } from './work-orders.repository';

type Row = Workload['unassigned'];

const emptyRow = (userId: number | null, name: string): Row => ({
  userId,
  name,
  openByState: { queued: 0, dispatched: 0, 'on-site': 0, 'awaiting-review': 0, 'sent-back': 0 },
  openTotal: 0,
  dueInRange: 0,
  overdue: 0,
});

/**
 * Open orders per technician (every active person with the technician role, busy or not) and
 * of nobody: counts by state, those due between `from` and `to`, and those overdue.
 */
export async function workloadOf(ctx: AppContext, q: z.output<typeof workloadQuery>): Promise<Workload> {
  const [technicians, open] = await Promise.all([
    activePeopleWithRole(ctx.db, 'technician'),
    ctx.db
      .select({ assigneeId: workOrders.assigneeId, state: workOrders.state, dueOn: workOrders.dueOn, timeZone: sites.timeZone })
      .from(workOrders)
      .innerJoin(sites, eq(sites.id, workOrders.siteId))
      .where(inArray(workOrders.state, [...openWorkOrderStates])),
  ]);
  const rows = new Map<number, Row>(technicians.map((t) => [t.id, emptyRow(t.id, t.name)]));
  const unassigned = emptyRow(null, 'Not assigned');
  const now = new Date();
  for (const o of open) {
    const row = o.assigneeId === null ? unassigned : rows.get(o.assigneeId);
    if (!row || o.state === 'sealed' || o.state === 'withdrawn') continue;
    row.openByState[o.state] += 1;
    row.openTotal += 1;
    if (o.dueOn >= q.from && o.dueOn <= q.to) row.dueInRange += 1;
    if (isOverdue(o, o.timeZone, now)) row.overdue += 1;
  }
  return { from: q.from, to: q.to, technicians: [...rows.values()], unassigned };
}

/** The people a planner may give an order to: active technicians by name, with id, name and e-mail only. */
export async function assignableTechnicians(ctx: AppContext): Promise<TechnicianList> {
  const items = await activePeopleWithRole(ctx.db, 'technician');
  return { items: items.map(({ id, name, email }) => ({ id, name, email })), total: items.length };
}
