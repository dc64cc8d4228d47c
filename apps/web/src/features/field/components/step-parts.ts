import type { ChecklistItem, WorkOrderDetail } from '@varden/schemas';

// Apart from the step's cards so that the order page can count what is recorded without loading
// the walk's forms (react-hook-form and the engineering checks), which come later.
type Step = WorkOrderDetail['bank']['steps'][number];

/** Checklist items recorded on a capacitor unit: the contract carries them on its capacitance reading. */
export const unitItems: readonly ChecklistItem[] = ['capacitance', 'visual', 'case-temperature', 'discharge-resistor', 'insulation-resistance'];

/** What the order's checklist asks for on this step: its units, contactor, reactor and fuses. */
export function partsOfStep(step: Step, checklist: readonly ChecklistItem[]) {
  return {
    units: checklist.some((item) => unitItems.includes(item)) ? step.units : [],
    contactor: checklist.includes('contactor') ? step.contactor : null,
    reactor: checklist.includes('reactor') ? step.reactor : null,
    fuseSet: checklist.includes('fuses') ? step.fuseSet : null,
  };
}
