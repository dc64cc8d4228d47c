import type { OutboxItem, PhotoTarget } from './outbox-types';

/** Readings of one component of an order still in the outbox, oldest first. */
export function readingItemsOf(items: readonly OutboxItem[], orderId: number, target: PhotoTarget, targetId: number): OutboxItem[] {
  return items.filter(
    (item) => item.orderId === orderId && item.payload.kind === 'reading' && item.payload.input.target === target && item.payload.input.targetId === targetId,
  );
}

/** Photos of one component (or of the whole order when target is undefined) still in the outbox. */
export function photoItemsOf(items: readonly OutboxItem[], orderId: number, target: PhotoTarget | undefined, targetId: number | undefined): OutboxItem[] {
  return items.filter((item) => item.orderId === orderId && item.payload.kind === 'photo' && item.payload.target === target && item.payload.targetId === targetId);
}

/** An order's move waiting in the outbox (the safety card acknowledged without signal). */
export function pendingMoveOf(items: readonly OutboxItem[], orderId: number): OutboxItem | undefined {
  return items.find((item) => item.orderId === orderId && item.payload.kind === 'transition');
}
