import { maintenanceIntervalMonths, NETA_INTERVAL_FACTORS } from '@varden/engineering';
import type { equipmentConditions, reliabilityNeeds } from '@varden/schemas';

export type ReliabilityNeed = (typeof reliabilityNeeds)[number];
export type EquipmentCondition = (typeof equipmentConditions)[number];

export type IntervalSuggestion = {
  factor: number;
  /** base × factor, unrounded. */
  exactMonths: number;
  /** What goes into a plan: whole months, at least one. */
  intervalMonths: number;
};

export const reliabilityLabels: Readonly<Record<ReliabilityNeed, string>> = {
  low: 'Low: a stop costs little',
  medium: 'Medium',
  high: 'High: the site depends on it',
};

export const conditionLabels: Readonly<Record<EquipmentCondition, string>> = {
  poor: 'Poor',
  average: 'Average',
  good: 'Good',
};

export const intervalSource = 'NETA MTS, Appendix B: base interval × a factor for the reliability needed and the condition of the equipment';

/**
 * The inspection interval helper: base interval × the NETA MTS Appendix B factor
 * (packages/engineering maintenanceIntervalMonths). A fractional result is rounded to the
 * nearest whole month, never below one, as the API's GET /api/inspection-plans/interval does.
 * Undefined when the base interval is not a whole number of months from 1 to 120.
 */
export function suggestInterval(baseIntervalMonths: number, reliability: ReliabilityNeed, condition: EquipmentCondition): IntervalSuggestion | undefined {
  if (!Number.isInteger(baseIntervalMonths) || baseIntervalMonths < 1 || baseIntervalMonths > 120) return undefined;
  const exactMonths = maintenanceIntervalMonths({ baseIntervalMonths, reliability, condition });
  return {
    factor: NETA_INTERVAL_FACTORS[reliability][condition],
    exactMonths,
    intervalMonths: Math.max(1, Math.round(exactMonths)),
  };
}
