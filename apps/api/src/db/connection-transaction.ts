import { drizzle } from 'drizzle-orm/mysql2';
import type { Pool, PoolConnection } from 'mysql2/promise';
import type { Database } from './client';
import * as schema from './schema/index';

/**
 * A Drizzle handle per pooled connection, kept for the connection's life. The pool hands out the
 * same few connections again and again, so what is built per handle with perDatabase (prepared
 * queries) is built once per connection, not once per transaction as with db.transaction().
 */
const handles = new WeakMap<object, Database>();

function handleOf(connection: PoolConnection): Database {
  // The promise wrapper is new at every checkout; the connection underneath is the lasting one.
  const lasting = connection.connection as object;
  let handle = handles.get(lasting);
  if (!handle) {
    // Typed as the pool's handle: it runs the same queries, only its $client (unused) is a connection.
    handle = drizzle(connection, { schema, mode: 'planetscale' }) as unknown as Database;
    handles.set(lasting, handle);
  }
  return handle;
}

/**
 * Runs `work` in one transaction on one pooled connection and commits, or rolls back and throws.
 * For a hot write path: inside `work`, prepared queries (db/prepared.ts) run on the transaction's
 * own connection, which they cannot inside db.transaction(). Use the handle only inside `work`:
 * the connection goes back to the pool when it ends.
 */
export async function transactionOnConnection<T>(pool: Pool, work: (tx: Database) => Promise<T>): Promise<T> {
  const connection = await pool.getConnection();
  // A connection whose begin, commit or rollback failed is not trusted again: it is closed, not pooled.
  let trusted = false;
  try {
    await connection.query('begin');
    let result: T;
    try {
      result = await work(handleOf(connection));
    } catch (error) {
      await connection.query('rollback');
      trusted = true;
      throw error;
    }
    await connection.query('commit');
    trusted = true;
    return result;
  } finally {
    if (trusted) connection.release();
    else connection.destroy();
  }
}
