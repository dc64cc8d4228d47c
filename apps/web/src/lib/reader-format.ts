/**
 * Numbers and dates in the reader's locale and time zone.
 *
 * In the browser these are the browser's own (Intl's defaults). While the server draws a first
 * view (src/entry-server.tsx) they are the visitor's, which the browser keeps in a cookie
 * (`varden_reader`, written at every start by src/app/start.tsx), so the markup drawn on the server reads
 * as the browser would draw it and hydration keeps it. Every formatter of the app is made here
 * (readerNumberFormat, readerDateFormat) rather than with `new Intl.…(undefined, …)`, which on the
 * server would be the server's locale and zone.
 */
export type ReaderFormat = { locale: string; timeZone: string };

let source: () => ReaderFormat | undefined = () => undefined;

/** For the server's renderer only: where each render's reader format comes from. */
export function setReaderFormatSource(next: () => ReaderFormat | undefined): void {
  source = next;
}

/** The reader's locale; undefined in the browser, where Intl's default is the reader's. */
export const readerLocale = (): string | undefined => source()?.locale;

/** The locale and time zone this browser formats in, as Intl resolves them. */
export function ownReaderFormat(): ReaderFormat {
  const { locale, timeZone } = new Intl.DateTimeFormat().resolvedOptions();
  return { locale, timeZone };
}

export const readerCookieName = 'varden_reader';

/** Keeps this browser's locale and zone for the server's next first view (a year; sent to this site only). */
export function rememberReaderFormat(doc: Document, secure: boolean): void {
  const { locale, timeZone } = ownReaderFormat();
  const value = encodeURIComponent(`${locale} ${timeZone}`);
  doc.cookie = `${readerCookieName}=${value}; Path=/; Max-Age=31536000; SameSite=Lax${secure ? '; Secure' : ''}`;
}

type Formatter<T> = { format: (value: T) => string };

/** One formatter per reader format, built when first used (a server render may meet many readers). */
function perReader<F>(build: (reader: ReaderFormat | undefined) => F): () => F {
  const built = new Map<string, F>();
  return () => {
    const reader = source();
    const key = reader ? `${reader.locale} ${reader.timeZone}` : '';
    let formatter = built.get(key);
    if (!formatter) {
      if (built.size >= 64) built.clear();
      formatter = build(reader);
      built.set(key, formatter);
    }
    return formatter;
  };
}

/** An Intl.NumberFormat in the reader's locale: `readerNumberFormat({ … }).format(n)`. */
export function readerNumberFormat(options?: Intl.NumberFormatOptions): Formatter<number> {
  const current = perReader((reader) => new Intl.NumberFormat(reader?.locale, options));
  return { format: (value) => current().format(value) };
}

/** An Intl.DateTimeFormat in the reader's locale and time zone (a `timeZone` in `options` wins). */
export function readerDateFormat(options: Intl.DateTimeFormatOptions): Formatter<Date | number> {
  const current = perReader((reader) => new Intl.DateTimeFormat(reader?.locale, { timeZone: reader?.timeZone, ...options }));
  return { format: (value) => current().format(value) };
}

const fractionFormats = new Map<string, Intl.NumberFormat>();

/** An Intl.NumberFormat with these decimals in `locale`, by default the reader's; one per locale and decimals. */
export function fractionDigitsFormat(minimumFractionDigits: number, maximumFractionDigits: number, locale = readerLocale()): Intl.NumberFormat {
  const key = `${locale ?? ''}:${minimumFractionDigits}:${maximumFractionDigits}`;
  let format = fractionFormats.get(key);
  if (!format) {
    if (fractionFormats.size >= 256) fractionFormats.clear();
    format = new Intl.NumberFormat(locale, { minimumFractionDigits, maximumFractionDigits });
    fractionFormats.set(key, format);
  }
  return format;
}
