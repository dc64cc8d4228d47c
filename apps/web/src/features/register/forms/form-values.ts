/**
 * How text typed into a form becomes the values the shared schemas check. Empty stays
 * "missing" (undefined for required fields, so the schema's own message shows; null for
 * optional ones); a decimal comma is accepted; anything else becomes NaN, which the schema
 * refuses as "enter a number".
 */
function parseNumber(raw: string): number {
  return Number(raw.trim().replace(',', '.'));
}

const isBlank = (raw: unknown) => raw === undefined || raw === null || (typeof raw === 'string' && raw.trim() === '');

/** A required number. */
export function asNumber(raw: unknown): number | undefined {
  if (typeof raw === 'number') return raw;
  if (isBlank(raw)) return undefined;
  return parseNumber(String(raw));
}

/** An optional number the contract takes as null when not given. */
export function asNullableNumber(raw: unknown): number | null {
  if (typeof raw === 'number') return raw;
  if (isBlank(raw)) return null;
  return parseNumber(String(raw));
}

/** An optional date (YYYY-MM-DD) or text the contract takes as null when empty. */
export function asNullableText(raw: unknown): string | null {
  if (isBlank(raw)) return null;
  return String(raw).trim();
}

/** A number shown in a field: empty for none. */
export function numberText(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value);
}
