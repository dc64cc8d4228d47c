import { defaultSignatureMeaning, type SessionResponse, type WorkOrder } from '@varden/schemas';
import { allowedMoves } from '../lib/allowed-moves';
import { Panel } from './form-controls';
import { MoveForm } from './order-moves';

/**
 * The supervisor's decision on a submitted order: seal it (a recorded signature with its
 * meaning, their name and the time) or send it back to the field with a reason.
 */
export function ReviewDecision({ order, me }: { order: WorkOrder; me: SessionResponse }) {
  const moves = allowedMoves(order, { userId: me.user.id, permissions: me.permissions }).map((m) => m.to);
  if (!moves.includes('sealed') && !moves.includes('sent-back')) return null;
  return (
    <div className="grid gap-4 desk:grid-cols-2 desk:items-start">
      {moves.includes('sealed') && (
        <Panel title="Seal">
          <dl className="mb-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="text-ink-muted">Signer</dt>
            <dd className="font-semibold">{me.user.name}</dd>
            <dt className="text-ink-muted">Time</dt>
            <dd>Recorded by the server when you seal</dd>
          </dl>
          <MoveForm
            order={order}
            to="sealed"
            command="Seal this order"
            explanation="Sealing signs the order off and locks it: afterwards nothing on it can change."
            signatureMeaning={defaultSignatureMeaning}
            variant="primary"
          />
        </Panel>
      )}
      {moves.includes('sent-back') && (
        <Panel title="Send back">
          <MoveForm
            order={order}
            to="sent-back"
            command="Send back to the field"
            explanation="The technician is told by e-mail with your reason, and the order goes back to them to measure or record again."
            needsReason="Give the reason for sending it back"
            reasonLabel="Reason"
          />
        </Panel>
      )}
    </div>
  );
}
