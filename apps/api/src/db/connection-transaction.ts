import { drizzle } from 'drizzle-orm/mysql2';
import mysql, { type Pool, type PoolConnection } from 'mysql2/promise';
import { poolOptions, type Database } from './client';
import { noteAutoIncrementMode, runTogether, type AnyStatement, type Answers } from './statement-batch';
import * as schema from './schema/index';

/**
 * A Drizzle handle per pooled connection, kept for the connection's life. The pool hands out the
 * same few connections again and again, so what is built per handle with perDatabase (prepared
 * queries) is built once per connection, not once per transaction as with db.transaction().
 */
const handles = new WeakMap<object, Database>();

/**
 * The connection's handle; the first time, the connection is also set never to autocommit, and
 * its server's auto-increment lock mode noted (merged INSERTs need consecutive ids, statement-batch.ts).
 */
async function handleOf(connection: PoolConnection): Promise<Database> {
  // The promise wrapper is new at every checkout; the connection underneath is the lasting one.
  const lasting = connection.connection as object;
  let handle = handles.get(lasting);
  if (!handle) {
    const [answers] = (await connection.query('set autocommit = 0; select @@innodb_autoinc_lock_mode as mode')) as unknown as [[unknown, Array<{ mode: number }>]];
    noteAutoIncrementMode(connection, Number(answers[1][0]?.mode));
    // Typed as the pool's handle: it runs the same queries, only its $client (unused) is a connection.
    handle = drizzle(connection, { schema, mode: 'planetscale' }) as unknown as Database;
    handles.set(lasting, handle);
  }
  return handle;
}

/** A pool whose connections never autocommit (createTransactionPool): only transactionOnConnection uses it. */
export type TransactionPool = Pool & { readonly __transactionsOnly: true };

/**
 * A second pool, for the hot write path, its connections set to autocommit = 0: each statement
 * then joins the transaction the first one began, until COMMIT or ROLLBACK, so a transaction
 * costs no separate BEGIN round trip (each round trip costs CPU in the API and in MariaDB,
 * docs/performance.md). A connection is set so the first time transactionOnConnection has it;
 * connections open lazily, so a process that never records a reading opens none.
 */
export function createTransactionPool(url: string, poolSize: number): TransactionPool {
  // multipleStatements for runTogether (db/statement-batch.ts): values still go in as escaped parameters.
  const pool = mysql.createPool({ ...poolOptions(url, poolSize), multipleStatements: true });
  return pool as TransactionPool;
}

/**
 * Runs statements of the transaction in one round trip (runTogether); with `commit` the COMMIT
 * goes with them, and nothing more may run in the transaction after.
 */
export type Together = <const S extends readonly AnyStatement[]>(statements: S, options?: { commit?: boolean }) => Promise<Answers<S>>;

/**
 * Runs `work` in one transaction on one connection of a transaction pool and commits, or rolls
 * back and throws. Inside `work`, prepared queries (db/prepared.ts) run on the transaction's own
 * connection, which they cannot inside db.transaction(). Use the handle only inside `work`: the
 * connection goes back to the pool when it ends.
 */
export async function transactionOnConnection<T>(pool: TransactionPool, work: (tx: Database, together: Together) => Promise<T>): Promise<T> {
  const connection = await pool.getConnection();
  // A connection whose commit or rollback failed is not trusted again: it is closed, not pooled.
  let trusted = false;
  try {
    const tx = await handleOf(connection);
    let committed = false;
    const together: Together = async (statements, options) => {
      if (committed) throw new Error('the transaction has already committed');
      const answers = await runTogether(connection, statements, options);
      if (options?.commit) committed = true;
      return answers;
    };
    let result: T;
    try {
      // No BEGIN: the connection does not autocommit, so the first statement begins the transaction.
      result = await work(tx, together);
    } catch (error) {
      // Committed already: the transaction ended cleanly, whatever failed after.
      if (committed) {
        trusted = true;
        throw error;
      }
      await connection.query('rollback');
      trusted = true;
      throw error;
    }
    if (!committed) await connection.query('commit');
    trusted = true;
    return result;
  } finally {
    if (trusted) connection.release();
    else connection.destroy();
  }
}
