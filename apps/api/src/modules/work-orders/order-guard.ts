import { eq, sql } from 'drizzle-orm';
import type { SessionUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { perDatabase } from '../../db/prepared';
import { workOrders } from '../../db/schema/index';
import { AppError } from '../../http/app-error';

export type WorkOrderRow = typeof workOrders.$inferSelect;

/** What the rules below read of an order: a query that only checks them may read just these. */
export type GuardedOrder = Pick<WorkOrderRow, 'id' | 'siteId' | 'state' | 'locked' | 'assigneeId'>;

/** An order the user may see: missing and out-of-scope orders answer alike (404). */
const orderById = perDatabase((db) =>
  db
    .select()
    .from(workOrders)
    .where(eq(workOrders.id, sql.placeholder('orderId')))
    .prepare(),
);

export async function findVisibleOrder(db: Database, user: SessionUser, orderId: number): Promise<WorkOrderRow> {
  const [order] = await orderById(db).execute({ orderId });
  return assertVisible(order, user, orderId);
}

/** The rule of findVisibleOrder on an order already read (undefined: it does not exist). */
export function assertVisible<O extends GuardedOrder>(order: O | undefined, user: SessionUser, orderId: number): O {
  const scope = siteScope(user);
  if (!order || (scope !== 'all' && !scope.includes(order.siteId))) {
    throw new AppError('not_found', `Work order ${orderId} does not exist.`);
  }
  return order;
}

/**
 * The rules for recording readings and photos on an order: only its assignee, only while the
 * order is on site (safety card acknowledged), never once sealed.
 */
export async function findOrderForRecording(db: Database, user: SessionUser, orderId: number): Promise<WorkOrderRow> {
  return assertRecordable(await findVisibleOrder(db, user, orderId), user);
}

/** The rules of findOrderForRecording on an order already read. */
export function assertRecordable<O extends GuardedOrder>(order: O, user: SessionUser): O {
  const orderId = order.id;
  if (order.locked) throw new AppError('locked', `Work order ${orderId} is sealed (signed off); its record can no longer change.`);
  if (order.assigneeId !== user.id) {
    throw new AppError('forbidden', `Work order ${orderId} is assigned to someone else; only its assignee records on it.`);
  }
  if (order.state !== 'on-site') {
    const hint =
      order.state === 'dispatched' || order.state === 'sent-back'
        ? 'Acknowledge the safety card to start work on it first.'
        : 'Readings are recorded only while the order is on site.';
    throw new AppError('conflict', `Work order ${orderId} is ${order.state}. ${hint}`);
  }
  return order;
}
