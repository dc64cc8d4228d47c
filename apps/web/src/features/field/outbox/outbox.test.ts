import type { ReadingInput } from '@varden/schemas';
import { describe, expect, test } from 'vitest';
import { backoffDelayMs, newIdempotencyKey, outcomeOf } from './answer-outcome';
import { countFor, createOutbox, type OutboxDeps } from './outbox';
import { memoryOutboxStore } from './outbox-store';
import type { OutboxItem, SendOutcome } from './outbox-types';

const reading = (targetId: number, key = newIdempotencyKey()): ReadingInput => ({
  idempotencyKey: key,
  target: 'fuse-set',
  targetId,
  continuity: [true, true, true],
  ratingMatchesRegister: true,
});

/** A fake server: answers by the queue of outcomes given, then 201; records what it stored, once per key. */
function fakeServer(answers: Array<SendOutcome | 'offline'> = []) {
  const stored = new Map<string, OutboxItem>();
  const calls: string[] = [];
  let offline = false;
  const send: OutboxDeps['send'] = (item) => {
    calls.push(item.id);
    const next = answers.shift();
    if (offline || next === 'offline') return Promise.resolve({ kind: 'retry', status: 0, message: 'No signal' });
    if (next) return Promise.resolve(next);
    const created = !stored.has(item.id);
    stored.set(item.id, item);
    return Promise.resolve({ kind: 'sent', status: created ? 201 : 200, body: { id: stored.size } });
  };
  return {
    send,
    stored,
    calls,
    setOffline: (value: boolean) => {
      offline = value;
    },
  };
}

function manualTimers() {
  const pending: Array<{ run: () => void; delayMs: number }> = [];
  const setTimer: NonNullable<OutboxDeps['setTimer']> = (run, delayMs) => {
    const entry = { run, delayMs };
    pending.push(entry);
    return () => {
      const index = pending.indexOf(entry);
      if (index >= 0) pending.splice(index, 1);
    };
  };
  return { setTimer, pending, fire: () => pending.splice(0).forEach((entry) => entry.run()) };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

describe('answers', () => {
  test('2xx is sent; no answer, 408, 429, 5xx and 401 are kept; other 4xx are refused', () => {
    expect(outcomeOf(201, {}).kind).toBe('sent');
    expect(outcomeOf(200, {}).kind).toBe('sent');
    for (const status of [0, 401, 408, 429, 500, 502, 503]) expect(outcomeOf(status, undefined).kind).toBe('retry');
    for (const status of [400, 403, 404, 409, 413, 415]) expect(outcomeOf(status, undefined).kind).toBe('refused');
  });

  test("a 400 asking for confirmation keeps the server's message and fields", () => {
    const outcome = outcomeOf(400, {
      error: { code: 'invalid', message: 'Some values look implausible.', fields: { readingsUF: 'Confirm it' }, confirmable: true },
    });
    expect(outcome).toEqual({
      kind: 'refused',
      refusal: { status: 400, code: 'invalid', message: 'Some values look implausible.', fields: { readingsUF: 'Confirm it' }, confirmable: true },
    });
  });

  test('backoff doubles from 2 s and stops at a minute', () => {
    const mid = () => 0.5;
    expect([0, 1, 2, 3, 4, 5, 9].map((n) => backoffDelayMs(n, mid))).toEqual([2000, 4000, 8000, 16000, 32000, 60000, 60000]);
    expect(backoffDelayMs(0, () => 0)).toBe(1600);
    expect(backoffDelayMs(0, () => 1)).toBe(2400);
  });

  test('idempotency keys match the contract', () => {
    expect(newIdempotencyKey()).toMatch(/^[A-Za-z0-9_-]{16,64}$/);
  });
});

describe('the outbox', () => {
  test('writes an item to storage before sending it, and removes it once the server stored it', async () => {
    const store = memoryOutboxStore();
    const seenInStore: boolean[] = [];
    const server = fakeServer();
    const outbox = createOutbox({
      store,
      isOnline: () => true,
      send: (item, progress) => {
        seenInStore.push(store.map.has(item.id));
        return server.send(item, progress);
      },
    });
    await outbox.load();
    const sent: string[] = [];
    outbox.onSent((item) => sent.push(item.id));
    const item = await outbox.add({ orderId: 7, label: 'Step 1 fuses', payload: { kind: 'reading', input: reading(3) } });
    await outbox.flush();
    expect(seenInStore).toEqual([true]);
    expect(sent).toEqual([item.id]);
    expect(store.map.size).toBe(0);
    expect(outbox.getSnapshot().items).toEqual([]);
  });

  test('offline: items stay, in order, and go out once each when the signal returns', async () => {
    const store = memoryOutboxStore();
    const server = fakeServer();
    let online = false;
    const timers = manualTimers();
    const outbox = createOutbox({ store, send: server.send, isOnline: () => online, setTimer: timers.setTimer, random: () => 0.5 });
    await outbox.load();
    const first = await outbox.add({ orderId: 1, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    const second = await outbox.add({ orderId: 1, label: 'b', payload: { kind: 'reading', input: reading(2) } });
    await outbox.flush();
    expect(server.calls).toEqual([]);
    expect(countFor(outbox.getSnapshot().items, 1)).toEqual({ waiting: 2, refused: 0 });
    expect(outbox.getSnapshot().online).toBe(false);
    expect(timers.pending.length).toBe(1);

    online = true;
    outbox.setOnline(true);
    await settle();
    await outbox.flush();
    expect(server.calls).toEqual([first.id, second.id]);
    expect([...server.stored.keys()]).toEqual([first.id, second.id]);
    expect(outbox.getSnapshot().items).toEqual([]);
    expect(timers.pending.length).toBe(0);
  });

  test('a lost answer is retried with the same key on a backoff timer; the server stores it once', async () => {
    const store = memoryOutboxStore();
    const server = fakeServer(['offline', 'offline']);
    const timers = manualTimers();
    const outbox = createOutbox({ store, send: server.send, isOnline: () => true, setTimer: timers.setTimer, random: () => 0.5 });
    await outbox.load();
    const item = await outbox.add({ orderId: 1, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    await outbox.flush();
    expect(timers.pending.map((t) => t.delayMs)).toEqual([2000]);
    expect(outbox.getSnapshot().items[0]).toMatchObject({ status: 'waiting', attempts: 1, lastFailure: 'No signal' });

    timers.fire();
    await outbox.flush();
    expect(timers.pending.map((t) => t.delayMs)).toEqual([4000]);
    expect(outbox.getSnapshot().items[0]).toMatchObject({ attempts: 2 });

    timers.fire();
    await outbox.flush();
    expect(server.calls).toEqual([item.id, item.id, item.id]);
    expect(server.stored.size).toBe(1);
    expect(outbox.getSnapshot().items).toEqual([]);
  });

  test('a 5xx on one item does not hold up the next; no answer stops the pass', async () => {
    const server = fakeServer([{ kind: 'retry', status: 503, message: 'busy' }]);
    const outbox = createOutbox({ store: memoryOutboxStore(), send: server.send, isOnline: () => true, setTimer: manualTimers().setTimer });
    await outbox.load();
    const photo = await outbox.add({
      orderId: 1,
      label: 'photo',
      payload: { kind: 'photo', idempotencyKey: newIdempotencyKey(), file: new Blob(['x']), fileName: 'a.jpg', caption: '' },
    });
    const next = await outbox.add({ orderId: 1, label: 'b', payload: { kind: 'reading', input: reading(2) } });
    await outbox.flush();
    expect(server.stored.has(next.id)).toBe(true);
    expect(outbox.getSnapshot().items.map((i) => i.id)).toEqual([photo.id]);

    const offlineServer = fakeServer(['offline']);
    const stalled = createOutbox({ store: memoryOutboxStore(), send: offlineServer.send, isOnline: () => true, setTimer: manualTimers().setTimer });
    // Added before the outbox was read back, so one pass meets both.
    const a = await stalled.add({ orderId: 1, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    await stalled.add({ orderId: 1, label: 'b', payload: { kind: 'reading', input: reading(2) } });
    await stalled.load();
    expect(offlineServer.calls).toEqual([a.id]);
    expect(countFor(stalled.getSnapshot().items)).toEqual({ waiting: 2, refused: 0 });
  });

  test('a refusal stays on its item, is not retried, and a confirmation resends it with confirmImplausible', async () => {
    const server = fakeServer([
      { kind: 'refused', refusal: { status: 400, code: 'invalid', message: 'Implausible', fields: {}, confirmable: true } },
    ]);
    const timers = manualTimers();
    const store = memoryOutboxStore();
    const outbox = createOutbox({ store, send: server.send, isOnline: () => true, setTimer: timers.setTimer });
    await outbox.load();
    const item = await outbox.add({ orderId: 1, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    await outbox.flush();
    expect(outbox.getSnapshot().items[0]).toMatchObject({ status: 'refused', refusal: { confirmable: true } });
    expect(timers.pending.length).toBe(0);
    await outbox.sendNow();
    expect(server.calls.length).toBe(1);

    await outbox.confirm(item.id);
    expect(server.calls).toEqual([item.id, item.id]);
    const stored = server.stored.get(item.id);
    expect(stored?.payload.kind === 'reading' && stored.payload.input.confirmImplausible).toBe(true);
    expect(store.map.size).toBe(0);
  });

  test("readings wait behind the order's move on site; a refused move holds them", async () => {
    const server = fakeServer([{ kind: 'refused', refusal: { status: 409, code: 'conflict', message: 'Changed', fields: {}, confirmable: false } }]);
    const outbox = createOutbox({ store: memoryOutboxStore(), send: server.send, isOnline: () => true, setTimer: manualTimers().setTimer });
    await outbox.load();
    const move = await outbox.add({ orderId: 4, label: 'on site', payload: { kind: 'transition', to: 'on-site', version: 2, comment: '' } });
    await outbox.add({ orderId: 4, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    const other = await outbox.add({ orderId: 5, label: 'b', payload: { kind: 'reading', input: reading(2) } });
    await outbox.flush();
    expect(server.calls).toEqual([move.id, other.id]);
    expect(countFor(outbox.getSnapshot().items, 4)).toEqual({ waiting: 1, refused: 1 });
    await outbox.discard(move.id);
    await outbox.flush();
    expect(server.calls.length).toBe(3);
  });

  test('a reload reads the outbox back from storage and sends what waits', async () => {
    const store = memoryOutboxStore();
    const offline = createOutbox({ store, send: fakeServer().send, isOnline: () => false, setTimer: manualTimers().setTimer });
    await offline.load();
    const a = await offline.add({ orderId: 1, label: 'a', payload: { kind: 'reading', input: reading(1) } });
    const b = await offline.add({ orderId: 1, label: 'b', payload: { kind: 'reading', input: reading(2) } });
    offline.dispose();

    const server = fakeServer();
    const reloaded = createOutbox({ store, send: server.send, isOnline: () => true, setTimer: manualTimers().setTimer });
    await reloaded.load();
    expect(server.calls).toEqual([a.id, b.id]);
    const c = await reloaded.add({ orderId: 1, label: 'c', payload: { kind: 'reading', input: reading(3) } });
    expect(c.seq).toBeGreaterThan(b.seq);
  });

  test('photos report their upload progress while they are sent', async () => {
    const seen: Array<number | null | undefined> = [];
    let outboxRef: ReturnType<typeof createOutbox> | null = null;
    const outbox = createOutbox({
      store: memoryOutboxStore(),
      isOnline: () => true,
      setTimer: manualTimers().setTimer,
      send: (item, onProgress) => {
        onProgress(0.5);
        seen.push(outboxRef?.getSnapshot().sending.get(item.id));
        return Promise.resolve({ kind: 'sent', status: 201, body: {} });
      },
    });
    outboxRef = outbox;
    await outbox.load();
    await outbox.add({
      orderId: 1,
      label: 'photo',
      payload: { kind: 'photo', idempotencyKey: newIdempotencyKey(), file: new Blob(['x']), fileName: 'a.jpg', caption: 'Nameplate' },
    });
    await outbox.flush();
    expect(seen).toEqual([0.5]);
    expect(outbox.getSnapshot().sending.size).toBe(0);
  });
});
