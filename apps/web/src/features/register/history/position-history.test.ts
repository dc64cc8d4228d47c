import type { Unit } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { positionHistory } from './position-history';

const unit = (id: number, over: Partial<Unit> = {}): Unit => ({
  id,
  stepId: 1,
  position: 1,
  nameplateKvar: 25,
  nameplateVoltageV: 400,
  nameplateFrequencyHz: 50,
  connection: 'delta',
  capacitanceUF: 165.79,
  capacitanceGiven: false,
  ratedCapacitanceUF: 165.79,
  tolerancePreset: 'iec',
  toleranceMinusPct: -5,
  tolerancePlusPct: 10,
  temperatureCategory: '',
  dischargeTimeS: 180,
  serial: `S-${id}`,
  maker: '',
  model: '',
  installedOn: null,
  removedOn: null,
  removalReason: null,
  replacedById: null,
  warnings: [],
  version: 1,
  ...over,
});

describe('positionHistory', () => {
  const first = unit(3, { installedOn: '2021-01-10', removedOn: '2023-05-02', replacedById: 9 });
  const second = unit(9, { installedOn: '2023-05-02', removedOn: '2025-02-01', replacedById: 4 });
  const third = unit(4, { installedOn: '2025-02-01' });
  const elsewhere = unit(5, { position: 2 });

  it('follows the replacement chain from the first unit at the position to the one in service', () => {
    const all = [third, elsewhere, first, second];
    expect(positionHistory(all, third).map((u) => u.id)).toEqual([3, 9, 4]);
    expect(positionHistory(all, first).map((u) => u.id)).toEqual([3, 9, 4]);
    expect(positionHistory(all, second).map((u) => u.id)).toEqual([3, 9, 4]);
  });

  it('keeps units outside the chain in installation order, and survives a loop in bad data', () => {
    const stray = unit(7, { installedOn: '2019-06-01', removedOn: '2020-12-31' });
    expect(positionHistory([third, stray, first, second], third).map((u) => u.id)).toEqual([7, 3, 9, 4]);
    const loopA = unit(1, { replacedById: 2 });
    const loopB = unit(2, { replacedById: 1 });
    expect(positionHistory([loopA, loopB], loopA).map((u) => u.id).sort()).toEqual([1, 2]);
  });

  it('is just the unit when nobody else stood there', () => {
    expect(positionHistory([elsewhere, third], third).map((u) => u.id)).toEqual([4]);
  });
});
