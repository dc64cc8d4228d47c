/** How a capacitor unit's elements are connected inside. */
export type Connection = 'delta' | 'star' | 'single-phase';

/** The rating printed on a capacitor unit. */
export interface Nameplate {
  /** Rated reactive power (three-phase total for a three-phase unit), kvar. */
  kvar: number;
  /** Rated voltage, line-to-line for a three-phase unit, V rms. */
  voltageV: number;
  /** Rated frequency, Hz. */
  frequencyHz: number;
  connection: Connection;
}

/** Three values in terminal order 1-2, 2-3, 3-1 (µF or A, as the name says). */
export type Triple = [number, number, number];

/** All connections, for validation and forms. */
export const CONNECTIONS: readonly Connection[] = ['delta', 'star', 'single-phase'];
