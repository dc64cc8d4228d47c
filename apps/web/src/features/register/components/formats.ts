/** How the register writes the values that are not a Quantity with a unit. */

const plain = new Intl.NumberFormat(undefined, { maximumFractionDigits: 3 });
const longDate = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' });

/** A power factor or tan φ: "0.95". */
export function formatRatio(value: number | null | undefined): string {
  return value === null || value === undefined ? '—' : plain.format(value);
}

/** A calendar date (YYYY-MM-DD, or an ISO time) as "1 Mar 2024" in the reader's language. */
export function formatDate(iso: string | null | undefined): string {
  if (!iso) return '—';
  const time = Date.parse(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  return Number.isNaN(time) ? iso : longDate.format(new Date(time));
}

/** A detuning factor 0.07 as "7 %". */
export function formatDetuning(factor: number | null | undefined): string {
  return factor === null || factor === undefined ? '—' : `${plain.format(factor * 100)} %`;
}

/** The tariff basis in words. */
export const tariffBasisLabels = { 'pf-threshold': 'PF threshold', 'tan-phi-limit': 'tan φ limit' } as const;
