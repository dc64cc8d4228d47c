import { readerDateFormat } from './reader-format';

const dateTime = readerDateFormat({ dateStyle: 'medium', timeStyle: 'short' });
const longDate = readerDateFormat({ weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' });

/** A calendar date as written: YYYY-MM-DD and nothing more. */
const calendarDateOnly = /^\d{4}-\d{2}-\d{2}$/;

function parse(iso: string): Date | undefined {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? undefined : date;
}

/** "3 Dec 2026, 14:05" in the reader's locale and time zone; the ISO text when it is not a date. */
export function formatDateTime(iso: string): string {
  const date = parse(iso);
  return date ? dateTime.format(date) : iso;
}

/**
 * A day written with `options` in the reader's locale. A calendar date (2026-12-03, a due date,
 * an installation date) is that day wherever the reader is, so it is read in UTC; a moment (an
 * ISO time) is the day it fell on in the reader's zone. Text that is not a date stays as it is.
 */
export function dayFormat(options: Intl.DateTimeFormatOptions): (iso: string) => string {
  const calendar = readerDateFormat({ ...options, timeZone: 'UTC' });
  const moment = readerDateFormat(options);
  return (iso) => {
    const date = parse(iso);
    if (!date) return iso;
    return (calendarDateOnly.test(iso) ? calendar : moment).format(date);
  };
}

/** "3 Dec 2026" in the reader's locale (dayFormat). */
export const formatDate = dayFormat({ dateStyle: 'medium' });

/** "Thursday, 3 December 2026" for a page about one day. */
export function formatLongDate(date: Date): string {
  return longDate.format(date);
}
