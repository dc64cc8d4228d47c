import { sql } from 'drizzle-orm';
import { bigint, datetime } from 'drizzle-orm/mysql-core';

/** Shared column helpers: every table keys on an unsigned auto-increment id; times are UTC, in ms. */
export const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();
export const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true });
export const at = (name: string) => datetime(name, { fsp: 3 });
export const createdAt = () =>
  at('created_at')
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`);
export const updatedAt = () =>
  at('updated_at')
    .notNull()
    .default(sql`CURRENT_TIMESTAMP(3)`)
    .$onUpdate(() => new Date());
