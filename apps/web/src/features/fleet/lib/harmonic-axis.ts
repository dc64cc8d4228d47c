import { CHARACTERISTIC_HARMONICS } from '@varden/engineering';
import type { SiteHealth } from '@varden/schemas';
import { formatNumber, nbsp, ordinal } from './number-format';
import { stepsText } from './step-labels';

/**
 * Placing a site's harmonic facts on an axis of harmonic orders: the characteristic orders
 * (5, 7, 11, 13; the 3rd too where a bank is detuned for it, p ≥ 10 %), each switchable
 * combination of undetuned steps at its resonance order with the supply (h_r = √(S_sc/Q),
 * engineering-reference.md §5) and each detuned step at its tuning order f_r/f₁ (§4).
 */

export const axisFirstOrder = 1;
export const axisLastOrder = 15;
/** Where markers beyond the 15th sit, just right of the last tick. */
export const beyondOrder = 15.7;

/** A detuning factor this high is chosen where a 3rd harmonic is present (14 %: fr 133.6 Hz at 50 Hz) [COMMON] §4. */
export const thirdHarmonicDetuning = 0.1;

export type AxisTick = { order: number; hz: number; characteristic: boolean };

/** Orders 1 to 15 with the characteristic ones marked; the 3rd only when a bank is detuned for it. */
export function harmonicTicks(frequencyHz: number, withThird: boolean): AxisTick[] {
  const characteristic = new Set<number>(withThird ? [3, ...CHARACTERISTIC_HARMONICS] : CHARACTERISTIC_HARMONICS);
  return Array.from({ length: axisLastOrder - axisFirstOrder + 1 }, (_, i) => {
    const order = axisFirstOrder + i;
    return { order, hz: order * frequencyHz, characteristic: characteristic.has(order) };
  });
}

/** Whether any bank of the site is detuned for a 3rd harmonic. */
export function needsThirdHarmonic(health: Pick<SiteHealth, 'banks'>): boolean {
  return health.banks.some((bank) => bank.detuned && (bank.detuningFactor ?? 0) >= thirdHarmonicDetuning);
}

export type AxisMarker = {
  id: string;
  /** resonance: above the axis; tuning (a step now) and design (the bank's design tuning): below. */
  kind: 'resonance' | 'tuning' | 'design';
  order: number;
  /** Where it is drawn: the order, or {@link beyondOrder} when past the 15th. */
  shownOrder: number;
  beyond: boolean;
  /** A resonance within 10 % of a characteristic harmonic, or a step tuned that close to one. */
  warning: boolean;
  /** A detuned step tuned more than 5 % above its design (not yet near a harmonic). */
  shifted: boolean;
  /** Short text on the drawing. */
  label: string;
  /** The whole fact in words, for the table and the text alternative. */
  description: string;
  bankName: string;
  /** What is switched in or tuned: "steps 1–4". */
  steps: string;
  hz: number | null;
  kvar: number | null;
  nearestHarmonic: number | null;
  distancePct: number | null;
};

const orderText = (order: number, locale?: string) => formatNumber(order, 2, locale);
const hzText = (hz: number, locale?: string) => `${formatNumber(hz, 0, locale)}${nbsp}Hz`;
const sameOrder = (a: number, b: number) => Math.abs(a - b) < 0.005;

/** Every marker of the site, resonance first, bank by bank. */
export function harmonicAxisMarkers(health: Pick<SiteHealth, 'banks' | 'frequencyHz'>, locale?: string): AxisMarker[] {
  const markers: AxisMarker[] = [];
  const f = health.frequencyHz;
  for (const bank of health.banks) {
    const beyond: AxisMarker[] = [];
    for (const [i, resonance] of bank.resonance.entries()) {
      const steps = stepsText(resonance.stepNumbers);
      const isBeyond = resonance.order > axisLastOrder;
      const near = resonance.warning ? `, within ${formatNumber(resonance.distancePct, 0, locale)}${nbsp}% of the ${ordinal(resonance.nearestHarmonic)}` : '';
      const marker: AxisMarker = {
        id: `resonance-${bank.id}-${i}`,
        kind: 'resonance',
        order: resonance.order,
        shownOrder: isBeyond ? beyondOrder : resonance.order,
        beyond: isBeyond,
        warning: resonance.warning,
        shifted: false,
        label: `${bank.name} ${steps.replace(/^steps? /, '')}${resonance.warning ? ` near ${ordinal(resonance.nearestHarmonic)}` : ''}`,
        description: `${bank.name}, ${steps} in (${formatNumber(resonance.kvar, 1, locale)}${nbsp}kvar): resonance with the supply at order ${orderText(resonance.order, locale)}${near}`,
        bankName: bank.name,
        steps,
        hz: resonance.order * f,
        kvar: resonance.kvar,
        nearestHarmonic: resonance.nearestHarmonic,
        distancePct: resonance.distancePct,
      };
      (isBeyond && !resonance.warning ? beyond : markers).push(marker);
    }
    // Small combinations resonate far above the 15th: one marker at the axis end says so.
    if (beyond.length > 0) {
      const first = beyond[0]!;
      markers.push({
        ...first,
        id: `resonance-${bank.id}-beyond`,
        order: Math.min(...beyond.map((m) => m.order)),
        label:
          beyond.length === 1
            ? `${bank.name} ${first.steps.replace(/^steps? /, '')} at ${orderText(first.order, locale)}`
            : `${bank.name}: ${beyond.length} combinations at ${formatNumber(Math.min(...beyond.map((m) => m.order)), 1, locale)}–${formatNumber(Math.max(...beyond.map((m) => m.order)), 1, locale)}`,
        description: beyond.map((m) => m.description).join('; ') + ' (beyond the 15th)',
        steps: beyond.map((m) => m.steps).join(', '),
        kvar: null,
        hz: null,
      });
    }

    const tuned = bank.steps.filter((step) => step.tuning !== null);
    if (tuned.length === 0) continue;
    // Steps tuned alike share one marker.
    const groups: { order: number; steps: typeof tuned }[] = [];
    for (const step of tuned) {
      const order = step.tuning!.tuningHz / f;
      const group = groups.find((g) => sameOrder(g.order, order));
      if (group) group.steps.push(step);
      else groups.push({ order, steps: [step] });
    }
    const designOrder = tuned[0]!.tuning!.designTuningHz / f;
    const designHz = tuned[0]!.tuning!.designTuningHz;
    let anyShifted = false;
    for (const group of groups) {
      const tuning = group.steps[0]!.tuning!;
      const steps = stepsText(group.steps.map((s) => s.number));
      const asDesigned = sameOrder(group.order, designOrder);
      anyShifted ||= !asDesigned;
      const warning = group.steps.some((s) => s.tuning!.nearHarmonic);
      const shifted = !warning && group.steps.some((s) => s.tuning!.tuningShifted);
      const state = warning
        ? `, within ${formatNumber(tuning.distancePct, 0, locale)}${nbsp}% of the ${ordinal(tuning.nearestHarmonic)}`
        : asDesigned
          ? ', as designed'
          : `, ${tuning.shiftPct >= 0 ? 'up' : 'down'} ${formatNumber(Math.abs(tuning.shiftPct), 1, locale)}${nbsp}% from its design ${hzText(designHz, locale)}`;
      markers.push({
        id: `tuning-${bank.id}-${group.steps[0]!.id}`,
        kind: 'tuning',
        order: group.order,
        shownOrder: Math.min(group.order, beyondOrder),
        beyond: group.order > axisLastOrder,
        warning,
        shifted,
        label: `${bank.name} ${steps.replace(/^steps? /, '')} · ${hzText(tuning.tuningHz, locale)}`,
        description: `${bank.name}, ${steps}: tuned at ${hzText(tuning.tuningHz, locale)} (order ${orderText(group.order, locale)})${state}`,
        bankName: bank.name,
        steps,
        hz: tuning.tuningHz,
        kvar: null,
        nearestHarmonic: tuning.nearestHarmonic,
        distancePct: tuning.distancePct,
      });
    }
    if (anyShifted) {
      markers.push({
        id: `design-${bank.id}`,
        kind: 'design',
        order: designOrder,
        shownOrder: designOrder,
        beyond: false,
        warning: false,
        shifted: false,
        label: `${bank.name} design · ${hzText(designHz, locale)}`,
        description: `${bank.name}: designed to tune at ${hzText(designHz, locale)} (order ${orderText(designOrder, locale)}, p ${formatNumber(100 * (bank.detuningFactor ?? 0), 2, locale)}${nbsp}%)`,
        bankName: bank.name,
        steps: '',
        hz: designHz,
        kvar: null,
        nearestHarmonic: null,
        distancePct: null,
      });
    }
  }
  return markers;
}

export type AxisScale = { width: number; left: number; right: number };

/** x of an order on the axis: orders 1…15 spread over the width less the margins, the beyond zone after. */
export function orderX(order: number, { width, left, right }: AxisScale): number {
  const clamped = Math.min(Math.max(order, axisFirstOrder), beyondOrder);
  return left + ((clamped - axisFirstOrder) / (beyondOrder - axisFirstOrder)) * (width - left - right);
}

/** An estimate of a label's drawn width at 12 px Work Sans, px. */
export function labelWidth(text: string): number {
  return Math.ceil(text.length * 6.4) + 4;
}

/**
 * Stacks labels in lanes so none overlaps: each item takes the lowest lane whose last label
 * ends at least `gap` px before it starts. Items are [left, right] extents in px; the result is
 * each item's lane, in input order.
 */
export function assignLanes(extents: ReadonlyArray<{ start: number; end: number }>, gap = 6): number[] {
  const order = extents.map((extent, i) => ({ ...extent, i })).sort((a, b) => a.start - b.start);
  const laneEnds: number[] = [];
  const lanes = new Array<number>(extents.length);
  for (const item of order) {
    let lane = laneEnds.findIndex((end) => end + gap <= item.start);
    if (lane === -1) {
      lane = laneEnds.length;
      laneEnds.push(item.end);
    } else laneEnds[lane] = item.end;
    lanes[item.i] = lane;
  }
  return lanes;
}

/**
 * A label's extent beside its marker at x: to the right of the pin, or to its left when it
 * would run past the drawing's right edge.
 */
export function labelExtent(x: number, text: string, width: number): { start: number; end: number; anchor: 'start' | 'end' } {
  const w = labelWidth(text);
  if (x + 4 + w <= width) return { start: x - 2, end: x + 4 + w, anchor: 'start' };
  return { start: x - 4 - w, end: x + 2, anchor: 'end' };
}

/** The text alternative of the whole axis, sentence by sentence. */
export function harmonicAxisSummary(health: Pick<SiteHealth, 'banks' | 'frequencyHz'>, locale?: string): string {
  const third = needsThirdHarmonic(health);
  const characteristic = (third ? [3, ...CHARACTERISTIC_HARMONICS] : [...CHARACTERISTIC_HARMONICS]).map((n) => ordinal(n));
  const markers = harmonicAxisMarkers(health, locale);
  const lines = [
    `Harmonic orders 1 to 15 at ${formatNumber(health.frequencyHz, 0, locale)}${nbsp}Hz, with the ${characteristic.slice(0, -1).join(', ')} and ${characteristic.at(-1)} marked as characteristic harmonics.`,
  ];
  if (markers.length === 0) lines.push('No bank has undetuned steps to resonate with the supply or detuned steps to place.');
  for (const marker of markers) lines.push(`${marker.description}${marker.warning ? ' (warning)' : ''}.`);
  return lines.join(' ');
}
