import type { OutboxItem } from './outbox-types';

/**
 * Where the outbox keeps its items between page loads. In the browser it is IndexedDB
 * (idb-outbox-store.ts); tests use the in-memory store below.
 */
export interface OutboxStore {
  all(): Promise<OutboxItem[]>;
  put(item: OutboxItem): Promise<void>;
  remove(id: string): Promise<void>;
}

/** An outbox store in a Map: for tests, and as a fallback where IndexedDB is not available. */
export function memoryOutboxStore(initial: readonly OutboxItem[] = []): OutboxStore & { map: Map<string, OutboxItem> } {
  const map = new Map(initial.map((item) => [item.id, structuredClone(item)]));
  return {
    map,
    all: () => Promise.resolve([...map.values()].map((item) => structuredClone(item))),
    put: (item) => {
      map.set(item.id, structuredClone(item));
      return Promise.resolve();
    },
    remove: (id) => {
      map.delete(id);
      return Promise.resolve();
    },
  };
}
