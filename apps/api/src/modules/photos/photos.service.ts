import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Photo, photoUploadFields } from '@varden/schemas';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import type { Database } from '../../db/client';
import { isDuplicateKey } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { findOrderForRecording, findVisibleOrder, type WorkOrderRow } from '../work-orders/order-guard';
import { findContactorPlace, findFuseSetPlace, findReactorPlace, findUnitPlace, lockOrder } from '../readings/readings.repository';
import { processPhoto, storedContentType } from './image-pipeline';
import { findPhoto, findPhotoByKey, insertPhoto, photosOfOrder, readingTarget, type PhotoRow } from './photos.repository';

export type PhotoFields = z.output<typeof photoUploadFields>;
export type PhotoVariant = 'display' | 'thumbnail';

export function toPhoto(row: PhotoRow): Photo {
  return {
    id: row.id,
    workOrderId: row.workOrderId,
    readingId: row.readingId,
    target: row.target,
    targetId: row.targetId,
    caption: row.caption,
    widthPx: row.widthPx,
    heightPx: row.heightPx,
    displayUrl: `/api/photos/${row.id}/display`,
    thumbnailUrl: `/api/photos/${row.id}/thumbnail`,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Every photo of an order, oldest first. */
export async function listPhotosForOrder(db: Database, workOrderId: number): Promise<Photo[]> {
  return (await photosOfOrder(db, workOrderId)).map(toPhoto);
}

export async function photosOfVisibleOrder(db: Database, user: SessionUser, orderId: number): Promise<Photo[]> {
  await findVisibleOrder(db, user, orderId);
  return listPhotosForOrder(db, orderId);
}

/** Refuses an upload to an order the user cannot see before its body is read. */
export async function assertOrderVisible(db: Database, user: SessionUser, orderId: number): Promise<void> {
  await findVisibleOrder(db, user, orderId);
}

/**
 * Stores a photo taken on an order.
 *
 * - Same rules as readings: only the assignee, while on site, never once sealed; a retry with
 *   the same idempotency key returns the stored photo (created: false).
 * - The content is checked and re-encoded by the image pipeline (the file name is never used).
 * - Both renditions go to object storage before the row is written; storage down → 503 and no
 *   row; a row that cannot be written takes its objects with it (best effort).
 */
export async function addPhoto(
  ctx: AppContext,
  user: SessionUser,
  orderId: number,
  fields: PhotoFields,
  file: { buffer: Buffer; size: number } | undefined,
): Promise<{ photo: Photo; created: boolean }> {
  const { db } = ctx;
  await findVisibleOrder(db, user, orderId);
  const earlier = await findPhotoByKey(db, fields.idempotencyKey);
  if (earlier && isRetryOf(earlier, user, orderId)) return { photo: toPhoto(earlier), created: false };
  const order = await findOrderForRecording(db, user, orderId);
  if (earlier) throw keyTaken();
  if (!file || file.size === 0) throw new AppError('invalid', 'No photo came with the upload.', { file: 'Attach the photo in the field "file"' });
  const place = await photoPlace(db, order, fields);

  const processed = await processPhoto(file.buffer, { maxPixels: ctx.config.PHOTO_MAX_PIXELS });
  const stem = `photos/${orderId}/${randomUUID()}`;
  const keys = { display: `${stem}-display.webp`, thumbnail: `${stem}-thumbnail.webp` };
  const uploads = await Promise.allSettled([
    ctx.store.put(keys.display, processed.display.data, storedContentType),
    ctx.store.put(keys.thumbnail, processed.thumbnail.data, storedContentType),
  ]);
  const failed = uploads.find((u): u is PromiseRejectedResult => u.status === 'rejected');
  if (failed) {
    ctx.log.warn({ err: failed.reason, orderId }, 'photo upload to object storage failed');
    await removeQuietly(ctx, keys);
    throw new AppError('unavailable', 'Photo storage is not reachable right now, so the photo was not stored. Send it again in a moment.', undefined, 5);
  }

  let photoId: number;
  try {
    photoId = await db.transaction(async (tx) => {
      const current = await lockOrder(tx, orderId);
      if (!current || current.locked || current.state !== 'on-site' || current.assigneeId !== user.id) {
        await findOrderForRecording(db, user, orderId);
        throw new AppError('conflict', `Work order ${orderId} changed while the photo was being stored. Reload it.`);
      }
      return insertPhoto(tx, {
        workOrderId: orderId,
        ...place,
        idempotencyKey: fields.idempotencyKey,
        caption: fields.caption,
        displayKey: keys.display,
        thumbnailKey: keys.thumbnail,
        widthPx: processed.display.widthPx,
        heightPx: processed.display.heightPx,
        bytes: file.size,
        takenById: user.id,
      });
    });
  } catch (error) {
    await removeQuietly(ctx, keys);
    if (!isDuplicateKey(error)) throw error;
    // Two identical uploads at once: the other one's row stands.
    const stored = await findPhotoByKey(db, fields.idempotencyKey);
    if (!stored || !isRetryOf(stored, user, orderId)) throw keyTaken();
    return { photo: toPhoto(stored), created: false };
  }
  return { photo: toPhoto((await findPhoto(db, photoId))!), created: true };
}

/** A stored rendition, for those who may see the order (404 for anyone else). */
export async function openPhoto(
  ctx: AppContext,
  user: SessionUser,
  photoId: number,
  variant: PhotoVariant,
): Promise<{ body: Readable; contentType: string; length: number | undefined }> {
  const row = await findPhoto(ctx.db, photoId);
  const missing = new AppError('not_found', `Photo ${photoId} does not exist.`);
  if (!row) throw missing;
  try {
    await findVisibleOrder(ctx.db, user, row.workOrderId);
  } catch (error) {
    if (error instanceof AppError && error.code === 'not_found') throw missing;
    throw error;
  }
  try {
    const object = await ctx.store.get(variant === 'display' ? row.displayKey : row.thumbnailKey);
    return { body: object.body, contentType: object.contentType ?? storedContentType, length: object.length };
  } catch (error) {
    if (isMissingObject(error)) throw new AppError('not_found', `The file of photo ${photoId} is missing from storage.`);
    ctx.log.warn({ err: error, photoId }, 'photo download from object storage failed');
    throw new AppError('unavailable', 'Photo storage is not reachable right now. Try again in a moment.', undefined, 5);
  }
}

function isRetryOf(stored: PhotoRow, user: SessionUser, orderId: number): boolean {
  return stored.workOrderId === orderId && stored.takenById === user.id;
}

const keyTaken = () =>
  new AppError('conflict', 'This idempotency key belongs to another photo. The phone makes a new key for each photo.', {
    idempotencyKey: 'Already used for another photo',
  });

async function removeQuietly(ctx: AppContext, keys: { display: string; thumbnail: string }): Promise<void> {
  const results = await Promise.allSettled([ctx.store.remove(keys.display), ctx.store.remove(keys.thumbnail)]);
  for (const r of results) if (r.status === 'rejected') ctx.log.warn({ err: r.reason, keys }, 'could not remove an orphaned photo object');
}

function isMissingObject(error: unknown): boolean {
  const e = error as { name?: unknown; $metadata?: { httpStatusCode?: unknown } };
  return e?.name === 'NoSuchKey' || e?.$metadata?.httpStatusCode === 404;
}

/** What a photo shows: a reading of this order, or a component of the order's bank, or the order as a whole. */
async function photoPlace(db: Database, order: WorkOrderRow, fields: PhotoFields): Promise<Pick<PhotoRow, 'readingId' | 'target' | 'targetId'>> {
  if ((fields.target === undefined) !== (fields.targetId === undefined)) {
    throw new AppError('invalid', 'A photo of a component names both the component kind and its id.', {
      [fields.target === undefined ? 'target' : 'targetId']: 'Give both target and targetId, or neither',
    });
  }
  let target = fields.target ?? null;
  let targetId = fields.targetId ?? null;
  if (fields.readingId !== undefined) {
    const reading = await readingTarget(db, fields.readingId);
    if (!reading || reading.workOrderId !== order.id) {
      throw new AppError('invalid', `Reading ${fields.readingId} is not a reading of work order ${order.id}.`, { readingId: 'Not a reading of this order' });
    }
    if (target !== null && (target !== reading.target || targetId !== reading.targetId)) {
      throw new AppError('invalid', 'The photo names a reading and a different component.', { targetId: 'Not the component of that reading' });
    }
    target = reading.target;
    targetId = reading.targetId;
  } else if (target !== null && targetId !== null && (await bankOf(db, target, targetId)) !== order.bankId) {
    throw new AppError('invalid', `That ${target} is not part of the bank of work order ${order.id}.`, { targetId: "Not a component of this order's bank" });
  }
  return { readingId: fields.readingId ?? null, target, targetId };
}

async function bankOf(db: Database, target: NonNullable<PhotoFields['target']>, id: number): Promise<number | undefined> {
  switch (target) {
    case 'bank':
      return id;
    case 'capacitor-unit':
      return (await findUnitPlace(db, id))?.step.bankId;
    case 'contactor':
      return (await findContactorPlace(db, id))?.step.bankId;
    case 'reactor':
      return (await findReactorPlace(db, id))?.step.bankId;
    case 'fuse-set':
      return (await findFuseSetPlace(db, id))?.step.bankId;
  }
}
