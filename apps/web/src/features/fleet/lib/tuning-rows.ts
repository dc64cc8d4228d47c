import type { SiteHealth } from '@varden/schemas';
import { needsThirdHarmonic } from './harmonic-axis';

/** One detuned step's tuning for the tuning-drift chart and its table. */
export type TuningRow = {
  stepId: number;
  bankId: number;
  /** "Bank A · step 6". */
  label: string;
  bankName: string;
  stepNumber: number;
  designHz: number;
  tuningHz: number;
  shiftPct: number;
  nearestHarmonic: number;
  nearestHarmonicHz: number;
  distancePct: number;
  fifthHarmonicHz: number;
  standing: 'near' | 'shifted' | 'as-designed';
};

/** Every detuned step of the site with its tuning, bank by bank, step by step. */
export function tuningRows(health: Pick<SiteHealth, 'banks'>): TuningRow[] {
  return health.banks.flatMap((bank) =>
    bank.steps.flatMap((step) => {
      const t = step.tuning;
      if (!t) return [];
      return [
        {
          stepId: step.id,
          bankId: bank.id,
          label: `${bank.name} · step ${step.number}`,
          bankName: bank.name,
          stepNumber: step.number,
          designHz: t.designTuningHz,
          tuningHz: t.tuningHz,
          shiftPct: t.shiftPct,
          nearestHarmonic: t.nearestHarmonic,
          nearestHarmonicHz: t.nearestHarmonicHz,
          distancePct: t.distancePct,
          fifthHarmonicHz: t.fifthHarmonicHz,
          standing: t.nearHarmonic ? ('near' as const) : t.tuningShifted ? ('shifted' as const) : ('as-designed' as const),
        },
      ];
    }),
  );
}

/**
 * The frequency range the chart shows, Hz, in tens: from a little under the lowest tuning to a
 * little over the 5th (or the highest tuning, if above it); the 3rd stays in view where a bank
 * is detuned for it.
 */
export function tuningDomain(rows: readonly TuningRow[], health: Pick<SiteHealth, 'banks' | 'frequencyHz'>): [number, number] {
  const fifth = 5 * health.frequencyHz;
  const third = needsThirdHarmonic(health) ? 3 * health.frequencyHz : Infinity;
  const low = Math.min(third, ...rows.flatMap((r) => [r.designHz, r.tuningHz]));
  const high = Math.max(fifth, ...rows.map((r) => r.tuningHz));
  return [Math.max(0, Math.floor((low * 0.92) / 10) * 10), Math.ceil((high * 1.04) / 10) * 10];
}
