import { fail, nonNegative, positive, powerFactor } from './validate.js';

/**
 * Estimates of what poor power factor costs under a reactive-energy tariff. These are
 * estimates: they assume the given average load holds for all the hours, and a tariff that
 * charges the reactive energy above an allowance of P·tan φ_limit at one price per kvarh.
 * Real tariffs differ (monthly averaging, maximum-demand charges, PF bands); store the basis
 * per site [COMMON] engineering-reference.md §6.
 */

function tanLimitOf(fn: string, a: { tanPhiLimit?: number; pfLimit?: number }): number {
  if (a.tanPhiLimit !== undefined && a.pfLimit !== undefined) fail(fn, 'pfLimit', 'must not be given together with tanPhiLimit', a.pfLimit);
  if (a.tanPhiLimit !== undefined) return nonNegative(fn, 'tanPhiLimit', a.tanPhiLimit);
  if (a.pfLimit !== undefined) {
    powerFactor(fn, 'pfLimit', a.pfLimit);
    return Math.sqrt(1 - a.pfLimit * a.pfLimit) / a.pfLimit;
  }
  return fail(fn, 'tanPhiLimit', 'or pfLimit must be given', undefined);
}

/** Result of {@link reactiveEnergyCharge}. */
export interface ReactiveEnergyCharge {
  /** Reactive power allowed free of charge, P·tan φ_limit, kvar. */
  allowedKvar: number;
  /** max(0, Q − allowed), kvar. */
  billableKvar: number;
  /** billableKvar × hours, kvarh per month. */
  billableKvarhPerMonth: number;
  /** billableKvarhPerMonth × price, in the price's currency. */
  monthlyCost: number;
}

/**
 * Estimated monthly charge for reactive energy above a tan φ limit (or a PF threshold,
 * tan φ = √(1 − PF²)/PF): kvarh = max(0, Q − P·tan φ_limit)·hours; cost = kvarh·price.
 * Estimate only (constant average load). Source: [COMMON] engineering-reference.md §6.
 */
export function reactiveEnergyCharge(a: {
  kw: number;
  kvar: number;
  hoursPerMonth: number;
  pricePerKvarh: number;
  tanPhiLimit?: number;
  pfLimit?: number;
}): ReactiveEnergyCharge {
  return chargeFor('reactiveEnergyCharge', a);
}

function chargeFor(
  fn: string,
  a: { kw: number; kvar: number; hoursPerMonth: number; pricePerKvarh: number; tanPhiLimit?: number; pfLimit?: number },
): ReactiveEnergyCharge {
  positive(fn, 'kw', a.kw);
  if (typeof a.kvar !== 'number' || !Number.isFinite(a.kvar)) fail(fn, 'kvar', 'must be a finite number', a.kvar);
  nonNegative(fn, 'hoursPerMonth', a.hoursPerMonth);
  nonNegative(fn, 'pricePerKvarh', a.pricePerKvarh);
  const tanLimit = tanLimitOf(fn, a);
  const allowedKvar = a.kw * tanLimit;
  const billableKvar = Math.max(0, a.kvar - allowedKvar);
  const kvarh = billableKvar * a.hoursPerMonth;
  return { allowedKvar, billableKvar, billableKvarhPerMonth: kvarh, monthlyCost: kvarh * a.pricePerKvarh };
}

/** Result of {@link lostCorrectionCost}. */
export interface LostCorrectionCost {
  /** Charge with the bank delivering its installed kvar. */
  asInstalled: ReactiveEnergyCharge;
  /** Charge with the bank delivering its effective (measured) kvar. */
  now: ReactiveEnergyCharge;
  /** now.billableKvarhPerMonth − asInstalled.billableKvarhPerMonth. */
  extraKvarhPerMonth: number;
  /** now.monthlyCost − asInstalled.monthlyCost: what the lost correction costs per month (estimate). */
  lostMonthlyCost: number;
}

/**
 * Estimated monthly cost of lost correction: the reactive-energy charge of the load's kvar
 * minus the bank's effective kvar, less the same with its installed kvar (both via
 * {@link reactiveEnergyCharge}). Estimate only. Source: [COMMON] engineering-reference.md §6.
 */
export function lostCorrectionCost(a: {
  kw: number;
  loadKvar: number;
  installedKvar: number;
  effectiveKvar: number;
  hoursPerMonth: number;
  pricePerKvarh: number;
  tanPhiLimit?: number;
  pfLimit?: number;
}): LostCorrectionCost {
  const fn = 'lostCorrectionCost';
  nonNegative(fn, 'loadKvar', a.loadKvar);
  nonNegative(fn, 'installedKvar', a.installedKvar);
  nonNegative(fn, 'effectiveKvar', a.effectiveKvar);
  const base = { kw: a.kw, hoursPerMonth: a.hoursPerMonth, pricePerKvarh: a.pricePerKvarh, tanPhiLimit: a.tanPhiLimit, pfLimit: a.pfLimit };
  const asInstalled = chargeFor(fn, { ...base, kvar: a.loadKvar - a.installedKvar });
  const now = chargeFor(fn, { ...base, kvar: a.loadKvar - a.effectiveKvar });
  return {
    asInstalled,
    now,
    extraKvarhPerMonth: now.billableKvarhPerMonth - asInstalled.billableKvarhPerMonth,
    lostMonthlyCost: now.monthlyCost - asInstalled.monthlyCost,
  };
}
