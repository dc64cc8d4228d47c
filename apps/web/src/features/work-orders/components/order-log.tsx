import type { WorkOrderDetail } from '@varden/schemas';
import { formatDateTime } from '../../../lib/date-format';
import { StateMark } from './state-mark';

/** The order log: every move of the order, oldest first: when, who, from, to, and why. */
export function OrderLog({ transitions }: { transitions: WorkOrderDetail['transitions'] }) {
  const th = 'border-b border-line-strong px-3 py-2 text-left text-base font-medium text-ink-muted desk:text-sm';
  return (
    <div role="region" aria-label="Order log entries" tabIndex={0} className="relative overflow-x-auto rounded-md border border-line bg-surface">
      <table className="w-full min-w-[36rem] border-collapse text-left">
        <caption className="sr-only">Every change of state of this order, oldest first</caption>
        <thead className="bg-sunken">
          <tr>
            <th scope="col" className={th}>
              When
            </th>
            <th scope="col" className={th}>
              Who
            </th>
            <th scope="col" className={th}>
              From
            </th>
            <th scope="col" className={th}>
              To
            </th>
            <th scope="col" className={th}>
              Comment
            </th>
          </tr>
        </thead>
        <tbody>
          {transitions.map((t, index) => (
            <tr key={`${t.at}-${index}`} className="border-b border-line last:border-b-0">
              <td className="px-3 py-2 align-top whitespace-nowrap">
                <time dateTime={t.at} className="numeric">
                  {formatDateTime(t.at)}
                </time>
              </td>
              <td className="px-3 py-2 align-top">{t.actorName ?? <span className="text-ink-muted">Varden (scheduler)</span>}</td>
              <td className="px-3 py-2 align-top">{t.fromState ? <StateMark state={t.fromState} /> : <span className="text-ink-muted">Created</span>}</td>
              <td className="px-3 py-2 align-top">
                <StateMark state={t.toState} />
              </td>
              <td className="px-3 py-2 align-top [overflow-wrap:anywhere]">{t.comment || <span className="text-ink-muted">—</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
