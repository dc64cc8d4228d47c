import { useState } from 'react';
import { Button } from '../../../components/button';
import { formatDateTime } from '../../../lib/date-format';
import type { OutboxItem } from '../outbox/outbox-types';
import { fieldOutbox, useOutboxSnapshot } from '../outbox/use-field-outbox';

/** A small clock (waiting), arrow (sending) or tick (stored): the state is also written. */
function StateGlyph({ state }: { state: 'waiting' | 'sending' | 'stored' }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-current stroke-2">
      {state === 'waiting' && (
        <>
          <circle cx="8" cy="8" r="6" />
          <path d="M8 4.5V8l2.5 1.5" strokeLinecap="round" />
        </>
      )}
      {state === 'sending' && <path d="M8 13V3M4 7l4-4 4 4" strokeLinecap="round" strokeLinejoin="round" />}
      {state === 'stored' && <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />}
    </svg>
  );
}

/**
 * Where one recorded item stands: on this phone waiting to send, being sent, refused by the
 * server (its message, and "Confirm this value" when the server asks for a confirmation), or
 * stored by the server.
 */
export function OutboxItemStatus({
  item,
  storedAt,
  what = 'Reading',
  compact = false,
}: {
  item: OutboxItem | undefined;
  storedAt?: string | undefined;
  what?: string;
  /** In a list of the whole order: a refusal in one line, its actions stay on the item's own card. */
  compact?: boolean;
}) {
  const { sending, online } = useOutboxSnapshot();
  const [busy, setBusy] = useState(false);
  if (!item) {
    if (!storedAt) return null;
    return (
      <p className="flex gap-2 text-base text-healthy" data-sync="stored">
        <StateGlyph state="stored" />
        <span>
          {what} stored by the server, {formatDateTime(storedAt)}.
        </span>
      </p>
    );
  }
  if (item.status === 'refused' && item.refusal && compact) {
    return (
      <p className="flex gap-2 text-base font-medium text-replace" data-sync="refused">
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-current stroke-2">
          <circle cx="8" cy="8" r="6.5" />
          <path d="M8 4.5v4.2M8 11.2v.3" strokeLinecap="round" />
        </svg>
        <span>
          {item.refusal.confirmable ? 'Needs your confirmation' : 'Not accepted'}: {item.refusal.message}
        </span>
      </p>
    );
  }
  if (item.status === 'refused' && item.refusal) {
    const refusal = item.refusal;
    const fieldMessages = Object.values(refusal.fields);
    const act = async (action: () => Promise<void>) => {
      setBusy(true);
      try {
        await action();
      } finally {
        setBusy(false);
      }
    };
    return (
      <div role="alert" data-sync="refused" className="grid gap-3 rounded border-2 border-replace bg-surface p-3">
        <div className="flex gap-2">
          <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-replace stroke-2">
            <circle cx="8" cy="8" r="6.5" />
            <path d="M8 4.5v4.2M8 11.2v.3" strokeLinecap="round" />
          </svg>
          <div className="grid min-w-0 gap-1">
            <p className="font-semibold">{refusal.confirmable ? 'The server asks you to confirm' : 'Not accepted by the server'}</p>
            <p>{refusal.message}</p>
            {fieldMessages.length > 0 && (
              <ul className="grid list-disc gap-1 pl-5">
                {fieldMessages.map((message) => (
                  <li key={message}>{message}</li>
                ))}
              </ul>
            )}
            <p className="text-ink-muted">Kept on this phone. Correct the values and record again, or:</p>
          </div>
        </div>
        <div className="flex flex-wrap gap-2">
          {refusal.confirmable && (
            <Button variant="primary" disabled={busy} onClick={() => void act(() => fieldOutbox().confirm(item.id))}>
              Confirm this value
            </Button>
          )}
          <Button disabled={busy} onClick={() => void act(() => fieldOutbox().discard(item.id))}>
            Discard this {what.toLowerCase()}
          </Button>
        </div>
      </div>
    );
  }
  const progress = sending.get(item.id);
  const isSending = sending.has(item.id);
  return (
    <p className="flex gap-2 text-base" data-sync={isSending ? 'sending' : 'waiting'}>
      <StateGlyph state={isSending ? 'sending' : 'waiting'} />
      <span>
        {isSending
          ? `Sending${typeof progress === 'number' ? ` — ${Math.round(progress * 100)} %` : '…'}`
          : online
            ? 'Saved on this phone, waiting to send.'
            : 'Saved on this phone. Offline: it will be sent when the signal returns.'}
        {!isSending && item.lastFailure && item.attempts > 0 && <span className="block text-ink-muted">{item.lastFailure}</span>}
      </span>
    </p>
  );
}
