import type { Band } from '@varden/engineering';
import type { readingInput } from '@varden/schemas';
import type { z } from 'zod';
import type { banks, capacitorUnits, contactors, flagKinds, fuseSets, reactors, sites, steps } from '../../db/schema/index';

export type ReadingInputValue = z.output<typeof readingInput>;
export type ReadingTarget = ReadingInputValue['target'];
export type InputFor<T extends ReadingTarget> = Extract<ReadingInputValue, { target: T }>;

export type FlagKind = (typeof flagKinds)[number];
export type Severity = 'advisory' | 'action';

/** A flag a reading calls for; the service raises it unless one is already open on the target. */
export interface FlagDraft {
  kind: FlagKind;
  severity: Severity;
  target: ReadingTarget;
  targetId: number;
  message: string;
}

/** What the server makes of one reading. */
export interface Outcome {
  /** Stored as readings.evaluation (JSON), with the engineering version beside it. */
  evaluation: Record<string, unknown>;
  band: Band | null;
  deviationPct: number | null;
  flags: FlagDraft[];
  /** Capacitor units only: what unit_latest_evaluations keeps. */
  unitResult?: { legsUF: number[]; kvarAtRated: number; deviationPct: number; band: Band };
  /**
   * Capacitor units only: when the reading behind the unit's latest evaluation so far was taken
   * (null before its first), and the points its drift was fitted over then (null when that
   * evaluation was stored without them: they are read from the history).
   */
  unitHistory?: { latestAt: Date | null; driftPoints: Array<{ recordedAt: Date; deviationPct: number }> | null };
}

export type SiteRecord = Pick<typeof sites.$inferSelect, 'id' | 'voltageV' | 'frequencyHz' | 'targetPf' | 'tariffBasis' | 'tariffLimit'>;
export type BankRecord = Pick<typeof banks.$inferSelect, 'id' | 'name' | 'detuned' | 'detuningFactor'>;
export type StepRecord = Pick<typeof steps.$inferSelect, 'id' | 'number'>;
export type UnitRecord = Pick<
  typeof capacitorUnits.$inferSelect,
  | 'id'
  | 'position'
  | 'nameplateKvar'
  | 'nameplateVoltageV'
  | 'nameplateFrequencyHz'
  | 'connection'
  | 'capacitanceUF'
  | 'toleranceMinusPct'
  | 'tolerancePlusPct'
>;
export type ReactorRecord = Pick<typeof reactors.$inferSelect, 'id' | 'inductanceMH' | 'detuningFactor'>;
export type ContactorRecord = Pick<typeof contactors.$inferSelect, 'id' | 'ratedOperations' | 'counterAtInstall'>;
export type FuseSetRecord = Pick<typeof fuseSets.$inferSelect, 'id' | 'ratedCurrentA' | 'type'>;

/** A deviation as people read it: "12.0 % below", "3.1 % above", "at". */
export function deviationWords(pct: number): string {
  const r = Math.abs(pct).toFixed(1);
  if (r === '0.0') return 'at';
  return `${r} % ${pct < 0 ? 'below' : 'above'}`;
}

/** Flag messages fit the flags.message column (500 characters). */
export function flagMessage(text: string): string {
  return text.length <= 500 ? text : `${text.slice(0, 497)}…`;
}
