import { readerLocale } from '../../../lib/reader-format';

/**
 * The due calendar's month: weeks of seven days from Monday, the days of the neighbouring
 * months filling the first and last week. Dates are calendar dates (YYYY-MM-DD) as the API
 * sends due dates, computed in UTC so no time zone moves a day.
 */

export type CalendarDay<T> = {
  date: string;
  /** Day of the month, 1–31. */
  day: number;
  inMonth: boolean;
  items: T[];
};

export type MonthGrid<T> = {
  month: string;
  weeks: Array<Array<CalendarDay<T>>>;
};

const monthPattern = /^(\d{4})-(0[1-9]|1[0-2])$/;

const isoDate = (d: Date) => d.toISOString().slice(0, 10);

/** The month of a date as YYYY-MM, in the reader's own calendar. */
export function monthOf(date: Date): string {
  return `${date.getFullYear()}-${String(date.getMonth() + 1).padStart(2, '0')}`;
}

/** Today as YYYY-MM-DD in the reader's own calendar. */
export function localToday(now: Date = new Date()): string {
  return `${monthOf(now)}-${String(now.getDate()).padStart(2, '0')}`;
}

/** A month from the URL, or undefined when it is not YYYY-MM. */
export function parseMonth(value: string | null | undefined): string | undefined {
  return value && monthPattern.test(value) ? value : undefined;
}

function parts(month: string): [number, number] {
  const match = monthPattern.exec(month);
  if (!match) throw new Error(`Not a month (YYYY-MM): ${month}`);
  return [Number(match[1]), Number(match[2]) - 1];
}

/** The first and last day of a month, for the list endpoint's dueFrom and dueTo. */
export function monthRange(month: string): { from: string; to: string } {
  const [year, index] = parts(month);
  return { from: isoDate(new Date(Date.UTC(year, index, 1))), to: isoDate(new Date(Date.UTC(year, index + 1, 0))) };
}

/** The month `delta` months away (negative to go back). */
export function shiftMonth(month: string, delta: number): string {
  const [year, index] = parts(month);
  const d = new Date(Date.UTC(year, index + delta, 1));
  return isoDate(d).slice(0, 7);
}

/** A date plus whole days. */
export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return isoDate(d);
}

/**
 * The weeks of `month`, Monday first, with each item placed on the day `dateOf` gives it.
 * Items dated outside the grid are left out.
 */
export function buildMonthGrid<T>(month: string, items: readonly T[], dateOf: (item: T) => string): MonthGrid<T> {
  const [year, index] = parts(month);
  const first = new Date(Date.UTC(year, index, 1));
  const last = new Date(Date.UTC(year, index + 1, 0));
  // getUTCDay: Sunday 0 … Saturday 6; days back to the Monday on or before the 1st.
  const lead = (first.getUTCDay() + 6) % 7;
  const trail = 6 - ((last.getUTCDay() + 6) % 7);
  const start = isoDate(new Date(Date.UTC(year, index, 1 - lead)));
  const dayCount = lead + last.getUTCDate() + trail;

  const byDate = new Map<string, T[]>();
  for (const item of items) {
    const date = dateOf(item);
    const list = byDate.get(date);
    if (list) list.push(item);
    else byDate.set(date, [item]);
  }

  const weeks: Array<Array<CalendarDay<T>>> = [];
  for (let offset = 0; offset < dayCount; offset++) {
    const date = addDays(start, offset);
    if (offset % 7 === 0) weeks.push([]);
    weeks[weeks.length - 1]!.push({ date, day: Number(date.slice(8)), inMonth: date.slice(0, 7) === month, items: byDate.get(date) ?? [] });
  }
  return { month, weeks };
}

/** The weekdays of the grid's columns, Monday first, in the reader's language. */
export function weekdayNames(locale = readerLocale()): Array<{ short: string; long: string }> {
  const long = new Intl.DateTimeFormat(locale, { weekday: 'long', timeZone: 'UTC' });
  const short = new Intl.DateTimeFormat(locale, { weekday: 'short', timeZone: 'UTC' });
  // 2024-01-01 was a Monday.
  return Array.from({ length: 7 }, (_, i) => {
    const d = new Date(Date.UTC(2024, 0, 1 + i));
    return { short: short.format(d), long: long.format(d) };
  });
}

/** "May 2026" in the reader's language. */
export function monthTitle(month: string, locale = readerLocale()): string {
  const [year, index] = parts(month);
  return new Intl.DateTimeFormat(locale, { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(Date.UTC(year, index, 1)));
}
