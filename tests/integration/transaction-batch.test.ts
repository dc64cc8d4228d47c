// Works sharing a transaction (apps/api/src/db/transaction-batch.ts), on the test MariaDB: those
// that queue while a batch runs go together in the next one, on one connection with their
// statements in shared round trips; a work's isolated refusal fails it alone; any other failure
// rolls the whole batch back and the others are told to run on their own; nothing half-done stays.
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Database } from '../../apps/api/src/db/client';
import type { Together } from '../../apps/api/src/db/connection-transaction';
import { readCache } from '../../apps/api/src/db/schema/index';
import { statement } from '../../apps/api/src/db/statement-batch';
import { createTransactionBatcher, RunAlone } from '../../apps/api/src/db/transaction-batch';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

class Refusal extends Error {}
const batcher = () => createTransactionBatcher(app.ctx.transactionPool, { maxWorks: 16, maxBatches: 1, isolated: (e) => e instanceof Refusal });

const row = (key: string) => ({ cacheKey: key, siteId: null, revision: 1, validFor: '2026-12-04T20:00', body: '{}', storedAt: new Date() });
const stored = async (key: string) => (await app.ctx.db.select({ key: readCache.cacheKey }).from(readCache).where(eq(readCache.cacheKey, key))).length;
const insert = (tx: Database, key: string) => statement(tx.insert(readCache).values({ ...row(key), cacheKey: sql.placeholder('key') }).prepare(), { key }, () => key);
const connectionId = (tx: Database) => statement(tx.select({ id: sql<number>`connection_id()` }).from(sql`dual`).prepare(), {}, (rows) => Number(rows[0]!.id));

/** A work as the readings service writes one: a read, then its write with the commit. */
const work = (key: string, seen: number[], options: { refuse?: boolean; fail?: boolean } = {}) => async (tx: Database, together: Together) => {
  const [id] = await together([connectionId(tx)]);
  seen.push(id);
  if (options.refuse) throw new Refusal(`refused ${key}`);
  if (options.fail) throw new Error(`failed ${key}`);
  await together([insert(tx, key)], { commit: true });
  return key;
};

/** A first work that holds the batcher's only batch until `release`, so the works queued after it has started wait for the next. */
async function holder(b: ReturnType<typeof batcher>) {
  let release!: () => void;
  let started!: () => void;
  const gate = new Promise<void>((resolve) => (release = resolve));
  const running = new Promise<void>((resolve) => (started = resolve));
  const done = b.run(async (tx, together) => {
    await together([connectionId(tx)]);
    started();
    await gate;
    return 'held';
  });
  await running;
  return {
    release: async () => {
      release();
      expect(await done).toBe('held');
    },
  };
}

describe('createTransactionBatcher', () => {
  test('works queued behind a running batch share the next one: one connection, all committed', async () => {
    const b = batcher();
    const hold = await holder(b);
    const base = unique('batch-shared');
    const seen: number[] = [];
    const works = [0, 1, 2, 3, 4].map((i) => b.run(work(`${base}-${i}`, seen)));
    await hold.release();
    expect(await Promise.all(works)).toEqual([0, 1, 2, 3, 4].map((i) => `${base}-${i}`));
    expect(seen).toHaveLength(5);
    expect(new Set(seen).size).toBe(1); // one transaction, on one connection
    for (let i = 0; i < 5; i++) expect(await stored(`${base}-${i}`)).toBe(1);
  });

  test("an isolated refusal fails only its own work; the others' writes are committed", async () => {
    const b = batcher();
    const hold = await holder(b);
    const base = unique('batch-refusal');
    const seen: number[] = [];
    const works = [b.run(work(`${base}-a`, seen)), b.run(work(`${base}-b`, seen, { refuse: true })), b.run(work(`${base}-c`, seen))];
    await hold.release();
    const settled = await Promise.allSettled(works);
    expect(settled[0]).toEqual({ status: 'fulfilled', value: `${base}-a` });
    expect(settled[1]).toMatchObject({ status: 'rejected', reason: expect.any(Refusal) });
    expect(settled[2]).toEqual({ status: 'fulfilled', value: `${base}-c` });
    expect([await stored(`${base}-a`), await stored(`${base}-b`), await stored(`${base}-c`)]).toEqual([1, 0, 1]);
  });

  test('any other failure rolls the batch back: nothing of it is stored, the failing work gets RunAlone as the rest do', async () => {
    const b = batcher();
    const hold = await holder(b);
    const base = unique('batch-failure');
    const seen: number[] = [];
    const works = [b.run(work(`${base}-a`, seen)), b.run(work(`${base}-b`, seen, { fail: true })), b.run(work(`${base}-c`, seen, { refuse: true }))];
    await hold.release();
    const settled = await Promise.allSettled(works);
    expect(settled[0]).toMatchObject({ status: 'rejected', reason: expect.any(RunAlone) });
    expect(settled[1]).toMatchObject({ status: 'rejected', reason: expect.any(RunAlone) });
    // A refusal stands: it was decided before the work wrote anything.
    expect(settled[2]).toMatchObject({ status: 'rejected', reason: expect.any(Refusal) });
    expect([await stored(`${base}-a`), await stored(`${base}-b`)]).toEqual([0, 0]);
  });

  test('a failing statement in a shared round trip (a duplicate key) rolls back the writes sent before it in that trip', async () => {
    const b = batcher();
    const taken = unique('batch-taken');
    await app.ctx.db.insert(readCache).values(row(taken));
    const hold = await holder(b);
    const base = unique('batch-duplicate');
    const seen: number[] = [];
    const works = [b.run(work(`${base}-a`, seen)), b.run(work(taken, seen)), b.run(work(`${base}-c`, seen))];
    await hold.release();
    const settled = await Promise.allSettled(works);
    expect(settled.map((s) => s.status)).toEqual(['rejected', 'rejected', 'rejected']);
    expect(settled.every((s) => s.status === 'rejected' && s.reason instanceof RunAlone)).toBe(true);
    expect([await stored(`${base}-a`), await stored(`${base}-c`)]).toEqual([0, 0]);
  });

  test('alone in its batch, a work fails with its own error, and a claim is granted once per batch', async () => {
    const b = batcher();
    await expect(b.run(work(unique('batch-alone'), [], { fail: true }))).rejects.toThrow(/^failed batch-alone/);
    const hold = await holder(b);
    const claims: boolean[] = [];
    const claimers = [0, 1, 2].map((i) => b.run(async (_tx, _together, batch) => claims.push(batch.claim(i === 2 ? 'bank 2' : 'bank 1'))));
    await hold.release();
    await Promise.all(claimers);
    expect(claims).toEqual([true, false, true]);
  });
});
