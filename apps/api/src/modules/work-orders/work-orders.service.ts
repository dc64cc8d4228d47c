import {
  workOrderStates,
  type WorkOrder,
  type WorkOrderState,
  type workOrderCreate,
  type workOrderListQuery,
  type workOrderUpdate,
} from '@varden/schemas';
import { eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import type { Executor } from '../../access/executor';
import { banks, workOrders } from '../../db/schema/index';
import { cacheKey, readThrough } from '../../db/read-cache';
import { updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { noticeAssigned } from './notices';
import { findVisibleOrder } from './order-guard';
import { toWorkOrder } from './to-work-order';
import {
  findOrderView,
  findPerson,
  insertOrder,
  insertTransition,
  listOrderViews,
  type WorkOrderFilter,
  type WorkOrderView,
} from './work-orders.repository';

type ListQuery = z.output<typeof workOrderListQuery>;

/** The list filter of a query, for the user asking: their site scope, 'me' as their id, states checked. */
export function filterOf(user: SessionUser, q: Omit<ListQuery, 'page' | 'pageSize' | 'sort'>): WorkOrderFilter {
  let states: WorkOrderState[] | undefined;
  if (q.state) {
    const named = q.state.split(',');
    const unknown = named.filter((s) => !(workOrderStates as readonly string[]).includes(s));
    if (unknown.length > 0) {
      throw new AppError('invalid', `Unknown state ${unknown.join(', ')}.`, { state: `States are ${workOrderStates.join(', ')}` });
    }
    states = named as WorkOrderState[];
  }
  return {
    scope: siteScope(user),
    states,
    siteId: q.siteId,
    bankId: q.bankId,
    assigneeId: q.assigneeId === 'me' ? user.id : q.assigneeId === 'none' ? null : q.assigneeId,
    dueFrom: q.dueFrom,
    dueTo: q.dueTo,
    kind: q.kind,
    q: q.q,
  };
}

export async function listWorkOrders(ctx: AppContext, user: SessionUser, q: ListQuery): Promise<{ items: WorkOrder[]; total: number }> {
  const { rows, total } = await listOrderViews(ctx.db, filterOf(user, q), q);
  const now = new Date();
  return { items: rows.map((r) => toWorkOrder(r, now)), total };
}

/**
 * A page of work orders as JSON text, stored for the next reader with the same filter (the
 * same scope and query, whoever asks: db/read-cache.ts).
 */
export async function workOrderPage(ctx: AppContext, user: SessionUser, q: ListQuery): Promise<Buffer> {
  const filter = filterOf(user, q);
  const key = cacheKey('work-orders', JSON.stringify({ ...filter, sort: q.sort, page: q.page, pageSize: q.pageSize }));
  const answer = await readThrough(ctx.db, key, async () => ({ value: await listWorkOrders(ctx, user, q), siteId: null }));
  return answer.body;
}

export async function loadOrderView(db: Executor, id: number): Promise<WorkOrderView> {
  const view = await findOrderView(db, id);
  if (!view) throw new AppError('not_found', `Work order ${id} does not exist.`);
  return view;
}

export async function getWorkOrder(ctx: AppContext, user: SessionUser, id: number): Promise<WorkOrder> {
  await findVisibleOrder(ctx.db, user, id);
  return toWorkOrder(await loadOrderView(ctx.db, id));
}

/** Only an active technician can be given an order; `field` names the input that chose them. */
export async function requireTechnician(db: Executor, userId: number, field: string): Promise<{ id: number; name: string }> {
  const person = await findPerson(db, userId);
  if (!person || !person.active || !person.roles.includes('technician')) {
    throw new AppError('invalid', `User ${userId} is not an active technician; only technicians perform work orders.`, {
      [field]: 'Choose an active technician',
    });
  }
  return person;
}

/** A bank that exists and is in service, with its site. */
export async function bankForNewOrder(db: Executor, bankId: number): Promise<{ id: number; siteId: number }> {
  const [bank] = await db.select({ id: banks.id, siteId: banks.siteId, retiredAt: banks.retiredAt }).from(banks).where(eq(banks.id, bankId));
  if (!bank) throw new AppError('invalid', `Bank ${bankId} does not exist.`, { bankId: 'No such bank' });
  if (bank.retiredAt) throw new AppError('invalid', `Bank ${bankId} is retired; it takes no new work.`, { bankId: 'This bank is retired' });
  return bank;
}

/** Inserts a queued order and its first transition (from nothing to queued) together. */
export async function insertQueuedOrder(
  db: Executor,
  values: Omit<typeof workOrders.$inferInsert, 'state' | 'locked'>,
  actorId: number | null,
  comment: string,
): Promise<number> {
  const id = await insertOrder(db, { ...values, state: 'queued' });
  await insertTransition(db, { workOrderId: id, fromState: null, toState: 'queued', actorId, comment, at: new Date() });
  return id;
}

export async function createWorkOrder(ctx: AppContext, user: SessionUser, input: z.output<typeof workOrderCreate>): Promise<WorkOrder> {
  const bank = await bankForNewOrder(ctx.db, input.bankId);
  if (input.assigneeId !== null) await requireTechnician(ctx.db, input.assigneeId, 'assigneeId');
  const id = await ctx.db.transaction((tx) =>
    insertQueuedOrder(tx, { ...input, siteId: bank.siteId, createdById: user.id }, user.id, 'Created by hand'),
  );
  return toWorkOrder(await loadOrderView(ctx.db, id));
}

/** States in which the person doing the work may still change: not while they are recording or under review. */
const reassignable: readonly WorkOrderState[] = ['queued', 'dispatched', 'sent-back'];

/**
 * Reschedule, reassign or edit an open order. A sealed order answers 'locked', a withdrawn one
 * 'conflict'; a stale version 'conflict'. A new assignee of a dispatched order is told by mail.
 */
export async function updateWorkOrder(ctx: AppContext, user: SessionUser, id: number, input: z.output<typeof workOrderUpdate>): Promise<WorkOrder> {
  const order = await findVisibleOrder(ctx.db, user, id);
  if (order.locked) throw new AppError('locked', `Work order ${id} is sealed (signed off); its record can no longer change.`);
  if (order.state === 'withdrawn') throw new AppError('conflict', `Work order ${id} was withdrawn; it no longer changes.`);
  const { version, ...values } = input;
  const reassigning = values.assigneeId !== undefined && values.assigneeId !== order.assigneeId;
  if (reassigning) {
    if (!reassignable.includes(order.state)) {
      throw new AppError('conflict', `Work order ${id} is ${order.state}: its technician cannot change now. Withdraw it, or wait for the review.`, {
        assigneeId: 'Cannot change in this state',
      });
    }
    if (values.assigneeId === null && order.state !== 'queued') {
      throw new AppError('invalid', `Work order ${id} is ${order.state} and needs a technician. Move it back to queued first.`, {
        assigneeId: 'A dispatched order needs a technician',
      });
    }
    if (values.assigneeId) await requireTechnician(ctx.db, values.assigneeId, 'assigneeId');
  }
  await updateVersioned(ctx.db, workOrders, id, version, values, 'Work order');
  const view = await loadOrderView(ctx.db, id);
  if (reassigning && view.order.assigneeId && view.order.state !== 'queued') await noticeAssigned(ctx, view);
  return toWorkOrder(view);
}
