import { describe, expect, test } from 'vitest';
import { addDays, addMonths, isOverdue, localDate } from './calendar';

describe('calendar dates', () => {
  test('months add on the calendar; a day past the month’s end falls on its last day', () => {
    expect(addMonths('2026-01-15', 6)).toBe('2026-07-15');
    expect(addMonths('2026-08-31', 6)).toBe('2027-02-28');
    expect(addMonths('2027-08-31', 6)).toBe('2028-02-29');
    expect(addMonths('2026-03-31', -1)).toBe('2026-02-28');
    expect(addMonths('2026-11-30', 14)).toBe('2028-01-30');
  });

  test('days add across months and years', () => {
    expect(addDays('2026-12-29', 7)).toBe('2027-01-05');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  test('today is asked for in the site’s own time zone', () => {
    const now = new Date('2026-12-02T03:30:00Z');
    expect(localDate('UTC', now)).toBe('2026-12-02');
    expect(localDate('America/Chicago', now)).toBe('2026-12-01');
    expect(localDate('Not/AZone', now)).toBe('2026-12-02');
  });

  test('an order is overdue once its due date has passed on the site’s calendar, until sealed or withdrawn', () => {
    const now = new Date('2026-12-02T03:30:00Z');
    expect(isOverdue({ dueOn: '2026-12-01', state: 'dispatched' }, 'UTC', now)).toBe(true);
    // Still the 1st in Chicago: not overdue there yet.
    expect(isOverdue({ dueOn: '2026-12-01', state: 'dispatched' }, 'America/Chicago', now)).toBe(false);
    expect(isOverdue({ dueOn: '2026-11-01', state: 'sealed' }, 'UTC', now)).toBe(false);
    expect(isOverdue({ dueOn: '2026-11-01', state: 'withdrawn' }, 'UTC', now)).toBe(false);
  });
});
