import type { SiteHealth } from '@varden/schemas';
import { countOf, formatNumber, nbsp, ordinal, pfText, quantityText, targetPfText } from './number-format';
import { flagKindLabel, stateLabels } from '../../work-orders/lib/work-order-words';
import { stepOfBank, stepsText } from './step-labels';

/** How soon a next step wants doing: act (now), plan (book it), note (good to know). */
export type Urgency = 'act' | 'plan' | 'note';

export type NextStep = {
  id: string;
  urgency: Urgency;
  /** The finding and what it asks, in plain words. */
  text: string;
  /** Where to do it. */
  link?: { href: string; label: string };
};

/** The pages a next step may lead to (config/paths and the other sections' pages). */
export type NextStepLinks = {
  flagQueue: (siteId: number, kind?: string) => string;
  siteRecord: (siteId: number) => string;
  step: (stepId: number) => string;
  bank: (bankId: number) => string;
  workOrder: (orderId: number) => string;
};

export type NextStepInput = {
  health: SiteHealth;
  links: NextStepLinks;
  locale?: string;
  /** Formats a due date ("10 Jan 2026"). */
  formatDate?: (iso: string) => string;
};

const kvar = (value: number, locale?: string) => quantityText(value, 'kvar', 1, locale);
const pct = (value: number, digits: number, locale?: string) => `${formatNumber(value, digits, locale)}${nbsp}%`;
const hz = (value: number, locale?: string) => `${formatNumber(value, 0, locale)}${nbsp}Hz`;
const urgencyRank: Record<Urgency, number> = { act: 0, plan: 1, note: 2 };
/** Flags whose finding the band counts (replace, watch, remeasure) or the tuning lines already state. */
const bandOrTuningKinds = new Set(['replace', 'watch', 'remeasure', 'tuning-drift']);

/** One line for reading aloud or printing: the text, then where to go. */
export function nextStepSentence(step: NextStep): string {
  return step.link ? `${step.text} — ${step.link.label}` : step.text;
}

/**
 * What a planner should do next at a site, most urgent first, built only from the health
 * figures: units to replace or remeasure, detuned steps drifting towards a harmonic, step
 * combinations resonating with the supply, over- or under-correction, the cost, and the
 * overdue orders.
 */
export function nextSteps({ health, links, locale, formatDate = (iso) => iso.slice(0, 10) }: NextStepInput): NextStep[] {
  const steps: NextStep[] = [];
  const { bands } = health;
  const units = bands.healthy + bands.watch + bands.replace + bands.remeasure + bands.noReading;

  if (health.banks.length === 0 || units === 0) {
    steps.push({
      id: 'no-bank',
      urgency: 'note',
      text: 'No correction bank with capacitor units is in the register for this site yet, so there is nothing to measure',
      link: { href: links.siteRecord(health.siteId), label: 'open the site record' },
    });
    return steps;
  }

  if (bands.replace > 0) {
    steps.push({
      id: 'replace',
      urgency: 'act',
      text: `${countOf(bands.replace, 'unit')} in the replace band`,
      link: { href: links.flagQueue(health.siteId, 'replace'), label: 'open the flag queue' },
    });
  }
  if (bands.remeasure > 0) {
    steps.push({
      id: 'remeasure',
      urgency: 'plan',
      text: `${countOf(bands.remeasure, 'unit')} ${bands.remeasure === 1 ? 'reads' : 'read'} more than 10${nbsp}% above the nameplate: the nameplate, the method or the meter is wrong, so measure again`,
      link: { href: links.flagQueue(health.siteId, 'remeasure'), label: 'open the flag queue' },
    });
  }

  for (const bank of health.banks) {
    for (const step of bank.steps) {
      const t = step.tuning;
      if (!t || !(t.nearHarmonic || t.tuningShifted)) continue;
      const where = `${stepOfBank(step.number, bank.name)} tuned at ${hz(t.tuningHz, locale)}, ${pct(t.distancePct, 0, locale)} from the ${ordinal(t.nearestHarmonic)}`;
      steps.push(
        t.nearHarmonic
          ? {
              id: `tuning-${step.id}`,
              urgency: 'act',
              text: `${where} (${hz(t.nearestHarmonicHz, locale)}): it absorbs harmonic current there; replace its capacitors before the reactor or the fuses fail`,
              link: { href: links.step(step.id), label: `open step ${step.number}` },
            }
          : {
              id: `tuning-${step.id}`,
              urgency: 'plan',
              text: `${where}, up ${pct(t.shiftPct, 1, locale)} from its design ${hz(t.designTuningHz, locale)} as its capacitors lose capacitance: plan their replacement`,
              link: { href: links.step(step.id), label: `open step ${step.number}` },
            },
      );
    }
    const warnings = bank.resonance.filter((r) => r.warning);
    if (warnings.length > 0) {
      const cases = warnings.map(
        (r) => `with ${stepsText(r.stepNumbers)} in (${kvar(r.kvar, locale)}) at order ${formatNumber(r.order, 1, locale)}, ${pct(r.distancePct, 0, locale)} from the ${ordinal(r.nearestHarmonic)}`,
      );
      steps.push({
        id: `resonance-${bank.id}`,
        urgency: 'plan',
        text: `${bank.name} resonates with the supply ${cases.join('; ')}: check the voltage distortion at those steps and consider detuned steps`,
        link: { href: links.bank(bank.id), label: `open ${bank.name}` },
      });
    }
  }

  // Open flags the bands and the tuning above do not already speak for: a blown fuse, a worn
  // contactor, a hot case, unbalanced legs. Action flags want doing now, unless an order has them in hand.
  for (const flag of health.openFlags.filter((f) => !bandOrTuningKinds.has(f.kind))) {
    const inHand = flag.correctiveOrderId !== null;
    steps.push({
      id: `flag-${flag.id}`,
      urgency: flag.severity === 'action' && !inHand ? 'act' : 'plan',
      text: `${flagKindLabel(flag.kind)} on ${flag.bankName}: ${flag.message.replace(/\.$/, '')}${inHand ? '; a corrective order has it in hand' : ''}`,
      link: inHand
        ? { href: links.workOrder(flag.correctiveOrderId!), label: `open order #${flag.correctiveOrderId}` }
        : { href: links.flagQueue(health.siteId, flag.kind), label: 'open the flag queue' },
    });
  }

  if (health.reachedPf !== null && health.leading) {
    steps.push({
      id: 'leading',
      urgency: 'act',
      text: `Over-corrected: the site reaches PF ${pfText(health.reachedPf, locale)} leading at this load, which is a fault too; switch fewer steps in or lower the controller's target`,
    });
  } else if (health.reachedPf !== null && health.targetMet === false && health.missingKvar !== null) {
    const missing = health.missingKvar;
    const cause =
      health.lostKvar <= 0
        ? `nothing is lost, so the bank is too small for this load: add ${kvar(missing, locale)}`
        : health.lostKvar >= missing
          ? `restoring the ${kvar(health.lostKvar, locale)} lost would meet it`
          : `restoring the ${kvar(health.lostKvar, locale)} lost is not enough: ${kvar(missing - health.lostKvar, locale)} more than installed is needed`;
    steps.push({
      id: 'target',
      urgency: 'plan',
      text: `PF ${pfText(health.reachedPf, locale)} is below the target ${targetPfText(health.targetPf, locale)}, ${kvar(missing, locale)} missing: ${cause}`,
    });
  }

  if (health.cost && health.cost.lostMonthlyCost > 0) {
    steps.push({
      id: 'cost',
      urgency: 'note',
      text: `The lost correction costs an estimated ${formatNumber(health.cost.lostMonthlyCost, 0, locale)}${nbsp}${health.cost.currency} a month at ${formatNumber(health.cost.hoursPerMonth, 0, locale)} hours of load`,
    });
  }

  for (const order of health.overdueOrders) {
    steps.push({
      id: `overdue-${order.id}`,
      urgency: 'plan',
      text: `“${order.title}” was due on ${formatDate(order.dueOn)} and is still ${stateLabels[order.state].toLowerCase()}`,
      link: { href: links.workOrder(order.id), label: 'open the order' },
    });
  }

  if (bands.watch > 0) {
    steps.push({
      id: 'watch',
      urgency: 'note',
      text: `${countOf(bands.watch, 'unit')} in the watch band: inspect ${bands.watch === 1 ? 'it' : 'them'} again sooner`,
    });
  }

  if (health.load === null) {
    steps.push({
      id: 'no-load',
      urgency: 'note',
      text: 'No load is known, so the reached PF, the power triangle and the cost wait for a controller reading with the load, or a planned load on the site record',
      link: { href: links.siteRecord(health.siteId), label: 'open the site record' },
    });
  }

  if (bands.noReading === units) {
    steps.push({
      id: 'no-reading',
      urgency: 'note',
      text: 'No reading yet: every figure assumes each unit still delivers its nameplate kvar until the first inspection is recorded',
    });
  } else if (bands.noReading > 0) {
    steps.push({
      id: 'no-reading',
      urgency: 'note',
      text: `${countOf(bands.noReading, 'unit')} ${bands.noReading === 1 ? 'has' : 'have'} no reading yet and ${bands.noReading === 1 ? 'counts' : 'count'} at ${bands.noReading === 1 ? 'its' : 'their'} nameplate kvar`,
    });
  }

  if (!steps.some((s) => s.urgency !== 'note') && bands.healthy === units && health.targetMet !== false) {
    steps.unshift({
      id: 'all-well',
      urgency: 'note',
      text:
        health.targetMet === true
          ? 'Nothing needs doing now: every unit reads healthy and the target PF is met'
          : 'Nothing needs doing now: every unit reads healthy',
    });
  }

  return steps.sort((a, b) => urgencyRank[a.urgency] - urgencyRank[b.urgency]);
}
