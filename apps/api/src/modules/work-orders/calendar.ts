/**
 * Calendar dates as YYYY-MM-DD strings, the form the database's DATE columns come back in.
 * Orders fall due on a site's own calendar, so "today" is asked for in the site's time zone.
 */

const formatters = new Map<string, Intl.DateTimeFormat>();

/** The date it is now in `timeZone` (UTC when the zone is unknown to the runtime). */
export function localDate(timeZone: string, now: Date = new Date()): string {
  let format = formatters.get(timeZone);
  if (!format) {
    try {
      format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    } catch {
      format = new Intl.DateTimeFormat('en-CA', { timeZone: 'UTC', year: 'numeric', month: '2-digit', day: '2-digit' });
    }
    formatters.set(timeZone, format);
  }
  return format.format(now);
}

export const utcDate = (now: Date = new Date()) => now.toISOString().slice(0, 10);

/** `date` plus whole days (negative to go back). */
export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return utcDate(d);
}

/** `date` plus whole months; a day past the end of the target month falls on its last day (31 Jan + 1 → 28/29 Feb). */
export function addMonths(date: string, months: number): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const index = y * 12 + (m - 1) + months;
  const year = Math.floor(index / 12);
  const month = index - year * 12;
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  return utcDate(new Date(Date.UTC(year, month, Math.min(d, lastDay))));
}

/** An order is overdue once its due date has passed on the site's calendar, until it is sealed or withdrawn. */
export function isOverdue(order: { dueOn: string; state: string }, timeZone: string, now: Date = new Date()): boolean {
  return order.state !== 'sealed' && order.state !== 'withdrawn' && order.dueOn < localDate(timeZone, now);
}
