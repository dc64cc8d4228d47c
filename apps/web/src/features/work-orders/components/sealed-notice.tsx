import type { WorkOrder } from '@varden/schemas';
import { formatDateTime } from '../../../lib/date-format';

/** Says at the top of an order's pages that its record is closed for good. */
export function SealedNotice({ order }: { order: Pick<WorkOrder, 'signedAt' | 'signedByName'> }) {
  return (
    <p role="status" className="mb-6 flex items-start gap-3 rounded border-2 border-line-strong bg-sunken p-3">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-ink stroke-[1.6]">
        {/* A padlock: the record is locked. */}
        <rect x="3" y="7" width="10" height="7.5" rx="1" />
        <path d="M5.5 7V5a2.5 2.5 0 0 1 5 0v2" />
      </svg>
      <span>
        Sealed{order.signedAt ? ` on ${formatDateTime(order.signedAt)}` : ''}
        {order.signedByName ? ` by ${order.signedByName}` : ''}. The record is locked: nothing on this order can change any more.
      </span>
    </p>
  );
}
