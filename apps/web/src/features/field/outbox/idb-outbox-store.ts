import { createStore, del, set, values } from 'idb-keyval';
import { memoryOutboxStore, type OutboxStore } from './outbox-store';
import type { OutboxItem } from './outbox-types';

/**
 * The outbox in IndexedDB (database varden-field, store outbox), one record per item keyed by
 * its idempotency key, so a photo's blob is written once and a reload keeps everything.
 */
export function idbOutboxStore(): OutboxStore {
  if (typeof indexedDB === 'undefined') return memoryOutboxStore();
  const store = createStore('varden-field', 'outbox');
  return {
    all: () => values<OutboxItem>(store),
    put: (item) => set(item.id, item, store),
    remove: (id) => del(id, store),
  };
}
