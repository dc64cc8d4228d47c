// The hot write path's transactions (apps/api/src/db/connection-transaction.ts): on connections
// that never autocommit, with no BEGIN sent, a transaction is still all or nothing and unseen
// by others until it commits; the next transaction on the same connection starts clean.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { sql } from 'drizzle-orm';
import { transactionOnConnection } from '../../apps/api/src/db/connection-transaction';
import { statement } from '../../apps/api/src/db/statement-batch';
import { readCache } from '../../apps/api/src/db/schema/index';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;

beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

const row = (key: string) => ({ cacheKey: key, siteId: null, revision: 1, validFor: '2026-12-03T10:00', body: '{}', storedAt: new Date() });
const stored = async (key: string) => (await app.ctx.db.select({ key: readCache.cacheKey }).from(readCache).where(eq(readCache.cacheKey, key))).length;

describe('transactionOnConnection', () => {
  test('work that throws after writing leaves nothing stored, and the error reaches the caller', async () => {
    const key = unique('tx-rollback');
    const failure = new Error('refused after the write');
    await expect(
      transactionOnConnection(app.ctx.transactionPool, async (tx) => {
        await tx.insert(readCache).values(row(key));
        expect(await stored(key)).toBe(0); // another connection does not see it yet
        throw failure;
      }),
    ).rejects.toBe(failure);
    expect(await stored(key)).toBe(0);
  });

  test('work that ends is committed, and each transaction on a reused connection stands alone', async () => {
    const kept = unique('tx-commit');
    // More transactions than the pool has connections, so connections are handed out again.
    for (let i = 0; i < app.ctx.config.DB_POOL_SIZE + 3; i++) {
      const key = `${kept}-${i}`;
      const result = await transactionOnConnection(app.ctx.transactionPool, async (tx) => {
        await tx.insert(readCache).values(row(key));
        return key;
      });
      expect(result).toBe(key);
      expect(await stored(key)).toBe(1);
      const dropped = `${key}-dropped`;
      await expect(
        transactionOnConnection(app.ctx.transactionPool, async (tx) => {
          await tx.insert(readCache).values(row(dropped));
          throw new Error('no');
        }),
      ).rejects.toThrow('no');
      expect(await stored(dropped)).toBe(0);
    }
  });

  test('statements sent together come back mapped as Drizzle maps them; a failing one stops the rest and nothing is kept', async () => {
    const key = unique('tx-together');
    const insert = (tx: Parameters<Parameters<typeof transactionOnConnection>[1]>[0], k: string) =>
      statement(tx.insert(readCache).values({ ...row(k), storedAt: sql.placeholder('at') }).prepare(), { at: new Date('2026-12-03T10:00:00.250Z') }, () => 'inserted');
    const readBack = (tx: Parameters<Parameters<typeof transactionOnConnection>[1]>[0], k: string) =>
      statement(
        tx.select({ key: readCache.cacheKey, storedAt: readCache.storedAt }).from(readCache).where(eq(readCache.cacheKey, sql.placeholder('k'))).prepare(),
        { k },
        (rows) => rows,
      );
    const answers = await transactionOnConnection(app.ctx.transactionPool, (tx, together) => together([insert(tx, key), readBack(tx, key)], { commit: true }));
    // The row as Drizzle maps it: a Date from the datetime(3) column, not MariaDB's text.
    expect(answers).toEqual(['inserted', [{ key, storedAt: new Date('2026-12-03T10:00:00.250Z') }]]);
    expect(await stored(key)).toBe(1);

    const second = unique('tx-together-failing');
    await expect(
      transactionOnConnection(app.ctx.transactionPool, (tx, together) => together([insert(tx, second), insert(tx, key), readBack(tx, second)], { commit: true })),
    ).rejects.toThrow(/Duplicate entry/);
    expect(await stored(second)).toBe(0);
  });

  test('each statement is prepared on the server once per connection, and its values reach MariaDB as they were', async () => {
    type Tx = Parameters<Parameters<typeof transactionOnConnection>[1]>[0];
    const key = unique('tx-prepared');
    // Quotes, a question mark, a backslash, a semicolon and letters beyond ASCII: the values go in the USING list.
    const body = `it's a "body" ? \\ ; -- ünïcode ⚡ ${key}`;
    const insert = (tx: Tx) =>
      statement(tx.insert(readCache).values({ ...row(key), body: sql.placeholder('body'), siteId: sql.placeholder('siteId') }).prepare(), { body, siteId: null }, () => 'inserted');
    const readBack = (tx: Tx, also?: 'revision') =>
      statement(
        tx
          .select({ body: readCache.body, siteId: readCache.siteId, ...(also ? { revision: readCache.revision } : {}) })
          .from(readCache)
          .where(eq(readCache.cacheKey, sql.placeholder('k')))
          .prepare(),
        { k: key },
        (rows) => rows,
      );
    const sessionCount = async (tx: Tx, name: string) => {
      const [rows] = (await tx.execute(sql`show session status like ${name}`)) as unknown as [Array<{ Value: string }>];
      return Number(rows[0]!.Value);
    };
    const counts = await transactionOnConnection(app.ctx.transactionPool, async (tx, together) => {
      await together([insert(tx), readBack(tx)]);
      const prepared = await sessionCount(tx, 'Com_prepare_sql');
      const executed = await sessionCount(tx, 'Com_execute_sql');
      const answers = [];
      for (let i = 0; i < 3; i++) answers.push(await together([readBack(tx), readBack(tx)]));
      const afterRepeats = { prepared: await sessionCount(tx, 'Com_prepare_sql'), executed: await sessionCount(tx, 'Com_execute_sql') };
      // Another SQL text (another column) is prepared the first time only, once for the two.
      await together([readBack(tx, 'revision'), readBack(tx, 'revision')], { commit: true });
      return { prepared, executed, answers, afterRepeats, afterNew: await sessionCount(tx, 'Com_prepare_sql') };
    });
    expect(counts.answers).toEqual(Array.from({ length: 3 }, () => [[{ body, siteId: null }], [{ body, siteId: null }]]));
    expect(counts.afterRepeats).toEqual({ prepared: counts.prepared, executed: counts.executed + 6 });
    expect(counts.afterNew).toBe(counts.prepared + 1);
    expect(await stored(key)).toBe(1);
  });
});
