import { bigint, index, mediumtext, mysqlTable, tinyint, varchar } from 'drizzle-orm/mysql-core';
import { at, ref } from './columns';

/**
 * The data's revision: one row, moved on by every write that succeeds (http/read-revision.ts
 * for the API, and every job or tool that writes outside it). A stored answer is good only
 * while the revision it was computed at is still the current one.
 */
export const readRevision = mysqlTable('read_revision', {
  id: tinyint('id').primaryKey().default(1),
  revision: bigint('revision', { mode: 'number', unsigned: true }).notNull().default(0),
});

/**
 * Answers of heavy reads (a site's health, the fleet, a unit's history, a page of work orders)
 * stored as the JSON they were sent as, with the revision and the quarter hour they were
 * computed in (an answer that says "overdue" depends on the date in the site's time zone, and
 * every time zone's offset is a multiple of 15 minutes). Any API process may
 * serve one: the check is against the database, never against a process's memory.
 */
export const readCache = mysqlTable('read_cache', {
  cacheKey: varchar('cache_key', { length: 190 }).primaryKey(),
  /** The site the answer belongs to, checked against the reader's scope before it is sent. */
  siteId: ref('site_id'),
  revision: bigint('revision', { mode: 'number', unsigned: true }).notNull(),
  /** The UTC quarter hour the answer holds for, as 2026-12-02T14:45. */
  validFor: varchar('valid_for', { length: 16 }).notNull(),
  body: mediumtext('body').notNull(),
  storedAt: at('stored_at').notNull(),
}, (t) => [index('read_cache_stored_at').on(t.storedAt)]);
