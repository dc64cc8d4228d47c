import type { WorkOrderDetail } from '@varden/schemas';
import { formatDateTime } from '../../../lib/date-format';
import { flagsOfOrder, otherReadingRows } from '../lib/order-results';
import { targetLabel } from '../lib/work-order-words';
import { FlagKind, Severity } from './flag-mark';

/** The flags the order's readings raised, with their severity and message. */
export function OrderFlags({ order }: { order: WorkOrderDetail }) {
  const raised = flagsOfOrder(order);
  if (raised.length === 0) return <p className="text-ink-muted">The readings raised no flags.</p>;
  return (
    <ul className="grid gap-2">
      {raised.map((flag, i) => (
        <li key={`${flag.readingId}-${i}`} className="grid gap-1 rounded border border-line p-3 print:break-inside-avoid">
          <span className="flex flex-wrap gap-x-4">
            <FlagKind kind={flag.kind} />
            <Severity severity={flag.severity} />
          </span>
          <span className="[overflow-wrap:anywhere]">
            {flag.message}
            {flag.alreadyOpen && <span className="text-ink-muted"> (already open from an earlier reading)</span>}
          </span>
        </li>
      ))}
    </ul>
  );
}

/** Contactors, reactors, fuses and the bank: what each reading showed. */
export function OtherReadings({ order }: { order: WorkOrderDetail }) {
  const rows = otherReadingRows(order);
  if (rows.length === 0) return <p className="text-ink-muted">No readings of contactors, reactors, fuses or the bank.</p>;
  return (
    <ul className="grid gap-2">
      {rows.map((row) => (
        <li key={row.readingId} className="rounded border border-line p-3 print:break-inside-avoid">
          <p className="font-medium">
            {targetLabel(row.target)} · {row.where}
          </p>
          {row.reasons.length > 0 ? (
            <ul className="mt-1 grid list-disc gap-0.5 pl-5">
              {row.reasons.map((reason, i) => (
                <li key={i}>{reason}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-ink-muted">Nothing to note.</p>
          )}
          {row.notes && <p className="mt-1 whitespace-pre-line">Technician’s note: {row.notes}</p>}
        </li>
      ))}
    </ul>
  );
}

/** Every note the technician wrote on a reading, with where and when. */
export function TechnicianNotes({ order }: { order: WorkOrderDetail }) {
  const notes = order.readings
    .map((reading) => ({ reading, text: typeof reading.input.notes === 'string' ? reading.input.notes.trim() : '' }))
    .filter((n) => n.text !== '');
  if (notes.length === 0) return <p className="text-ink-muted">The technician left no notes.</p>;
  const unitName = new Map(order.bank.steps.flatMap((step) => step.units.map((unit) => [unit.id, `Step ${step.number}, unit ${unit.position}`] as const)));
  return (
    <ul className="grid gap-2">
      {notes.map(({ reading, text }) => (
        <li key={reading.id} className="rounded border border-line p-3 print:break-inside-avoid">
          <p className="text-sm text-ink-muted">
            {reading.target === 'capacitor-unit' ? (unitName.get(reading.targetId) ?? targetLabel(reading.target)) : targetLabel(reading.target)} · {reading.recordedByName} ·{' '}
            <time dateTime={reading.recordedAt}>{formatDateTime(reading.recordedAt)}</time>
          </p>
          <p className="mt-1 whitespace-pre-line">{text}</p>
        </li>
      ))}
    </ul>
  );
}
