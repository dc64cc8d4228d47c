import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lusolve } from 'mathjs';
import { fitDrift, projectDrift } from './drift.js';

const DAY = 86_400_000;
const YEAR = 365.25 * DAY;
const at = (ms: number): string => new Date(ms).toISOString();
const T0 = Date.UTC(2020, 0, 1);

describe('projectDrift', () => {
  it('points on an exact line of −2 %/year reach −10 % after 5 years', () => {
    // [DERIVED] least squares through collinear points returns the line: y = −2·t, −10 % at t = 5 years (365.25-day years)
    const points = [0, 1, 2, 3].map((y) => ({ date: at(T0 + y * YEAR), deviationPct: -2 * y }));
    const r = projectDrift({ points, replaceBelowPct: -10 });
    expect(r.ratePctPerYear).toBeCloseTo(-2, 12);
    expect(r.replaceBy).toBe(at(T0 + 5 * YEAR).slice(0, 10)); // 2024-12-31
  });

  it('plain ISO dates with noise: slope matches the normal equations solved by mathjs', () => {
    // [DERIVED] ordinary least squares; independent solve of [[n, Σt], [Σt, Σt²]]·[b, m] = [Σy, Σty]
    const points = [
      { date: '2019-03-14', deviationPct: 0.8 },
      { date: '2020-02-01', deviationPct: -0.4 },
      { date: '2021-06-30', deviationPct: -1.9 },
      { date: '2022-01-15', deviationPct: -2.1 },
      { date: '2023-09-09', deviationPct: -4.6 },
    ];
    const t = points.map((p) => (Date.parse(p.date) - Date.parse('2019-03-14')) / YEAR);
    const y = points.map((p) => p.deviationPct);
    const sum = (a: number[]): number => a.reduce((s, v) => s + v, 0);
    const sol = lusolve(
      [
        [t.length, sum(t)],
        [sum(t), sum(t.map((v) => v * v))],
      ],
      [sum(y), sum(t.map((v, i) => v * (y[i] as number)))],
    ) as unknown as number[][];
    const b = (sol[0] as number[])[0] as number;
    const m = (sol[1] as number[])[0] as number;
    const r = projectDrift({ points, replaceBelowPct: -10 });
    expect(r.ratePctPerYear).toBeCloseTo(m, 10);
    const cross = Date.parse('2019-03-14') + ((-10 - b) / m) * YEAR;
    expect(r.replaceBy).toBe(new Date(cross).toISOString().slice(0, 10));
  });

  it('property: the slope of collinear points is recovered whatever the order of the points', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 0, max: 20 * 365 }), { minLength: 2, maxLength: 12 }),
        fc.double({ min: -5, max: -0.1, noNaN: true }),
        fc.double({ min: -3, max: 3, noNaN: true }),
        (days, rate, y0) => {
          const points = days.map((d) => ({ date: at(T0 + d * DAY), deviationPct: y0 + (rate * d * DAY) / YEAR }));
          const r = projectDrift({ points, replaceBelowPct: -10 });
          expect(r.ratePctPerYear).toBeCloseTo(rate, 8);
          expect(r.replaceBy).not.toBeNull();
        },
      ),
    );
  });

  it('no trend: rate ≥ 0 or fewer than 2 distinct dates → null', () => {
    expect(projectDrift({ points: [], replaceBelowPct: -10 })).toEqual({ ratePctPerYear: 0, replaceBy: null });
    expect(projectDrift({ points: [{ date: '2024-01-01', deviationPct: -3 }], replaceBelowPct: -10 })).toEqual({ ratePctPerYear: 0, replaceBy: null });
    expect(
      projectDrift({
        points: [
          { date: '2024-01-01', deviationPct: -3 },
          { date: '2024-01-01', deviationPct: -4 },
        ],
        replaceBelowPct: -10,
      }),
    ).toEqual({ ratePctPerYear: 0, replaceBy: null });
    const flat = projectDrift({
      points: [
        { date: '2022-01-01', deviationPct: -3 },
        { date: '2024-01-01', deviationPct: -3 },
      ],
      replaceBelowPct: -10,
    });
    expect(flat.ratePctPerYear).toBe(0);
    expect(flat.replaceBy).toBeNull();
    const rising = projectDrift({
      points: [
        { date: '2022-01-01', deviationPct: -3 },
        { date: '2024-01-01', deviationPct: -2 },
      ],
      replaceBelowPct: -10,
    });
    expect(rising.ratePctPerYear).toBeGreaterThan(0);
    expect(rising.replaceBy).toBeNull();
  });

  it('already below the limit: the crossing date lies in the past', () => {
    // [DERIVED] line −4 %/year from −8 % at T0: crosses −10 % half a year after T0, before the last point
    const points = [0, 1].map((y) => ({ date: at(T0 + y * YEAR), deviationPct: -8 - 4 * y }));
    const r = fitDrift({ points, replaceBelowPct: -10 });
    expect(r.alreadyBelow).toBe(true);
    expect(r.replaceBy).toBe(at(T0 + 0.5 * YEAR).slice(0, 10));
    expect(r.fittedLatestPct).toBeCloseTo(-12, 10);
  });

  it('a crossing beyond year 9999 gives null', () => {
    const r = projectDrift({
      points: [
        { date: '2020-01-01', deviationPct: -1 },
        { date: '2024-01-01', deviationPct: -1.0000001 },
      ],
      replaceBelowPct: -10,
    });
    expect(r.ratePctPerYear).toBeLessThan(0);
    expect(r.replaceBy).toBeNull();
  });
});
