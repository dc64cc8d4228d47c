import { fractionDigitsFormat } from '../../../lib/reader-format';

/** A no-break space: a number and its unit never part at a line end. */
export const nbsp = '\u00A0';

/** A number in the reader's locale (or `locale`), with a fixed number of decimals. */
export function formatNumber(value: number, fractionDigits: number, locale?: string): string {
  // −0 would print as "-0".
  const shown = Object.is(value, -0) ? 0 : value;
  return fractionDigitsFormat(fractionDigits, fractionDigits, locale).format(shown);
}

/** "40.2 kvar": a value, a no-break space and its unit, for sentences and chart labels. */
export function quantityText(value: number, unit: string, fractionDigits = 1, locale?: string): string {
  return `${formatNumber(value, fractionDigits, locale)}${nbsp}${unit}`;
}

/** A power factor to three decimals ("0.876"), so 0.947 does not read as the target 0.95. */
export function pfText(pf: number, locale?: string): string {
  return formatNumber(pf, 3, locale);
}

/** A target power factor as entered (two decimals unless it has three: 0.95, 0.925). */
export function targetPfText(pf: number, locale?: string): string {
  return formatNumber(pf, Math.abs(pf * 100 - Math.round(pf * 100)) > 1e-9 ? 3 : 2, locale);
}

/** An English ordinal for a harmonic order: 3rd, 5th, 11th, 13th, 21st. */
export function ordinal(n: number): string {
  const lastTwo = n % 100;
  if (lastTwo >= 11 && lastTwo <= 13) return `${n}th`;
  switch (n % 10) {
    case 1:
      return `${n}st`;
    case 2:
      return `${n}nd`;
    case 3:
      return `${n}rd`;
    default:
      return `${n}th`;
  }
}

/** "1 unit", "3 units". */
export function countOf(n: number, singular: string, plural = `${singular}s`): string {
  return `${n} ${n === 1 ? singular : plural}`;
}
