import { useEffect, useSyncExternalStore } from 'react';
import { idbOutboxStore } from './idb-outbox-store';
import { createOutbox, type Outbox } from './outbox';
import type { OutboxSnapshot } from './outbox-types';
import { sendOutboxItem } from './send-outbox-item';

let shared: Outbox | null = null;

/**
 * The phone's one outbox, made on first use: IndexedDB storage, the real sender, the
 * browser's online state. It starts sending as soon as it has read what a previous page
 * load left, and again whenever the browser says the signal is back.
 */
export function fieldOutbox(): Outbox {
  if (shared) return shared;
  const outbox = createOutbox({ store: idbOutboxStore(), send: sendOutboxItem, isOnline: () => navigator.onLine });
  shared = outbox;
  window.addEventListener('online', () => outbox.setOnline(true));
  window.addEventListener('offline', () => outbox.setOnline(false));
  // Coming back to the tab (the phone woke up) is a good moment to try again.
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') void outbox.sendNow();
  });
  void outbox.load();
  return outbox;
}

const subscribe = (listener: () => void) => fieldOutbox().subscribe(listener);
const getSnapshot = () => fieldOutbox().getSnapshot();
/** What a page drawn on the server shows, and what its hydration starts from: nothing read from the phone yet. */
const beforeReading: OutboxSnapshot = { items: [], sending: new Map(), online: true, loaded: false };
const getServerSnapshot = () => beforeReading;

/** What the outbox holds right now, redrawn on every change. */
export function useOutboxSnapshot(): OutboxSnapshot {
  return useSyncExternalStore(subscribe, getSnapshot, getServerSnapshot);
}

/** Runs `onSent` for every item of `orderId` the server has stored (to refresh the order). */
export function useWhenSent(orderId: number, onSent: () => void): void {
  useEffect(() => fieldOutbox().onSent((item) => item.orderId === orderId && onSent()), [orderId, onSent]);
}
