import {
  defaultSignatureMeaning,
  workOrderTransitions,
  type WorkOrder,
  type WorkOrderState,
  type workOrderTransitionRequest,
} from '@varden/schemas';
import { and, eq } from 'drizzle-orm';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import type { Executor } from '../../access/executor';
import { can } from '../../access/policy';
import type { AppContext } from '../../context';
import { flags, type workOrders } from '../../db/schema/index';
import { AppError } from '../../http/app-error';
import { noticeAssigned, noticeReturned, noticeSealed, noticeSubmitted } from './notices';
import { findVisibleOrder } from './order-guard';
import { toWorkOrder } from './to-work-order';
import { countReadings, findOrderRow, findPerson, insertTransition, updateOrderIfCurrent, type WorkOrderRow } from './work-orders.repository';
import { loadOrderView, requireTechnician } from './work-orders.service';

type Request = z.output<typeof workOrderTransitionRequest>;
type Mover = 'planner' | 'assignee' | 'supervisor';

/** Who makes the move from `from` to `to` (the shared table), or undefined when there is no such move. */
export function moverOf(from: WorkOrderState, to: WorkOrderState): Mover | undefined {
  const moves: Partial<Record<WorkOrderState, Mover>> = workOrderTransitions[from];
  return moves[to];
}

function authorise(user: SessionUser, order: WorkOrderRow, mover: Mover, to: WorkOrderState): void {
  if (mover === 'planner' && !can(user.roles, 'work-orders:schedule')) {
    throw new AppError('forbidden', `Only a planner moves a work order to ${to}.`);
  }
  if (mover === 'assignee' && (order.assigneeId !== user.id || !can(user.roles, 'work-orders:perform'))) {
    throw new AppError('forbidden', `Only the technician work order ${order.id} is assigned to moves it to ${to}.`);
  }
  if (mover === 'supervisor') {
    if (!can(user.roles, 'work-orders:review')) throw new AppError('forbidden', `Only a supervisor moves a work order to ${to}.`);
    // Separation of duties: whoever did the work does not sign it off.
    if (order.assigneeId === user.id) {
      throw new AppError('forbidden', `You performed work order ${order.id}; another supervisor must review it.`);
    }
  }
}

/** What the move writes on the order besides its state, after checking what it needs. */
async function changesFor(db: Executor, user: SessionUser, order: WorkOrderRow, req: Request, now: Date): Promise<Partial<typeof workOrders.$inferInsert>> {
  const comment = req.comment.trim();
  switch (req.to) {
    case 'dispatched': {
      const assigneeId = req.assigneeId ?? order.assigneeId;
      if (!assigneeId) {
        throw new AppError('invalid', `Work order ${order.id} has no technician: choose one to dispatch it to.`, { assigneeId: 'Choose a technician' });
      }
      await requireTechnician(db, assigneeId, 'assigneeId');
      return { assigneeId };
    }
    case 'on-site':
      // Moving on site is the acknowledgement of the safety card, recorded anew at every visit.
      return { safetyAcknowledgedAt: now, safetyAcknowledgedById: user.id };
    case 'awaiting-review':
      if ((await countReadings(db, order.id)) === 0) {
        throw new AppError('conflict', `Work order ${order.id} has no readings yet. Record at least one reading before submitting it for review.`);
      }
      return { submittedAt: now };
    case 'sent-back':
      if (!comment) throw new AppError('invalid', 'Say why the order goes back to the field.', { comment: 'Give the reason for sending it back' });
      return {};
    case 'withdrawn':
      if (!comment) throw new AppError('invalid', 'Say why the order is withdrawn.', { comment: 'Give the reason for withdrawing it' });
      return {};
    case 'sealed': {
      const signer = await findPerson(db, user.id);
      return {
        signedAt: now,
        signedById: user.id,
        signedByName: signer?.name ?? user.name,
        signatureMeaning: req.signatureMeaning?.trim() || defaultSignatureMeaning,
        locked: true,
      };
    }
    default:
      return {};
  }
}

/** Why a guarded update matched no row: the order is gone, sealed meanwhile, or changed by someone else. */
async function refusal(db: Executor, id: number, version: number): Promise<AppError> {
  const now = await findOrderRow(db, id);
  if (!now) return new AppError('not_found', `Work order ${id} does not exist.`);
  if (now.locked) return new AppError('locked', `Work order ${id} was sealed (signed off) meanwhile; its record can no longer change.`);
  return new AppError(
    'conflict',
    `Work order ${id} was changed by someone else since you opened it (your version ${version}, now ${now.version}, ${now.state}). Reload it and try again.`,
  );
}

/**
 * Moves an order along the shared transition table. The checks: the order is visible, not
 * sealed, at the version the caller read; the move exists; the caller is the one the table
 * names; and what the move needs is there. The state change, its transition record and the
 * flag a corrective order settles are written in one transaction; the UPDATE repeats the
 * version and state in its WHERE, so of two concurrent moves exactly one wins.
 */
export async function transitionWorkOrder(ctx: AppContext, user: SessionUser, id: number, req: Request): Promise<WorkOrder> {
  const order = await findVisibleOrder(ctx.db, user, id);
  if (order.locked) throw new AppError('locked', `Work order ${id} is sealed (signed off); its record can no longer change.`);
  const mover = moverOf(order.state, req.to);
  if (!mover) {
    const possible = Object.keys(workOrderTransitions[order.state]);
    throw new AppError(
      'conflict',
      `Work order ${id} is ${order.state} and cannot move to ${req.to}. ${possible.length ? `From ${order.state} it can move to ${possible.join(', ')}.` : 'It moves no further.'}`,
    );
  }
  authorise(user, order, mover, req.to);
  if (order.version !== req.version) throw await refusal(ctx.db, id, req.version);
  const now = new Date();
  const changes = await changesFor(ctx.db, user, order, req, now);

  const moved = await ctx.db.transaction(async (tx) => {
    if (!(await updateOrderIfCurrent(tx, id, { version: req.version, state: order.state }, { ...changes, state: req.to }))) return false;
    await insertTransition(tx, { workOrderId: id, fromState: order.state, toState: req.to, actorId: user.id, comment: req.comment.trim(), at: now });
    if (order.flagId) await settleFlag(tx, order.flagId, id, req.to, now);
    return true;
  });
  if (!moved) throw await refusal(ctx.db, id, req.version);

  const view = await loadOrderView(ctx.db, id);
  if (req.to === 'dispatched') await noticeAssigned(ctx, view);
  if (req.to === 'awaiting-review') await noticeSubmitted(ctx, view, user.name);
  if (req.to === 'sent-back') await noticeReturned(ctx, view, user.name, req.comment.trim());
  if (req.to === 'sealed') await noticeSealed(ctx, view, view.order.signedByName ?? user.name, now);
  return toWorkOrder(view);
}

/**
 * A corrective order settles the flag it was raised from: sealing it clears the flag;
 * withdrawing it puts the flag back in the queue, so a new order can be raised from it.
 */
async function settleFlag(db: Executor, flagId: number, orderId: number, to: WorkOrderState, now: Date): Promise<void> {
  const ours = and(eq(flags.id, flagId), eq(flags.correctiveOrderId, orderId));
  if (to === 'sealed') await db.update(flags).set({ state: 'cleared', clearedAt: now }).where(ours);
  if (to === 'withdrawn') await db.update(flags).set({ state: 'open', correctiveOrderId: null }).where(ours);
}
