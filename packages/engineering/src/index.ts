/**
 * @varden/engineering: every electrical computation of Varden, pure TypeScript with no I/O and
 * no dependencies. Formulas, limits and their sources: docs in each module and
 * /work/shared/engineering-reference.md (labels [STD], [STD-summary], [STD-memory],
 * [HANDBOOK], [DERIVED], [COMMON]).
 */
export type { Connection, Nameplate, Triple } from './types.js';
export { CONNECTIONS } from './types.js';
export { ENGINEERING_VERSION } from './version.js';

export {
  TWO_PI,
  omega,
  ratedCapacitanceUF,
  ratedLegUF,
  ratedCurrentA,
  kvarFromLegs,
  kvarFromElement,
  kvarFromStarPhases,
  starPhasesFromLegs,
  legsFromStarPhases,
  rescaleKvar,
} from './rating.js';

export {
  legsFromOpenPairs,
  legsFromShortedPairs,
  legsFromLineCurrents,
  openPairReadingsFromLegs,
  shortedReadingsFromLegs,
  lineCurrentsFromLegs,
  solveLegCurrents,
} from './field-methods.js';

export { CHARACTERISTIC_HARMONICS, nearestHarmonic, currentMethodHarmonicBiasPct } from './harmonics.js';

export {
  tuningFrequencyHz,
  detuningFactor,
  reactorInductanceMH,
  capacitorVoltageV,
  detunedStepKvar,
  detunedStepWithLoss,
} from './detuning.js';

export type { ResonanceCase } from './resonance.js';
export { resonanceOrder, shortCircuitKva, voltageRisePct, bankResonance } from './resonance.js';

export type { Policy, Band, CapacitorAssessment } from './assessment.js';
export { assessCapacitor, defaultPolicy, bandRank } from './assessment.js';

export type { TolerancePreset, CaseTemperatureLevel } from './limits.js';
export {
  TOLERANCE_PRESETS,
  withinTolerance,
  MAX_TERMINAL_PAIR_RATIO,
  OPERATING_LIMITS,
  caseTemperatureLevel,
  TEMPERATURE_CATEGORIES,
} from './limits.js';

export type { DriftPoint, DriftFit } from './drift.js';
export { projectDrift, fitDrift } from './drift.js';

export type { StepCapacitor, StepInput, StepTuning, StepEvaluation } from './step.js';
export { evaluateStep } from './step.js';

export type { BankSummary } from './bank.js';
export { bankSummary } from './bank.js';

export type { PowerTriangle, SiteLoad, SiteEvaluation } from './site.js';
export { powerTriangle, tanPhiFromPf, pfFromTanPhi, correctionKvar, evaluateSite } from './site.js';

export type { ReactiveEnergyCharge, LostCorrectionCost } from './tariff.js';
export { reactiveEnergyCharge, lostCorrectionCost } from './tariff.js';

export type { ContactorLife } from './contactor.js';
export { contactorLifeUsed } from './contactor.js';

export type { ReliabilityNeed, EquipmentCondition, ThermographySeverity, InsulationResistanceRow } from './maintenance.js';
export {
  NETA_INTERVAL_FACTORS,
  maintenanceIntervalMonths,
  thermographySeverity,
  INSULATION_RESISTANCE_TABLE,
  insulationResistanceMinimum,
  insulationResistanceOk,
  COMMON_LV_CADENCE,
} from './maintenance.js';

export type { DischargeRequirement } from './safety.js';
export { storedEnergyJ, maxDischargeResistanceOhm, dischargeTimeS, DISCHARGE_REQUIREMENTS } from './safety.js';
