import { contactorLifeUsed } from '@varden/engineering';
import { reasonOf } from './decimal';

/** Above this share of its rated electrical endurance a contactor is flagged [COMMON] §7 (common practice). */
export const contactorFlagAbovePct = 80;
/** A reactor within this of the register's inductance is fine (common practice). */
export const reactorTolerancePct = 5;

export type LiveContactorResult =
  | { kind: 'incomplete' }
  | { kind: 'not-accepted'; reason: string }
  | { kind: 'result'; operations: number; usedPct: number; remainingOperations: number; flag: boolean };

/** Share of the contactor's rated operations used since it was installed (contactorLifeUsed, AC-6b endurance per datasheet). */
export function liveContactorResult(counter: number | undefined, contactor: { ratedOperations: number; counterAtInstall: number }): LiveContactorResult {
  if (counter === undefined) return { kind: 'incomplete' };
  if (Number.isNaN(counter)) return { kind: 'not-accepted', reason: 'The counter is a whole number.' };
  if (!Number.isInteger(counter)) return { kind: 'not-accepted', reason: 'The counter is a whole number of operations.' };
  try {
    const life = contactorLifeUsed({ counterNow: counter, counterAtInstall: contactor.counterAtInstall, ratedOperations: contactor.ratedOperations, flagAbovePct: contactorFlagAbovePct });
    return { kind: 'result', ...life };
  } catch (error) {
    if (error instanceof RangeError) return { kind: 'not-accepted', reason: reasonOf(error).replace(/^CounterNow\b/, 'The counter') };
    throw error;
  }
}

export type LiveReactorResult = { kind: 'none' } | { kind: 'incomplete' } | { kind: 'result'; deviationsPct: number[]; within: boolean };

/** Each phase's inductance against the register's, % (± 5 % common practice). */
export function liveReactorResult(inductanceMH: ReadonlyArray<number | undefined>, registerMH: number): LiveReactorResult {
  const typed = inductanceMH.filter((v) => v !== undefined);
  if (typed.length === 0) return { kind: 'none' };
  if (typed.length < 3 || typed.some((v) => Number.isNaN(v) || v <= 0)) return { kind: 'incomplete' };
  const deviationsPct = typed.map((l) => (l / registerMH - 1) * 100);
  return { kind: 'result', deviationsPct, within: deviationsPct.every((d) => Math.abs(d) <= reactorTolerancePct + 1e-9) };
}

/** Fuses without continuity, numbered 1–3. */
export function blownFuses(continuity: readonly [boolean, boolean, boolean]): number[] {
  return continuity.flatMap((ok, i) => (ok ? [] : [i + 1]));
}
