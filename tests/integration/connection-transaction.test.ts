// The hot write path's transactions (apps/api/src/db/connection-transaction.ts): on connections
// that never autocommit, with no BEGIN sent, a transaction is still all or nothing and unseen
// by others until it commits; the next transaction on the same connection starts clean.
import { eq, inArray } from 'drizzle-orm';
import { int, mysqlTable, serial, varchar } from 'drizzle-orm/mysql-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { sql } from 'drizzle-orm';
import { transactionOnConnection } from '../../apps/api/src/db/connection-transaction';
import { mergedInsert, mergedLookup, statement, type AnyStatement, type Merge } from '../../apps/api/src/db/statement-batch';
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

  test('statements of one kind in a trip go as one: lookups by key split back to each, a shared INSERT gives each its own row and its follower that row', async () => {
    type Tx = Parameters<Parameters<typeof transactionOnConnection>[1]>[0];
    // Temporary tables: the session's own, gone with it; DDL on them does not end the transaction.
    const items = mysqlTable('varden_merge_items', { id: serial('id').primaryKey(), label: varchar('label', { length: 40 }).notNull() });
    const refs = mysqlTable('varden_merge_refs', { label: varchar('label', { length: 40 }).primaryKey(), itemId: int('item_id').notNull() });
    const lookups = new WeakMap<Tx, Merge>();
    const inserts = new WeakMap<Tx, Merge>();
    const followers = new WeakMap<Tx, Merge>();
    const once = <T>(map: WeakMap<Tx, T>, tx: Tx, make: () => T) => map.get(tx) ?? (map.set(tx, make()), map.get(tx)!);
    const lookup = (tx: Tx, label: string) =>
      statement(
        tx.select().from(items).where(eq(items.label, sql.placeholder('label'))).prepare(),
        { label },
        (rows) => rows.map((r) => r.label),
        {
          merge: once(lookups, tx, () =>
            mergedLookup<{ label: string }>('merge test lookup', 'label', (n) => tx.select().from(items).where(inArray(items.label, Array.from({ length: n }, (_, i) => sql.placeholder(`label${i}`)))).prepare(), (r) => r.label),
          ),
        },
      );
    const insertOf = (tx: Tx, n: number) => tx.insert(items).values(Array.from({ length: n }, (_, i) => ({ label: sql.placeholder(`label${n === 1 ? '' : i}`) }))).$returningId().prepare();
    const insert = (tx: Tx, label: string) =>
      statement(insertOf(tx, 1), { label }, (created) => created[0]!.id, { merge: once(inserts, tx, () => mergedInsert('merge test insert', ['label'], (n) => insertOf(tx, n))) });
    const followerOf = (tx: Tx, n: number) =>
      tx
        .insert(refs)
        .values(Array.from({ length: n }, (_, i) => ({ label: sql.placeholder(`label${n === 1 ? '' : i}`), itemId: sql`last_insert_id() + ${sql.placeholder(`offset${n === 1 ? '' : i}`)}` })))
        .prepare();
    const follower = (tx: Tx, label: string, of: AnyStatement) =>
      statement(followerOf(tx, 1), { label }, () => undefined, {
        merge: once(followers, tx, () => mergedInsert('merge test follower', ['label', 'offset'], (n) => followerOf(tx, n))),
        follows: { statement: of, offset: 'offset' },
      });
    const executed = async (tx: Tx) => {
      const [rows] = (await tx.execute(sql`show session status like 'Com_execute_sql'`)) as unknown as [Array<{ Value: string }>];
      return Number(rows[0]!.Value);
    };
    const outcome = await transactionOnConnection(app.ctx.transactionPool, async (tx, together) => {
      await tx.execute(sql`create temporary table varden_merge_items (id int auto_increment primary key, label varchar(40) not null)`);
      await tx.execute(sql`create temporary table varden_merge_refs (label varchar(40) primary key, item_id int not null)`);
      // Ids the shared INSERT must not take for its own: rows already there.
      await together([insert(tx, 'first'), insert(tx, 'second')]);
      const labels = ['a', 'b', 'c', 'd'];
      const before = await executed(tx);
      const made = labels.map((label) => insert(tx, label));
      // Each reading's pair as a work sends it: its INSERT, then its follower.
      const ids = await together(made.flatMap((m, i) => [m, follower(tx, labels[i]!, m)]));
      const statementsRun = (await executed(tx)) - before;
      const found = await together([lookup(tx, 'c'), lookup(tx, 'missing'), lookup(tx, 'a'), lookup(tx, 'c')]);
      const stored = await tx.select().from(items);
      const pointed = await tx.select().from(refs);
      const late = insert(tx, 'e');
      const misplaced = await together([follower(tx, 'e', late), late]).then(
        () => 'sent',
        (error: Error) => error.message,
      );
      return { ids: ids.filter((_, i) => i % 2 === 0), statementsRun, found, stored, pointed, misplaced };
    });
    const idOf = (label: string) => outcome.stored.find((r) => r.label === label)!.id;
    // Two statements ran for eight: one INSERT of four rows, one of their four followers.
    expect(outcome.statementsRun).toBe(2);
    expect(outcome.ids).toEqual(['a', 'b', 'c', 'd'].map(idOf));
    expect(new Set(outcome.ids).size).toBe(4);
    for (const label of ['a', 'b', 'c', 'd']) expect(outcome.pointed.find((r) => r.label === label)?.itemId).toBe(idOf(label));
    expect(outcome.found).toEqual([['c'], [], ['a'], ['c']]);
    expect(outcome.misplaced).toMatch(/a follower must come after its INSERT/);
  });
});
