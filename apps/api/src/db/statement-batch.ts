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
export interface Statement<Result, Value> extends Sendable {
  prepared: PreparedQuery<Result>;
  values: Record<string, unknown>;
  map: (result: Result) => Value;
}

/** What runTogether may do with a statement besides sending it as it is. */
interface Sendable {
  /** Statements of one kind sent in one round trip go as one statement (mergeable). */
  merge?: Merge;
  /**
   * An INSERT whose row this statement points to with `last_insert_id() + offset`: the value
   * named `offset` is set to the row's place among the rows that INSERT went out with (0 when
   * the INSERT went in an earlier round trip, right only if it was the connection's last).
   */
  follows?: { statement: AnyStatement; offset: string };
}

export function statement<Result, Value>(
  prepared: PreparedQuery<Result>,
  values: Record<string, unknown>,
  map: (result: Result) => Value,
  more: Sendable = {},
): Statement<Result, Value> {
  return { prepared, values, map, ...more };
}

/**
 * How several statements of one kind, sent in one round trip, go as one: a lookup of several
 * keys with IN, or an INSERT of several rows. One statement costs MariaDB its dispatch, its
 * tables' opening and locking, its plan and a network write of its answer, and costs the API an
 * answer to decode with its column definitions; the hot write path's shared transactions
 * (db/transaction-batch.ts) send each kind once per round trip instead of once per reading.
 */
export interface Merge {
  /** Statements with the same key are merged. */
  key: string;
  /** An INSERT's merge, which needs a connection whose INSERTs number their rows consecutively (noteAutoIncrementMode). */
  insert?: boolean;
  /** The one statement for these statements' values, in their order. */
  build(values: ReadonlyArray<Record<string, unknown>>): { prepared: PreparedQuery<unknown>; values: Record<string, unknown> };
  /** The merged statement's answer (its rows as Drizzle maps them, its new ids, or its header), split into each statement's. */
  split(answer: unknown, values: ReadonlyArray<Record<string, unknown>>): unknown[];
}

/** Prepared queries for n values at once (merged ones, an IN of n keys), built once per count: their SQL differs with it. */
export function perCount<T>(build: (n: number) => T): (n: number) => T {
  const built = new Map<number, T>();
  return (n) => {
    let prepared = built.get(n);
    if (!prepared) built.set(n, (prepared = build(n)));
    return prepared;
  };
}

/** Placeholders `name0` … `name{n-1}`, as `numbered` fills them (an IN of n keys, a merged statement). */
export const numberedPlaceholders = (name: string, n: number) => Array.from({ length: n }, (_, i) => drizzleOrm.sql.placeholder(`${name}${i}`));

/** Values named `name0`, `name1`, … for a merged statement: each statement's `name` under its place. */
function numbered(values: ReadonlyArray<Record<string, unknown>>, names: readonly string[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  values.forEach((v, i) => {
    for (const name of names) out[`${name}${i}`] = v[name];
  });
  return out;
}

/**
 * A lookup by one key (`name`), merged as one lookup of every key: `build(n)` prepares it for n
 * keys, placeholders `name0` … `name{n-1}`; each statement gets the rows whose `keyOf` is its key.
 */
export function mergedLookup<Row>(key: string, name: string, build: (n: number) => PreparedQuery<unknown>, keyOf: (row: Row) => unknown): Merge {
  const prepared = perCount(build);
  return {
    key,
    build: (values) => ({ prepared: prepared(values.length), values: numbered(values, [name]) }),
    split: (rows, values) => values.map((v) => (rows as Row[]).filter((row) => keyOf(row) === v[name])),
  };
}

/**
 * An INSERT of one row (placeholders `names`), merged as one INSERT of every row: `build(n)`
 * prepares it for n rows, placeholders suffixed with the row's place. An INSERT with
 * $returningId() gives each statement its own row's id (InnoDB numbers the rows of one
 * multi-row INSERT consecutively, as Drizzle's $returningId() also reads them); any other
 * INSERT gives each statement the merged one's header.
 */
export function mergedInsert(key: string, names: readonly string[], build: (n: number) => PreparedQuery<unknown>): Merge {
  const prepared = perCount(build);
  return {
    key,
    insert: true,
    build: (values) => ({ prepared: prepared(values.length), values: numbered(values, names) }),
    split: (answer, values) => (Array.isArray(answer) ? values.map((_, i) => [answer[i]]) : values.map(() => answer)),
  };
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
export interface AnyStatement extends Sendable {
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

/**
 * Connections whose server numbers the rows of one multi-row INSERT consecutively: InnoDB with
 * innodb_autoinc_lock_mode 0 or 1 (MariaDB's default is 1); in mode 2 ("interleaved") another
 * session's rows may come between, and INSERTs are then never merged.
 */
const consecutive = new WeakSet<object>();

/** The promise wrapper is new at every checkout; the connection underneath is the lasting one. */
const lastingOf = (connection: PoolConnection): object => (connection as unknown as { connection?: object }).connection ?? connection;

/** Marks a connection for merged INSERTs once its server's auto-increment lock mode is known (db/connection-transaction.ts). */
export function noteAutoIncrementMode(connection: PoolConnection, mode: number): void {
  const lasting = lastingOf(connection);
  if (mode === 0 || mode === 1) consecutive.add(lasting);
  else consecutive.delete(lasting);
}

const idOf = (text: string) => {
  let id = preparedIds.get(text);
  if (id === undefined) preparedIds.set(text, (id = preparedIds.size + 1));
  return id;
};

/** One statement as sent: a statement as it is, or several merged into one. */
interface Sent {
  prepared: PreparedQuery<unknown>;
  values: Record<string, unknown>;
  /** The statements it answers, by their place in the call, and the merge that split the answer. */
  members: number[];
  merge?: Merge;
}

/**
 * The statements as they go: those of one merge key (when two or more are in the trip) merged
 * into one at the place of the first; a follower's offset set to its INSERT's row.
 */
function toSend(statements: readonly AnyStatement[], mergeInserts: boolean): Sent[] {
  const counts = new Map<string, number>();
  for (const s of statements) if (s.merge && (mergeInserts || !s.merge.insert)) counts.set(s.merge.key, (counts.get(s.merge.key) ?? 0) + 1);
  const sent: Sent[] = [];
  const groups = new Map<string, Sent>();
  statements.forEach((s, i) => {
    const key = s.merge && (counts.get(s.merge.key) ?? 0) > 1 ? s.merge.key : undefined;
    const group = key === undefined ? undefined : groups.get(key);
    if (group) group.members.push(i);
    else {
      const entry: Sent = { prepared: s.prepared, values: s.values, members: [i], merge: key === undefined ? undefined : s.merge };
      sent.push(entry);
      if (key !== undefined) groups.set(key, entry);
    }
  });
  const entryOf = (i: number) => sent.findIndex((e) => e.members.includes(i));
  const values = statements.map((s, i) => {
    if (!s.follows) return s.values;
    const followed = statements.indexOf(s.follows.statement);
    if (followed < 0) return { ...s.values, [s.follows.offset]: 0 };
    const [from, to] = [entryOf(followed), entryOf(i)];
    // last_insert_id() is the first row of the last INSERT that made ids: the followed one, sent just before.
    const between = sent.slice(from + 1, to).some((e) => internalsOf(e.prepared).returningIds?.length);
    if (from >= to || between) throw new Error('statement-batch: a follower must come after its INSERT, with no other INSERT of new ids between');
    return { ...s.values, [s.follows.offset]: sent[from]!.members.indexOf(followed) };
  });
  for (const entry of sent) {
    if (!entry.merge) {
      entry.values = values[entry.members[0]!]!;
      continue;
    }
    const built = entry.merge.build(entry.members.map((i) => values[i]!));
    entry.prepared = built.prepared;
    entry.values = built.values;
  }
  return sent;
}

/**
 * Runs the statements (one or more) in one round trip on `connection` and returns each one's
 * mapped answer. With `commit`, a COMMIT goes last in the same round trip. Statements with a
 * merge (mergedLookup, mergedInsert) go as one statement of their kind per trip.
 */
export async function runTogether<const T extends readonly AnyStatement[]>(
  connection: PoolConnection,
  statements: T,
  options: { commit?: boolean } = {},
): Promise<Answers<T>> {
  if (statements.length === 0) throw new Error('runTogether needs a statement');
  const lasting = lastingOf(connection);
  let prepared = preparedOn.get(lasting);
  if (!prepared) preparedOn.set(lasting, (prepared = new Set()));
  const texts: string[] = [];
  const params: unknown[] = [];
  // Where each sent statement's answer is among the trip's results (a PREPARE has one of its own).
  const at: number[] = [];
  const preparing: number[] = [];
  const sent = toSend(statements, consecutive.has(lasting)).map((entry) => {
    const internals = internalsOf(entry.prepared);
    const own = fillPlaceholders(internals.params, entry.values);
    const id = idOf(internals.fields ? internals.query.sql : internals.rawQuery.sql);
    if (!prepared.has(id) && !preparing.includes(id)) {
      texts.push(`prepare varden_${id} from ?`);
      params.push(internals.fields ? internals.query.sql : internals.rawQuery.sql);
      preparing.push(id);
    }
    at.push(texts.length);
    texts.push(own.length === 0 ? `execute varden_${id}` : `execute varden_${id} using ${own.map(() => '?').join(', ')}`);
    params.push(...own);
    return { entry, internals };
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
  const answers: unknown[] = new Array(statements.length);
  sent.forEach(({ entry, internals }, i) => {
    const raw = rawAnswer(internals, results[at[i]!]);
    const own = entry.merge ? entry.merge.split(raw, entry.members.map((m) => statements[m]!.values)) : [raw];
    entry.members.forEach((m, j) => {
      answers[m] = (statements[m]!.map as (r: unknown) => unknown)(own[j]);
    });
  });
  return answers as Answers<T>;
}

/** A statement's answer as its Drizzle prepared query would give it. */
function rawAnswer(internals: PreparedInternals, result: unknown): unknown {
  if (internals.fields) {
    const fields = internals.fields;
    return (result as unknown[][]).map((row) => mapResultRow(fields, row, internals.joinsNotNullableMap));
  }
  const header = result as ResultSetHeader;
  if (internals.returningIds?.length) {
    // As Drizzle's $returningId(): the auto-increment ids of the rows inserted, under the key's name.
    const key = internals.returningIds[0]!.path[0]!;
    return Array.from({ length: header.affectedRows }, (_, j) => ({ [key]: header.insertId + j }));
  }
  return header;
}
