import { contactorLifeUsed, correctionKvar, tanPhiFromPf } from '@varden/engineering';
import { fromEngineering, ImplausibleValues } from './engineering-call';
import {
  deviationWords,
  flagMessage,
  type BankRecord,
  type ContactorRecord,
  type FlagDraft,
  type FuseSetRecord,
  type InputFor,
  type Outcome,
  type ReactorRecord,
  type SiteRecord,
  type StepRecord,
} from './evaluation-types';

/** An inductance as people write it: three decimals of a millihenry, not a float's every digit. */
const mh = (value: number) => value.toFixed(3);

/** Share of rated electrical endurance above which a contactor is flagged [COMMON] §7 (common practice). */
export const contactorFlagAbovePct = 80;
/** A reactor's inductance within this of the register is fine [COMMON] (common practice). */
export const reactorTolerancePct = 5;
/** Beyond this the value entered is more likely mH/µH confusion than a reactor. */
export const reactorImplausiblePct = 30;
/** Voltage THD above which an undetuned bank risks resonance with the supply [COMMON] §5. */
export const bankThdNotePct = 5;

/** The message engineering-reference §7 gives for a blown fuse. */
export const blownFuseAdvice = "a blown fuse usually means a failed capacitor: investigate, don't just re-fuse";

/**
 * Contactor: share of rated electrical endurance used, flagged above 80 % (common practice,
 * AC-6b endurance per datasheet, IEC 60947-4-1) §7; burnt contacts flagged.
 */
export function evaluateContactorReading(
  input: InputFor<'contactor'>,
  ctx: { contactor: ContactorRecord; step: StepRecord; previousCounter: number | null },
): Outcome {
  const where = `Step ${ctx.step.number} contactor`;
  const implausible = new ImplausibleValues();
  const life = fromEngineering('operationsCounter', () =>
    contactorLifeUsed({
      counterNow: input.operationsCounter,
      counterAtInstall: ctx.contactor.counterAtInstall,
      ratedOperations: ctx.contactor.ratedOperations,
      flagAbovePct: contactorFlagAbovePct,
    }),
  );
  if (ctx.previousCounter !== null && input.operationsCounter < ctx.previousCounter) {
    implausible.add(
      'operationsCounter',
      `The counter reads ${input.operationsCounter}, fewer than the ${ctx.previousCounter} recorded before: a counter only counts up. Was it reset, or is this another contactor?`,
    );
  }
  const confirmed = implausible.settle(input.confirmImplausible);
  const reasons: string[] = [`${life.usedPct.toFixed(1)} % of the rated ${ctx.contactor.ratedOperations} operations used (${life.operations} since installation)`];
  const endurance: string[] = [];
  if (life.flag) endurance.push(`has used ${life.usedPct.toFixed(1)} % of its rated ${ctx.contactor.ratedOperations} operations (flag above ${contactorFlagAbovePct} %)`);
  if (input.contactCondition === 'burnt') endurance.push('has burnt contacts');
  if (input.contactCondition === 'worn') reasons.push('contacts worn: check them again at the next inspection');
  const flags: FlagDraft[] = [];
  if (endurance.length) {
    reasons.push(...endurance.map((e) => `the contactor ${e}`));
    flags.push({
      kind: 'contactor-endurance',
      severity: 'action',
      target: 'contactor',
      targetId: ctx.contactor.id,
      message: flagMessage(`${where} ${endurance.join(' and ')}. Plan its replacement and check its pre-charge resistors.`),
    });
  }
  return {
    evaluation: {
      target: 'contactor',
      operations: life.operations,
      usedPct: life.usedPct,
      remainingOperations: life.remainingOperations,
      ratedOperations: ctx.contactor.ratedOperations,
      counterAtInstall: ctx.contactor.counterAtInstall,
      contactCondition: input.contactCondition,
      prechargeResistorsOhm: input.prechargeResistorsOhm,
      reasons,
      ...(confirmed.length ? { confirmedImplausible: confirmed } : {}),
    },
    band: null,
    deviationPct: null,
    flags,
  };
}

/**
 * Detuning reactor: thermal-switch continuity, inductance per phase against the register
 * (± 5 %, common practice).
 */
export function evaluateReactorReading(input: InputFor<'reactor'>, ctx: { reactor: ReactorRecord; step: StepRecord }): Outcome {
  const where = `Step ${ctx.step.number} reactor`;
  const implausible = new ImplausibleValues();
  const reasons: string[] = [];
  const notes: string[] = [];
  let severity: FlagDraft['severity'] = 'advisory';
  let inductance: Record<string, unknown> | undefined;
  if (input.inductanceMH) {
    const registerMH = ctx.reactor.inductanceMH;
    const deviationsPct = input.inductanceMH.map((l) => (l / registerMH - 1) * 100);
    const worst = deviationsPct.reduce((w, d) => (Math.abs(d) > Math.abs(w) ? d : w), 0);
    if (Math.abs(worst) > reactorImplausiblePct) {
      implausible.add('inductanceMH', `An inductance ${deviationWords(worst)} the register's ${mh(registerMH)} mH is more likely a unit slip (mH, µH) or another reactor.`);
    }
    const within = Math.abs(worst) <= reactorTolerancePct + 1e-9;
    const meanMH = input.inductanceMH.reduce((s, l) => s + l, 0) / 3;
    inductance = { registerMH, measuredMH: input.inductanceMH, meanMH, deviationsPct, within, tolerancePct: reactorTolerancePct };
    if (!within) {
      const text = `inductance ${deviationWords(worst)} the register's ${mh(registerMH)} mH (± ${reactorTolerancePct} % common practice): check the reactor for shorted turns and the register`;
      reasons.push(text);
      notes.push(text);
    } else {
      reasons.push(`inductance within ± ${reactorTolerancePct} % of the register's ${mh(registerMH)} mH`);
    }
  }
  if (!input.thermalSwitchClosed) {
    const text = 'thermal switch open: the reactor has overheated (harmonics, tuning drift, ventilation); find the cause before the step goes back in';
    reasons.push(text);
    notes.unshift(text);
    severity = 'action';
  }
  const confirmed = implausible.settle(input.confirmImplausible);
  const flags: FlagDraft[] = notes.length
    ? [{ kind: 'watch', severity, target: 'reactor', targetId: ctx.reactor.id, message: flagMessage(`${where}: ${notes.join('; ')}.`) }]
    : [];
  return {
    evaluation: {
      target: 'reactor',
      thermalSwitchClosed: input.thermalSwitchClosed,
      temperatureC: input.temperatureC ?? null,
      ...(inductance ? { inductance } : {}),
      reasons,
      ...(confirmed.length ? { confirmedImplausible: confirmed } : {}),
    },
    band: null,
    deviationPct: null,
    flags,
  };
}

/** Fuse set: continuity of each fuse and the rating against the register (engineering-reference §7). */
export function evaluateFuseReading(input: InputFor<'fuse-set'>, ctx: { fuseSet: FuseSetRecord; step: StepRecord }): Outcome {
  const where = `Step ${ctx.step.number}`;
  const blown = input.continuity.flatMap((ok, i) => (ok ? [] : [i + 1]));
  const flags: FlagDraft[] = [];
  const reasons: string[] = [];
  if (blown.length) {
    const which = blown.length === 1 ? `fuse ${blown[0]}` : `fuses ${blown.join(' and ')}`;
    reasons.push(`${which} without continuity`);
    flags.push({
      kind: 'blown-fuse',
      severity: 'action',
      target: 'fuse-set',
      targetId: ctx.fuseSet.id,
      message: flagMessage(`${where}, ${which} without continuity — ${blownFuseAdvice}.`),
    });
  }
  if (!input.ratingMatchesRegister) {
    const text = `the fuses fitted do not match the register's ${ctx.fuseSet.ratedCurrentA} A ${ctx.fuseSet.type}`;
    reasons.push(text);
    flags.push({
      kind: 'watch',
      severity: 'advisory',
      target: 'fuse-set',
      targetId: ctx.fuseSet.id,
      message: flagMessage(`${where}: ${text}. Fit the rating the register gives (gG at 1.6–1.8 × the capacitor current, handbook practice) or correct the register.`),
    });
  }
  return {
    evaluation: {
      target: 'fuse-set',
      continuity: input.continuity,
      blownFuses: blown,
      ratingMatchesRegister: input.ratingMatchesRegister,
      registerRatingA: ctx.fuseSet.ratedCurrentA,
      registerType: ctx.fuseSet.type,
      reasons,
    },
    band: null,
    deviationPct: null,
    flags,
  };
}

/**
 * Bank: the controller's PF (negative = leading) against the site's target and tariff, with
 * the correction missing Q_c = P·(tan φ1 − tan φ2) [STD-summary, IEEE 141] §6; a leading PF is
 * over-correction, also a fault §6; voltage THD recorded, noted above 5 % [COMMON] §5.
 */
export function evaluateBankReading(input: InputFor<'bank'>, ctx: { bank: BankRecord; site: SiteRecord }): Outcome {
  const notes: string[] = [];
  const pf = input.controllerPf;
  let pfResult: Record<string, unknown> | undefined;
  if (pf !== undefined) {
    const leading = pf < 0;
    const magnitude = Math.abs(pf);
    const belowTarget = !leading && magnitude < ctx.site.targetPf;
    let missingKvar: number | null = null;
    if (belowTarget && input.loadKw !== undefined && magnitude > 0) {
      missingKvar = correctionKvar({ kw: input.loadKw, pfFrom: magnitude, pfTo: ctx.site.targetPf });
    }
    let charged: boolean | null = null;
    if (!leading && magnitude > 0) {
      charged = ctx.site.tariffBasis === 'pf-threshold' ? magnitude < ctx.site.tariffLimit : tanPhiFromPf(magnitude) > ctx.site.tariffLimit;
    }
    if (leading) {
      notes.push(`the controller shows a leading PF ${magnitude.toFixed(2)}: the bank over-corrects (too many steps in, a step stuck on, or the controller's settings); check the controller and the contactors`);
    } else if (belowTarget) {
      notes.push(
        `PF ${magnitude.toFixed(2)} is below the site's target ${ctx.site.targetPf}${missingKvar !== null ? `: about ${missingKvar.toFixed(0)} kvar missing at ${input.loadKw} kW` : ''}`,
      );
    }
    if (charged) notes.push('below the tariff limit: reactive energy is being charged');
    pfResult = { controllerPf: pf, leading, overCorrected: leading, targetPf: ctx.site.targetPf, belowTarget, missingKvar, tariffCharged: charged };
  }
  if (input.voltageThdPct !== undefined && input.voltageThdPct > bankThdNotePct) {
    notes.push(
      ctx.bank.detuned
        ? `voltage THD ${input.voltageThdPct} %: keep watching the detuned steps' reactors and tuning`
        : `voltage THD ${input.voltageThdPct} % with an undetuned bank: check its resonance with the supply transformer`,
    );
  }
  return {
    evaluation: {
      target: 'bank',
      ...(pfResult ?? {}),
      loadKw: input.loadKw ?? null,
      voltageThdPct: input.voltageThdPct ?? null,
      cleaningDone: input.cleaningDone,
      filtersDone: input.filtersDone,
      reasons: notes,
    },
    band: null,
    deviationPct: null,
    flags: [],
  };
}
