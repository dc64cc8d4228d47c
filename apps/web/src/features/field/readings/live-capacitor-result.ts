import {
  assessCapacitor,
  caseTemperatureLevel,
  defaultPolicy,
  legsFromLineCurrents,
  legsFromOpenPairs,
  legsFromShortedPairs,
  legsFromStarPhases,
  ratedLegUF,
  reactorInductanceMH,
  type Band,
  type Nameplate,
  type Triple,
} from '@varden/engineering';
import type { FieldMethod, WalkthroughBank } from '@varden/schemas';
import { reasonOf } from './decimal';

type WalkthroughStep = WalkthroughBank['steps'][number];
export type WalkthroughUnit = WalkthroughStep['units'][number];

/** Where the unit sits, for what the line-current method needs (a detuned step's reactor). */
export type UnitPlace = {
  detuned: boolean;
  detuningFactor: number | null;
  siteFrequencyHz: number;
  reactorInductanceMH: number | null;
  unitsInStep: number;
};

/** What the technician has typed so far, as numbers (undefined: empty, NaN: not a number). */
export type CapacitorValues = {
  method: FieldMethod;
  readingsUF: ReadonlyArray<number | undefined>;
  elementsUF: ReadonlyArray<number | undefined>;
  currentsA: ReadonlyArray<number | undefined>;
  measuredVoltageV: number | undefined;
  measuredFrequencyHz: number | undefined;
  caseTemperatureC?: number | undefined;
  bulging?: boolean;
  disconnectorOperated?: boolean;
};

export type LiveCapacitorResult =
  | { kind: 'incomplete'; missing: string }
  /** The values cannot come from a real unit (an engineering RangeError, in words). */
  | { kind: 'not-accepted'; reason: string }
  | {
      kind: 'result';
      legsUF: number[];
      ratedLegUF: number;
      kvarAtRated: number;
      deviationPct: number;
      legDeviationsPct: number[];
      unbalanceRatio: number;
      band: Band;
      reasons: string[];
    };

export const methodLabels: Record<FieldMethod, string> = {
  'open-pairs': 'Terminal pairs, third open',
  shorted: 'One against two shorted',
  'line-currents': 'Line currents',
  'per-element': 'Per element',
};

export function nameplateOf(unit: WalkthroughUnit): Nameplate {
  return { kvar: unit.nameplateKvar, voltageV: unit.nameplateVoltageV, frequencyHz: unit.nameplateFrequencyHz, connection: unit.connection };
}

/** The methods that apply: a single-phase unit has one element; a detuned step of several units cannot be split by its currents. */
export function methodsFor(unit: WalkthroughUnit, place: UnitPlace): FieldMethod[] {
  if (unit.connection === 'single-phase') return ['per-element'];
  const methods: FieldMethod[] = ['open-pairs', 'shorted', 'line-currents', 'per-element'];
  return place.detuned && place.unitsInStep > 1 ? methods.filter((m) => m !== 'line-currents') : methods;
}

function complete(values: ReadonlyArray<number | undefined>, count: number): values is Triple {
  return values.length >= count && values.slice(0, count).every((v) => v !== undefined && !Number.isNaN(v));
}

/** The words of an engineering refusal, with its parameter names turned into what is on the screen. */
function inWords(error: RangeError): string {
  return reasonOf(error)
    .replace(/^ReadingsUF\b/, 'The readings')
    .replace(/^CurrentsA\b/, 'The currents')
    .replace(/^PhasesUF\b/, 'The elements')
    .replace(/^MeasuredUF\b/, 'The legs');
}

function legsOf(unit: WalkthroughUnit, place: UnitPlace, v: CapacitorValues): number[] | LiveCapacitorResult {
  const three = unit.connection !== 'single-phase';
  switch (v.method) {
    case 'open-pairs':
    case 'shorted': {
      if (!three) return { kind: 'not-accepted', reason: 'A single-phase unit is measured per element.' };
      if (!complete(v.readingsUF, 3)) return { kind: 'incomplete', missing: 'Enter the three readings.' };
      // Terminal pairs with the third open §2(a), or one against two shorted §2(b) [DERIVED].
      return v.method === 'open-pairs' ? legsFromOpenPairs([...v.readingsUF]) : legsFromShortedPairs([...v.readingsUF]);
    }
    case 'per-element': {
      if (!three) {
        const [element] = v.elementsUF;
        if (element === undefined || Number.isNaN(element)) return { kind: 'incomplete', missing: 'Enter the capacitance of the element.' };
        return [element];
      }
      if (!complete(v.elementsUF, 3)) return { kind: 'incomplete', missing: 'Enter the capacitance of each of the three elements.' };
      // A star unit's elements are its phases; the assessment takes delta-equivalent legs [DERIVED] §1.
      return unit.connection === 'star' ? legsFromStarPhases([...v.elementsUF]) : [...v.elementsUF];
    }
    case 'line-currents': {
      if (!three) return { kind: 'not-accepted', reason: 'A single-phase unit is measured per element.' };
      if (!complete(v.currentsA, 3)) return { kind: 'incomplete', missing: 'Enter the three line currents.' };
      if (v.measuredVoltageV === undefined || Number.isNaN(v.measuredVoltageV)) return { kind: 'incomplete', missing: 'Enter the voltage measured with the currents.' };
      if (v.measuredFrequencyHz === undefined || Number.isNaN(v.measuredFrequencyHz)) return { kind: 'incomplete', missing: 'Enter the frequency measured with the currents.' };
      let inductanceMH: number | undefined;
      if (place.detuned) {
        if (place.unitsInStep > 1) {
          return { kind: 'not-accepted', reason: 'The reactor carries the current of every unit of this step: measure this unit de-energised instead.' };
        }
        if (place.reactorInductanceMH !== null) inductanceMH = place.reactorInductanceMH;
        else if (place.detuningFactor) {
          // L = p/(ω²·C_star) from the design factor and the rated legs [DERIVED] §4.
          const rated = ratedLegUF(nameplateOf(unit));
          inductanceMH = reactorInductanceMH({ detuningFactor: place.detuningFactor, legsUF: [rated, rated, rated], frequencyHz: place.siteFrequencyHz });
        } else {
          return { kind: 'not-accepted', reason: 'The register has no reactor for this detuned step: measure the unit de-energised.' };
        }
      }
      // Line currents at the measured voltage and frequency, the reactor added back [DERIVED] §2(c).
      return legsFromLineCurrents({
        currentsA: [...v.currentsA],
        voltageV: v.measuredVoltageV,
        frequencyHz: v.measuredFrequencyHz,
        ...(inductanceMH !== undefined ? { reactorInductanceMH: inductanceMH } : {}),
      });
    }
  }
}

/**
 * The result of a capacitor unit's reading as the technician types it, computed on the phone
 * with packages/engineering the way the server will: legs from the field method, kvar at rated
 * voltage and frequency, deviation, band and reasons (assessCapacitor with the re-measure limit
 * moved up to the unit's own upper tolerance), a bulging case or an operated disconnector
 * making it 'replace', and the case temperature (investigate above 55 °C, limit 65 °C §3).
 * The server's evaluation, shown once it is sent, is the record.
 */
export function liveCapacitorResult(unit: WalkthroughUnit, place: UnitPlace, values: CapacitorValues): LiveCapacitorResult {
  try {
    const legs = legsOf(unit, place, values);
    if (!Array.isArray(legs)) return legs;
    const nameplate = nameplateOf(unit);
    const policy = { remeasureAbovePct: Math.max(defaultPolicy.remeasureAbovePct, unit.tolerancePlusPct) };
    const assessment = assessCapacitor({ nameplate, measuredUF: legs, policy });
    const reasons = [...assessment.reasons];
    const t = values.caseTemperatureC;
    if (t !== undefined && !Number.isNaN(t)) {
      const level = caseTemperatureLevel(t);
      if (level === 'over-limit') reasons.push(`case temperature ${t} °C is above the 65 °C limit`);
      if (level === 'investigate') reasons.push(`case temperature ${t} °C is above 55 °C: investigate`);
    }
    const visualReplace = [
      ...(values.bulging ? ['the case is bulging'] : []),
      ...(values.disconnectorOperated ? ['the over-pressure disconnector has operated'] : []),
    ];
    for (const finding of visualReplace) reasons.push(`${finding}: replace the unit`);
    return {
      kind: 'result',
      legsUF: legs,
      ratedLegUF: ratedLegUF(nameplate),
      kvarAtRated: assessment.kvarAtRated,
      deviationPct: assessment.deviationPct,
      legDeviationsPct: assessment.legDeviationsPct,
      unbalanceRatio: assessment.unbalanceRatio,
      band: visualReplace.length ? 'replace' : assessment.band,
      reasons,
    };
  } catch (error) {
    if (error instanceof RangeError) return { kind: 'not-accepted', reason: inWords(error) };
    throw error;
  }
}

/** The server's stored result of a capacitor reading, read defensively from its evaluation. */
export type ServerCapacitorResult = { band: Band | null; deviationPct: number | null; kvarAtRated: number | null; legsUF: number[] | null; reasons: string[] };

export function serverCapacitorResult(reading: { band: Band | null; deviationPct: number | null; evaluation: Record<string, unknown> }): ServerCapacitorResult {
  const e = reading.evaluation;
  const numbers = (v: unknown) => (Array.isArray(v) && v.every((n) => typeof n === 'number') ? (v as number[]) : null);
  return {
    band: reading.band,
    deviationPct: reading.deviationPct,
    kvarAtRated: typeof e.kvarAtRated === 'number' ? e.kvarAtRated : null,
    legsUF: numbers(e.legsUF),
    reasons: Array.isArray(e.reasons) ? e.reasons.filter((r): r is string => typeof r === 'string') : [],
  };
}

/** Whether the server's result says something else than the phone's: another band, or a deviation apart by 0.1 % point or more. */
export function differsFromServer(live: LiveCapacitorResult, server: ServerCapacitorResult): boolean {
  if (live.kind !== 'result') return false;
  if (server.band !== live.band) return true;
  return server.deviationPct !== null && Math.abs(server.deviationPct - live.deviationPct) >= 0.1;
}
