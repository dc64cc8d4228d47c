import { projectDrift } from '@varden/engineering';
import { and, asc, count, desc, eq, gte, inArray, isNotNull, isNull, lte, ne, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../../access/executor';
import {
  banks,
  capacitorUnits,
  contactors,
  flags,
  fuseSets,
  reactors,
  readings,
  sites,
  steps,
  unitLatestEvaluations,
  users,
  workOrders,
} from '../../db/schema/index';
import { offset } from '../../db/versioned';
import type { Database } from '../../db/client';
import { perDatabase } from '../../db/prepared';
import { mergedInsert, mergedLookup, numberedPlaceholders, runStatement, statement, type AnyStatement } from '../../db/statement-batch';
import type { FlagDraft, ReadingTarget } from './evaluation-types';
import type { WorkOrderRow } from '../work-orders/order-guard';
import type { StepUnit } from './evaluate-step';

export type ReadingRow = typeof readings.$inferSelect;

/** The window of history a unit's drift is fitted over, before its latest reading. */
export const driftWindowMs = 5 * 365.25 * 86_400_000;
/** The deviation below which a unit is replaced, as the fleet projects it (the policy's replace limit). */
export const replaceBelowPct = -10;

const readingColumns = {
  reading: readings,
  recordedByName: users.name,
};

const readingByKey = perDatabase((db) =>
  db
    .select(readingColumns)
    .from(readings)
    .innerJoin(users, eq(users.id, readings.recordedById))
    .where(eq(readings.idempotencyKey, sql.placeholder('idempotencyKey')))
    .prepare(),
);

/** The reading stored under a phone's idempotency key, with who recorded it (outside any transaction). */
export async function findReadingByKey(db: Database, idempotencyKey: string) {
  const [row] = await readingByKey(db).execute({ idempotencyKey });
  return row;
}

export async function readingsOfOrder(db: Executor, workOrderId: number) {
  return db
    .select(readingColumns)
    .from(readings)
    .innerJoin(users, eq(users.id, readings.recordedById))
    .where(eq(readings.workOrderId, workOrderId))
    .orderBy(asc(readings.recordedAt), asc(readings.id));
}

/**
 * Locks the order for the length of the transaction: a submission or a sign-off waits for the
 * reading being stored, and a reading never lands on an order that moved on meanwhile.
 */
export async function lockOrder(db: Executor, orderId: number) {
  const [row] = await db
    .select({ id: workOrders.id, state: workOrders.state, locked: workOrders.locked, assigneeId: workOrders.assigneeId })
    .from(workOrders)
    .where(eq(workOrders.id, orderId))
    .for('update');
  return row;
}

/**
 * The order as a reading needs it: the columns its rules (order-guard) and the evaluation read,
 * not the whole row (its instructions and checklist would be read, parsed and mapped for nothing
 * on every reading).
 */
const lockedOrderColumns = {
  id: workOrders.id,
  kind: workOrders.kind,
  siteId: workOrders.siteId,
  bankId: workOrders.bankId,
  state: workOrders.state,
  locked: workOrders.locked,
  assigneeId: workOrders.assigneeId,
};

export type LockedOrder = Pick<WorkOrderRow, keyof typeof lockedOrderColumns>;

const orderAndBankLockWhere = (db: Database, where: SQL) =>
  db
    .select({ order: lockedOrderColumns, bankId: banks.id })
    .from(workOrders)
    .innerJoin(banks, eq(banks.id, workOrders.bankId))
    .where(where)
    .for('update')
    .prepare();

const orderAndBankLock = perDatabase((db) => orderAndBankLockWhere(db, eq(workOrders.id, sql.placeholder('orderId'))));
/** The locks of a shared transaction's readings, sent together, as one statement (InnoDB then locks the orders in the order of their ids). */
const orderAndBankLocks = perDatabase((db) =>
  mergedLookup<{ order: LockedOrder }>('order and bank lock', 'orderId', (n) => orderAndBankLockWhere(db, inArray(workOrders.id, numberedPlaceholders('orderId', n))), (row) => row.order.id),
);

/**
 * Reads the order and locks it and its bank for the length of the transaction, in one statement
 * (FOR UPDATE locks the rows read from both tables): readings on one bank are serialised, so
 * flags are raised once and latest evaluations move forward only, and a reading never lands on
 * an order that moved on meanwhile. `db` is a transaction's handle (db/connection-transaction.ts).
 */
export const lockOrderAndBankStatement = (db: Database, orderId: number) =>
  statement(orderAndBankLock(db), { orderId }, (rows): LockedOrder | undefined => rows[0]?.order, { merge: orderAndBankLocks(db) });

export const lockOrderAndBank = (db: Database, orderId: number) => runStatement(lockOrderAndBankStatement(db, orderId));

const placeColumns = {
  step: { id: steps.id, number: steps.number, bankId: steps.bankId },
  bank: { id: banks.id, name: banks.name, detuned: banks.detuned, detuningFactor: banks.detuningFactor },
  site: {
    id: sites.id,
    voltageV: sites.voltageV,
    frequencyHz: sites.frequencyHz,
    targetPf: sites.targetPf,
    tariffBasis: sites.tariffBasis,
    tariffLimit: sites.tariffLimit,
  },
};

/**
 * The unit's columns a reading's evaluation reads (UnitRecord, and whether it is still in
 * service), not the whole row: every column costs MariaDB its definition and value and the API
 * their decoding, on every reading.
 */
const evaluatedUnitColumns = {
  id: capacitorUnits.id,
  stepId: capacitorUnits.stepId,
  position: capacitorUnits.position,
  nameplateKvar: capacitorUnits.nameplateKvar,
  nameplateVoltageV: capacitorUnits.nameplateVoltageV,
  nameplateFrequencyHz: capacitorUnits.nameplateFrequencyHz,
  connection: capacitorUnits.connection,
  capacitanceUF: capacitorUnits.capacitanceUF,
  toleranceMinusPct: capacitorUnits.toleranceMinusPct,
  tolerancePlusPct: capacitorUnits.tolerancePlusPct,
  removedOn: capacitorUnits.removedOn,
};

const unitPlaceWhere = (db: Database, where: SQL) =>
  db
    .select({
      unit: evaluatedUnitColumns,
      ...placeColumns,
      latestRecordedAt: unitLatestEvaluations.recordedAt,
      // The points the unit's drift was fitted over when its latest reading was stored (advanceUnitLatestStatement).
      driftPoints: unitLatestEvaluations.driftPoints,
    })
    .from(capacitorUnits)
    .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .leftJoin(unitLatestEvaluations, eq(unitLatestEvaluations.unitId, capacitorUnits.id))
    .where(where)
    .prepare();

const unitPlaceForReading = perDatabase((db) => unitPlaceWhere(db, eq(capacitorUnits.id, sql.placeholder('unitId'))));
const unitPlacesForReadings = perDatabase((db) =>
  mergedLookup<{ unit: { id: number } }>('unit place', 'unitId', (n) => unitPlaceWhere(db, inArray(capacitorUnits.id, numberedPlaceholders('unitId', n))), (row) => row.unit.id),
);

export interface DriftPoint {
  recordedAt: Date;
  deviationPct: number;
}

/** The points as unit_latest_evaluations.drift_points keeps them: [epoch milliseconds, deviation %], oldest first. */
export type StoredDriftPoints = Array<[number, number]>;

const fromStored = (stored: StoredDriftPoints): DriftPoint[] => stored.map(([ms, deviationPct]) => ({ recordedAt: new Date(ms), deviationPct }));

/**
 * A unit with its step, bank and site, when the reading behind its latest evaluation was taken
 * (null before its first), and the points its drift was fitted over then: the unit's readings in
 * the five years up to its latest, kept beside that evaluation so a reading never reads the
 * history. `driftPoints` is null for a latest evaluation stored without them (written by an older
 * version or another tool): the reading then reads them from the history (unitDriftHistoryStatement).
 */
export const unitPlaceForReadingStatement = (db: Database, unitId: number) =>
  statement(
    unitPlaceForReading(db),
    { unitId },
    (rows) => {
      const row = rows[0];
      if (!row) return undefined;
      const { driftPoints, ...place } = row;
      return { ...place, driftPoints: driftPoints ? fromStored(driftPoints) : place.latestRecordedAt ? null : [] };
    },
    { merge: unitPlacesForReadings(db) },
  );

export type UnitPlaceForReading = NonNullable<Awaited<ReturnType<typeof findUnitPlace>>>;

/** A unit with its step, bank and site (unitPlaceForReadingStatement), read on its own. */
export const findUnitPlace = (db: Database, unitId: number) => runStatement(unitPlaceForReadingStatement(db, unitId));

const driftHistory = perDatabase((db) =>
  db
    .select({ recordedAt: readings.recordedAt, deviationPct: readings.deviationPct })
    .from(readings)
    .where(
      and(
        eq(readings.target, 'capacitor-unit'),
        eq(readings.targetId, sql.placeholder('unitId')),
        isNotNull(readings.deviationPct),
        gte(readings.recordedAt, sql.placeholder('from')),
        lte(readings.recordedAt, sql.placeholder('to')),
      ),
    )
    .orderBy(asc(readings.recordedAt))
    .prepare(),
);

/** A unit's stored readings in the drift window ending at `windowEnd`, from the history (readings_target holds all it reads). */
export const unitDriftHistoryStatement = (db: Database, unitId: number, windowEnd: Date) =>
  statement(driftHistory(db), { unitId, from: new Date(windowEnd.getTime() - driftWindowMs), to: windowEnd }, (rows): DriftPoint[] =>
    rows.map((r) => ({ recordedAt: r.recordedAt, deviationPct: r.deviationPct! })),
  );

export async function findContactorPlace(db: Executor, id: number) {
  const [row] = await db
    .select({ contactor: contactors, ...placeColumns })
    .from(contactors)
    .innerJoin(steps, eq(steps.id, contactors.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(contactors.id, id));
  return row;
}

export async function findReactorPlace(db: Executor, id: number) {
  const [row] = await db
    .select({ reactor: reactors, ...placeColumns })
    .from(reactors)
    .innerJoin(steps, eq(steps.id, reactors.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(reactors.id, id));
  return row;
}

export async function findFuseSetPlace(db: Executor, id: number) {
  const [row] = await db
    .select({ fuseSet: fuseSets, ...placeColumns })
    .from(fuseSets)
    .innerJoin(steps, eq(steps.id, fuseSets.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(fuseSets.id, id));
  return row;
}

export async function findBankPlace(db: Executor, bankId: number) {
  const [row] = await db
    .select({ bank: placeColumns.bank, site: placeColumns.site })
    .from(banks)
    .innerJoin(sites, eq(sites.id, banks.siteId))
    .where(eq(banks.id, bankId));
  return row;
}

const stepReactor = perDatabase((db) =>
  db
    .select({
      id: reactors.id,
      inductanceMH: reactors.inductanceMH,
      detuningFactor: reactors.detuningFactor,
      // The inductances the reactor's latest reading measured, as JSON text, if it measured any.
      // Written out with its own alias: Drizzle leaves columns unqualified in a one-table select.
      latestInductanceMH: sql<unknown>`(select json_extract(latest.input, '$.inductanceMH') from ${readings} as latest where latest.target = 'reactor' and latest.target_id = ${sql.identifier('reactors')}.${sql.identifier('id')} order by latest.recorded_at desc, latest.id desc limit 1)`,
    })
    .from(reactors)
    .where(and(eq(reactors.stepId, sql.placeholder('stepId')), isNull(reactors.removedOn)))
    .orderBy(desc(reactors.id))
    .limit(1)
    .prepare(),
);

/** The reactor in service on a step, with the inductances its latest reading measured (undefined when it measured none). */
export const reactorInServiceStatement = (db: Database, stepId: number) =>
  statement(stepReactor(db), { stepId }, (rows) => {
    const row = rows[0];
    if (!row) return null;
    const { latestInductanceMH, ...reactor } = row;
    // mysql2 hands a JSON value over parsed; text (a driver that does not) is parsed here.
    const measured: unknown = typeof latestInductanceMH === 'string' ? JSON.parse(latestInductanceMH) : latestInductanceMH;
    return { reactor, latestInductanceMH: measured ?? undefined };
  });

const stepUnits = perDatabase((db) =>
  db
    .select({ unit: evaluatedUnitColumns, legsUF: unitLatestEvaluations.legsUF, recordedAt: unitLatestEvaluations.recordedAt })
    .from(capacitorUnits)
    .leftJoin(unitLatestEvaluations, eq(unitLatestEvaluations.unitId, capacitorUnits.id))
    .where(and(eq(capacitorUnits.stepId, sql.placeholder('stepId')), isNull(capacitorUnits.removedOn)))
    .orderBy(asc(capacitorUnits.position))
    .prepare(),
);

/** The units in service in a step with the legs of their latest evaluation. */
export const unitsOfStepStatement = (db: Database, stepId: number) =>
  statement(stepUnits(db), { stepId }, (rows): Array<StepUnit & { recordedAt: Date | null }> =>
    rows.map((r) => ({ unit: r.unit, legsUF: r.legsUF ?? undefined, recordedAt: r.recordedAt })),
  );

export const unitsOfStep = (db: Database, stepId: number) => runStatement(unitsOfStepStatement(db, stepId));

/** The newest earlier reading of a target, by the time it was taken. */
export async function latestReadingInput(db: Executor, target: ReadingTarget, targetId: number) {
  const [row] = await db
    .select({ input: readings.input, recordedAt: readings.recordedAt })
    .from(readings)
    .where(and(eq(readings.target, target), eq(readings.targetId, targetId)))
    .orderBy(desc(readings.recordedAt), desc(readings.id))
    .limit(1);
  return row;
}

const readingColumnNames = [
  'workOrderId',
  'idempotencyKey',
  'target',
  'targetId',
  'input',
  'evaluation',
  'engineeringVersion',
  'band',
  'deviationPct',
  'recordedById',
  'recordedAt',
] as const;

/** The placeholders of one row: each column's name, suffixed with the row's place in a merged INSERT. */
const rowOf = <N extends string>(names: readonly N[], suffix: number | '') =>
  Object.fromEntries(names.map((name) => [name, sql.placeholder(`${name}${suffix}`)])) as Record<N, ReturnType<typeof sql.placeholder>>;

const readingInsertOf = (db: Database, rows: Array<number | ''>) =>
  db
    .insert(readings)
    .values(rows.map((suffix) => rowOf(readingColumnNames, suffix)))
    .$returningId()
    .prepare();

const readingInsert = perDatabase((db) => readingInsertOf(db, ['']));
const readingInserts = perDatabase((db) =>
  mergedInsert('reading insert', readingColumnNames, (n) => readingInsertOf(db, Array.from({ length: n }, (_, i) => i))),
);

type ReadingValues = Omit<typeof readings.$inferInsert, 'id' | 'createdAt'>;

export const insertReadingStatement = (db: Database, values: ReadingValues) =>
  statement(readingInsert(db), { band: null, deviationPct: null, ...values }, (created) => created[0]!.id, { merge: readingInserts(db) });

/**
 * The unit's drift fitted (projectDrift) over its readings in the five years up to `windowEnd`,
 * the time of the reading behind its latest evaluation: the rate and the projected replacement
 * date stored beside that evaluation, so the fleet dashboard reads one row per unit, never the
 * history; and the points of that window, stored with them for the unit's next reading.
 */
export function unitDrift(
  points: DriftPoint[],
  windowEnd: Date,
): { driftRatePctPerYear: number | null; replaceBy: string | null; driftPoints: StoredDriftPoints } {
  const from = windowEnd.getTime() - driftWindowMs;
  const inWindow = points
    .filter((p) => p.recordedAt.getTime() >= from && p.recordedAt.getTime() <= windowEnd.getTime())
    .sort((a, b) => a.recordedAt.getTime() - b.recordedAt.getTime());
  const drift =
    inWindow.length < 2
      ? null
      : projectDrift({ points: inWindow.map((p) => ({ date: p.recordedAt.toISOString(), deviationPct: p.deviationPct })), replaceBelowPct });
  return {
    driftRatePctPerYear: drift?.ratePctPerYear ?? null,
    replaceBy: drift?.replaceBy?.slice(0, 10) ?? null,
    driftPoints: inWindow.map((p) => [p.recordedAt.getTime(), p.deviationPct]),
  };
}

const later = sql`VALUES(${sql.identifier('recorded_at')}) >= ${unitLatestEvaluations.recordedAt}`;
const keepLater = (column: string) => sql`IF(${later}, VALUES(${sql.identifier(column)}), ${sql.identifier(column)})`;

const latestColumnNames = ['unitId', 'band', 'deviationPct', 'kvarAtRated', 'legsUF', 'recordedAt', 'driftRatePctPerYear', 'replaceBy', 'driftPoints'] as const;

const unitLatestUpsertOf = (db: Database, rows: Array<number | ''>) =>
  db
    .insert(unitLatestEvaluations)
    .values(
      rows.map((suffix) => ({
        ...rowOf(latestColumnNames, suffix),
        // The reading inserted just before on this connection (insertReadingStatement, sent with this one):
        // LAST_INSERT_ID() is the first row of that INSERT, and this unit's reading is `readingOffset` rows on.
        readingId: sql`last_insert_id() + ${sql.placeholder(`readingOffset${suffix}`)}`,
      })),
    )
    .onDuplicateKeyUpdate({
      set: {
        readingId: keepLater('reading_id'),
        band: keepLater('band'),
        deviationPct: keepLater('deviation_pct'),
        kvarAtRated: keepLater('kvar_at_rated'),
        legsUF: keepLater('legs_uf'),
        // The drift is fitted over the window up to whichever reading is the latest, so it always moves.
        driftRatePctPerYear: sql`VALUES(${sql.identifier('drift_rate_pct_per_year')})`,
        replaceBy: sql`VALUES(${sql.identifier('replace_by')})`,
        driftPoints: sql`VALUES(${sql.identifier('drift_points')})`,
        // MariaDB applies the assignments left to right, so recorded_at, which the IFs read, goes last.
        recordedAt: keepLater('recorded_at'),
      },
    })
    .prepare();

const unitLatestUpsert = perDatabase((db) => unitLatestUpsertOf(db, ['']));
const unitLatestUpserts = perDatabase((db) =>
  mergedInsert('unit latest upsert', [...latestColumnNames, 'readingOffset'], (n) => unitLatestUpsertOf(db, Array.from({ length: n }, (_, i) => i))),
);

/**
 * Moves a unit's latest evaluation to this reading unless a reading taken later is already
 * stored, and stores the drift fitted up to whichever is the latest (unitDrift). One upsert, not
 * a locking read then an insert: SELECT … FOR UPDATE on a unit with no row yet takes a gap lock,
 * and two banks' first readings then deadlock on each other's gap when they insert (seen under
 * the field load test). Readings of one unit are already serialised by the bank lock; the IF
 * keeps the later reading when they arrive out of order. Sent right after insertReadingStatement,
 * in the same round trip (runTogether): the reading it points to is LAST_INSERT_ID() plus its
 * row's place in that INSERT, which a shared transaction sends as one INSERT of its readings
 * (and these upserts as one of their rows; no two readings of a batch are of one unit, since
 * each claims its bank).
 */
export const advanceUnitLatestStatement = (
  db: Database,
  /** The reading's INSERT (insertReadingStatement), sent just before in the same round trip. */
  reading: AnyStatement,
  values: {
    unitId: number;
    band: NonNullable<ReadingRow['band']>;
    deviationPct: number;
    kvarAtRated: number;
    legsUF: number[];
    recordedAt: Date;
    driftRatePctPerYear: number | null;
    replaceBy: string | null;
    driftPoints: StoredDriftPoints;
  },
) => statement(unitLatestUpsert(db), values, () => undefined, { merge: unitLatestUpserts(db), follows: { statement: reading, offset: 'readingOffset' } });

/** Flags not yet cleared (open or in hand) on these targets, as "kind target id" keys. */
export async function unclearedFlagKeys(db: Executor, drafts: FlagDraft[]): Promise<Set<string>> {
  if (drafts.length === 0) return new Set();
  const targetIds = [...new Set(drafts.map((d) => d.targetId))];
  const rows = await db
    .select({ kind: flags.kind, target: flags.target, targetId: flags.targetId })
    .from(flags)
    .where(and(inArray(flags.targetId, targetIds), ne(flags.state, 'cleared')));
  return new Set(rows.map((r) => flagKey(r)));
}

export const flagKey = (f: { kind: string; target: string; targetId: number }) => `${f.kind} ${f.target} ${f.targetId}`;

export async function insertFlag(db: Executor, values: typeof flags.$inferInsert) {
  const [created] = await db.insert(flags).values(values).$returningId();
  const [row] = await db.select().from(flags).where(eq(flags.id, created!.id));
  return row!;
}

/** A capacitor unit's readings, newest first or oldest first, paged. */
export async function unitReadingPage(db: Executor, unitId: number, q: { page: number; pageSize: number; sort: 'recordedAt' | '-recordedAt' }) {
  const where = and(eq(readings.target, 'capacitor-unit'), eq(readings.targetId, unitId));
  const direction = q.sort === 'recordedAt' ? asc : desc;
  const [rows, [total]] = await Promise.all([
    db
      .select({ reading: readings, workOrderState: workOrders.state })
      .from(readings)
      .innerJoin(workOrders, eq(workOrders.id, readings.workOrderId))
      .where(where)
      .orderBy(direction(readings.recordedAt), direction(readings.id))
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db.select({ n: count() }).from(readings).where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

/** The site a unit belongs to, for the viewer's scope. */
export async function siteOfUnit(db: Executor, unitId: number): Promise<number | undefined> {
  const [row] = await db
    .select({ siteId: banks.siteId })
    .from(capacitorUnits)
    .innerJoin(steps, eq(steps.id, capacitorUnits.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .where(eq(capacitorUnits.id, unitId));
  return row?.siteId;
}
