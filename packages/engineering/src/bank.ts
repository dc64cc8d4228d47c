import { fail, nonNegative } from './validate.js';

/** Result of {@link bankSummary}. */
export interface BankSummary {
  stepCount: number;
  /** Σ installed kvar of the steps at network voltage. */
  installedKvar: number;
  /** Σ effective kvar of the steps at network voltage. */
  effectiveKvar: number;
  /** installed − effective, kvar (negative if the bank delivers more than installed). */
  lostKvar: number;
  /** 100·effective/installed (100 for an empty bank). */
  effectivePct: number;
}

/**
 * Installed versus effective kvar of a bank: sums over its steps (e.g. the results of
 * evaluateStep). Source: [DERIVED] parallel reactive powers add.
 */
export function bankSummary(steps: ReadonlyArray<{ installedKvar: number; effectiveKvar: number }>): BankSummary {
  const fn = 'bankSummary';
  if (!Array.isArray(steps)) fail(fn, 'steps', 'must be an array', steps);
  let installed = 0;
  let effective = 0;
  for (let i = 0; i < steps.length; i++) {
    const s = steps[i] as { installedKvar: number; effectiveKvar: number };
    installed += nonNegative(fn, `steps[${i}].installedKvar`, s.installedKvar);
    effective += nonNegative(fn, `steps[${i}].effectiveKvar`, s.effectiveKvar);
  }
  return {
    stepCount: steps.length,
    installedKvar: installed,
    effectiveKvar: effective,
    lostKvar: installed - effective,
    effectivePct: installed > 0 ? (effective / installed) * 100 : 100,
  };
}
