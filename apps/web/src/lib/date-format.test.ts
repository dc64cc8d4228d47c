import { afterEach, describe, expect, it } from 'vitest';
import { formatDate, formatDateTime } from './date-format';
import { readerNumberFormat, setReaderFormatSource, type ReaderFormat } from './reader-format';

// Expected texts are what ICU (the Intl of Node 20, the reference library here) writes for
// each locale; the point of each check is which day and which reader's conventions are used.
const readAs = (reader: ReaderFormat | undefined) => setReaderFormatSource(() => reader);

afterEach(() => readAs(undefined));

describe('formatDate', () => {
  it('writes a calendar date (a due date) as that day, even for a reader west of UTC', () => {
    readAs({ locale: 'en-US', timeZone: 'America/New_York' });
    // new Date('2026-12-03') is midnight UTC, which is still 2 December in New York.
    expect(formatDate('2026-12-03')).toBe('Dec 3, 2026');
  });

  it("writes a moment as the day it fell on in the reader's zone", () => {
    readAs({ locale: 'en-US', timeZone: 'America/New_York' });
    expect(formatDate('2026-12-03T02:00:00Z')).toBe('Dec 2, 2026');
    readAs({ locale: 'de-DE', timeZone: 'Europe/Berlin' });
    expect(formatDate('2026-12-03T23:30:00Z')).toBe('04.12.2026');
  });

  it('leaves text that is not a date as it is', () => {
    expect(formatDate('not a date')).toBe('not a date');
  });
});

describe('formatDateTime', () => {
  it("follows the reader's locale and zone, one reader after another (as server renders do)", () => {
    readAs({ locale: 'de-DE', timeZone: 'Europe/Berlin' });
    expect(formatDateTime('2026-12-03T23:30:00Z')).toBe('04.12.2026, 00:30');
    readAs({ locale: 'en-GB', timeZone: 'Europe/London' });
    expect(formatDateTime('2026-12-03T23:30:00Z')).toBe('3 Dec 2026, 23:30');
  });
});

describe('readerNumberFormat', () => {
  it("groups and marks decimals as the reader's locale does", () => {
    const counter = readerNumberFormat({ maximumFractionDigits: 1 });
    readAs({ locale: 'de-DE', timeZone: 'Europe/Berlin' });
    expect(counter.format(12345.5)).toBe('12.345,5');
    readAs({ locale: 'en-GB', timeZone: 'Europe/London' });
    expect(counter.format(12345.5)).toBe('12,345.5');
  });
});
