import { NETA_INTERVAL_FACTORS } from '@varden/engineering';
import { describe, expect, test } from 'vitest';
import { suggestInterval } from './inspection-interval';

describe('suggestInterval (NETA MTS Appendix B)', () => {
  test('the factor table: low 1.0/2.0/2.5, medium 0.5/1.0/1.5, high 0.25/0.5/0.75 for poor/average/good', () => {
    expect(NETA_INTERVAL_FACTORS).toEqual({
      low: { poor: 1, average: 2, good: 2.5 },
      medium: { poor: 0.5, average: 1, good: 1.5 },
      high: { poor: 0.25, average: 0.5, good: 0.75 },
    });
  });

  test('12 months base: high need and poor condition → 3 months; low need, good condition → 30', () => {
    expect(suggestInterval(12, 'high', 'poor')).toEqual({ factor: 0.25, exactMonths: 3, intervalMonths: 3 });
    expect(suggestInterval(12, 'low', 'good')).toEqual({ factor: 2.5, exactMonths: 30, intervalMonths: 30 });
    expect(suggestInterval(12, 'medium', 'average')).toEqual({ factor: 1, exactMonths: 12, intervalMonths: 12 });
  });

  test('a fractional interval rounds to the nearest whole month (as the API does), never below one', () => {
    expect(suggestInterval(6, 'high', 'good')).toEqual({ factor: 0.75, exactMonths: 4.5, intervalMonths: 5 });
    expect(suggestInterval(5, 'high', 'good')).toEqual({ factor: 0.75, exactMonths: 3.75, intervalMonths: 4 });
    expect(suggestInterval(7, 'high', 'average')).toEqual({ factor: 0.5, exactMonths: 3.5, intervalMonths: 4 });
    expect(suggestInterval(3, 'high', 'poor')).toEqual({ factor: 0.25, exactMonths: 0.75, intervalMonths: 1 });
    expect(suggestInterval(1, 'medium', 'poor')!.intervalMonths).toBe(1);
  });

  test('no suggestion for a base that is not 1–120 whole months', () => {
    expect(suggestInterval(0, 'medium', 'average')).toBeUndefined();
    expect(suggestInterval(2.5, 'medium', 'average')).toBeUndefined();
    expect(suggestInterval(121, 'medium', 'average')).toBeUndefined();
    expect(suggestInterval(Number.NaN, 'medium', 'average')).toBeUndefined();
  });
});
