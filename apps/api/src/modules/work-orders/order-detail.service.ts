import type { bands, WorkOrderDetail, WorkOrderReview, unitComparison, unitResult } from '@varden/schemas';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { AppError } from '../../http/app-error';
import { listPhotosForOrder } from '../photos/photos.service';
import { listReadingsForOrder } from '../readings/readings.service';
import { walkthroughBankOf } from './bank-tree.repository';
import { findVisibleOrder } from './order-guard';
import { earlierUnitReadings, readingsOfOrder, unitsByIds, type StoredReading } from './record.repository';
import { safetyCardFor } from './safety-card';
import { toWorkOrder } from './to-work-order';
import { findPerson, listTransitions } from './work-orders.repository';
import { loadOrderView } from './work-orders.service';

const nameOf = async (ctx: AppContext, id: number | null) => (id ? ((await findPerson(ctx.db, id))?.name ?? null) : null);

/**
 * An order opened for work or review: the order, its bank as built (steps, units with their
 * nameplates and discharge times, contactor, reactor, fuse set), the safety card, what was
 * recorded (readings, photos) and every transition with who made it.
 */
export async function getWorkOrderDetail(ctx: AppContext, user: SessionUser, id: number): Promise<WorkOrderDetail> {
  const order = await findVisibleOrder(ctx.db, user, id);
  const [view, bank, readings, photos, transitions, createdByName, acknowledgedByName] = await Promise.all([
    loadOrderView(ctx.db, id),
    walkthroughBankOf(ctx.db, order.bankId),
    listReadingsForOrder(ctx.db, id),
    listPhotosForOrder(ctx.db, id),
    listTransitions(ctx.db, id),
    nameOf(ctx, order.createdById),
    nameOf(ctx, order.safetyAcknowledgedById),
  ]);
  if (!bank) throw new AppError('not_found', `The bank of work order ${id} does not exist.`);
  return {
    ...toWorkOrder(view),
    createdByName,
    signedById: order.signedById,
    bank,
    safetyCard: safetyCardFor(bank, { at: order.safetyAcknowledgedAt, byName: acknowledgedByName }),
    readings,
    photos,
    transitions: transitions.map((t) => ({
      fromState: t.fromState,
      toState: t.toState,
      actorName: t.actorName,
      comment: t.comment,
      at: t.at.toISOString(),
    })),
  };
}

type UnitResult = z.infer<typeof unitResult>;
type Band = (typeof bands)[number];
const numberOr = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);

function resultOf(r: StoredReading): UnitResult {
  const legs = r.evaluation.legsUF;
  return {
    readingId: r.id,
    workOrderId: r.workOrderId,
    recordedAt: r.recordedAt.toISOString(),
    band: (r.band ?? null) as Band | null,
    deviationPct: r.deviationPct ?? numberOr(r.evaluation.deviationPct),
    kvarAtRated: numberOr(r.evaluation.kvarAtRated),
    legsUF: Array.isArray(legs) && legs.every((v) => typeof v === 'number') ? (legs as number[]) : null,
  };
}

/**
 * Each capacitor unit's latest result on this order beside its previous one: the newest
 * reading of the unit on an earlier order (not a withdrawn one) taken before this order's.
 */
export async function unitComparisons(ctx: AppContext, orderId: number, bankUnitIds: number[]): Promise<Array<z.infer<typeof unitComparison>>> {
  const own = (await readingsOfOrder(ctx.db, orderId)).filter((r) => r.target === 'capacitor-unit');
  const latestOwn = new Map<number, StoredReading>();
  for (const r of own) latestOwn.set(r.targetId, r);
  const unitIds = [...new Set([...bankUnitIds, ...latestOwn.keys()])];
  const firstOwnAt = new Map<number, Date>();
  for (const r of own) if (!firstOwnAt.has(r.targetId)) firstOwnAt.set(r.targetId, r.recordedAt);
  const now = new Date();
  const [earlier, units] = await Promise.all([earlierUnitReadings(ctx.db, unitIds, orderId, now), unitsByIds(ctx.db, unitIds)]);
  return units
    .sort((a, b) => a.stepNumber - b.stepNumber || a.unit.position - b.unit.position || a.unit.id - b.unit.id)
    .map(({ unit, stepNumber }) => {
      const cutoff = firstOwnAt.get(unit.id) ?? now;
      const previous = earlier.find((r) => r.targetId === unit.id && r.recordedAt < cutoff);
      const current = latestOwn.get(unit.id);
      const c = current ? resultOf(current) : null;
      const p = previous ? resultOf(previous) : null;
      return {
        unitId: unit.id,
        stepNumber,
        position: unit.position,
        serial: unit.serial,
        current: c,
        previous: p,
        deviationChangePct: c?.deviationPct != null && p?.deviationPct != null ? c.deviationPct - p.deviationPct : null,
      };
    });
}

/** The supervisor's review page: the order opened as for work, with each unit's previous result. */
export async function getWorkOrderReview(ctx: AppContext, user: SessionUser, id: number): Promise<WorkOrderReview> {
  const detail = await getWorkOrderDetail(ctx, user, id);
  const bankUnitIds = detail.bank.steps.flatMap((s) => s.units.map((u) => u.id));
  return { ...detail, comparisons: await unitComparisons(ctx, id, bankUnitIds) };
}
