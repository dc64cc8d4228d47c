import type { correctiveOrderRequest, Flag, flagListQuery, WorkOrder } from '@varden/schemas';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import type { Database } from '../../db/client';
import { AppError } from '../../http/app-error';
import { addDays, localDate } from '../work-orders/calendar';
import { toWorkOrder } from '../work-orders/to-work-order';
import { bankForNewOrder, insertQueuedOrder, loadOrderView, requireTechnician } from '../work-orders/work-orders.service';
import { correctiveChecklistFor, correctiveDueDays, correctiveInstructionsFor, correctiveTitleFor } from './corrective-order';
import { findFlagView, listFlagViews, lockFlag, markInHand, type FlagView } from './flags.repository';

export function toFlag({ flag, siteName, bankName }: FlagView): Flag {
  return {
    id: flag.id,
    kind: flag.kind,
    severity: flag.severity,
    siteId: flag.siteId,
    siteName,
    bankId: flag.bankId,
    bankName,
    target: flag.target,
    targetId: flag.targetId,
    readingId: flag.readingId,
    message: flag.message,
    state: flag.state,
    correctiveOrderId: flag.correctiveOrderId,
    raisedAt: flag.raisedAt.toISOString(),
  };
}

export async function listFlags(db: Database, user: SessionUser, q: z.output<typeof flagListQuery>) {
  const { rows, total } = await listFlagViews(
    db,
    { scope: siteScope(user), state: q.state, siteId: q.siteId, bankId: q.bankId, kind: q.kind, severity: q.severity },
    q,
  );
  return { items: rows.map(toFlag), total };
}

async function visibleFlag(db: Database, user: SessionUser, id: number): Promise<FlagView> {
  const view = await findFlagView(db, id);
  const scope = siteScope(user);
  if (!view || (scope !== 'all' && !scope.includes(view.flag.siteId))) throw new AppError('not_found', `Flag ${id} does not exist.`);
  return view;
}

/**
 * Turns an open flag into a corrective order on its bank in one action: the title and
 * instructions come from the flag's message, the checklist from its kind, the due date is a
 * week away for an action flag and a month for an advisory one (on the site's calendar). The
 * flag goes in hand with the order's id, in the same transaction; a flag already in hand or
 * cleared answers 409.
 */
export async function raiseCorrectiveOrder(
  ctx: AppContext,
  user: SessionUser,
  flagId: number,
  input: z.output<typeof correctiveOrderRequest>,
): Promise<{ flag: Flag; workOrder: WorkOrder }> {
  const seen = await visibleFlag(ctx.db, user, flagId);
  if (input.assigneeId) await requireTechnician(ctx.db, input.assigneeId, 'assigneeId');
  const bank = await bankForNewOrder(ctx.db, seen.flag.bankId);
  const siteToday = localDate(seen.siteTimeZone);

  const orderId = await ctx.db.transaction(async (tx) => {
    const flag = await lockFlag(tx, flagId);
    if (!flag) throw new AppError('not_found', `Flag ${flagId} does not exist.`);
    if (flag.state !== 'open') {
      throw new AppError(
        'conflict',
        flag.state === 'in-hand'
          ? `Flag ${flagId} is already in hand: corrective order ${flag.correctiveOrderId ?? ''} deals with it.`
          : `Flag ${flagId} was cleared; it needs no corrective order.`,
      );
    }
    const id = await insertQueuedOrder(
      tx,
      {
        kind: 'corrective',
        siteId: bank.siteId,
        bankId: bank.id,
        flagId: flag.id,
        title: correctiveTitleFor(flag.kind, flag.message),
        instructions: correctiveInstructionsFor(flag.kind, flag.message),
        checklist: correctiveChecklistFor(flag.kind),
        dueOn: input.dueOn ?? addDays(siteToday, correctiveDueDays(flag.severity)),
        priority: input.priority ?? (flag.severity === 'action' ? 'high' : 'normal'),
        assigneeId: input.assigneeId ?? null,
        createdById: user.id,
      },
      user.id,
      `Raised from flag ${flag.id} (${flag.kind})`,
    );
    await markInHand(tx, flag.id, id);
    return id;
  });
  const [flag, order] = await Promise.all([findFlagView(ctx.db, flagId), loadOrderView(ctx.db, orderId)]);
  return { flag: toFlag(flag!), workOrder: toWorkOrder(order) };
}

