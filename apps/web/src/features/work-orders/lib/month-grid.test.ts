import { describe, expect, test } from 'vitest';
import { addDays, buildMonthGrid, localToday, monthRange, parseMonth, shiftMonth, weekdayNames } from './month-grid';

describe('buildMonthGrid', () => {
  test('May 2026 starts on a Friday: four days of April lead, seven days to a week, Monday first', () => {
    const grid = buildMonthGrid('2026-05', [], (d: { dueOn: string }) => d.dueOn);
    expect(grid.weeks).toHaveLength(5);
    expect(grid.weeks.every((week) => week.length === 7)).toBe(true);
    expect(grid.weeks[0]!.map((d) => d.date)).toEqual(['2026-04-27', '2026-04-28', '2026-04-29', '2026-04-30', '2026-05-01', '2026-05-02', '2026-05-03']);
    expect(grid.weeks[0]!.map((d) => d.inMonth)).toEqual([false, false, false, false, true, true, true]);
    expect(grid.weeks.at(-1)!.at(-1)).toMatchObject({ date: '2026-05-31', day: 31, inMonth: true });
  });

  test('a February that starts on a Monday and ends on a Sunday fills exactly four weeks', () => {
    const grid = buildMonthGrid('2027-02', [], () => '');
    expect(grid.weeks).toHaveLength(4);
    expect(grid.weeks[0]![0]!.date).toBe('2027-02-01');
    expect(grid.weeks[3]![6]!.date).toBe('2027-02-28');
  });

  test('a leap February and a month needing six weeks', () => {
    const leap = buildMonthGrid('2028-02', [], () => '');
    expect(leap.weeks.flat().filter((d) => d.inMonth)).toHaveLength(29);
    // August 2026 starts on a Saturday and has 31 days: 5 + 31 = 36 days → six weeks.
    expect(buildMonthGrid('2026-08', [], () => '').weeks).toHaveLength(6);
  });

  test('items land on their day, in the order given; items outside the grid are left out', () => {
    const items = [
      { id: 1, dueOn: '2026-05-04' },
      { id: 2, dueOn: '2026-05-04' },
      { id: 3, dueOn: '2026-04-27' },
      { id: 4, dueOn: '2026-07-01' },
    ];
    const days = buildMonthGrid('2026-05', items, (i) => i.dueOn).weeks.flat();
    expect(days.find((d) => d.date === '2026-05-04')!.items.map((i) => i.id)).toEqual([1, 2]);
    expect(days.find((d) => d.date === '2026-04-27')!.items.map((i) => i.id)).toEqual([3]);
    expect(days.flatMap((d) => d.items).map((i) => i.id)).not.toContain(4);
  });

  test('refuses a value that is not a month', () => {
    expect(() => buildMonthGrid('2026-13', [], () => '')).toThrow(/Not a month/);
  });
});

describe('month helpers', () => {
  test('range, shift across years, parse', () => {
    expect(monthRange('2026-02')).toEqual({ from: '2026-02-01', to: '2026-02-28' });
    expect(monthRange('2028-02')).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(monthRange('2026-12')).toEqual({ from: '2026-12-01', to: '2026-12-31' });
    expect(shiftMonth('2026-12', 1)).toBe('2027-01');
    expect(shiftMonth('2026-01', -1)).toBe('2025-12');
    expect(shiftMonth('2026-05', 12)).toBe('2027-05');
    expect(parseMonth('2026-05')).toBe('2026-05');
    expect(parseMonth('2026-5')).toBeUndefined();
    expect(parseMonth(null)).toBeUndefined();
    expect(addDays('2026-02-28', 1)).toBe('2026-03-01');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  test('today in the reader’s calendar and the weekday names, Monday first', () => {
    expect(localToday(new Date(2026, 4, 4, 23, 30))).toBe('2026-05-04');
    const names = weekdayNames('en-GB');
    expect(names[0]).toEqual({ short: 'Mon', long: 'Monday' });
    expect(names[6]!.long).toBe('Sunday');
  });
});
