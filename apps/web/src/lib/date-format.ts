import { readerDateFormat } from './reader-format';

const dateTime = readerDateFormat({ dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = readerDateFormat({ dateStyle: 'medium' });
// A calendar date as written (a due date, an installation date): no time zone may move it.
const calendarDate = readerDateFormat({ dateStyle: 'medium', timeZone: 'UTC' });
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
 * "3 Dec 2026" in the reader's locale. A calendar date (2026-12-03, a due date) is that day
 * wherever the reader is; a moment (an ISO time) is the day it fell on in the reader's zone.
 */
export function formatDate(iso: string): string {
  const date = parse(iso);
  if (!date) return iso;
  return calendarDateOnly.test(iso) ? calendarDate.format(date) : dateOnly.format(date);
}

/** "Thursday, 3 December 2026" for a page about one day. */
export function formatLongDate(date: Date): string {
  return longDate.format(date);
}
