import type { Reading, WorkOrderDetail, WorkOrderReview } from '@varden/schemas';

type Band = NonNullable<Reading['band']>;

/** One capacitor unit's result on an order, beside its previous reading when the review has it. */
export type UnitResultRow = {
  unitId: number;
  stepNumber: number;
  position: number;
  serial: string;
  /** Null for a unit since removed from the bank. */
  nameplateKvar: number | null;
  /** Null when the order holds no reading of this unit. */
  current: {
    readingId: number;
    recordedAt: string;
    recordedByName: string;
    method: string | null;
    legsUF: number[];
    kvarAtRated: number | null;
    deviationPct: number | null;
    band: Band | null;
    reasons: string[];
    warnings: string[];
    notes: string;
    /** Earlier readings of the same unit on this order (a remeasure replaced them). */
    earlierOnOrder: number;
  } | null;
  previous: {
    workOrderId: number;
    recordedAt: string;
    legsUF: number[];
    kvarAtRated: number | null;
    deviationPct: number | null;
    band: Band | null;
  } | null;
  deviationChangePct: number | null;
};

/** Any other reading (contactor, reactor, fuse set, bank) with where it sits and what it showed. */
export type OtherReadingRow = {
  readingId: number;
  target: Reading['target'];
  where: string;
  recordedAt: string;
  recordedByName: string;
  reasons: string[];
  notes: string;
};

const numbers = (value: unknown): number[] => (Array.isArray(value) ? value.filter((n): n is number => typeof n === 'number' && Number.isFinite(n)) : []);
const strings = (value: unknown): string[] => (Array.isArray(value) ? value.filter((s): s is string => typeof s === 'string') : []);
const numberOrNull = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const text = (value: unknown): string => (typeof value === 'string' ? value : '');

/** The latest reading of each target on the order, and how many earlier ones it replaced. */
function latestByTarget(readings: readonly Reading[], target: Reading['target']): Map<number, { reading: Reading; earlier: number }> {
  const latest = new Map<number, { reading: Reading; earlier: number }>();
  for (const reading of readings) {
    if (reading.target !== target) continue;
    const held = latest.get(reading.targetId);
    if (!held) latest.set(reading.targetId, { reading, earlier: 0 });
    else if (reading.recordedAt >= held.reading.recordedAt) latest.set(reading.targetId, { reading, earlier: held.earlier + 1 });
    else held.earlier += 1;
  }
  return latest;
}

/**
 * Every capacitor unit of the order's bank, step by step, with its result on this order (the
 * latest reading when it was measured again) and, from the review, its previous reading.
 */
export function unitResultRows(order: WorkOrderDetail | WorkOrderReview): UnitResultRow[] {
  const latest = latestByTarget(order.readings, 'capacitor-unit');
  const comparisons = new Map('comparisons' in order ? order.comparisons.map((c) => [c.unitId, c] as const) : []);
  const rows: UnitResultRow[] = [];
  const seen = new Set<number>();
  for (const step of [...order.bank.steps].sort((a, b) => a.number - b.number)) {
    for (const unit of [...step.units].sort((a, b) => a.position - b.position)) {
      seen.add(unit.id);
      rows.push(row(unit.id, step.number, unit.position, unit.serial, unit.nameplateKvar));
    }
  }
  // A unit measured on this order but since removed from the bank still belongs to its record.
  for (const comparison of comparisons.values()) {
    if (!seen.has(comparison.unitId)) rows.push(row(comparison.unitId, comparison.stepNumber, comparison.position, comparison.serial, null));
  }
  return rows;

  function row(unitId: number, stepNumber: number, position: number, serial: string, nameplateKvar: number | null): UnitResultRow {
    const held = latest.get(unitId);
    const comparison = comparisons.get(unitId);
    const evaluation = held?.reading.evaluation ?? {};
    const input = held?.reading.input ?? {};
    const previous = comparison?.previous ?? null;
    return {
      unitId,
      stepNumber,
      position,
      serial,
      nameplateKvar,
      current: held
        ? {
            readingId: held.reading.id,
            recordedAt: held.reading.recordedAt,
            recordedByName: held.reading.recordedByName,
            method: text(evaluation.method) || text(input.method) || null,
            legsUF: numbers(evaluation.legsUF),
            kvarAtRated: numberOrNull(evaluation.kvarAtRated),
            deviationPct: held.reading.deviationPct ?? numberOrNull(evaluation.deviationPct),
            band: held.reading.band,
            reasons: strings(evaluation.reasons),
            warnings: strings(evaluation.warnings),
            notes: text(input.notes).trim(),
            earlierOnOrder: held.earlier,
          }
        : null,
      previous: previous
        ? {
            workOrderId: previous.workOrderId,
            recordedAt: previous.recordedAt,
            legsUF: previous.legsUF ?? [],
            kvarAtRated: previous.kvarAtRated,
            deviationPct: previous.deviationPct,
            band: previous.band,
          }
        : null,
      deviationChangePct: comparison?.deviationChangePct ?? null,
    };
  }
}

/** The order's other readings, latest per component, with the step they belong to. */
export function otherReadingRows(order: WorkOrderDetail): OtherReadingRow[] {
  const where = new Map<string, string>();
  for (const step of order.bank.steps) {
    if (step.contactor) where.set(`contactor:${step.contactor.id}`, `Step ${step.number}`);
    if (step.reactor) where.set(`reactor:${step.reactor.id}`, `Step ${step.number}`);
    if (step.fuseSet) where.set(`fuse-set:${step.fuseSet.id}`, `Step ${step.number}`);
  }
  where.set(`bank:${order.bank.id}`, order.bank.name);
  const rows: OtherReadingRow[] = [];
  for (const target of ['bank', 'contactor', 'reactor', 'fuse-set'] as const) {
    for (const { reading } of latestByTarget(order.readings, target).values()) {
      rows.push({
        readingId: reading.id,
        target,
        where: where.get(`${target}:${reading.targetId}`) ?? `#${reading.targetId}`,
        recordedAt: reading.recordedAt,
        recordedByName: reading.recordedByName,
        reasons: strings(reading.evaluation.reasons),
        notes: text(reading.input.notes).trim(),
      });
    }
  }
  return rows.sort((a, b) => a.where.localeCompare(b.where, undefined, { numeric: true }) || a.target.localeCompare(b.target));
}

/** Every flag the order's readings raised (or found already open), in recording order. */
export function flagsOfOrder(order: WorkOrderDetail): Array<{ readingId: number; kind: string; severity: 'advisory' | 'action'; message: string; alreadyOpen: boolean }> {
  return [...order.readings]
    .sort((a, b) => a.recordedAt.localeCompare(b.recordedAt) || a.id - b.id)
    .flatMap((reading) => reading.flags.map((flag) => ({ readingId: reading.id, kind: flag.kind, severity: flag.severity, message: flag.message, alreadyOpen: flag.alreadyOpen ?? false })));
}
