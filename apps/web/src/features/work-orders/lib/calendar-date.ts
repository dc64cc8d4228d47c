import { readerDateFormat } from '../../../lib/reader-format';

const dateFormat = readerDateFormat({ day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
const longFormat = readerDateFormat({ weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

function toDate(date: string): Date | undefined {
  const time = Date.parse(`${date.slice(0, 10)}T00:00:00Z`);
  return Number.isNaN(time) ? undefined : new Date(time);
}

/**
 * A calendar date (YYYY-MM-DD, a due date) as "4 May 2026" in the reader's language. Read in
 * UTC so that no time zone moves it to the day before.
 */
export function formatCalendarDate(date: string): string {
  const d = toDate(date);
  return d ? dateFormat.format(d) : date;
}

/** "Monday, 4 May 2026", for the day headings of the calendar's list. */
export function formatLongCalendarDate(date: string): string {
  const d = toDate(date);
  return d ? longFormat.format(d) : date;
}
