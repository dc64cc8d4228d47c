import type { SessionResponse, WorkOrder } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { buttonClassName } from '../../../components/button';
import { allowedMoves, editRights, type Move } from '../lib/allowed-moves';
import { paths } from '../../../config/paths';
import { Panel } from './form-controls';
import { ReassignForm, RescheduleForm } from './order-changes';
import { MoveForm } from './order-moves';

const actorOf = (me: SessionResponse | null | undefined) => (me ? { userId: me.user.id, permissions: me.permissions } : null);

function PlannerMove({ order, move }: { order: WorkOrder; move: Move }) {
  switch (move.to) {
    case 'dispatched':
      return (
        <MoveForm
          order={order}
          to="dispatched"
          command={order.assigneeName ? `Dispatch to ${order.assigneeName}` : 'Dispatch'}
          explanation={order.assigneeName ? `${order.assigneeName} is told by e-mail and sees the order among theirs.` : 'Choose who does the work; they are told by e-mail.'}
          asksTechnician={order.assigneeId === null}
          variant="primary"
        />
      );
    case 'queued':
      return <MoveForm order={order} to="queued" command="Recall to queue" explanation="Takes the order back from the technician before they start; it keeps its technician until you change it." />;
    case 'withdrawn':
      return (
        <MoveForm
          order={order}
          to="withdrawn"
          command="Withdraw this order"
          explanation="Cancels the order for good. What was recorded stays on it; a flag it came from returns to the flag queue."
          needsReason="Give the reason for withdrawing it"
          reasonLabel="Reason"
        />
      );
    default:
      return null;
  }
}

/**
 * Order commands: the moves the signed-in person can make (the shared transition table) and the
 * changes a planner may still make. A sealed order shows none of them.
 */
export function OrderCommandPanel({ order, me }: { order: WorkOrder; me: SessionResponse | null | undefined }) {
  const actor = actorOf(me);
  const moves = allowedMoves(order, actor);
  const rights = editRights(order, actor);
  const plannerMoves = moves.filter((m) => m.mover === 'planner');
  const reviewing = moves.some((m) => m.mover === 'supervisor');
  const fieldMoves = moves.filter((m) => m.mover === 'assignee');

  if (moves.length === 0 && !rights.reschedule && !rights.reassign) {
    return (
      <Panel title="Commands">
        <p className="text-ink-muted">
          {order.locked
            ? 'Sealed: this record no longer changes.'
            : order.state === 'withdrawn'
              ? 'Withdrawn: this order no longer changes.'
              : 'Nothing here is yours to move on this order.'}
        </p>
      </Panel>
    );
  }

  return (
    <div className="grid gap-4">
      {reviewing && (
        <Panel title="Review">
          <p className="mb-3 text-ink-muted">Submitted for review. Look through the results, flags and photos, then seal the order or send it back.</p>
          <Link to={paths.workOrders.review.getHref(order.id)} className={buttonClassName('primary')}>
            Review and sign off
          </Link>
        </Panel>
      )}
      {fieldMoves.length > 0 && (
        <Panel title="In the field">
          <p className="mb-3 text-ink-muted">You are this order’s technician. Start and submit it on your phone, where the safety card comes first.</p>
          <Link to={paths.fieldOrder.getHref(order.id)} className={buttonClassName('primary')}>
            Open in the field
          </Link>
        </Panel>
      )}
      {plannerMoves.map((move) => (
        <Panel key={move.to} title={move.to === 'withdrawn' ? 'Withdraw' : move.to === 'queued' ? 'Recall' : 'Dispatch'}>
          <PlannerMove order={order} move={move} />
        </Panel>
      ))}
      {rights.reschedule && (
        <Panel title="Reschedule">
          <RescheduleForm order={order} />
        </Panel>
      )}
      {rights.reassign && (
        <Panel title={order.assigneeId === null ? 'Assign' : 'Reassign'}>
          <ReassignForm order={order} />
        </Panel>
      )}
    </div>
  );
}
