/** How the register writes the values that are not a Quantity with a unit. */

import { dayFormat } from '../../../lib/date-format';
import { readerNumberFormat } from '../../../lib/reader-format';

const plain = readerNumberFormat({ maximumFractionDigits: 3 });
const shortDay = dayFormat({ year: 'numeric', month: 'short', day: 'numeric' });

/** A power factor or tan φ: "0.95". */
export function formatRatio(value: number | null | undefined): string {
  return value === null || value === undefined ? '—' : plain.format(value);
}

/** A calendar date (YYYY-MM-DD, or an ISO time) as "1 Mar 2024" in the reader's language. */
export function formatDate(iso: string | null | undefined): string {
  return iso ? shortDay(iso) : '—';
}

/** A detuning factor 0.07 as "7 %". */
export function formatDetuning(factor: number | null | undefined): string {
  return factor === null || factor === undefined ? '—' : `${plain.format(factor * 100)} %`;
}

/** The tariff basis in words. */
export const tariffBasisLabels = { 'pf-threshold': 'PF threshold', 'tan-phi-limit': 'tan φ limit' } as const;
