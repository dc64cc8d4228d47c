import type { FleetOverview } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../lib/date-format';
import { StateMark } from '../../work-orders/components/state-mark';
import { fleetLinks } from '../lib/fleet-links';
import { FigureTable, type FigureColumn } from './figure-table';

type Overdue = FleetOverview['overdueOrders'][number];

const dayMs = 86_400_000;

/** Whole days from a due date (YYYY-MM-DD) to `today`. */
export function daysOverdue(dueOn: string, today: Date): number {
  const due = Date.parse(`${dueOn.slice(0, 10)}T00:00:00Z`);
  const start = Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate());
  return Math.max(0, Math.round((start - due) / dayMs));
}

/** "Overdue orders": open orders past their due date, the longest overdue first. */
export function OverdueOrdersTable({ orders, today = new Date() }: { orders: FleetOverview['overdueOrders']; today?: Date }) {
  const columns: FigureColumn<Overdue>[] = [
    {
      header: 'Order',
      rowHeader: true,
      cell: (o) => (
        <Link to={fleetLinks.workOrder(o.id)} className="font-medium">
          {o.title}
        </Link>
      ),
    },
    { header: 'Site', cell: (o) => <Link to={fleetLinks.siteHealth(o.siteId)}>{o.siteName}</Link> },
    { header: 'State', cell: (o) => <StateMark state={o.state} /> },
    { header: 'Due', align: 'end', cell: (o) => formatDate(o.dueOn) },
    {
      header: 'Overdue by',
      align: 'end',
      cell: (o) => {
        const days = daysOverdue(o.dueOn, today);
        return <span className="font-semibold">{days === 1 ? '1 day' : `${days} days`}</span>;
      },
    },
  ];
  const rows = [...orders].sort((a, b) => a.dueOn.localeCompare(b.dueOn));
  return <FigureTable caption="Overdue work orders" columns={columns} rows={rows} rowKey={(o) => String(o.id)} empty="No order is overdue." />;
}
