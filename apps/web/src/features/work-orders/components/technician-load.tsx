import { openWorkOrderStates, type Workload } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { classNames } from '../../../lib/class-names';
import { openStatesFilter } from '../lib/work-order-search';
import { stateLabels } from '../lib/work-order-words';
import { paths } from '../../../config/paths';
import { readerNumberFormat } from '../../../lib/reader-format';

type Row = Workload['technicians'][number];

const count = readerNumberFormat();

/** The open orders of one technician (or of nobody), as the work-order table lists them. */
function ordersHref(row: Row, state: string = openStatesFilter): string {
  return paths.workOrders.list.getHref(new URLSearchParams({ state, assigneeId: row.userId === null ? 'none' : String(row.userId) }));
}

/** A bar of open orders against the busiest row, so the load reads at a glance. */
function LoadBar({ value, max }: { value: number; max: number }) {
  const share = max === 0 ? 0 : value / max;
  return (
    <span aria-hidden="true" className="block h-2 w-full min-w-16 rounded-full bg-sunken">
      <span className="block h-2 rounded-full bg-ink" style={{ width: `${Math.round(share * 100)}%` }} />
    </span>
  );
}

type TechnicianLoadProps = {
  load: Workload;
  /** Short form for the planning desk: totals only. */
  compact?: boolean;
  rangeLabel: string;
};

/** Technician load: open orders per technician by state, due in the range, overdue; nobody's orders last. */
export function TechnicianLoad({ load, compact = false, rangeLabel }: TechnicianLoadProps) {
  const rows = [...load.technicians].sort((a, b) => b.openTotal - a.openTotal || a.name.localeCompare(b.name));
  const all = [...rows, { ...load.unassigned, name: 'Not assigned' }];
  const max = Math.max(0, ...all.map((r) => r.openTotal));
  const cell = 'px-3 py-2 text-right numeric';
  return (
    <div role="region" aria-label={`Technician load, ${rangeLabel}`} tabIndex={0} className="relative overflow-x-auto rounded-md border border-line bg-surface">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Open work orders per technician{compact ? '' : ' by state'}, due {rangeLabel}, and overdue</caption>
        <thead className="bg-sunken text-base whitespace-nowrap text-ink-muted desk:text-sm">
          <tr>
            <th scope="col" className="border-b border-line-strong px-3 py-2 font-medium">
              Technician
            </th>
            {!compact &&
              openWorkOrderStates.map((state) => (
                <th key={state} scope="col" className="border-b border-line-strong px-3 py-2 text-right font-medium">
                  {stateLabels[state]}
                </th>
              ))}
            <th scope="col" className="border-b border-line-strong px-3 py-2 text-right font-medium">
              Open
            </th>
            <th scope="col" className="border-b border-line-strong px-3 py-2 font-medium">
              <span className="sr-only">Share of the busiest</span>
            </th>
            <th scope="col" className="border-b border-line-strong px-3 py-2 text-right font-medium">
              Due {rangeLabel}
            </th>
            <th scope="col" className="border-b border-line-strong px-3 py-2 text-right font-medium">
              Overdue
            </th>
          </tr>
        </thead>
        <tbody>
          {all.map((row, index) => (
            <tr key={row.userId ?? 'none'} className={classNames('border-b border-line last:border-b-0', index === all.length - 1 && 'bg-paper')}>
              <th scope="row" className="px-3 py-2 font-medium">
                <Link to={ordersHref(row)} className="inline-flex min-h-touch items-center desk:min-h-0">
                  {row.name}
                </Link>
              </th>
              {!compact &&
                openWorkOrderStates.map((state) => (
                  <td key={state} className={cell}>
                    {row.openByState[state] === 0 ? <span className="text-ink-muted">0</span> : count.format(row.openByState[state])}
                  </td>
                ))}
              <td className={classNames(cell, 'font-semibold')}>{count.format(row.openTotal)}</td>
              <td className="w-24 px-3 py-2 align-middle">
                <LoadBar value={row.openTotal} max={max} />
              </td>
              <td className={cell}>{count.format(row.dueInRange)}</td>
              <td className={cell}>{row.overdue === 0 ? <span className="text-ink-muted">0</span> : <strong>{count.format(row.overdue)}</strong>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
