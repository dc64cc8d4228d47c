import { and, asc, desc, eq, inArray, lt, ne } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { banks, capacitorUnits, flags, photos, readings, sites, steps, workOrders } from '../../db/schema/index';
import { fromJson } from './to-work-order';

// Reads of the stored record of an order that its pages and its PDF need beyond the order
// itself. Readings and photos are written by their own modules; these only read them.

export interface StoredReading {
  id: number;
  workOrderId: number;
  target: (typeof readings.$inferSelect)['target'];
  targetId: number;
  input: Record<string, unknown>;
  evaluation: Record<string, unknown>;
  band: (typeof readings.$inferSelect)['band'];
  deviationPct: number | null;
  engineeringVersion: string;
  recordedAt: Date;
}

const storedColumns = {
  id: readings.id,
  workOrderId: readings.workOrderId,
  target: readings.target,
  targetId: readings.targetId,
  input: readings.input,
  evaluation: readings.evaluation,
  band: readings.band,
  deviationPct: readings.deviationPct,
  engineeringVersion: readings.engineeringVersion,
  recordedAt: readings.recordedAt,
};

const parsed = (r: StoredReading | (Omit<StoredReading, 'input' | 'evaluation'> & { input: unknown; evaluation: unknown })): StoredReading => ({
  ...r,
  input: fromJson(r.input as Record<string, unknown>),
  evaluation: fromJson(r.evaluation as Record<string, unknown>),
});

/** The order's readings in the order they were recorded. */
export async function readingsOfOrder(db: Database, orderId: number): Promise<StoredReading[]> {
  const rows = await db.select(storedColumns).from(readings).where(eq(readings.workOrderId, orderId)).orderBy(asc(readings.recordedAt), asc(readings.id));
  return rows.map(parsed);
}

/**
 * Readings of these capacitor units on other orders (not withdrawn ones) recorded before
 * `before`, newest first: the history a supervisor compares the order's results with.
 */
export async function earlierUnitReadings(db: Database, unitIds: number[], excludingOrderId: number, before: Date): Promise<StoredReading[]> {
  if (unitIds.length === 0) return [];
  const rows = await db
    .select(storedColumns)
    .from(readings)
    .innerJoin(workOrders, eq(workOrders.id, readings.workOrderId))
    .where(
      and(
        eq(readings.target, 'capacitor-unit'),
        inArray(readings.targetId, unitIds),
        ne(readings.workOrderId, excludingOrderId),
        ne(workOrders.state, 'withdrawn'),
        lt(readings.recordedAt, before),
      ),
    )
    .orderBy(desc(readings.recordedAt), desc(readings.id));
  return rows.map(parsed);
}

/** The flags raised by the order's readings. */
export async function flagsOfOrder(db: Database, orderId: number) {
  return db
    .select({ flag: flags })
    .from(flags)
    .innerJoin(readings, eq(readings.id, flags.readingId))
    .where(eq(readings.workOrderId, orderId))
    .orderBy(asc(flags.raisedAt), asc(flags.id))
    .then((rows) => rows.map((r) => r.flag));
}

/** The order's photos with their storage keys (the photo contract hands out URLs instead). */
export async function photoKeysOfOrder(db: Database, orderId: number) {
  return db
    .select({ id: photos.id, caption: photos.caption, thumbnailKey: photos.thumbnailKey, target: photos.target, targetId: photos.targetId })
    .from(photos)
    .where(eq(photos.workOrderId, orderId))
    .orderBy(asc(photos.createdAt), asc(photos.id));
}

/** Capacitor units by id, removed ones too (a sealed record keeps what it measured), with their step number. */
export async function unitsByIds(db: Database, ids: number[]) {
  if (ids.length === 0) return [];
  return db
    .select({ unit: capacitorUnits, stepNumber: steps.number })
    .from(capacitorUnits)
    .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
    .where(inArray(capacitorUnits.id, ids));
}

/** The site facts the record's header shows. */
export async function siteAndBankOf(db: Database, bankId: number) {
  const [row] = await db
    .select({ siteName: sites.name, siteAddress: sites.address, bankName: banks.name, bankLocation: banks.location, timeZone: sites.timeZone })
    .from(banks)
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(banks.id, bankId));
  return row;
}
