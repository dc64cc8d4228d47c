import { workOrderTransitions, type Permission, type WorkOrder, type WorkOrderState } from '@varden/schemas';

/** Who makes a move, as the shared transition table names them. */
export type Mover = 'planner' | 'assignee' | 'supervisor';

/** The signed-in person as far as moves are concerned. */
export type Actor = { userId: number; permissions: readonly Permission[] };

export type Move = { to: WorkOrderState; mover: Mover };

type OrderFacts = Pick<WorkOrder, 'state' | 'locked' | 'assigneeId'>;

/** States in which the technician of an order may still change (the API refuses it otherwise). */
export const reassignableStates: readonly WorkOrderState[] = ['queued', 'dispatched', 'sent-back'];

function mayMove(mover: Mover, order: OrderFacts, actor: Actor): boolean {
  const holds = (permission: Permission) => actor.permissions.includes(permission);
  switch (mover) {
    case 'planner':
      return holds('work-orders:schedule');
    case 'assignee':
      return holds('work-orders:perform') && order.assigneeId === actor.userId;
    case 'supervisor':
      // Separation of duties: whoever did the work does not sign it off.
      return holds('work-orders:review') && order.assigneeId !== actor.userId;
  }
}

/**
 * The moves this person can make on this order, read from the shared transition table with
 * the same rules the API's service applies. A sealed (locked) order makes none. The server
 * decides anyway; this keeps the page from offering what would be refused.
 */
export function allowedMoves(order: OrderFacts, actor: Actor | null): Move[] {
  if (!actor || order.locked) return [];
  const moves: Partial<Record<WorkOrderState, Mover>> = workOrderTransitions[order.state];
  return (Object.entries(moves) as Array<[WorkOrderState, Mover]>)
    .filter(([, mover]) => mayMove(mover, order, actor))
    .map(([to, mover]) => ({ to, mover }));
}

export type EditRights = {
  /** Change the due date, priority, title, instructions or checklist (PATCH). */
  reschedule: boolean;
  /** Change the technician (PATCH assigneeId). */
  reassign: boolean;
};

/** What a planner may still change on an order: nothing once it is sealed or withdrawn. */
export function editRights(order: OrderFacts, actor: Actor | null): EditRights {
  const planner = actor?.permissions.includes('work-orders:schedule') ?? false;
  const open = !order.locked && order.state !== 'withdrawn' && order.state !== 'sealed';
  return {
    reschedule: planner && open,
    reassign: planner && open && reassignableStates.includes(order.state),
  };
}
