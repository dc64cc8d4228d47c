import {
  bankResonance,
  ENGINEERING_VERSION,
  evaluateSite,
  evaluateStep,
  lostCorrectionCost,
  powerTriangle,
  type Connection,
  type StepCapacitor,
} from '@varden/engineering';
import type { SiteHealth } from '@varden/schemas';
import type { SiteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { AppError } from '../../http/app-error';
import { latestControllerReading, loadSiteForHealth, openFlagsOfSite, overdueOrdersOfSite } from './repository';

type Bands = SiteHealth['bands'];
const noBands = (): Bands => ({ healthy: 0, watch: 0, replace: 0, remeasure: 0, noReading: 0 });
const addBands = (into: Bands, from: Bands) => {
  for (const key of Object.keys(into) as Array<keyof Bands>) into[key] += from[key];
};

function triangleOf(kw: number, kvar: number) {
  const t = powerTriangle({ kw, kvar });
  return { kw, kvar, kva: t.kva, pf: t.powerFactor, phiDeg: t.phiDeg, leading: t.leading };
}

/**
 * A site's health from the register and each unit's stored latest evaluation: installed and
 * effective kvar per step (detuned steps at network voltage through their reactor), the PF the
 * site reaches at its load, the kvar missing to its target, the resonance order of each
 * switchable combination with the supply, the tuning of detuned steps and the estimated cost of
 * the lost correction. All figures come from packages/engineering.
 */
export async function siteHealth(db: Database, scope: SiteScope, siteId: number, hoursPerMonth: number, today = new Date()): Promise<SiteHealth> {
  const data = await loadSiteForHealth(db, siteId);
  if (!data || (scope !== 'all' && !scope.includes(siteId))) throw new AppError('not_found', `Site ${siteId} does not exist.`);
  const { site } = data;
  const siteBands = noBands();

  const banks = data.banks.map((bank) => {
    const bankSteps = data.steps.filter((s) => s.bankId === bank.id);
    const stepResults = bankSteps.flatMap((step) => {
      const units = data.units.filter((u) => u.unit.stepId === step.id);
      if (units.length === 0) return [];
      const bands = noBands();
      const capacitors: StepCapacitor[] = units.map(({ unit, latest }) => {
        if (latest) bands[latest.band] += 1;
        else bands.noReading += 1;
        return {
          nameplate: {
            kvar: unit.nameplateKvar,
            voltageV: unit.nameplateVoltageV,
            frequencyHz: unit.nameplateFrequencyHz,
            connection: unit.connection as Connection,
          },
          ...(latest ? { measuredUF: latest.legsUF } : {}),
        };
      });
      const reactor = data.reactors.find((r) => r.stepId === step.id);
      const evaluation = evaluateStep({
        networkVoltageV: site.voltageV,
        networkFrequencyHz: site.frequencyHz,
        capacitors,
        ...(bank.detuned && bank.detuningFactor
          ? { detuning: { designFactor: bank.detuningFactor, ...(reactor ? { reactorInductanceMH: reactor.inductanceMH } : {}) } }
          : {}),
      });
      addBands(siteBands, bands);
      const t = evaluation.tuning;
      return [
        {
          id: step.id,
          number: step.number,
          ratedKvar: step.ratedKvar,
          installedKvar: evaluation.installedKvar,
          effectiveKvar: evaluation.effectiveKvar,
          effectivePct: evaluation.effectivePct,
          bands,
          tuning: t
            ? {
                designTuningHz: t.designTuningHz,
                tuningHz: t.tuningHz,
                shiftPct: t.shiftPct,
                nearestHarmonic: t.nearestHarmonic,
                nearestHarmonicHz: t.nearestHarmonicHz,
                distancePct: t.distancePct,
                fifthHarmonicHz: 5 * site.frequencyHz,
                tuningShifted: t.tuningShifted,
                nearHarmonic: t.nearHarmonic,
              }
            : null,
          reasons: evaluation.reasons,
        },
      ];
    });
    // Steps that deliver nothing switch in no capacitance, so they take no part in the resonance.
    const delivering = bank.detuned ? [] : stepResults.filter((s) => s.effectiveKvar > 0);
    return {
      id: bank.id,
      name: bank.name,
      detuned: bank.detuned,
      detuningFactor: bank.detuningFactor,
      installedKvar: sum(stepResults.map((s) => s.installedKvar)),
      effectiveKvar: sum(stepResults.map((s) => s.effectiveKvar)),
      steps: stepResults,
      resonance:
        delivering.length > 0
          ? bankResonance({
              transformerKva: site.transformerKva,
              impedancePct: site.transformerImpedancePct,
              ...(site.utilityShortCircuitKva ? { utilityShortCircuitKva: site.utilityShortCircuitKva } : {}),
              stepsKvar: delivering.map((s) => s.effectiveKvar),
            }).map(({ stepsOn, ...rest }) => ({ stepNumbers: stepsOn.map((i) => delivering[i]!.number), ...rest }))
          : [],
    };
  });

  const installedKvar = sum(banks.map((b) => b.installedKvar));
  const effectiveKvar = sum(banks.map((b) => b.effectiveKvar));
  const lostKvar = Math.max(0, installedKvar - effectiveKvar);
  const [load, openFlags, overdueOrders] = await Promise.all([
    siteLoad(db, site, data.banks.map((b) => b.id), effectiveKvar),
    openFlagsOfSite(db, site.id),
    overdueOrdersOfSite(db, site.id, today.toISOString().slice(0, 10)),
  ]);
  const readingTimes = [...data.units.map((u) => u.latest?.recordedAt), load?.recordedAt].filter((t): t is Date => t instanceof Date);
  const newestReadingAt = readingTimes.length > 0 ? new Date(Math.max(...readingTimes.map((t) => t.getTime()))) : null;

  let power: Pick<SiteHealth, 'reachedPf' | 'leading' | 'requiredKvar' | 'missingKvar' | 'targetMet' | 'triangle' | 'cost'> = {
    reachedPf: null,
    leading: null,
    requiredKvar: null,
    missingKvar: null,
    targetMet: null,
    triangle: null,
    cost: null,
  };
  if (load) {
    const evaluation = evaluateSite({ kw: load.kw, loadKvar: load.loadKvar, correctionKvar: effectiveKvar, pfTarget: site.targetPf });
    const limit = site.tariffBasis === 'tan-phi-limit' ? { tanPhiLimit: site.tariffLimit } : { pfLimit: site.tariffLimit };
    const cost = lostCorrectionCost({
      kw: load.kw,
      loadKvar: load.loadKvar,
      installedKvar,
      effectiveKvar,
      hoursPerMonth,
      pricePerKvarh: site.pricePerKvarh,
      ...limit,
    });
    power = {
      reachedPf: evaluation.pfReached,
      leading: evaluation.leading,
      requiredKvar: evaluation.requiredKvar,
      missingKvar: evaluation.missingKvar,
      targetMet: evaluation.targetMet,
      triangle: { asInstalled: triangleOf(load.kw, load.loadKvar - installedKvar), now: triangleOf(load.kw, load.loadKvar - effectiveKvar) },
      cost: {
        estimate: true,
        currency: site.currency,
        pricePerKvarh: site.pricePerKvarh,
        hoursPerMonth,
        basis:
          site.tariffBasis === 'tan-phi-limit'
            ? `reactive energy above tan φ ${site.tariffLimit} is charged`
            : `reactive energy beyond PF ${site.tariffLimit} is charged`,
        extraKvarhPerMonth: cost.extraKvarhPerMonth,
        lostMonthlyCost: cost.lostMonthlyCost,
        assumptions: [
          `The load of ${load.kw.toFixed(0)} kW at PF ${load.loadPf.toFixed(2)} (${load.source === 'controller-reading' ? 'from the latest controller reading' : 'as entered by the planner'}) lasts ${hoursPerMonth} hours a month.`,
          'Every step is switched in while the load runs; the controller may switch fewer.',
          'The tariff charges reactive energy beyond the limit at one flat price; demand charges are not included.',
        ],
      },
    };
  }

  return {
    siteId: site.id,
    siteName: site.name,
    voltageV: site.voltageV,
    frequencyHz: site.frequencyHz,
    targetPf: site.targetPf,
    installedKvar,
    effectiveKvar,
    lostKvar,
    lostPct: installedKvar > 0 ? (100 * lostKvar) / installedKvar : 0,
    bands: siteBands,
    load: load ? { ...load, recordedAt: load.recordedAt?.toISOString() ?? null } : null,
    ...power,
    banks,
    newestReadingAt: newestReadingAt?.toISOString() ?? null,
    openFlags: openFlags.map((f) => ({ ...f, state: f.state as 'open' | 'in-hand', raisedAt: f.raisedAt.toISOString() })),
    overdueOrders,
    engineeringVersion: ENGINEERING_VERSION,
  };
}

const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);

/**
 * The site's load: from the newest controller reading (its PF is the corrected one, so the
 * load's own kvar is the net kvar plus what the bank delivered), else from the planner's entry.
 */
async function siteLoad(
  db: Database,
  site: { plannedLoadKw: number | null; plannedLoadPf: number | null },
  bankIds: number[],
  effectiveKvar: number,
) {
  const reading = await latestControllerReading(db, bankIds);
  if (reading) {
    const kw = reading.input.loadKw as number;
    const pf = reading.input.controllerPf as number;
    const netKvar = (Math.sign(pf) || 1) * ((kw * Math.sqrt(1 - pf * pf)) / Math.abs(pf));
    const loadKvar = Math.max(0, netKvar + effectiveKvar);
    return {
      source: 'controller-reading' as const,
      kw,
      loadKvar,
      loadPf: kw / Math.hypot(kw, loadKvar),
      recordedAt: reading.recordedAt,
      note: `Controller showed PF ${pf.toFixed(2)} at ${kw.toFixed(0)} kW; the load's own kvar adds back what the bank delivers.`,
    };
  }
  if (site.plannedLoadKw && site.plannedLoadPf) {
    const kw = site.plannedLoadKw;
    const loadKvar = (kw * Math.sqrt(1 - site.plannedLoadPf ** 2)) / site.plannedLoadPf;
    return {
      source: 'planned-load' as const,
      kw,
      loadKvar,
      loadPf: site.plannedLoadPf,
      recordedAt: null,
      note: 'The load a planner entered for this site; no controller reading with a load is recorded yet.',
    };
  }
  return null;
}
