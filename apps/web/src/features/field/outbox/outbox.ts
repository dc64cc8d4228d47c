import { backoffDelayMs, newIdempotencyKey } from './answer-outcome';
import type { OutboxStore } from './outbox-store';
import type { OutboxItem, OutboxPayload, OutboxSnapshot, SendOutcome } from './outbox-types';

export type OutboxDeps = {
  store: OutboxStore;
  /** One try to send an item; `onProgress` reports the share uploaded (photos). Never throws. */
  send: (item: OutboxItem, onProgress: (fraction: number) => void) => Promise<SendOutcome>;
  isOnline: () => boolean;
  /** Sets a timer and returns its cancel; defaults to setTimeout. */
  setTimer?: (run: () => void, delayMs: number) => () => void;
  random?: () => number;
  now?: () => Date;
};

export type OutboxDraft = { orderId: number; label: string; payload: OutboxPayload };

export type SentListener = (item: OutboxItem, outcome: Extract<SendOutcome, { kind: 'sent' }>) => void;

export type Outbox = {
  /** Reads what a previous page load left, then starts sending. */
  load(): Promise<void>;
  /** Writes the item to storage first, then tries to send it. Resolves once it is stored on the phone. */
  add(draft: OutboxDraft): Promise<OutboxItem>;
  /** One pass over what is due; a pass already running is followed by another. */
  flush(): Promise<void>;
  /** Sends what is waiting now, without waiting for the backoff. */
  sendNow(): Promise<void>;
  setOnline(online: boolean): void;
  /** Resends a reading the server found implausible, with confirmImplausible: true. */
  confirm(id: string): Promise<void>;
  /** Takes a refused item out of the outbox: the technician gave it up. */
  discard(id: string): Promise<void>;
  subscribe(listener: () => void): () => void;
  getSnapshot(): OutboxSnapshot;
  onSent(listener: SentListener): () => void;
  dispose(): void;
};

const defaultTimer = (run: () => void, delayMs: number) => {
  const handle = setTimeout(run, delayMs);
  return () => clearTimeout(handle);
};

/** An earlier move of the same order still waiting: what comes after it must wait too (a reading needs the order on site). */
export function isBlocked(item: OutboxItem, items: readonly OutboxItem[]): boolean {
  return items.some((other) => other.orderId === item.orderId && other.seq < item.seq && other.payload.kind === 'transition');
}

/** How many items of an order (or of all orders) are still waiting or refused. */
export function countFor(items: readonly OutboxItem[], orderId?: number): { waiting: number; refused: number } {
  let waiting = 0;
  let refused = 0;
  for (const item of items) {
    if (orderId !== undefined && item.orderId !== orderId) continue;
    if (item.status === 'refused') refused++;
    else waiting++;
  }
  return { waiting, refused };
}

/**
 * The field outbox. Items go out one at a time in the order they were recorded; an item stays
 * until the server has stored it (a 2xx). No answer stops the pass (the signal is gone) and a
 * timer with backoff tries again, as does the browser's 'online' event; a 5xx, 408 or 429 on
 * one item does not hold up the others. A refusal (other 4xx) stays on its item for the
 * technician. Because every item carries its idempotency key, sending one twice (a reload
 * mid-send, two tabs) stores it once.
 */
export function createOutbox(deps: OutboxDeps): Outbox {
  const setTimer = deps.setTimer ?? defaultTimer;
  const random = deps.random ?? Math.random;
  const now = deps.now ?? (() => new Date());

  let items: OutboxItem[] = [];
  let sending = new Map<string, number | null>();
  let online = deps.isOnline();
  let loaded = false;
  let nextSeq = 1;
  let failures = 0;
  let cancelTimer: (() => void) | null = null;
  let running: Promise<void> | null = null;
  let again = false;
  let disposed = false;
  let snapshot: OutboxSnapshot = { items, sending, online, loaded };

  const listeners = new Set<() => void>();
  const sentListeners = new Set<SentListener>();

  function emit() {
    snapshot = { items, sending, online, loaded };
    for (const listener of listeners) listener();
  }

  function replace(item: OutboxItem) {
    items = items.map((other) => (other.id === item.id ? item : other));
  }

  function setSending(id: string, fraction: number | null | undefined) {
    sending = new Map(sending);
    if (fraction === undefined) sending.delete(id);
    else sending.set(id, fraction);
  }

  function schedule() {
    cancelTimer?.();
    cancelTimer = null;
    if (disposed || !items.some((item) => item.status === 'waiting')) return;
    const delay = backoffDelayMs(failures - 1, random);
    cancelTimer = setTimer(() => {
      cancelTimer = null;
      void flush();
    }, delay);
  }

  /** One pass; `tried` spans the passes of one run, so an item that just failed waits for its backoff. */
  async function pass(tried: Set<string>): Promise<void> {
    let anyRetry = false;
    let anySent = false;
    for (;;) {
      online = deps.isOnline();
      if (!online) {
        anyRetry = true;
        break;
      }
      const next = items.find((item) => item.status === 'waiting' && !tried.has(item.id) && !isBlocked(item, items));
      if (!next) break;
      tried.add(next.id);
      setSending(next.id, null);
      emit();
      const outcome = await deps.send(next, (fraction) => {
        if (!sending.has(next.id)) return;
        setSending(next.id, fraction);
        emit();
      });
      setSending(next.id, undefined);
      if (!items.some((item) => item.id === next.id)) {
        emit();
        continue; // discarded while it was on its way
      }
      if (outcome.kind === 'sent') {
        await deps.store.remove(next.id);
        items = items.filter((item) => item.id !== next.id);
        emit();
        anySent = true;
        for (const listener of sentListeners) listener(next, outcome);
        continue;
      }
      if (outcome.kind === 'refused') {
        const refused: OutboxItem = { ...next, status: 'refused', attempts: next.attempts + 1, refusal: outcome.refusal, lastFailure: null };
        await deps.store.put(refused);
        replace(refused);
        anySent = true;
        emit();
        continue;
      }
      anyRetry = true;
      const kept: OutboxItem = { ...next, attempts: next.attempts + 1, lastFailure: outcome.message };
      await deps.store.put(kept);
      replace(kept);
      emit();
      // No answer at all: the signal is gone, the rest would fail the same way.
      if (outcome.status === 0) break;
    }
    // A pass that met the server without a failure resets the backoff; one that only skipped leaves it.
    if (anyRetry) failures += 1;
    else if (anySent) failures = 0;
    emit();
    schedule();
  }

  function flush(): Promise<void> {
    if (disposed || !loaded) return Promise.resolve();
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      try {
        const tried = new Set<string>();
        do {
          again = false;
          await pass(tried);
        } while (again && !disposed);
      } finally {
        running = null;
      }
    })();
    return running;
  }

  function sendNow(): Promise<void> {
    failures = 0;
    cancelTimer?.();
    cancelTimer = null;
    return flush();
  }

  return {
    async load() {
      const stored = await deps.store.all();
      const known = new Set(items.map((item) => item.id));
      items = [...items, ...stored.filter((item) => !known.has(item.id))].sort((a, b) => a.seq - b.seq);
      nextSeq = Math.max(nextSeq, ...items.map((item) => item.seq + 1));
      loaded = true;
      emit();
      await flush();
    },

    async add(draft) {
      const id = draft.payload.kind === 'reading' ? draft.payload.input.idempotencyKey : draft.payload.kind === 'photo' ? draft.payload.idempotencyKey : newIdempotencyKey();
      const item: OutboxItem = {
        id,
        orderId: draft.orderId,
        seq: nextSeq++,
        createdAt: now().toISOString(),
        label: draft.label,
        payload: draft.payload,
        status: 'waiting',
        attempts: 0,
        lastFailure: null,
        refusal: null,
      };
      await deps.store.put(item);
      items = [...items, item];
      emit();
      void flush();
      return item;
    },

    flush,

    sendNow,

    setOnline(isOnline) {
      online = isOnline;
      emit();
      if (isOnline) void sendNow();
    },

    async confirm(id) {
      const item = items.find((other) => other.id === id);
      if (!item || item.payload.kind !== 'reading') return;
      const confirmed: OutboxItem = {
        ...item,
        payload: { kind: 'reading', input: { ...item.payload.input, confirmImplausible: true } },
        status: 'waiting',
        refusal: null,
        lastFailure: null,
      };
      await deps.store.put(confirmed);
      replace(confirmed);
      emit();
      await sendNow();
    },

    async discard(id) {
      await deps.store.remove(id);
      items = items.filter((item) => item.id !== id);
      emit();
    },

    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },

    getSnapshot: () => snapshot,

    onSent(listener) {
      sentListeners.add(listener);
      return () => sentListeners.delete(listener);
    },

    dispose() {
      disposed = true;
      cancelTimer?.();
      cancelTimer = null;
    },
  };
}
