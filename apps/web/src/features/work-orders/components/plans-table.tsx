import type { InspectionPlan } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { formatCalendarDate } from '../lib/calendar-date';
import { checklistLabels } from '../lib/work-order-words';
import { paths } from '../../../config/paths';

const th = 'border-b border-line-strong px-3 py-2 text-left text-base font-medium text-ink-muted desk:text-sm';

const every = (months: number) => (months === 1 ? 'every month' : `every ${months} months`);

/** Inspection plans with their interval, lead time, readings and next due date; a name opens the plan. */
export function PlansTable({ items, busy }: { items: readonly InspectionPlan[]; busy: boolean }) {
  return (
    <div role="region" aria-label="Inspection plans" tabIndex={0} className="relative overflow-x-auto rounded-md border border-line bg-surface">
      <table aria-busy={busy} className="w-full border-collapse text-left">
        <caption className="sr-only">Inspection plans with their bank, interval, lead time, readings and next due date</caption>
        <thead className="bg-sunken">
          <tr>
            <th scope="col" className={th}>
              Plan
            </th>
            <th scope="col" className={`${th} hidden desk:table-cell`}>
              Site and bank
            </th>
            <th scope="col" className={`${th} hidden desk:table-cell`}>
              Interval
            </th>
            <th scope="col" className={`${th} hidden desk:table-cell`}>
              Readings
            </th>
            <th scope="col" className={`${th} hidden text-right desk:table-cell`}>
              Next due
            </th>
          </tr>
        </thead>
        <tbody>
          {items.length === 0 ? (
            <tr>
              <td colSpan={5} className="px-3 py-6 text-ink-muted">
                No inspection plans here yet.
              </td>
            </tr>
          ) : (
            items.map((plan) => (
              <tr key={plan.id} className="border-b border-line last:border-b-0">
                <td className="px-3 py-3 align-top">
                  <Link to={paths.plans.edit.getHref(plan.id)} className="font-medium">
                    {plan.name}
                  </Link>
                  {!plan.active && <span className="ml-2 text-ink-muted">(paused)</span>}
                  <span className="mt-1 grid gap-1 text-base desk:hidden">
                    <span className="text-ink-muted">
                      {plan.siteName} · {plan.bankName}
                    </span>
                    <span>
                      {every(plan.intervalMonths)}, made {plan.leadDays} days ahead
                    </span>
                    <span>Next due {formatCalendarDate(plan.nextDueOn)}</span>
                  </span>
                </td>
                <td className="hidden px-3 py-3 align-top desk:table-cell">
                  <span className="grid">
                    <span>{plan.siteName}</span>
                    <span className="text-sm text-ink-muted">{plan.bankName}</span>
                  </span>
                </td>
                <td className="hidden px-3 py-3 align-top desk:table-cell">
                  <span className="grid">
                    <span className="numeric">{every(plan.intervalMonths)}</span>
                    <span className="numeric text-sm text-ink-muted">made {plan.leadDays} days ahead</span>
                  </span>
                </td>
                <td className="hidden px-3 py-3 align-top text-sm desk:table-cell">{plan.checklist.map((item) => checklistLabels[item]).join(', ')}</td>
                <td className="hidden px-3 py-3 text-right align-top whitespace-nowrap desk:table-cell">
                  <time dateTime={plan.nextDueOn} className="numeric">
                    {formatCalendarDate(plan.nextDueOn)}
                  </time>
                </td>
              </tr>
            ))
          )}
        </tbody>
      </table>
    </div>
  );
}
