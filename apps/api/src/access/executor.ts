import type { Database } from '../db/client';

/**
 * The database or a transaction on it, so the access repositories work inside either.
 * (A general helper: it can move to db/ when other areas need it.)
 */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];
