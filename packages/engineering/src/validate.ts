/**
 * Input checks shared by every module. Each helper takes the calling function's name and the
 * parameter's name so the RangeError says exactly which argument is wrong and why, e.g.
 * `legsFromOpenPairs: readingsUF[1] must be a finite number > 0, got -3`.
 *
 * The helpers build their message only when a check fails and take no callbacks, so they cost
 * a comparison or two on the hot path.
 */

/** Renders a rejected value for an error message. */
export function describeValue(v: unknown): string {
  if (typeof v === 'number') return String(v);
  if (typeof v === 'string') return JSON.stringify(v);
  if (v === undefined) return 'undefined';
  if (v === null) return 'null';
  if (Array.isArray(v)) return `an array of length ${v.length}`;
  return typeof v;
}

function paramName(name: string, index: number): string {
  return index < 0 ? name : `${name}[${index}]`;
}

/** Throws `RangeError("<fn>: <name> <what>, got <value>")`. */
export function fail(fn: string, name: string, what: string, got: unknown): never {
  throw new RangeError(`${fn}: ${name} ${what}, got ${describeValue(got)}`);
}

/** Throws a RangeError with a free-form reason (for combinations no real unit can produce). */
export function failWith(fn: string, message: string): never {
  throw new RangeError(`${fn}: ${message}`);
}

/** True for a finite number > 0 (no throw). */
export function isPositive(v: unknown): v is number {
  return typeof v === 'number' && v > 0 && v !== Infinity;
}

/** Any finite number. */
export function finite(fn: string, name: string, v: number, index = -1): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) fail(fn, paramName(name, index), 'must be a finite number', v);
  return v;
}

/** A finite number > 0 (a physical quantity such as µF, V, Hz, kvar, kVA). */
export function positive(fn: string, name: string, v: number, index = -1): number {
  if (typeof v !== 'number' || !(v > 0) || v === Infinity) fail(fn, paramName(name, index), 'must be a finite number > 0', v);
  return v;
}

/** A finite number ≥ 0. */
export function nonNegative(fn: string, name: string, v: number, index = -1): number {
  if (typeof v !== 'number' || !(v >= 0) || v === Infinity) fail(fn, paramName(name, index), 'must be a finite number ≥ 0', v);
  return v;
}

/** A power factor in (0, 1]. */
export function powerFactor(fn: string, name: string, v: number): number {
  if (typeof v !== 'number' || !(v > 0 && v <= 1)) fail(fn, name, 'must be a power factor in (0, 1]', v);
  return v;
}

/** A detuning factor p = X_L/X_C in (0, 0.5). */
export function detuning(fn: string, name: string, v: number): number {
  if (typeof v !== 'number' || !(v > 0 && v < 0.5)) fail(fn, name, 'must be a detuning factor in (0, 0.5)', v);
  return v;
}

/** An array of exactly `length` finite numbers > 0. */
export function positiveArray(fn: string, name: string, v: readonly number[], length: number, what: string): void {
  if (!Array.isArray(v) || v.length !== length) {
    fail(fn, name, `must hold ${length} value${length === 1 ? '' : 's'} (${what})`, v);
  }
  for (let i = 0; i < length; i++) positive(fn, name, v[i] as number, i);
}

/** A triple of finite numbers > 0 in terminal order 1-2, 2-3, 3-1. */
export function positiveTriple(fn: string, name: string, v: readonly number[]): void {
  if (Array.isArray(v) && v.length === 3 && isPositive(v[0]) && isPositive(v[1]) && isPositive(v[2])) return;
  positiveArray(fn, name, v, 3, 'terminal order 1-2, 2-3, 3-1');
}

/** One of a fixed set of string values. */
export function oneOf<T extends string>(fn: string, name: string, v: T, allowed: readonly T[]): T {
  if (!allowed.includes(v)) fail(fn, name, `must be one of ${allowed.map((a) => `'${a}'`).join(', ')}`, v);
  return v;
}
