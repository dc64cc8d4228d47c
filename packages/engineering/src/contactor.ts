import { fail, nonNegative, positive } from './validate.js';

/** Result of {@link contactorLifeUsed}. */
export interface ContactorLife {
  /** Operations since installation. */
  operations: number;
  /** Share of the rated electrical endurance used, % (may exceed 100). */
  usedPct: number;
  /** Rated operations left (negative when past the rating). */
  remainingOperations: number;
  /** True when usedPct exceeds flagAbovePct (default 80 %, common practice). */
  flag: boolean;
}

/**
 * Share of a capacitor-duty contactor's rated electrical endurance used:
 * used % = 100·(counter now − counter at install) / rated operations.
 * Electrical endurance comes from the datasheet (often about 10⁵ operations, utilisation
 * category AC-6b [STD, IEC 60947-4-1]); flag above 80 % is common practice [COMMON]
 * engineering-reference.md §7.
 *
 * @throws RangeError when counterNow < counterAtInstall (a reset or replaced counter).
 */
export function contactorLifeUsed(a: { counterNow: number; counterAtInstall: number; ratedOperations: number; flagAbovePct?: number }): ContactorLife {
  const fn = 'contactorLifeUsed';
  nonNegative(fn, 'counterNow', a.counterNow);
  nonNegative(fn, 'counterAtInstall', a.counterAtInstall);
  positive(fn, 'ratedOperations', a.ratedOperations);
  const flagAt = a.flagAbovePct ?? 80;
  positive(fn, 'flagAbovePct', flagAt);
  if (a.counterNow < a.counterAtInstall) {
    fail(fn, 'counterNow', `must be ≥ counterAtInstall (${a.counterAtInstall}); was the counter reset or the contactor replaced?`, a.counterNow);
  }
  const operations = a.counterNow - a.counterAtInstall;
  const usedPct = (operations / a.ratedOperations) * 100;
  return { operations, usedPct, remainingOperations: a.ratedOperations - operations, flag: usedPct > flagAt };
}
