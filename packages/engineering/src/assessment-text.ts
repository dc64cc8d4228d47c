/**
 * Wording of assessment reasons. Kept apart from the rules in assessment.ts.
 *
 * An assessment runs millions of times on a server and its reasons are the bulk of its cost,
 * so, for the default policy, each finished sentence is kept once made, keyed by what it says
 * (kind, leg, and the value as displayed: 0.1 % steps, or 0.001 for ratios). A sentence is
 * therefore built once per displayed value and then reused. Custom policies build their
 * sentences each time.
 */

/** Thresholds of a policy as shown in reasons. */
export interface LimitTexts {
  watch: string;
  replace: string;
  remeasure: string;
  ratio: string;
  fromMean: string;
  /** True for the default policy's texts: sentences may be cached. */
  cacheable: boolean;
}

/** A limit with a real minus sign: −10 %, +10 %, 0 %. */
export function limitText(pct: number): string {
  const v = Math.round(Math.abs(pct) * 100) / 100;
  return `${pct < 0 ? '−' : pct > 0 ? '+' : ''}${v} %`;
}

/** The threshold texts of a policy; `cacheable` only for the default policy. */
export function limitTexts(
  p: { watchBelowPct: number; replaceBelowPct: number; remeasureAbovePct: number; maxUnbalanceRatio: number; maxLegFromMeanPct: number },
  cacheable = false,
): LimitTexts {
  return {
    watch: limitText(p.watchBelowPct),
    replace: limitText(p.replaceBelowPct),
    remeasure: limitText(p.remeasureAbovePct),
    ratio: String(p.maxUnbalanceRatio),
    fromMean: `${Math.round(p.maxLegFromMeanPct * 100) / 100} %`,
    cacheable,
  };
}

/** |x| with 1 or 3 decimals, as Math.abs(x).toFixed(d) prints it. */
export function fixedAbs(x: number, decimals: 1 | 3): string {
  return Math.abs(x).toFixed(decimals);
}

/** "12.3 % below nameplate", "4.0 % above nameplate", "at nameplate". */
export function deviationText(pct: number): string {
  const r = Math.abs(pct).toFixed(1);
  if (r === '0.0') return 'at nameplate';
  return `${r} % ${pct < 0 ? 'below' : 'above'} nameplate`;
}

// Reason kinds. The subject index says what the sentence is about:
// 0 'output' (single-phase), 1 'total output' of legs, 2 'total output' of phases for the
// output kinds; 0–2 legs 1-2, 2-3, 3-1 and 3–5 phases 1, 2, 3 for element kinds;
// 0 legs, 1 phases for the ratio kinds.
export const OUTPUT_REMEASURE = 0;
export const OUTPUT_REPLACE = 1;
export const OUTPUT_WATCH = 2;
export const OUTPUT_HEALTHY = 3;
export const ELEMENT_REMEASURE = 4;
export const ELEMENT_REPLACE = 5;
export const ELEMENT_WATCH = 6;
export const ELEMENT_FROM_MEAN = 7;
export const UNBALANCED = 8;
export const HEALTHY_RATIO = 9;

const ELEMENT_LABELS = ['leg 1-2', 'leg 2-3', 'leg 3-1', 'phase 1', 'phase 2', 'phase 3'];
const CHECK_TEXT = ': check the nameplate, the method and the meter';

function build(kind: number, subject: number, value: number, t: LimitTexts): string {
  switch (kind) {
    case OUTPUT_REMEASURE:
      return `${subject === 0 ? 'output' : 'total output'} ${deviationText(value)} (re-measure above ${t.remeasure})${CHECK_TEXT}`;
    case OUTPUT_REPLACE:
      return `${subject === 0 ? 'output' : 'total output'} ${deviationText(value)} (replace below ${t.replace})`;
    case OUTPUT_WATCH:
      return `${subject === 0 ? 'output' : 'total output'} ${deviationText(value)} (watch below ${t.watch})`;
    case OUTPUT_HEALTHY:
      return subject === 0
        ? `output ${deviationText(value)}, within ${t.watch} … ${t.remeasure}`
        : `total output ${deviationText(value)}; every ${subject === 1 ? 'leg' : 'phase'} within ${t.watch} … ${t.remeasure}`;
    case ELEMENT_REMEASURE:
      return `${ELEMENT_LABELS[subject]} ${deviationText(value)} (re-measure above ${t.remeasure})${CHECK_TEXT}`;
    case ELEMENT_REPLACE:
      return `${ELEMENT_LABELS[subject]} ${deviationText(value)} (replace below ${t.replace})`;
    case ELEMENT_WATCH:
      return `${ELEMENT_LABELS[subject]} ${deviationText(value)} (watch below ${t.watch})`;
    case ELEMENT_FROM_MEAN:
      return `${ELEMENT_LABELS[subject]} ${fixedAbs(value, 1)} % ${value < 0 ? 'below' : 'above'} the mean of the ${subject < 3 ? 'legs' : 'phases'} (watch beyond ±${t.fromMean})`;
    case UNBALANCED:
      return `${subject === 0 ? 'legs' : 'phases'} unbalanced: max/min ${fixedAbs(value, 3)} (watch above ${t.ratio})`;
    default:
      return `, max/min ${fixedAbs(value, 3)}`;
  }
}

const KEY_LIMIT = 8_000; // two signs × displayed magnitudes below 400 % (0.1 % steps) or ratios below 4 (0.001 steps); 64 kB per kind and subject in use
const SLOTS: Array<Array<string | undefined> | undefined> = [];

/**
 * The sentence of `kind` about `subject` for `value` (a deviation in %, or a ratio for
 * UNBALANCED and HEALTHY_RATIO), with the thresholds in `t`. The value is first rounded to
 * what is displayed (0.1 %, or 0.001 for ratios), so cached and freshly built sentences agree.
 */
export function reasonText(kind: number, subject: number, value: number, t: LimitTexts): string {
  const scale = kind >= UNBALANCED ? 1000 : 10;
  const scaled = Math.round(Math.abs(value) * scale);
  const shown = (value < 0 ? -scaled : scaled) / scale;
  const key = scaled * 2 + (value < 0 ? 1 : 0);
  if (!t.cacheable || !(key < KEY_LIMIT)) return build(kind, subject, shown, t);
  const cat = kind * 8 + subject;
  let slot = SLOTS[cat];
  if (slot === undefined) {
    slot = new Array<string | undefined>(KEY_LIMIT);
    SLOTS[cat] = slot;
  }
  const hit = slot[key];
  if (hit !== undefined) return hit;
  const text = build(kind, subject, shown, t);
  slot[key] = text;
  return text;
}
