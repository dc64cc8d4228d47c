import { ENGINEERING_VERSION } from '@varden/engineering';
import { raisedFlag, type Reading, type UnitReading, type unitReadingListQuery } from '@varden/schemas';
import { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import { siteScope } from '../../access/site-scope';
import type { AppContext } from '../../context';
import type { Database } from '../../db/client';
import type { flags } from '../../db/schema/index';
import { isDuplicateKey } from '../../db/versioned';
import { cacheKey, readThrough } from '../../db/read-cache';
import { AppError } from '../../http/app-error';
import { notifyReplaceFlag } from '../flags/flag-mail';
import { assertRecordable, assertVisible, findVisibleOrder } from '../work-orders/order-guard';
import { transactionOnConnection, type Together, type TransactionPool } from '../../db/connection-transaction';
import { createTransactionBatcher, RunAlone, type BatchClaims, type TransactionBatcher } from '../../db/transaction-batch';
import { evaluateReading } from './evaluate';
import type { ReadingInputValue } from './evaluation-types';
import {
  advanceUnitLatestStatement,
  findReadingByKey,
  flagKey,
  insertFlag,
  insertReadingStatement,
  lockOrderAndBank,
  lockOrderAndBankStatement,
  readingsOfOrder,
  siteOfUnit,
  unclearedFlagKeys,
  unitDrift,
  unitDriftHistoryStatement,
  unitPlaceForReadingStatement,
  unitReadingPage,
  type ReadingRow,
} from './readings.repository';

export type FlagRow = typeof flags.$inferSelect;

/** A phone's clock may run a little fast; beyond this a time in the future is refused. */
const clockSkewMs = 5 * 60 * 1000;

/**
 * Capacitor readings that arrive while others are being stored share their transaction
 * (db/transaction-batch.ts): up to 32 in one, two such transactions at once, so that one
 * waiting on a lock does not hold up every reading. Each reading claims its bank, so two
 * readings of one bank never share a transaction (a later one runs on its own, after the bank's
 * lock is released); a refusal fails only its own reading.
 */
const batchers = new WeakMap<TransactionPool, TransactionBatcher>();
const batcherOf = (pool: TransactionPool) => {
  let batcher = batchers.get(pool);
  if (!batcher) {
    batcher = createTransactionBatcher(pool, { maxWorks: 32, maxBatches: 2, isolated: (error) => error instanceof AppError });
    batchers.set(pool, batcher);
  }
  return batcher;
};

type Stored = { row: ReadingRow; newFlags: FlagRow[] };

/** A capacitor reading in a shared transaction, or in one of its own when its batch could not commit. */
async function storeShared(pool: TransactionPool, store: (tx: Database, together: Together, claims?: BatchClaims) => Promise<Stored>): Promise<Stored> {
  try {
    return await batcherOf(pool).run(store);
  } catch (error) {
    if (!(error instanceof RunAlone)) throw error;
    return transactionOnConnection(pool, (tx, together) => store(tx, together));
  }
}

/**
 * Records a reading on a work order and evaluates it on the server.
 *
 * - Idempotent: the phone's key is unique. A retry by the same person on the same order gets
 *   the stored reading (created: false), whatever has happened to the order since; the key on
 *   another order or reading is a conflict. The key is looked up only when the reading cannot
 *   be stored (a refusal or the unique key), so a first sending costs no lookup.
 * - Only the assignee, only while the order is on site, never once sealed (order-guard),
 *   checked on the order as read under its lock inside the transaction.
 * - The reading, the unit's latest evaluation and its drift, and new flags are written in one
 *   transaction, holding a lock on the bank so concurrent readings raise each flag once.
 *   The transaction runs on one pooled connection (db/connection-transaction.ts), so its
 *   statements are prepared once per connection, not built again for every reading.
 */
export async function recordReading(
  ctx: AppContext,
  user: SessionUser,
  orderId: number,
  input: ReadingInputValue,
): Promise<{ reading: Reading; created: boolean }> {
  let stored: Stored;
  try {
    const recordedAt = recordedAtOf(input);
    const store = (tx: Database, together: Together, claims?: BatchClaims) => storeReading(tx, together, user, orderId, input, recordedAt, claims);
    stored =
      input.target === 'capacitor-unit'
        ? await storeShared(ctx.transactionPool, store)
        : await transactionOnConnection(ctx.transactionPool, (tx, together) => store(tx, together));
  } catch (error) {
    // A retry of a reading already stored, or its key used for another: the key tells.
    const refused = error instanceof AppError;
    if (!refused && !isDuplicateKey(error)) throw error;
    const earlier = await findReadingByKey(ctx.db, input.idempotencyKey);
    if (earlier && isRetryOf(earlier.reading, user, orderId, input)) return { reading: toReading(earlier), created: false };
    if (refused) throw error;
    if (earlier) throw keyTaken();
    throw new AppError('conflict', 'The reading could not be stored; send it again.');
  }
  await announceNewFlags(ctx, stored.newFlags);
  return { reading: toReading({ reading: stored.row, recordedByName: user.name }), created: true };
}

/**
 * The transaction of recordReading, on `tx`, a transaction's handle. For a capacitor unit (the
 * common reading) it takes three round trips: the lock with the unit's place, the flags already
 * open if the reading raises any, and the writes with the commit; in a shared transaction
 * (storeShared) each of them carries the statements of the batch's other readings too.
 */
async function storeReading(
  tx: Database,
  together: Together,
  user: SessionUser,
  orderId: number,
  input: ReadingInputValue,
  recordedAt: Date,
  /** In a shared transaction (storeShared): the bank is this reading's to write for, or it runs on its own. */
  claims?: BatchClaims,
): Promise<Stored> {
  // A second request with the same key waits on the bank's lock, then meets the unique key.
  // For a unit, its place is read in the same round trip, after the lock and so under it.
  const [locked, read] =
    input.target === 'capacitor-unit'
      ? await together([lockOrderAndBankStatement(tx, orderId), unitPlaceForReadingStatement(tx, input.targetId)]).then(
          ([order, unitPlace]) => [order, { together, unitPlace }] as const,
        )
      : ([await lockOrderAndBank(tx, orderId), undefined] as const);
  const order = assertRecordable(assertVisible(locked, user, orderId), user);
  if (claims && !claims.claim(`bank ${order.bankId}`)) throw new RunAlone();

  const outcome = await evaluateReading(tx, order, input, recordedAt, read);
  const open = await unclearedFlagKeys(tx, outcome.flags);
  const drafts = outcome.flags.filter((f, i, all) => all.findIndex((g) => flagKey(g) === flagKey(f)) === i);
  outcome.evaluation.flags = drafts.map((f) => ({ kind: f.kind, severity: f.severity, message: f.message, alreadyOpen: open.has(flagKey(f)) }));
  const toRaise = drafts.filter((draft) => !open.has(flagKey(draft)));

  const values = {
    workOrderId: orderId,
    idempotencyKey: input.idempotencyKey,
    target: input.target,
    targetId: input.targetId,
    input: { ...input },
    evaluation: outcome.evaluation,
    engineeringVersion: ENGINEERING_VERSION,
    band: outcome.band ?? null,
    deviationPct: outcome.deviationPct ?? null,
    recordedById: user.id,
    recordedAt,
  };
  const insert = insertReadingStatement(tx, values);
  // With no flag to raise, the commit goes with the writes.
  const commit = toRaise.length === 0;
  let readingId: number;
  if (outcome.unitResult) {
    // The drift is fitted up to the unit's latest reading: this one, unless one taken later is stored.
    const latestAt = outcome.unitHistory?.latestAt;
    const windowEnd = latestAt && latestAt > recordedAt ? latestAt : recordedAt;
    const stored = values.deviationPct === null ? [] : [{ recordedAt, deviationPct: values.deviationPct }];
    // The points kept with the unit's latest evaluation; read from the history only for a row stored without them.
    const earlier = outcome.unitHistory?.driftPoints ?? (await together([unitDriftHistoryStatement(tx, input.targetId, windowEnd)]))[0];
    const drift = unitDrift([...earlier, ...stored], windowEnd);
    const advance = advanceUnitLatestStatement(tx, insert, { unitId: input.targetId, recordedAt, ...outcome.unitResult, ...drift });
    [readingId] = await together([insert, advance], { commit });
  } else {
    [readingId] = await together([insert], { commit });
  }
  const newFlags: FlagRow[] = [];
  const raisedAt = new Date();
  for (const draft of toRaise) {
    newFlags.push(await insertFlag(tx, { ...draft, siteId: order.siteId, bankId: order.bankId, readingId, raisedAt }));
  }
  // The stored row as it would read back (JSON columns hold what was written); no second query.
  return { row: { id: readingId, ...values, createdAt: new Date() }, newFlags };
}

/**
 * Planners and supervisors hear of a new replace flag by mail (through the outbox). The reading
 * is stored by then, so a failure here is logged rather than answered as an error.
 */
async function announceNewFlags(ctx: AppContext, raised: FlagRow[]): Promise<void> {
  for (const flag of raised) {
    if (flag.kind !== 'replace') continue;
    try {
      await notifyReplaceFlag(ctx, flag);
    } catch (error) {
      ctx.log.error({ err: error, flagId: flag.id }, 'could not queue the mail for a replace flag');
    }
  }
}

function isRetryOf(stored: ReadingRow, user: SessionUser, orderId: number, input: ReadingInputValue): boolean {
  return stored.workOrderId === orderId && stored.recordedById === user.id && stored.target === input.target && stored.targetId === input.targetId;
}

const keyTaken = () =>
  new AppError('conflict', 'This idempotency key belongs to another reading. The phone makes a new key for each reading.', {
    idempotencyKey: 'Already used for another reading',
  });

function recordedAtOf(input: ReadingInputValue): Date {
  if (!input.recordedAt) return new Date();
  const at = new Date(input.recordedAt);
  if (at.getTime() > Date.now() + clockSkewMs) {
    throw new AppError('invalid', 'The reading is dated in the future.', { recordedAt: "In the future: check the phone's date and time" });
  }
  return at;
}

const storedFlags = z.array(raisedFlag).catch([]);

export function toReading(row: { reading: ReadingRow; recordedByName: string }): Reading {
  const r = row.reading;
  return {
    id: r.id,
    workOrderId: r.workOrderId,
    target: r.target,
    targetId: r.targetId,
    idempotencyKey: r.idempotencyKey,
    input: r.input,
    evaluation: r.evaluation,
    band: r.band,
    deviationPct: r.deviationPct,
    engineeringVersion: r.engineeringVersion,
    flags: storedFlags.parse(r.evaluation.flags ?? []),
    recordedByName: row.recordedByName,
    recordedAt: r.recordedAt.toISOString(),
  };
}

/** Every reading of an order, oldest first, with its evaluation and the flags it raised. */
export async function listReadingsForOrder(db: Database, workOrderId: number): Promise<Reading[]> {
  return (await readingsOfOrder(db, workOrderId)).map(toReading);
}

/** The readings of an order the user may see (404 for an order out of their scope). */
export async function readingsOfVisibleOrder(db: Database, user: SessionUser, orderId: number): Promise<Reading[]> {
  await findVisibleOrder(db, user, orderId);
  return listReadingsForOrder(db, orderId);
}

/** A capacitor unit's reading history for its table and trend chart, paged. */
/**
 * A unit's readings, newest first by default, as the unit's page of history, with the unit's
 * site for the reader's scope check (the answer is stored and shared: db/read-cache.ts).
 */
export async function unitReadingHistory(
  db: Database,
  unitId: number,
  q: z.output<typeof unitReadingListQuery>,
): Promise<{ value: { items: UnitReading[]; total: number }; siteId: number }> {
  const siteId = await siteOfUnit(db, unitId);
  if (siteId === undefined) throw unitNotFound(unitId);
  const { rows, total } = await unitReadingPage(db, unitId, q);
  const items = rows.map(({ reading, workOrderState }) => {
    const e = reading.evaluation;
    return {
      id: reading.id,
      recordedAt: reading.recordedAt.toISOString(),
      workOrderId: reading.workOrderId,
      workOrderState,
      method: e.method as UnitReading['method'],
      legsUF: Array.isArray(e.legsUF) ? (e.legsUF as number[]) : [],
      kvarAtRated: typeof e.kvarAtRated === 'number' ? e.kvarAtRated : 0,
      deviationPct: reading.deviationPct ?? 0,
      band: reading.band ?? 'remeasure',
    };
  });
  return { value: { items, total }, siteId };
}

export const unitNotFound = (unitId: number) => new AppError('not_found', `Capacitor unit ${unitId} does not exist.`);

/** A unit's history for a user: a unit on a site outside their scope does not exist for them. */
export async function listUnitReadings(db: Database, user: SessionUser, unitId: number, q: z.output<typeof unitReadingListQuery>) {
  const answer = await readThrough(db, cacheKey('unit-readings', unitId, q.sort, q.page, q.pageSize), () => unitReadingHistory(db, unitId, q));
  const scope = siteScope(user);
  if (scope !== 'all' && !scope.includes(answer.siteId!)) throw unitNotFound(unitId);
  return answer.body;
}
