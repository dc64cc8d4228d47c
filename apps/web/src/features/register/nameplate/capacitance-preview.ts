import { ratedCapacitanceUF, type Connection } from '@varden/engineering';

/** A given capacitance further than this from the nameplate's gets a warning (the API warns at the same limit). */
export const capacitanceWarningPct = 2;

/** The nameplate fields as a form holds them while someone types: anything, until valid. */
export type NameplateDraft = {
  kvar: unknown;
  voltageV: unknown;
  frequencyHz: unknown;
  connection: unknown;
};

const connections: readonly string[] = ['delta', 'star', 'single-phase'] satisfies readonly Connection[];

const isConnection = (value: unknown): value is Connection => typeof value === 'string' && connections.includes(value);

/**
 * The rated capacitance per delta leg, star phase or element that the nameplate gives, µF, or
 * null while the nameplate is incomplete or impossible (packages/engineering refuses it with a
 * RangeError, so the form shows nothing rather than a wrong number).
 * Source of the formula: [DERIVED] engineering-reference.md §1, in ratedCapacitanceUF.
 */
export function ratedCapacitancePreview(draft: NameplateDraft): number | null {
  const { kvar, voltageV, frequencyHz, connection } = draft;
  if (typeof kvar !== 'number' || typeof voltageV !== 'number' || typeof frequencyHz !== 'number') return null;
  if (!isConnection(connection)) return null;
  try {
    return ratedCapacitanceUF({ kvar, voltageV, frequencyHz, connection });
  } catch (error) {
    if (error instanceof RangeError) return null;
    throw error;
  }
}

export type CapacitanceComparison = {
  /** 100·(given − rated)/rated, %. */
  differencePct: number;
  /** True when the difference is beyond ±capacitanceWarningPct. */
  beyondWarning: boolean;
};

/** How far a typed capacitance lies from the nameplate's, or null until both are known. */
export function compareCapacitance(givenUF: unknown, ratedUF: number | null): CapacitanceComparison | null {
  if (ratedUF === null || typeof givenUF !== 'number' || !Number.isFinite(givenUF) || givenUF <= 0) return null;
  const differencePct = ((givenUF - ratedUF) / ratedUF) * 100;
  return { differencePct, beyondWarning: Math.abs(differencePct) > capacitanceWarningPct };
}

/** What the capacitance figure stands for, in words, per connection. */
export function capacitanceBasis(connection: unknown): string {
  if (connection === 'delta') return 'per delta leg';
  if (connection === 'star') return 'per star phase';
  if (connection === 'single-phase') return 'for the element';
  return '';
}
