import { and, eq, sql, type SQL } from 'drizzle-orm';
import type { MySqlColumn, MySqlTable } from 'drizzle-orm/mysql-core';
import type { ResultSetHeader } from 'mysql2';
import { AppError } from '../http/app-error';
import type { Database } from './client';

type Versioned = MySqlTable & { id: MySqlColumn; version: MySqlColumn };

/**
 * Optimistic concurrency: applies `values` only when the row still has `version`, and bumps it.
 * Throws not_found when the row is gone and conflict when someone changed it first.
 */
export async function updateVersioned<T extends Versioned>(
  db: Database,
  table: T,
  id: number,
  version: number,
  values: Record<string, unknown>,
  what: string,
): Promise<void> {
  const result = (await db
    .update(table)
    .set({ ...values, version: sql`${table.version} + 1` } as never)
    .where(and(eq(table.id, id), eq(table.version, version)))) as unknown as [ResultSetHeader];
  if (result[0].affectedRows === 1) return;
  const [row] = await db.select({ version: table.version }).from(table as MySqlTable).where(eq(table.id, id));
  if (!row) throw new AppError('not_found', `${what} ${id} does not exist.`);
  throw new AppError(
    'conflict',
    `${what} ${id} was changed by someone else since you opened it (your version ${version}, now ${String(row.version)}). Reload and apply your change again.`,
  );
}

/** Deletes a row; a row that other records still refer to is refused with a clear 409. */
export async function deleteUnreferenced(db: Database, table: Versioned, id: number, what: string, retireHint: string): Promise<void> {
  try {
    const result = (await db.delete(table).where(eq(table.id, id))) as unknown as [ResultSetHeader];
    if (result[0].affectedRows === 0) throw new AppError('not_found', `${what} ${id} does not exist.`);
  } catch (error) {
    if (isForeignKeyViolation(error)) {
      throw new AppError('conflict', `${what} ${id} has history and cannot be deleted. ${retireHint}`);
    }
    throw error;
  }
}

export function isForeignKeyViolation(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && depth < 4; depth++) {
    const code = (e as { code?: string }).code;
    if (code === 'ER_ROW_IS_REFERENCED_2' || code === 'ER_ROW_IS_REFERENCED') return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

export function isDuplicateKey(error: unknown): boolean {
  for (let e: unknown = error, depth = 0; e && depth < 4; depth++) {
    if ((e as { code?: string }).code === 'ER_DUP_ENTRY') return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}

/** ORDER BY from a sort key such as 'name' or '-name'. */
export function orderBy(sort: string, columns: Record<string, MySqlColumn>): SQL {
  const desc = sort.startsWith('-');
  const column = columns[desc ? sort.slice(1) : sort];
  if (!column) throw new AppError('invalid', `Cannot sort by ${sort}.`, { sort: 'Unknown sort field' });
  return desc ? sql`${column} DESC` : sql`${column} ASC`;
}

export const offset = (page: number, pageSize: number) => (page - 1) * pageSize;
