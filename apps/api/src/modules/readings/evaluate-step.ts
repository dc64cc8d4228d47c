import { evaluateStep, type Connection, type StepCapacitor } from '@varden/engineering';
import { flagMessage, type BankRecord, type FlagDraft, type ReactorRecord, type SiteRecord, type StepRecord, type UnitRecord } from './evaluation-types';

export interface StepUnit {
  unit: UnitRecord;
  /** Delta-equivalent legs (or the element) of the unit's latest reading; undefined when it has none. */
  legsUF: number[] | undefined;
}

export interface StepTuningResult {
  evaluation: Record<string, unknown>;
  flag?: FlagDraft;
}

/**
 * The tuning of a detuned step from the latest readings of all its units and the reactor
 * (evaluateStep, [DERIVED] engineering-reference §4): f_r = f/√p' with p' from the reactor and
 * the measured capacitance. Flags when f_r rises more than 5 % above design, and as an action
 * when it comes within 10 % of a characteristic harmonic or passes the lowest one it should
 * block [COMMON] §4 (common practice). Undetuned steps have no tuning: undefined.
 */
export function evaluateStepTuning(a: {
  site: SiteRecord;
  bank: BankRecord;
  step: StepRecord;
  reactor: ReactorRecord | null;
  units: StepUnit[];
  /** Mean measured inductance per line (a reactor reading), used instead of the register's. */
  measuredInductanceMH?: number;
}): StepTuningResult | undefined {
  if (!a.bank.detuned) return undefined;
  const base = { stepId: a.step.id, stepNumber: a.step.number };
  const designFactor = a.reactor?.detuningFactor ?? a.bank.detuningFactor;
  if (!designFactor) return { evaluation: { ...base, note: 'the register gives no detuning factor for this step, so its tuning cannot be checked' } };
  if (a.units.length === 0) return { evaluation: { ...base, note: 'the step has no capacitor units in service' } };
  const measured = a.units.filter((u) => u.legsUF !== undefined).length;
  if (measured < a.units.length) {
    return {
      evaluation: {
        ...base,
        note: `tuning is checked once every unit of step ${a.step.number} has a reading (${measured} of ${a.units.length} so far)`,
        unitsMeasured: measured,
        unitsInStep: a.units.length,
      },
    };
  }
  const inductanceMH = a.measuredInductanceMH ?? a.reactor?.inductanceMH;
  const capacitors: StepCapacitor[] = a.units.map(({ unit, legsUF }) => ({
    nameplate: { kvar: unit.nameplateKvar, voltageV: unit.nameplateVoltageV, frequencyHz: unit.nameplateFrequencyHz, connection: unit.connection as Connection },
    measuredUF: legsUF,
  }));
  let result: ReturnType<typeof evaluateStep>;
  try {
    result = evaluateStep({
      networkVoltageV: a.site.voltageV,
      networkFrequencyHz: a.site.frequencyHz,
      capacitors,
      detuning: { designFactor, ...(inductanceMH !== undefined ? { reactorInductanceMH: inductanceMH } : {}) },
    });
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    // The unit's own reading stands; the step's register data is what does not fit.
    return { evaluation: { ...base, note: `the step's tuning could not be evaluated: ${error.message}` } };
  }
  const evaluation = {
    ...base,
    inductanceSource: a.measuredInductanceMH !== undefined ? 'reactor reading' : a.reactor ? 'register' : 'design detuning factor',
    inductanceMH: inductanceMH ?? null,
    nameplateKvar: result.nameplateKvar,
    installedKvar: result.installedKvar,
    effectiveKvar: result.effectiveKvar,
    effectivePct: result.effectivePct,
    capacitanceRatio: result.capacitanceRatio,
    tuning: result.tuning,
    reasons: result.reasons,
  };
  const t = result.tuning;
  if (!t || !(t.tuningShifted || t.nearHarmonic || t.aboveLowestHarmonic)) return { evaluation };
  const tuningReasons = result.reasons.filter((r) => r.startsWith('tuning'));
  const urgent = t.nearHarmonic || t.aboveLowestHarmonic;
  return {
    evaluation,
    flag: {
      kind: 'tuning-drift',
      severity: urgent ? 'action' : 'advisory',
      target: a.reactor ? 'reactor' : 'bank',
      targetId: a.reactor ? a.reactor.id : a.bank.id,
      message: flagMessage(
        `Step ${a.step.number} of ${a.bank.name}: ${tuningReasons.join('; ')}. ${urgent ? 'Take the step out of service until its capacitors are replaced.' : 'Plan the replacement of its capacitors before the tuning nears a harmonic.'}`,
      ),
    },
  };
}
