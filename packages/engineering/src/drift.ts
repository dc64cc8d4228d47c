import { fail, finite } from './validate.js';

/** Milliseconds in a mean Julian year (365.25 days). */
const MS_PER_YEAR = 365.25 * 86_400_000;
/** Earliest and latest instants that toISOString renders with a four-digit year (0001-01-01, 9999-12-31). */
const MIN_MS = -62_135_596_800_000;
const MAX_MS = 253_402_214_400_000;

/** A dated deviation of a unit from nameplate, e.g. assessCapacitor().deviationPct. */
export interface DriftPoint {
  /** ISO 8601 date or date-time ('2024-03-01' is read as UTC midnight). */
  date: string;
  deviationPct: number;
}

/** Result of {@link fitDrift}. */
export interface DriftFit {
  /** Least-squares slope of deviation against time, % per year (0 when it cannot be fitted). */
  ratePctPerYear: number;
  /** Date (YYYY-MM-DD, UTC) where the line crosses replaceBelowPct, or null. */
  replaceBy: string | null;
  /** Value of the fitted line at the latest point's date, %. */
  fittedLatestPct: number | null;
  /** True when the fitted line is already below replaceBelowPct at the latest point's date. */
  alreadyBelow: boolean;
  /** Number of points and of distinct dates used. */
  pointCount: number;
  distinctDates: number;
}

/**
 * Least-squares line of deviationPct against time t in years (365.25-day years):
 * rate = Σ(t − t̄)(y − ȳ) / Σ(t − t̄)²; the line crosses replaceBelowPct at
 * t* = t̄ + (replaceBelowPct − ȳ)/rate. Source: [DERIVED] ordinary least squares.
 *
 * replaceBy is null when there are fewer than 2 distinct dates (ratePctPerYear is then 0), when
 * the rate is ≥ 0 (no loss trend), or when the crossing is beyond the year 9999. When the unit
 * is already below the limit the crossing date lies in the past: it is still returned, and
 * `alreadyBelow` is true.
 */
export function fitDrift(a: { points: DriftPoint[]; replaceBelowPct: number }): DriftFit {
  return fit('fitDrift', a);
}

function fit(fn: string, a: { points: DriftPoint[]; replaceBelowPct: number }): DriftFit {
  if (!Array.isArray(a.points)) fail(fn, 'points', 'must be an array', a.points);
  finite(fn, 'replaceBelowPct', a.replaceBelowPct);
  const n = a.points.length;
  const ms = new Array<number>(n);
  let latest = -Infinity;
  let sumT = 0;
  let sumY = 0;
  for (let i = 0; i < n; i++) {
    const p = a.points[i] as DriftPoint;
    if (p === null || typeof p !== 'object') fail(fn, `points[${i}]`, 'must be an object', p);
    const t = typeof p.date === 'string' ? Date.parse(p.date) : NaN;
    if (!Number.isFinite(t)) fail(fn, `points[${i}].date`, 'must be an ISO 8601 date', p.date);
    finite(fn, `points[${i}].deviationPct`, p.deviationPct);
    ms[i] = t;
    if (t > latest) latest = t;
    sumT += t;
    sumY += p.deviationPct;
  }
  const distinct = new Set(ms).size;
  if (distinct < 2) {
    return { ratePctPerYear: 0, replaceBy: null, fittedLatestPct: n > 0 ? sumY / n : null, alreadyBelow: n > 0 && sumY / n < a.replaceBelowPct, pointCount: n, distinctDates: distinct };
  }
  // Centre the times before squaring to keep precision (epoch milliseconds are ~1e12).
  const tMean = sumT / n;
  const yMean = sumY / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    const dt = ((ms[i] as number) - tMean) / MS_PER_YEAR;
    sxy += dt * ((a.points[i] as DriftPoint).deviationPct - yMean);
    sxx += dt * dt;
  }
  const rate = sxy / sxx;
  const fittedLatest = yMean + rate * ((latest - tMean) / MS_PER_YEAR);
  const alreadyBelow = fittedLatest < a.replaceBelowPct;
  let replaceBy: string | null = null;
  if (rate < 0) {
    const crossMs = tMean + ((a.replaceBelowPct - yMean) / rate) * MS_PER_YEAR;
    if (crossMs >= MIN_MS && crossMs <= MAX_MS) replaceBy = new Date(crossMs).toISOString().slice(0, 10);
  }
  return { ratePctPerYear: rate, replaceBy, fittedLatestPct: fittedLatest, alreadyBelow, pointCount: n, distinctDates: distinct };
}

/**
 * Loss rate of a unit and the projected date it needs replacing: least-squares line of
 * deviationPct against time in years, crossing `replaceBelowPct` (negative, e.g. −10, the
 * policy's replace limit). Returns the rate in % per year and the crossing as an ISO date
 * (YYYY-MM-DD, UTC), or null if the rate is ≥ 0, there are fewer than 2 distinct dates, or the
 * crossing is beyond the year 9999. A unit already below the limit gets a crossing date in the
 * past. See {@link fitDrift} for the details. Source: [DERIVED] ordinary least squares.
 */
export function projectDrift(a: { points: DriftPoint[]; replaceBelowPct: number }): { ratePctPerYear: number; replaceBy: string | null } {
  const r = fit('projectDrift', a);
  return { ratePctPerYear: r.ratePctPerYear, replaceBy: r.replaceBy };
}
