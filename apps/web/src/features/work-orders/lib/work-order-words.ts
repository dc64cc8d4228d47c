import type { ChecklistItem, WorkOrderKind, WorkOrderState, priorities } from '@varden/schemas';

/** The states in words, as the glossary names them. */
export const stateLabels: Readonly<Record<WorkOrderState, string>> = {
  queued: 'Queued',
  dispatched: 'Dispatched',
  'on-site': 'On site',
  'awaiting-review': 'Awaiting review',
  'sent-back': 'Sent back',
  sealed: 'Sealed',
  withdrawn: 'Withdrawn',
};

/** One line on what each state means for the person reading the list. */
export const stateMeanings: Readonly<Record<WorkOrderState, string>> = {
  queued: 'Created; not yet sent to a technician.',
  dispatched: 'Sent to a technician; waiting for them to start on site.',
  'on-site': 'The technician acknowledged the safety card and is recording.',
  'awaiting-review': 'Submitted; waiting for a supervisor.',
  'sent-back': 'Returned to the technician with a reason.',
  sealed: 'Signed off by a supervisor; the record no longer changes.',
  withdrawn: 'Cancelled with a reason.',
};

export const kindLabels: Readonly<Record<WorkOrderKind, string>> = {
  inspection: 'Inspection',
  corrective: 'Corrective',
  baseline: 'Baseline',
};

export type Priority = (typeof priorities)[number];

export const priorityLabels: Readonly<Record<Priority, string>> = {
  low: 'Low',
  normal: 'Normal',
  high: 'High',
  urgent: 'Urgent',
};

export const checklistLabels: Readonly<Record<ChecklistItem, string>> = {
  capacitance: 'Capacitance of every unit',
  visual: 'Visual checks',
  'case-temperature': 'Case temperature',
  'discharge-resistor': 'Discharge resistors',
  'insulation-resistance': 'Insulation resistance',
  contactor: 'Contactors',
  reactor: 'Detuning reactors',
  fuses: 'Fuses',
  bank: 'Bank: controller PF, cleaning, filters',
  photos: 'Photos',
};

/** The command that makes each move, in Varden's words. */
export const moveLabels: Readonly<Partial<Record<WorkOrderState, string>>> = {
  dispatched: 'Dispatch',
  queued: 'Recall to queue',
  'on-site': 'Start on site',
  'awaiting-review': 'Submit for review',
  'sent-back': 'Send back',
  sealed: 'Seal',
  withdrawn: 'Withdraw',
};

const targetLabels: Readonly<Record<string, string>> = {
  'capacitor-unit': 'Capacitor unit',
  contactor: 'Contactor',
  reactor: 'Reactor',
  'fuse-set': 'Fuse set',
  bank: 'Bank',
};

/** A reading's or flag's target in words; an unknown one as it came. */
export function targetLabel(target: string): string {
  return targetLabels[target] ?? target;
}

const flagKindLabels: Readonly<Record<string, string>> = {
  replace: 'Replace',
  watch: 'Watch',
  unbalance: 'Unbalance',
  remeasure: 'Remeasure',
  'tuning-drift': 'Tuning drift',
  'contactor-endurance': 'Contactor endurance',
  'case-temperature': 'Case temperature',
  'blown-fuse': 'Blown fuse',
};

/** A flag's kind in words; an unknown one with its dashes as spaces. */
export function flagKindLabel(kind: string): string {
  return flagKindLabels[kind] ?? kind.replace(/-/g, ' ');
}

export const severityLabels = { action: 'Action', advisory: 'Advisory' } as const;

export const methodLabels: Readonly<Record<string, string>> = {
  'open-pairs': 'Terminal pairs, third open',
  shorted: 'One terminal against two shorted',
  'line-currents': 'Line currents',
  'per-element': 'Per element',
};
