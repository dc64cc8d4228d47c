import type { WorkOrder } from '@varden/schemas';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { classNames } from '../../../lib/class-names';
import { formatLongCalendarDate } from '../lib/calendar-date';
import { buildMonthGrid, monthTitle, weekdayNames, type CalendarDay } from '../lib/month-grid';
import { paths } from '../../../config/paths';
import { OverdueMark, StateMark } from './state-mark';

type DueCalendarProps = {
  month: string;
  orders: readonly WorkOrder[];
  today: string;
};

function OrderLink({ order }: { order: WorkOrder }) {
  return (
    <Link
      to={paths.workOrders.detail.getHref(order.id)}
      className="grid min-h-touch gap-0.5 rounded border border-line bg-paper px-2 py-1 text-sm leading-5 no-underline hover:border-line-strong desk:min-h-control"
    >
      <span className="font-medium text-copper underline underline-offset-2 [overflow-wrap:anywhere]">
        <span className="numeric">#{order.id}</span> {order.title}
      </span>
      <span className="text-xs text-ink-muted">{order.siteName}</span>
      <span className="flex flex-wrap gap-x-2 text-xs text-ink">
        <StateMark state={order.state} />
        {order.overdue && <OverdueMark />}
      </span>
    </Link>
  );
}

/** One day of the grid: its date (spoken in full), "Today", and the orders due that day. */
function DayCell({ day, today }: { day: CalendarDay<WorkOrder>; today: string }) {
  const isToday = day.date === today;
  return (
    <td className={classNames('h-[7rem] w-[14.28%] border border-line p-1.5 align-top', day.inMonth ? 'bg-surface' : 'bg-sunken', isToday && 'outline-2 -outline-offset-2 outline-copper')}>
      <p className="mb-1 flex items-baseline justify-between gap-1 text-sm">
        <time dateTime={day.date} className={classNames('numeric font-semibold', !day.inMonth && 'text-ink-muted')}>
          <span aria-hidden="true">{day.day}</span>
          <span className="sr-only">{formatLongCalendarDate(day.date)}</span>
        </time>
        {isToday && <span className="text-xs font-semibold">Today</span>}
      </p>
      {day.items.length > 0 && (
        <ul className="grid gap-1" aria-label={`${day.items.length} due`}>
          {day.items.map((order) => (
            <li key={order.id}>
              <OrderLink order={order} />
            </li>
          ))}
        </ul>
      )}
    </td>
  );
}

/**
 * The due calendar: on a desk a month grid (a table, weekdays as column headings, each day's
 * orders as links); on a phone the days that have orders, each under its date as a heading.
 */
export function DueCalendar({ month, orders, today }: DueCalendarProps) {
  const grid = buildMonthGrid(month, orders, (order) => order.dueOn);
  const weekdays = weekdayNames();
  const title = monthTitle(month);
  const agendaId = useId();
  const busyDays = grid.weeks.flat().filter((day) => day.inMonth && day.items.length > 0);

  return (
    <>
      <div role="region" aria-label={`Month grid, ${title}`} tabIndex={0} className="relative hidden overflow-x-auto desk:block">
        <table className="w-full min-w-[44rem] table-fixed border-collapse">
          <caption className="sr-only">Work orders due in {title}, by day; weeks start on Monday</caption>
          <thead>
            <tr>
              {weekdays.map((weekday) => (
                <th key={weekday.long} scope="col" abbr={weekday.long} className="border-b border-line-strong px-1.5 py-2 text-left text-sm font-medium text-ink-muted">
                  {weekday.short}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {grid.weeks.map((week) => (
              <tr key={week[0]!.date}>
                {week.map((day) => (
                  <DayCell key={day.date} day={day} today={today} />
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <section aria-labelledby={agendaId} className="desk:hidden">
        <h2 id={agendaId} className="sr-only">
          Days with orders due in {title}
        </h2>
        {busyDays.length === 0 ? (
          <p className="rounded-md border border-line bg-surface p-4 text-ink-muted">No work orders fall due in {title}.</p>
        ) : (
          <ol className="grid gap-4">
            {busyDays.map((day) => (
              <li key={day.date}>
                <h3 className="mb-2 flex items-baseline gap-2 font-semibold">
                  <time dateTime={day.date}>{formatLongCalendarDate(day.date)}</time>
                  {day.date === today && <span className="text-sm">(today)</span>}
                </h3>
                <ul className="grid gap-2">
                  {day.items.map((order) => (
                    <li key={order.id}>
                      <OrderLink order={order} />
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ol>
        )}
      </section>
    </>
  );
}
