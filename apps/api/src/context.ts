import type { Pool } from 'mysql2/promise';
import type { Config } from './config';
import { createDatabase, type Database } from './db/client';
import { createTransactionPool, type TransactionPool } from './db/connection-transaction';
import { createInFlight, type InFlight } from './http/in-flight';
import { createLogger, type Logger } from './logger';
import { createMailTransport, type MailTransport } from './mail/transport';
import { createObjectStore, type ObjectStore } from './storage/object-store';

/** Everything a request or a job needs, built once per process and passed down explicitly. */
export interface AppContext {
  config: Config;
  db: Database;
  pool: Pool;
  /** Connections that never autocommit, for the hot write path's transactions (db/connection-transaction.ts). */
  transactionPool: TransactionPool;
  store: ObjectStore;
  mail: MailTransport;
  log: Logger;
  /** The requests being answered, for a shutdown that lets them finish (shutdown.ts). */
  inFlight: InFlight;
}

export function createContext(config: Config): AppContext {
  const { db, pool } = createDatabase(config.DATABASE_URL, config.DB_POOL_SIZE);
  return {
    config,
    db,
    pool,
    transactionPool: createTransactionPool(config.DATABASE_URL, config.DB_POOL_SIZE),
    store: createObjectStore(config),
    mail: createMailTransport(config),
    log: createLogger(config),
    inFlight: createInFlight(),
  };
}

export async function closeContext(ctx: AppContext): Promise<void> {
  ctx.store.destroy();
  ctx.mail.close();
  await ctx.pool.end();
  await ctx.transactionPool.end();
}
