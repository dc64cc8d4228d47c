import { useId } from 'react';
import { useOutboxSnapshot } from '../outbox/use-field-outbox';
import { OutboxItemStatus } from './outbox-item-status';

/** "Waiting to send": everything of this order still on the phone, with where each stands. */
export function WaitingList({ orderId }: { orderId: number }) {
  const headingId = useId();
  const { items } = useOutboxSnapshot();
  const mine = items.filter((item) => item.orderId === orderId);
  return (
    <section id="waiting-to-send" aria-labelledby={headingId} tabIndex={-1} className="grid gap-3 rounded-md border border-line bg-surface p-4 focus-visible:outline-none desk:p-6">
      <h2 id={headingId} className="text-lg font-semibold">
        Waiting to send
      </h2>
      {mine.length === 0 ? (
        <p className="text-ink-muted" data-testid="nothing-waiting">
          Nothing: everything recorded on this order is stored by the server.
        </p>
      ) : (
        <ul className="grid gap-3" data-testid="waiting-list">
          {mine.map((item) => (
            <li key={item.id} className="grid gap-1 border-t border-line pt-3 first:border-t-0 first:pt-0">
              <p className="font-medium">{item.label}</p>
              <OutboxItemStatus item={item} compact={item.payload.kind !== 'transition'} what={item.payload.kind === 'photo' ? 'Photo' : item.payload.kind === 'transition' ? 'Acknowledgement' : 'Reading'} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
