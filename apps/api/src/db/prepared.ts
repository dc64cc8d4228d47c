import type { Database } from './client';

/**
 * A query every request runs, built once per database handle as a Drizzle prepared query and
 * then only executed with its placeholders. Drizzle's builder costs several times the query's
 * own round trip in CPU (about 250 µs against 60 µs for a one-row select, docs/performance.md).
 * Never for a transaction: a prepared query runs on the pool it was built on.
 */
export function preparedPerDatabase<Q>(build: (db: Database) => Q): (db: Database) => Q {
  const built = new WeakMap<Database, Q>();
  return (db) => {
    let query = built.get(db);
    if (!query) built.set(db, (query = build(db)));
    return query;
  };
}
