import type { Database } from './client';

/**
 * One of something per database handle, built on first use: a Drizzle prepared query that
 * every request runs (Drizzle's builder costs several times the query's own round trip in CPU,
 * about 250 µs against 60 µs for a one-row select, docs/performance.md), or a process's memo
 * for that database. A prepared query is never for a transaction: it runs on the pool it was
 * built on.
 */
export function perDatabase<T>(build: (db: Database) => T): (db: Database) => T {
  const built = new WeakMap<Database, T>();
  return (db) => {
    let value = built.get(db);
    if (!value) built.set(db, (value = build(db)));
    return value;
  };
}
