import { asc, eq } from 'drizzle-orm';
import type { Executor } from '../../access/executor';
import { photos, readings } from '../../db/schema/index';

export type PhotoRow = typeof photos.$inferSelect;

export async function findPhotoByKey(db: Executor, idempotencyKey: string): Promise<PhotoRow | undefined> {
  const [row] = await db.select().from(photos).where(eq(photos.idempotencyKey, idempotencyKey));
  return row;
}

export async function findPhoto(db: Executor, id: number): Promise<PhotoRow | undefined> {
  const [row] = await db.select().from(photos).where(eq(photos.id, id));
  return row;
}

export async function photosOfOrder(db: Executor, workOrderId: number): Promise<PhotoRow[]> {
  return db.select().from(photos).where(eq(photos.workOrderId, workOrderId)).orderBy(asc(photos.createdAt), asc(photos.id));
}

export async function insertPhoto(db: Executor, values: typeof photos.$inferInsert): Promise<number> {
  const [created] = await db.insert(photos).values(values).$returningId();
  return created!.id;
}

export async function readingTarget(db: Executor, readingId: number) {
  const [row] = await db
    .select({ workOrderId: readings.workOrderId, target: readings.target, targetId: readings.targetId })
    .from(readings)
    .where(eq(readings.id, readingId));
  return row;
}
