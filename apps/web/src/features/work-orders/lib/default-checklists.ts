import type { ChecklistItem, WorkOrderKind } from '@varden/schemas';

/** What each kind of order usually asks the technician to record; the planner may change it. */
export const defaultChecklists: Readonly<Record<WorkOrderKind, ChecklistItem[]>> = {
  inspection: ['capacitance', 'visual', 'case-temperature', 'contactor', 'reactor', 'fuses', 'bank', 'photos'],
  corrective: ['capacitance', 'visual', 'photos'],
  baseline: ['capacitance', 'visual', 'discharge-resistor', 'insulation-resistance', 'photos'],
};
