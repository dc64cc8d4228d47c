import type { WorkOrderDetail } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { formatDateTime } from '../../../lib/date-format';
import { paths } from '../../../config/paths';
import { checklistLabels, kindLabels, priorityLabels } from '../lib/work-order-words';
import { DueDate } from './work-order-table';
import { Facts } from './form-controls';
import { StateMark } from './state-mark';

const when = (iso: string | null) =>
  iso ? (
    <time dateTime={iso} className="numeric">
      {formatDateTime(iso)}
    </time>
  ) : (
    <span className="text-ink-muted">Not yet</span>
  );

/** What an order is and where it stands: the facts its pages share. */
export function OrderFacts({ order, linkBank = true }: { order: WorkOrderDetail; linkBank?: boolean }) {
  return (
    <Facts
      items={[
        { label: 'State', value: <StateMark state={order.state} /> },
        { label: 'Kind', value: kindLabels[order.kind] },
        { label: 'Site', value: order.siteName },
        {
          label: 'Bank',
          value: linkBank ? <Link to={paths.register.bank.getHref(order.bankId)}>{order.bankName}</Link> : order.bankName,
        },
        ...(order.bank.location ? [{ label: 'Location', value: order.bank.location }] : []),
        { label: 'Due', value: <DueDate order={order} /> },
        { label: 'Priority', value: priorityLabels[order.priority] },
        { label: 'Technician', value: order.assigneeName ?? <span className="text-ink-muted">Not assigned</span> },
        { label: 'Created', value: <>{when(order.createdAt)}{order.createdByName ? ` by ${order.createdByName}` : order.planId ? ' from its inspection plan' : ''}</> },
        { label: 'Safety card', value: order.safetyAcknowledgedAt ? <>Acknowledged {when(order.safetyAcknowledgedAt)}{order.safetyCard.acknowledgedByName ? ` by ${order.safetyCard.acknowledgedByName}` : ''}</> : when(null) },
        { label: 'Submitted', value: when(order.submittedAt) },
        { label: 'Sealed', value: order.signedAt ? <>{when(order.signedAt)} by {order.signedByName}</> : when(null) },
      ]}
    />
  );
}

/** The readings the order asks for, as a list. */
export function Checklist({ items }: { items: WorkOrderDetail['checklist'] }) {
  return (
    <ul className="grid list-disc gap-1 pl-6 desk:grid-cols-2">
      {items.map((item) => (
        <li key={item}>{checklistLabels[item]}</li>
      ))}
    </ul>
  );
}
