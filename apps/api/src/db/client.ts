import { drizzle } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema/index';

export type Database = ReturnType<typeof createDatabase>['db'];

/**
 * One pool per process. Mode 'planetscale' makes Drizzle's relational queries avoid
 * LEFT JOIN LATERAL, which MariaDB rejects.
 */
/** The pool's options: one place, so every pool of the process connects alike. */
export function poolOptions(url: string, poolSize: number): mysql.PoolOptions {
  return {
    uri: url,
    connectionLimit: poolSize,
    waitForConnections: true,
    queueLimit: 500,
    connectTimeout: 3000,
    enableKeepAlive: true,
    timezone: 'Z',
    dateStrings: false,
    supportBigNumbers: true,
    decimalNumbers: true,
    // No stack captured at every query's call site (mysql2's default): Drizzle wraps each error with its query already.
    trace: false,
  };
}

export function createDatabase(url: string, poolSize = 20) {
  const pool = mysql.createPool(poolOptions(url, poolSize));
  const db = drizzle(pool, { schema, mode: 'planetscale' });
  return { db, pool };
}
