const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const longDate = new Intl.DateTimeFormat(undefined, { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' });

function parse(iso: string): Date | undefined {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? undefined : date;
}

/** "3 Dec 2026, 14:05" in the reader's locale; the ISO text when it is not a date. */
export function formatDateTime(iso: string): string {
  const date = parse(iso);
  return date ? dateTime.format(date) : iso;
}

/** "3 Dec 2026" in the reader's locale. */
export function formatDate(iso: string): string {
  const date = parse(iso);
  return date ? dateOnly.format(date) : iso;
}

/** "Thursday, 3 December 2026" for a page about one day. */
export function formatLongDate(date: Date): string {
  return longDate.format(date);
}
