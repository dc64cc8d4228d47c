import type { WorkOrder } from '@varden/schemas';
import { formatDateTime } from '../../../lib/date-format';

/** The supervisor's signature on a sealed order: who signed, when, and what the signature means. */
export function SignatureBlock({ order }: { order: Pick<WorkOrder, 'signedAt' | 'signedByName' | 'signatureMeaning'> }) {
  if (!order.signedAt) return <p className="text-ink-muted">Not signed off yet.</p>;
  return (
    <figure data-testid="signature-block" className="grid gap-3 rounded border-2 border-ink p-4 print:break-inside-avoid">
      <blockquote className="text-base">“{order.signatureMeaning}”</blockquote>
      <figcaption className="grid gap-1 border-t border-line pt-3 desk:grid-cols-2 print:grid-cols-2">
        <span>
          <span className="block text-sm text-ink-muted">Signed by</span>
          <span className="text-lg font-semibold">{order.signedByName}</span>
        </span>
        <span>
          <span className="block text-sm text-ink-muted">Signed at</span>
          <time dateTime={order.signedAt} className="numeric text-lg font-semibold">
            {formatDateTime(order.signedAt)}
          </time>
        </span>
      </figcaption>
    </figure>
  );
}
