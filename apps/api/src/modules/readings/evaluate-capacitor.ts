import {
  assessCapacitor,
  caseTemperatureLevel,
  currentMethodHarmonicBiasPct,
  defaultPolicy,
  DISCHARGE_REQUIREMENTS,
  insulationResistanceMinimum,
  kvarFromLegs,
  legsFromLineCurrents,
  legsFromOpenPairs,
  legsFromShortedPairs,
  legsFromStarPhases,
  maxDischargeResistanceOhm,
  ratedLegUF,
  reactorInductanceMH,
  withinTolerance,
  type Band,
  type Nameplate,
  type Triple,
} from '@varden/engineering';
import type { FieldMethod, workOrderKinds } from '@varden/schemas';
import { AppError } from '../../http/app-error';
import { fromEngineering, ImplausibleValues } from './engineering-call';
import {
  deviationWords,
  flagMessage,
  type BankRecord,
  type FlagDraft,
  type InputFor,
  type Outcome,
  type ReactorRecord,
  type SiteRecord,
  type StepRecord,
  type UnitRecord,
} from './evaluation-types';

export interface CapacitorContext {
  unit: UnitRecord;
  step: StepRecord;
  bank: BankRecord;
  site: SiteRecord;
  /** The step's reactor in service, if the register has one. */
  reactor: ReactorRecord | null;
  /**
   * Units in service in the step (this one included). Only a detuned step's line currents read
   * it, so it may be null for a step that is not detuned.
   */
  unitsInStep: number | null;
  orderKind: (typeof workOrderKinds)[number];
}

/** Above this, a voltage THD biases the line-current method enough to warn (engineering-reference §2(c): 5 % of 5th ≈ +3 %). */
export const thdWarningPct = 5;
/** Readings further above nameplate than this are more likely a slip than a capacitor (asked to confirm). */
export const implausiblyHighPct = 30;
/** Readings below half the nameplate are asked to be confirmed unless the disconnector has operated. */
export const implausiblyLowPct = -50;
/** A case this hot would have failed: the thermometer is more likely wrong. */
export const implausibleCaseTemperatureC = 100;

const methodField: Record<FieldMethod, 'readingsUF' | 'elementsUF' | 'currentsA'> = {
  'open-pairs': 'readingsUF',
  shorted: 'readingsUF',
  'per-element': 'elementsUF',
  'line-currents': 'currentsA',
};

interface Legs {
  legsUF: number[];
  lineCurrents?: Record<string, unknown>;
}

/**
 * A capacitor unit's reading: legs from the field method, kvar at rated conditions, deviation,
 * band and reasons (assessCapacitor), then the checks around it: case temperature, visual,
 * discharge resistor, insulation resistance, tolerance of a new unit. Sources beside each rule.
 */
export function evaluateCapacitorReading(input: InputFor<'capacitor-unit'>, ctx: CapacitorContext): Outcome {
  const { unit, step } = ctx;
  const where = `Step ${step.number}, unit ${unit.position}`;
  const nameplate: Nameplate = {
    kvar: unit.nameplateKvar,
    voltageV: unit.nameplateVoltageV,
    frequencyHz: unit.nameplateFrequencyHz,
    connection: unit.connection,
  };
  const field = methodField[input.method];
  const implausible = new ImplausibleValues();
  const warnings: string[] = [];
  const { legsUF, lineCurrents } = legsFromMethod(input, ctx, nameplate, implausible, warnings);

  // The unit's own upper tolerance (IEEE 18-1992 allows +15 %) moves the re-measure limit, never below +10 % [COMMON] §3.
  const policy = { remeasureAbovePct: Math.max(defaultPolicy.remeasureAbovePct, unit.tolerancePlusPct) };
  const assessment = fromEngineering(field, () => assessCapacitor({ nameplate, measuredUF: legsUF, policy }));
  const highest = Math.max(assessment.deviationPct, ...assessment.legDeviationsPct);
  if (highest > implausiblyHighPct) {
    implausible.add(
      field,
      `${where} reads ${highest.toFixed(1)} % above its nameplate (${nameplate.kvar} kvar): more than ${implausiblyHighPct} % above usually means the wrong meter range, method, unit or nameplate.`,
    );
  }
  if (assessment.deviationPct < implausiblyLowPct && !input.visual.disconnectorOperated) {
    implausible.add(
      field,
      `${where} reads ${Math.abs(assessment.deviationPct).toFixed(1)} % below its nameplate: less than half usually means a slipped decimal point or the wrong range (a unit whose disconnector has operated can read this low).`,
    );
  }

  const reasons = [...assessment.reasons];
  const flags: FlagDraft[] = [];
  const raise = (kind: FlagDraft['kind'], severity: FlagDraft['severity'], message: string) =>
    flags.push({ kind, severity, target: 'capacitor-unit', targetId: unit.id, message: flagMessage(message) });
  const watchNotes: string[] = [];

  // Case temperature: investigate above 55 °C, never above 65 °C [STD, a US facilities maintenance manual] §3.
  let caseTemperature: Record<string, unknown> | undefined;
  if (input.caseTemperatureC !== undefined) {
    const t = input.caseTemperatureC;
    if (t > implausibleCaseTemperatureC) {
      implausible.add('caseTemperatureC', `A case temperature of ${t} °C is above ${implausibleCaseTemperatureC} °C: check the thermometer and the spot measured (a unit this hot would have failed).`);
    }
    const level = caseTemperatureLevel(t);
    caseTemperature = { valueC: t, ambientC: input.ambientTemperatureC ?? null, level, investigateAboveC: 55, limitC: 65 };
    if (level === 'over-limit') {
      reasons.push(`case temperature ${t} °C is above the 65 °C limit`);
      raise('case-temperature', 'action', `${where}: case temperature ${t} °C is above the 65 °C limit. Take the step out of service and find the cause (over-voltage, harmonics, ventilation).`);
    } else if (level === 'investigate') {
      reasons.push(`case temperature ${t} °C is above 55 °C: investigate`);
      raise('case-temperature', 'advisory', `${where}: case temperature ${t} °C is above 55 °C. Investigate the cause (ventilation, over-voltage, harmonics).`);
    }
  }

  // Visual and mechanical checks, NETA MTS 7.20 [STD-memory for wording] §7.
  const visualReplace = [
    ...(input.visual.bulging ? ['the case is bulging'] : []),
    ...(input.visual.disconnectorOperated ? ['the over-pressure disconnector has operated'] : []),
  ];
  const visualWatch = [
    ...(input.visual.leakage ? ['leakage'] : []),
    ...(input.visual.discoloration ? ['discoloration'] : []),
    ...(input.visual.hotTerminals ? ['hot terminals (check the connections)'] : []),
  ];
  for (const finding of visualReplace) reasons.push(`${finding}: replace the unit`);
  if (visualWatch.length) {
    reasons.push(`visual: ${visualWatch.join(', ')}`);
    watchNotes.push(`visual check found ${visualWatch.join(', ')}`);
  }

  const dischargeResistor = input.dischargeResistorOhm === undefined ? undefined : checkDischargeResistor(input.dischargeResistorOhm, unit, nameplate);
  if (dischargeResistor && dischargeResistor.ok === false) {
    const text = `discharge resistance ${formatOhm(input.dischargeResistorOhm!)} is above the ${formatOhm(dischargeResistor.maxOhm as number)} that discharges an element to ${String(dischargeResistor.residualV)} V within ${String(dischargeResistor.seconds)} s (${String(dischargeResistor.requirement)}): treat the unit as charged for longer and replace the resistor`;
    reasons.push(text);
    watchNotes.push(text);
  }

  // Insulation resistance, terminals joined to case: ANSI/NETA MTS Table 100.1 [STD] §3.
  let insulation: Record<string, unknown> | undefined;
  if (input.insulationResistanceMOhm !== undefined) {
    const row = insulationResistanceMinimum(nameplate.voltageV);
    const ok = row === null ? null : input.insulationResistanceMOhm >= row.minimumMOhm;
    insulation = { measuredMOhm: input.insulationResistanceMOhm, minimumMOhm: row?.minimumMOhm ?? null, testVoltageVdc: row?.testVoltageVdc ?? null, ok };
    if (ok === false) {
      const text = `insulation resistance ${input.insulationResistanceMOhm} MΩ is below the ${row!.minimumMOhm} MΩ minimum (${row!.testVoltageVdc} V DC test, ANSI/NETA MTS Table 100.1): investigate`;
      reasons.push(text);
      watchNotes.push(text);
    }
  }

  // Tolerance of a new unit, the unit's preset (IEC 60831-1 / IEEE 18, from memory) §3.
  const tolerance = {
    minPct: unit.toleranceMinusPct,
    maxPct: unit.tolerancePlusPct,
    within: withinTolerance({ deviationPct: assessment.deviationPct, preset: { minPct: unit.toleranceMinusPct, maxPct: unit.tolerancePlusPct } }),
  };
  if (ctx.orderKind === 'baseline' && !tolerance.within) {
    const text = `new unit ${deviationWords(assessment.deviationPct)} nameplate, outside its tolerance ${unit.toleranceMinusPct} % … +${unit.tolerancePlusPct} %: take it up with the supplier`;
    reasons.push(text);
    watchNotes.push(text);
  }

  const confirmed = implausible.settle(input.confirmImplausible);

  // Physical evidence outweighs a reading that cannot be trusted: a bulging unit is replaced.
  const band: Band = visualReplace.length ? 'replace' : assessment.band;
  const summary = capacitanceSummary(assessment, unit.connection);
  if (band === 'replace') {
    const why = [...(assessment.band === 'replace' ? [summary] : []), ...visualReplace].join('; ');
    raise('replace', 'action', `${where}: ${why}. Plan a replacement.`);
  }
  if (assessment.band === 'remeasure') {
    raise('remeasure', 'advisory', `${where}: ${summary}, more than ${policy.remeasureAbovePct} % above nameplate. Check the nameplate, the method and the meter, and measure it again.`);
  }
  if (band === 'watch' || band === 'healthy') {
    const low = Math.min(assessment.deviationPct, ...assessment.legDeviationsPct) < defaultPolicy.watchBelowPct - 1e-9;
    if (low) watchNotes.unshift(`${summary} (watch below ${defaultPolicy.watchBelowPct} %)`);
    const unbalance = unbalanceOf(assessment.legDeviationsPct, assessment.unbalanceRatio);
    if (unbalance) raise('unbalance', 'advisory', `${where}: ${unbalance}. Inspect it again sooner.`);
  }
  if (watchNotes.length) raise('watch', 'advisory', `${where}: ${watchNotes.join('; ')}.`);

  const evaluation: Record<string, unknown> = {
    target: 'capacitor-unit',
    method: input.method,
    legsUF,
    kvarAtRated: assessment.kvarAtRated,
    deviationPct: assessment.deviationPct,
    legDeviationsPct: assessment.legDeviationsPct,
    unbalanceRatio: assessment.unbalanceRatio,
    band,
    capacitanceBand: assessment.band,
    reasons,
    warnings,
    nameplate: { ...nameplate, ratedLegUF: ratedLegUF(nameplate) },
    policy: { ...defaultPolicy, ...policy },
    tolerance,
    ...(lineCurrents ? { lineCurrents } : {}),
    ...(caseTemperature ? { caseTemperature } : {}),
    visual: { replace: visualReplace, watch: visualWatch },
    ...(dischargeResistor ? { dischargeResistor } : {}),
    ...(insulation ? { insulation } : {}),
    ...(confirmed.length ? { confirmedImplausible: confirmed } : {}),
  };
  return {
    evaluation,
    band,
    deviationPct: assessment.deviationPct,
    flags,
    unitResult: { legsUF, kvarAtRated: assessment.kvarAtRated, deviationPct: assessment.deviationPct, band },
  };
}

function legsFromMethod(
  input: InputFor<'capacitor-unit'>,
  ctx: CapacitorContext,
  nameplate: Nameplate,
  implausible: ImplausibleValues,
  warnings: string[],
): Legs {
  const single = nameplate.connection === 'single-phase';
  if (single && input.method !== 'per-element') {
    throw new AppError('invalid', 'A single-phase unit is measured per element.', { method: 'A single-phase unit has one element: measure it per element' });
  }
  switch (input.method) {
    case 'open-pairs':
      // Terminal pairs with the third open, closed-form inverse [DERIVED] §2(a).
      return { legsUF: fromEngineering('readingsUF', () => legsFromOpenPairs(input.readingsUF as Triple)) };
    case 'shorted':
      // One terminal against the other two shorted [DERIVED] §2(b).
      return { legsUF: fromEngineering('readingsUF', () => legsFromShortedPairs(input.readingsUF as Triple)) };
    case 'per-element': {
      const elements = input.elementsUF ?? [];
      if (single) {
        if (elements.length !== 1) throw new AppError('invalid', 'A single-phase unit has one element.', { elementsUF: 'Enter the one element of this single-phase unit' });
        return { legsUF: [elements[0] as number] };
      }
      if (elements.length !== 3) {
        const what = nameplate.connection === 'star' ? 'the three star phases C1, C2, C3' : 'the three delta legs C12, C23, C31';
        throw new AppError('invalid', `A three-phase unit has three elements.`, { elementsUF: `Enter ${what}` });
      }
      // A star unit's elements are its phases; assessments take delta-equivalent legs [DERIVED] §1.
      if (nameplate.connection === 'star') return { legsUF: fromEngineering('elementsUF', () => legsFromStarPhases(elements as Triple)) };
      return { legsUF: [...elements] };
    }
    case 'line-currents':
      return legsFromCurrents(input, ctx, nameplate, implausible, warnings);
  }
}

/**
 * Line currents at a measured voltage and frequency [DERIVED] §2(c). In a detuned step the
 * current sees X_C − X_L, so the reactor is added back (from the register, or from the design
 * detuning factor when no reactor is recorded). The legs are the capacitance itself, so kvar at
 * rated conditions follows from the nameplate: Q_rated = Q_m·(U_N/U_m)²·(f_N/f_m).
 */
function legsFromCurrents(
  input: InputFor<'capacitor-unit'>,
  ctx: CapacitorContext,
  nameplate: Nameplate,
  implausible: ImplausibleValues,
  warnings: string[],
): Legs {
  const currentsA = input.currentsA as Triple;
  const voltageV = input.measuredVoltageV as number;
  const frequencyHz = input.measuredFrequencyHz as number;
  let inductanceMH: number | undefined;
  let inductanceSource: 'register' | 'design-detuning-factor' | null = null;
  if (ctx.bank.detuned) {
    if (ctx.unitsInStep === null) throw new Error('evaluateCapacitorReading: a detuned step needs its count of units in service');
    if (ctx.unitsInStep > 1) {
      throw new AppError('invalid', 'In a detuned step with several units the line currents cannot be split between them.', {
        method: `The reactor of step ${ctx.step.number} carries the current of all ${ctx.unitsInStep} units: measure this unit de-energised (open pairs or shorted) instead`,
      });
    }
    if (ctx.reactor) {
      inductanceMH = ctx.reactor.inductanceMH;
      inductanceSource = 'register';
    } else if (ctx.bank.detuningFactor) {
      // L = p/(ω²·C_star) from the design factor and the rated legs [DERIVED] §4.
      const p = ctx.bank.detuningFactor;
      const rated = ratedLegUF(nameplate);
      inductanceMH = reactorInductanceMH({ detuningFactor: p, legsUF: [rated, rated, rated], frequencyHz: ctx.site.frequencyHz });
      inductanceSource = 'design-detuning-factor';
    } else {
      throw new AppError('invalid', 'This detuned step has neither a reactor nor a detuning factor in the register.', {
        method: 'The register lacks the reactor of this detuned step: measure the unit de-energised, or have the planner record the reactor',
      });
    }
  }
  if (Math.abs(frequencyHz / ctx.site.frequencyHz - 1) > 0.05) {
    implausible.add('measuredFrequencyHz', `The network here runs at ${ctx.site.frequencyHz} Hz and ${frequencyHz} Hz was entered.`);
  }
  if (Math.abs(voltageV / ctx.site.voltageV - 1) > 0.2) {
    implausible.add('measuredVoltageV', `The network here is ${ctx.site.voltageV} V and ${voltageV} V was entered: line-to-line voltage is expected.`);
  }
  const legsUF = fromEngineering('currentsA', () =>
    legsFromLineCurrents({ currentsA, voltageV, frequencyHz, ...(inductanceMH !== undefined ? { reactorInductanceMH: inductanceMH } : {}) }),
  );
  const meanCurrentA = (currentsA[0] + currentsA[1] + currentsA[2]) / 3;
  let harmonicBiasPct: number | null = null;
  if (input.voltageThdPct !== undefined && input.voltageThdPct > thdWarningPct) {
    // Upward bias of the current method, taking all the distortion as 5th harmonic [DERIVED] §2(c).
    harmonicBiasPct = currentMethodHarmonicBiasPct([{ order: 5, voltagePct: input.voltageThdPct }]);
    warnings.push(
      `voltage THD ${input.voltageThdPct} % biases the line-current method upward (about +${harmonicBiasPct.toFixed(1)} % if it is all 5th harmonic): the capacitance may be overstated; confirm with a de-energised measurement`,
    );
  }
  return {
    legsUF,
    lineCurrents: {
      currentsA,
      measuredVoltageV: voltageV,
      measuredFrequencyHz: frequencyHz,
      reactorInductanceMH: inductanceMH ?? null,
      reactorInductanceSource: inductanceSource,
      // √3·U·I: what the step delivered at the measured conditions (the effective kvar when detuned) [DERIVED] §2(c).
      measuredKvar: (Math.sqrt(3) * voltageV * meanCurrentA) / 1000,
      capacitorKvarAtMeasured: fromEngineering('currentsA', () => kvarFromLegs({ legsUF: legsUF as Triple, voltageV, frequencyHz })),
      voltageThdPct: input.voltageThdPct ?? null,
      harmonicBiasPct,
    },
  };
}

/**
 * Largest discharge resistance per element, R ≤ t/(C·ln(√2·U_N/U_R)) [DERIVED] §3, with the
 * requirement of the unit's market: IEC 60831-1, 75 V within 3 min [STD-summary] for 50 Hz
 * units; NEC 460 for 60 Hz units, 50 V within 1 min up to 600 V [STD-summary] and within
 * 5 min above [STD-memory]. The element is a delta leg at U_N, a star phase at U_N/√3, or the
 * single element; the value entered is taken across one element.
 */
function checkDischargeResistor(measuredOhm: number, unit: UnitRecord, nameplate: Nameplate): Record<string, unknown> {
  const id = unit.nameplateFrequencyHz === 60 ? (nameplate.voltageV <= 600 ? 'nec-460-lv' : 'nec-460-mv') : 'iec-60831-1';
  const requirement = DISCHARGE_REQUIREMENTS.find((r) => r.id === id) ?? DISCHARGE_REQUIREMENTS[0]!;
  const elementVoltageV = nameplate.connection === 'star' ? nameplate.voltageV / Math.sqrt(3) : nameplate.voltageV;
  try {
    const maxOhm = maxDischargeResistanceOhm({
      capacitanceUF: unit.capacitanceUF,
      voltageV: elementVoltageV,
      seconds: requirement.seconds,
      residualV: requirement.residualV,
    });
    return { measuredOhm, maxOhm, ok: measuredOhm <= maxOhm, requirement: requirement.label, residualV: requirement.residualV, seconds: requirement.seconds };
  } catch (error) {
    if (!(error instanceof RangeError)) throw error;
    // A unit whose peak voltage is below the residual limit needs no discharge device for it.
    return { measuredOhm, maxOhm: null, ok: null, requirement: requirement.label, note: error.message };
  }
}

function formatOhm(ohm: number): string {
  if (ohm >= 1e6) return `${(ohm / 1e6).toFixed(2)} MΩ`;
  if (ohm >= 1e3) return `${(ohm / 1e3).toFixed(1)} kΩ`;
  return `${ohm.toFixed(0)} Ω`;
}

function capacitanceSummary(a: { kvarAtRated: number; deviationPct: number; legDeviationsPct: number[] }, connection: Nameplate['connection']): string {
  const total = `${a.kvarAtRated.toFixed(1)} kvar at rated conditions, ${deviationWords(a.deviationPct)} nameplate`;
  if (connection === 'single-phase') return total;
  const lowest = Math.min(...a.legDeviationsPct);
  const index = a.legDeviationsPct.indexOf(lowest);
  const label = connection === 'star' ? `phase ${index + 1}` : (['leg 1-2', 'leg 2-3', 'leg 3-1'][index] ?? 'a leg');
  return `${total}; lowest ${label} ${deviationWords(lowest)}`;
}

/**
 * Unbalance: max/min of the elements above 1.08 (IEC 60871-1, from memory) or an element more
 * than 5 % from their mean [COMMON] §3. Elements share one rated value, so their ratios follow
 * from the deviations.
 */
function unbalanceOf(legDeviationsPct: number[], ratio: number): string | undefined {
  if (legDeviationsPct.length < 3) return undefined;
  const elements = legDeviationsPct.map((d) => 1 + d / 100);
  const mean = elements.reduce((s, e) => s + e, 0) / elements.length;
  const furthest = Math.max(...elements.map((e) => Math.abs(e / mean - 1) * 100));
  const parts: string[] = [];
  if (ratio > defaultPolicy.maxUnbalanceRatio + 1e-12) parts.push(`max/min ${ratio.toFixed(3)}, above ${defaultPolicy.maxUnbalanceRatio}`);
  if (furthest > defaultPolicy.maxLegFromMeanPct + 1e-9) parts.push(`an element ${furthest.toFixed(1)} % from the mean, beyond ${defaultPolicy.maxLegFromMeanPct} %`);
  return parts.length ? `elements unbalanced (${parts.join('; ')})` : undefined;
}
