import { mysqlTable, tinyint } from 'drizzle-orm/mysql-core';
import { at } from './columns';

/** One row once the demo scenario has been seeded, so a second `npm start` keeps the data. */
export const seedMarker = mysqlTable('seed_marker', {
  id: tinyint('id').primaryKey().default(1),
  seededAt: at('seeded_at').notNull(),
});
