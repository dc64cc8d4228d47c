import * as drizzleOrm from 'drizzle-orm';
import type { PoolConnection, ResultSetHeader } from 'mysql2/promise';

/**
 * Several prepared queries sent to MariaDB in one round trip, each answer mapped as Drizzle maps
 * it. On this machine a round trip costs the API more CPU than most statements do
 * (docs/performance.md), so the hot write path sends what does not depend on an earlier answer
 * together. Statements run in order and stop at the first error, which is thrown.
 *
 * Only for connections opened with multipleStatements (db/connection-transaction.ts). Every
 * value still goes in as a `?` parameter that mysql2 escapes; no text is ever spliced into SQL.
 */

type Field = { path: string[]; field: unknown };
/** Drizzle's row mapper: exported at run time by drizzle-orm 0.45, left out of its types (internal). */
const exported = (drizzleOrm as unknown as { mapResultRow?: (fields: Field[], row: unknown[], joins?: Record<string, boolean>) => unknown }).mapResultRow;
if (typeof exported !== 'function') throw new Error('statement-batch: drizzle-orm no longer exports mapResultRow; see the pinned version');
const mapResultRow = exported;
const { fillPlaceholders } = drizzleOrm;

/** A Drizzle prepared query: what `.prepare()` returns. */
export interface PreparedQuery<Result> {
  execute(values?: Record<string, unknown>): Promise<Result>;
}

/** A prepared query with its values and what its caller makes of the answer. */
export interface Statement<Result, Value> {
  prepared: PreparedQuery<Result>;
  values: Record<string, unknown>;
  map: (result: Result) => Value;
}

export function statement<Result, Value>(prepared: PreparedQuery<Result>, values: Record<string, unknown>, map: (result: Result) => Value): Statement<Result, Value> {
  return { prepared, values, map };
}

/** One statement on its own (its prepared query's usual round trip). */
export async function runStatement<Result, Value>(s: Statement<Result, Value>): Promise<Value> {
  return s.map(await s.prepared.execute(s.values));
}

/**
 * What is read of a mysql2 prepared query of drizzle-orm 0.45 (pinned in package.json): the SQL
 * it sends, its parameters and how it maps rows. Checked at run time, so another Drizzle version
 * that changes these fails loudly in the tests rather than quietly here.
 */
interface PreparedInternals {
  query: { sql: string };
  rawQuery: { sql: string };
  params: unknown[];
  fields?: Field[];
  joinsNotNullableMap?: Record<string, boolean>;
  returningIds?: Array<{ path: string[] }>;
  customResultMapper?: unknown;
}

function internalsOf(prepared: PreparedQuery<unknown>): PreparedInternals {
  const p = prepared as unknown as Partial<PreparedInternals>;
  if (typeof p.query?.sql !== 'string' || typeof p.rawQuery?.sql !== 'string' || !Array.isArray(p.params) || p.customResultMapper) {
    throw new Error('statement-batch: this Drizzle prepared query does not have the shape of drizzle-orm 0.45 (query, rawQuery, params)');
  }
  return p as PreparedInternals;
}

/**
 * Drizzle's own choice for its mysql2 queries: dates as the text MariaDB sends, mapped by their
 * columns. Drizzle asks for it with a typeCast function; mysql2's dateStrings gives the same
 * values without one, and without the wrapper object and closures mysql2 builds for every field
 * of every row when a typeCast function is set (measurable CPU and garbage on the hot write).
 */
// dateStrings: true covers exactly DATE, DATETIME and TIMESTAMP, the three types Drizzle's typeCast reads as text.
const datesAsText = { dateStrings: true } as const;

/** Any statement, whatever its answer. */
export interface AnyStatement {
  prepared: PreparedQuery<unknown>;
  values: Record<string, unknown>;
  map: (result: never) => unknown;
}

export type Answers<T extends readonly AnyStatement[]> = { -readonly [K in keyof T]: T[K]['map'] extends (result: never) => infer V ? V : never };

/**
 * Each statement's SQL is prepared on the server once per connection (SQL-level PREPARE, sent in
 * the round trip that first needs it) and run after with EXECUTE … USING its values, so MariaDB
 * lexes and parses the long text once per connection instead of on every reading: the parser was
 * a fifth of MariaDB's CPU on the hot write (docs/performance.md). The values are still `?`
 * parameters that mysql2 escapes, now in the USING list; MariaDB takes literals there as it does
 * in the text. A prepared statement lives as long as its connection and survives ROLLBACK; a
 * PREPARE under a name already taken replaces it, so one sent again after a failed trip is harmless.
 */
const preparedIds = new Map<string, number>();
/** ER_UNKNOWN_STMT_HANDLER: EXECUTE of a name the session has not prepared. */
const unknownStatementErrno = 1243;
const preparedOn = new WeakMap<object, Set<number>>();

const idOf = (text: string) => {
  let id = preparedIds.get(text);
  if (id === undefined) preparedIds.set(text, (id = preparedIds.size + 1));
  return id;
};

/**
 * Runs the statements (one or more) in one round trip on `connection` and returns each one's
 * mapped answer. With `commit`, a COMMIT goes last in the same round trip.
 */
export async function runTogether<const T extends readonly AnyStatement[]>(
  connection: PoolConnection,
  statements: T,
  options: { commit?: boolean } = {},
): Promise<Answers<T>> {
  if (statements.length === 0) throw new Error('runTogether needs a statement');
  // The promise wrapper is new at every checkout; the connection underneath is the lasting one.
  const lasting = (connection as unknown as { connection?: object }).connection ?? connection;
  let prepared = preparedOn.get(lasting);
  if (!prepared) preparedOn.set(lasting, (prepared = new Set()));
  const texts: string[] = [];
  const params: unknown[] = [];
  // Where each statement's answer is among the trip's results (a PREPARE has one of its own).
  const at: number[] = [];
  const preparing: number[] = [];
  const parts = statements.map((s) => {
    const internals = internalsOf(s.prepared);
    const own = fillPlaceholders(internals.params, s.values);
    const id = idOf(internals.fields ? internals.query.sql : internals.rawQuery.sql);
    if (!prepared.has(id) && !preparing.includes(id)) {
      texts.push(`prepare varden_${id} from ?`);
      params.push(internals.fields ? internals.query.sql : internals.rawQuery.sql);
      preparing.push(id);
    }
    at.push(texts.length);
    texts.push(own.length === 0 ? `execute varden_${id}` : `execute varden_${id} using ${own.map(() => '?').join(', ')}`);
    params.push(...own);
    return { s, internals };
  });
  if (options.commit) texts.push('commit');
  let results: unknown[];
  try {
    const [answer] = (await connection.query({ sql: texts.join(';\n'), rowsAsArray: true, ...datesAsText }, params)) as unknown as [unknown, unknown];
    // One statement's answer comes on its own, several as a list of answers.
    results = texts.length === 1 ? [answer] : (answer as unknown[]);
  } catch (error) {
    // The server no longer has a statement this connection prepared: prepare each again next time.
    if ((error as { errno?: number }).errno === unknownStatementErrno) prepared.clear();
    throw error;
  }
  for (const id of preparing) prepared.add(id);
  return parts.map(({ s, internals }, i) => {
    const result = results[at[i]!];
    if (internals.fields) {
      const fields = internals.fields;
      return (s.map as (r: unknown) => unknown)((result as unknown[][]).map((row) => mapResultRow(fields, row, internals.joinsNotNullableMap)));
    }
    const header = result as ResultSetHeader;
    if (internals.returningIds?.length) {
      // As Drizzle's $returningId(): the auto-increment ids of the rows inserted, under the key's name.
      const key = internals.returningIds[0]!.path[0]!;
      const ids = Array.from({ length: header.affectedRows }, (_, j) => ({ [key]: header.insertId + j }));
      return (s.map as (r: unknown) => unknown)(ids);
    }
    return (s.map as (r: unknown) => unknown)(header);
  }) as Answers<T>;
}
