import type { ChecklistItem } from '@varden/schemas';
import type { FlagKind } from './flags.repository';

/**
 * What a corrective order raised from a flag asks for, by the flag's kind. The measurements
 * that confirm the fault come first; photos where the repair leaves evidence.
 */
export const correctiveChecklists: Readonly<Record<FlagKind, readonly ChecklistItem[]>> = {
  replace: ['capacitance', 'visual', 'discharge-resistor', 'photos'],
  watch: ['capacitance', 'visual', 'case-temperature'],
  unbalance: ['capacitance', 'visual', 'photos'],
  remeasure: ['capacitance', 'visual'],
  'tuning-drift': ['capacitance', 'reactor', 'visual'],
  'contactor-endurance': ['contactor', 'visual', 'photos'],
  'case-temperature': ['case-temperature', 'capacitance', 'visual', 'bank'],
  'blown-fuse': ['fuses', 'capacitance', 'visual', 'photos'],
};

/** A trade hint per kind, after the flag's own message (engineering-reference.md §2–§7). */
const hints: Readonly<Record<FlagKind, string>> = {
  replace: 'Confirm the loss with a second measurement, replace the unit, and record the new unit’s first readings.',
  watch: 'Measure the unit again and compare with its previous readings; look for heat and ageing.',
  unbalance: 'Measure every terminal combination again; an unbalanced unit often has a failing element.',
  remeasure: 'The reading was above nameplate: check the nameplate, the method and the meter, then measure again.',
  'tuning-drift': 'Lost capacitance raises the tuning frequency towards a harmonic: measure the step’s capacitors and reactor, replace what drifted.',
  'contactor-endurance': 'The contactor nears its rated electrical endurance: inspect the contacts and pre-charge resistors and plan its replacement.',
  'case-temperature': 'A case above 55 °C needs looking into (65 °C is the limit): check ventilation, filters, voltage and harmonics.',
  'blown-fuse': 'A blown fuse usually means a failed capacitor: measure the step’s units before fitting new fuses, do not just re-fuse.',
};

const knownKind = (kind: string): kind is FlagKind => Object.hasOwn(correctiveChecklists, kind);

export function correctiveChecklistFor(kind: string): ChecklistItem[] {
  return knownKind(kind) ? [...correctiveChecklists[kind]] : ['capacitance', 'visual'];
}

/** What a corrective order of each kind is about, as the start of its title. */
const titleWords: Readonly<Record<FlagKind, string>> = {
  replace: 'Replace a capacitor unit',
  watch: 'Look again at a capacitor unit',
  unbalance: 'Unbalanced capacitor unit',
  remeasure: 'Re-measure a capacitor unit',
  'tuning-drift': 'Detuned step drifting',
  'contactor-endurance': 'Contactor near its endurance',
  'case-temperature': 'Hot capacitor case',
  'blown-fuse': 'Blown fuse',
};

/**
 * A short title from the flag: what it is about, then where, taken from the start of the
 * flag's message (up to its first colon, dash or full stop); the whole message goes into the
 * instructions.
 */
export function correctiveTitleFor(kind: string, message: string): string {
  const where = message.split(/: | — | - |\. /)[0]!.trim().replace(/\.$/, '');
  const title = `${knownKind(kind) ? titleWords[kind] : 'Corrective'}: ${where}`;
  return title.length <= 200 ? title : `${title.slice(0, 199)}…`;
}

export function correctiveInstructionsFor(kind: string, message: string): string {
  return [message, knownKind(kind) ? hints[kind] : ''].filter(Boolean).join('\n\n');
}

/** Action flags want the work within a week; advisory ones within a month. */
export const correctiveDueDays = (severity: 'advisory' | 'action') => (severity === 'action' ? 7 : 30);
