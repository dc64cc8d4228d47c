import type { Reading, WorkOrderReview } from '@varden/schemas';
import { describe, expect, test } from 'vitest';
import { flagsOfOrder, otherReadingRows, unitResultRows } from './order-results';

const unit = (id: number, position: number) => ({
  id,
  position,
  nameplateKvar: 25,
  nameplateVoltageV: 440,
  nameplateFrequencyHz: 50,
  connection: 'delta' as const,
  capacitanceUF: 136.9,
  toleranceMinusPct: 5,
  tolerancePlusPct: 10,
  dischargeTimeS: 180,
  serial: `SN-${id}`,
  maker: 'M',
  model: 'X',
  installedOn: null,
});

const reading = (over: Partial<Reading>): Reading => ({
  id: 1,
  workOrderId: 7,
  target: 'capacitor-unit',
  targetId: 11,
  idempotencyKey: 'reading-0000000000000001',
  input: { method: 'open-pairs', notes: '' },
  evaluation: { method: 'open-pairs', legsUF: [130, 131, 129], kvarAtRated: 23.8, deviationPct: -4.8, band: 'healthy', reasons: ['within tolerance'], warnings: [] },
  band: 'healthy',
  deviationPct: -4.8,
  engineeringVersion: '0.1.0',
  flags: [],
  recordedByName: 'Kasimir',
  recordedAt: '2026-05-04T09:00:00.000Z',
  ...over,
});

function order(readings: Reading[]): WorkOrderReview {
  return {
    readings,
    comparisons: [
      {
        unitId: 11,
        stepNumber: 1,
        position: 1,
        serial: 'SN-11',
        current: null,
        previous: { readingId: 90, workOrderId: 3, recordedAt: '2025-11-02T10:00:00.000Z', band: 'healthy', deviationPct: -2.1, kvarAtRated: 24.5, legsUF: [134, 134, 133] },
        deviationChangePct: -2.7,
      },
      { unitId: 99, stepNumber: 2, position: 4, serial: 'SN-OLD', current: null, previous: null, deviationChangePct: null },
    ],
    bank: {
      id: 5,
      name: 'Bank A',
      location: '',
      detuned: false,
      detuningFactor: null,
      siteId: 1,
      siteName: 'Site',
      siteVoltageV: 400,
      siteFrequencyHz: 50,
      steps: [
        { id: 22, number: 2, ratedKvar: 50, units: [unit(13, 1)], contactor: { id: 40, ratedOperations: 100000, counterAtInstall: 0, maker: '', model: '' }, reactor: null, fuseSet: null },
        { id: 21, number: 1, ratedKvar: 50, units: [unit(12, 2), unit(11, 1)], contactor: null, reactor: null, fuseSet: { id: 50, ratedCurrentA: 100, type: 'gG' } },
      ],
    },
  } as unknown as WorkOrderReview;
}

describe('unitResultRows', () => {
  test('every unit of the bank step by step, the latest reading of a remeasured unit, the previous one beside it', () => {
    const rows = unitResultRows(
      order([
        reading({ id: 1, recordedAt: '2026-05-04T09:00:00.000Z', band: 'remeasure', deviationPct: 14 }),
        reading({ id: 2, recordedAt: '2026-05-04T09:10:00.000Z', input: { method: 'open-pairs', notes: 'Meter changed' } }),
      ]),
    );
    expect(rows.map((r) => [r.stepNumber, r.position, r.unitId])).toEqual([
      [1, 1, 11],
      [1, 2, 12],
      [2, 1, 13],
      [2, 4, 99],
    ]);
    const first = rows[0]!;
    expect(first.current).toMatchObject({ readingId: 2, method: 'open-pairs', legsUF: [130, 131, 129], kvarAtRated: 23.8, deviationPct: -4.8, band: 'healthy', reasons: ['within tolerance'], notes: 'Meter changed', earlierOnOrder: 1 });
    expect(first.previous).toMatchObject({ workOrderId: 3, deviationPct: -2.1, band: 'healthy' });
    expect(first.deviationChangePct).toBe(-2.7);
    expect(rows[1]!.current).toBeNull();
    // A unit since removed keeps its row, without a nameplate from the bank.
    expect(rows[3]).toMatchObject({ serial: 'SN-OLD', nameplateKvar: null });
  });
});

describe('other readings and flags', () => {
  test('components are placed in their step; flags come in recording order', () => {
    const detail = order([
      reading({ id: 3, target: 'fuse-set', targetId: 50, evaluation: { reasons: ['fuse 2 is open'] }, recordedAt: '2026-05-04T09:20:00.000Z', flags: [{ kind: 'blown-fuse', severity: 'action', message: 'Step 1: fuse 2 blown' }] }),
      reading({ id: 4, target: 'contactor', targetId: 40, evaluation: { reasons: [] }, input: { notes: 'Counter hard to read' } }),
      reading({ id: 5, flags: [{ kind: 'watch', severity: 'advisory', message: 'Step 1, unit 1 drifting', alreadyOpen: true }] }),
    ]);
    expect(otherReadingRows(detail).map((r) => [r.target, r.where, r.reasons, r.notes])).toEqual([
      ['fuse-set', 'Step 1', ['fuse 2 is open'], ''],
      ['contactor', 'Step 2', [], 'Counter hard to read'],
    ]);
    expect(flagsOfOrder(detail).map((f) => [f.kind, f.alreadyOpen])).toEqual([
      ['watch', true],
      ['blown-fuse', false],
    ]);
  });
});
