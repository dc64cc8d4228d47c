import { describe, expect, it } from 'vitest';
import { readerFormatFor } from './entry-server';

const serverZone = new Intl.DateTimeFormat().resolvedOptions().timeZone;

describe('readerFormatFor', () => {
  it('takes the locale and zone the browser kept in its cookie', () => {
    const cookie = `varden_session=abc; varden_reader=${encodeURIComponent('de-DE Europe/Berlin')}; other=1`;
    expect(readerFormatFor(cookie, 'en-US,en;q=0.9')).toEqual({ locale: 'de-DE', timeZone: 'Europe/Berlin' });
  });

  it("before the browser has one, takes its first accepted language and this server's zone", () => {
    expect(readerFormatFor('varden_session=abc', 'fr-CA,fr;q=0.9,en;q=0.8')).toEqual({ locale: 'fr-CA', timeZone: serverZone });
  });

  it('ignores a cookie whose locale or zone Intl does not know, and a bad Accept-Language', () => {
    const fallback = new Intl.DateTimeFormat().resolvedOptions().locale;
    expect(readerFormatFor(`varden_reader=${encodeURIComponent('de-DE Mars/Olympus')}`, 'en-GB')).toEqual({ locale: 'en-GB', timeZone: serverZone });
    expect(readerFormatFor('varden_reader=%E0%A4%A', '*')).toEqual({ locale: fallback, timeZone: serverZone });
    expect(readerFormatFor(`varden_reader=${encodeURIComponent('not_a locale here')}`, undefined)).toEqual({ locale: fallback, timeZone: serverZone });
  });
});
