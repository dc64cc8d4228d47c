import { classNames } from '../../../lib/class-names';
import { countFor } from '../outbox/outbox';
import { useOutboxSnapshot } from '../outbox/use-field-outbox';

export type SyncSummary = {
  waiting: number;
  refused: number;
  online: boolean;
  sending: boolean;
  /** "All sent", "3 waiting to send", "Offline — 3 waiting", "1 needs you". */
  words: string;
  tone: 'done' | 'waiting' | 'attention';
};

/** Where an order's records stand between the phone and the server, in words. */
export function syncSummary(counts: { waiting: number; refused: number }, online: boolean, sending: boolean): SyncSummary {
  const { waiting, refused } = counts;
  const waitingWords = online ? `${waiting} waiting to send` : `Offline — ${waiting} waiting`;
  let words: string;
  if (refused > 0) words = `${refused} ${refused === 1 ? 'needs' : 'need'} you${waiting ? ` · ${waitingWords}` : ''}`;
  else if (waiting > 0) words = sending ? `Sending — ${waiting} waiting` : waitingWords;
  else words = online ? 'All sent' : 'Offline — all sent';
  return { waiting, refused, online, sending, words, tone: refused > 0 ? 'attention' : waiting > 0 ? 'waiting' : 'done' };
}

export function useSyncSummary(orderId?: number): SyncSummary {
  const { items, online, sending } = useOutboxSnapshot();
  const ofOrder = orderId === undefined ? items : items.filter((item) => item.orderId === orderId);
  return syncSummary(countFor(items, orderId), online, ofOrder.some((item) => sending.has(item.id)));
}

/** A glyph per state, so the state never rests on colour: a tick, a clock, an exclamation mark. */
function SyncGlyph({ tone, online }: { tone: SyncSummary['tone']; online: boolean }) {
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-4 shrink-0 fill-none stroke-current stroke-2">
      {tone === 'done' && online && <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />}
      {tone === 'done' && !online && <path d="M2 2l12 12M5 12h6.5a2.5 2.5 0 0 0 .4-5A4 4 0 0 0 5 6.5 2.8 2.8 0 0 0 5 12Z" strokeLinecap="round" />}
      {tone === 'waiting' && (
        <>
          <circle cx="8" cy="8" r="6" />
          <path d="M8 4.5V8l2.5 1.5" strokeLinecap="round" />
        </>
      )}
      {tone === 'attention' && (
        <>
          <circle cx="8" cy="8" r="6.5" />
          <path d="M8 4.5v4.2M8 11.2v.3" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

/** The order's sync state as a badge in its header: announced to screen readers when it changes. */
export function SyncState({ orderId, className }: { orderId?: number; className?: string }) {
  const summary = useSyncSummary(orderId);
  return (
    <p
      role="status"
      data-testid="sync-state"
      data-tone={summary.tone}
      className={classNames(
        'inline-flex min-h-touch items-center gap-2 rounded-md border-2 px-3 py-1 text-base font-semibold desk:min-h-control',
        summary.tone === 'attention' ? 'border-replace text-replace' : summary.tone === 'waiting' ? 'border-watch text-watch' : 'border-healthy text-healthy',
        className,
      )}
    >
      <SyncGlyph tone={summary.tone} online={summary.online} />
      {summary.words}
    </p>
  );
}
