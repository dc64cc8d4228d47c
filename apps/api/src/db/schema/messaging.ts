import { index, int, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id } from './columns';

/**
 * Mail waits here until the outbox job hands it to the SMTP server, so an outage of the mail
 * server loses nothing. Rows are claimed with SELECT … FOR UPDATE SKIP LOCKED.
 */
export const outbox = mysqlTable(
  'outbox',
  {
    id: id(),
    kind: varchar('kind', { length: 64 }).notNull(),
    toAddress: varchar('to_address', { length: 320 }).notNull(),
    subject: varchar('subject', { length: 300 }).notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    status: mysqlEnum('status', ['waiting', 'sent', 'failed']).notNull().default('waiting'),
    attempts: int('attempts').notNull().default(0),
    lastError: varchar('last_error', { length: 500 }),
    sendAfter: at('send_after').notNull(),
    sentAt: at('sent_at'),
    createdAt: createdAt(),
  },
  (t) => [index('outbox_status_send_after').on(t.status, t.sendAfter)],
);
