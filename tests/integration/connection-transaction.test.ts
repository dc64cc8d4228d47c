// The hot write path's transactions (apps/api/src/db/connection-transaction.ts): on connections
// that never autocommit, with no BEGIN sent, a transaction is still all or nothing and unseen
// by others until it commits; the next transaction on the same connection starts clean.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { transactionOnConnection } from '../../apps/api/src/db/connection-transaction';
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
});
