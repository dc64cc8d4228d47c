import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import type { Database } from './client';

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../drizzle');

/** Applies the committed SQL migrations in drizzle/; a no-op when the database is current. */
export async function applyMigrations(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder });
}
