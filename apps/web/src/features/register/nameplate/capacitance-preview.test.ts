import { describe, expect, it } from 'vitest';
import { capacitanceBasis, compareCapacitance, ratedCapacitancePreview } from './capacitance-preview';

describe('ratedCapacitancePreview', () => {
  it('gives the rated capacitance of a complete nameplate', () => {
    // [DERIVED] engineering-reference.md §1: 50 kvar 400 V 50 Hz delta → C_Δ = 331.57 µF per leg.
    expect(ratedCapacitancePreview({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' })).toBeCloseTo(331.57, 2);
    // [DERIVED] engineering-reference.md §1: star phases are 3 × the delta legs, C_Y = 994.72 µF.
    expect(ratedCapacitancePreview({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'star' })).toBeCloseTo(994.72, 2);
    // [DERIVED] engineering-reference.md §1: 25 kvar 480 V 60 Hz delta → C_Δ = 95.94 µF.
    expect(ratedCapacitancePreview({ kvar: 25, voltageV: 480, frequencyHz: 60, connection: 'delta' })).toBeCloseTo(95.94, 2);
  });

  it('shows nothing while a field is empty, not a number, impossible or unknown', () => {
    const valid = { kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' };
    expect(ratedCapacitancePreview({ ...valid, kvar: null })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, kvar: undefined })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, kvar: Number.NaN })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, kvar: '50' })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, voltageV: 0 })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, voltageV: -400 })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, frequencyHz: Number.POSITIVE_INFINITY })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, connection: 'zigzag' })).toBeNull();
    expect(ratedCapacitancePreview({ ...valid, connection: '' })).toBeNull();
  });
});

describe('compareCapacitance', () => {
  const rated = 331.57;

  it('gives the difference from the nameplate in % and warns beyond 2 %', () => {
    expect(compareCapacitance(rated, rated)).toEqual({ differencePct: 0, beyondWarning: false });
    const within = compareCapacitance(rated * 1.019, rated);
    expect(within?.differencePct).toBeCloseTo(1.9, 9);
    expect(within?.beyondWarning).toBe(false);
    const above = compareCapacitance(rated * 1.05, rated);
    expect(above?.differencePct).toBeCloseTo(5, 9);
    expect(above?.beyondWarning).toBe(true);
    const below = compareCapacitance(rated * 0.97, rated);
    expect(below?.differencePct).toBeCloseTo(-3, 9);
    expect(below?.beyondWarning).toBe(true);
  });

  it('says nothing until both values are known', () => {
    expect(compareCapacitance(null, rated)).toBeNull();
    expect(compareCapacitance(Number.NaN, rated)).toBeNull();
    expect(compareCapacitance(0, rated)).toBeNull();
    expect(compareCapacitance(330, null)).toBeNull();
  });
});

describe('capacitanceBasis', () => {
  it('names what the figure stands for', () => {
    expect(capacitanceBasis('delta')).toBe('per delta leg');
    expect(capacitanceBasis('star')).toBe('per star phase');
    expect(capacitanceBasis('single-phase')).toBe('for the element');
    expect(capacitanceBasis(undefined)).toBe('');
  });
});
