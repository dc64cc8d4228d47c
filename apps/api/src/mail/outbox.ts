import { sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { outbox } from '../db/schema/index';
import type { Logger } from '../logger';
import type { MailTransport, OutgoingMail } from './transport';

/** Queues a mail in the same database as the change that causes it; the job sends it later. */
export async function enqueueMail(db: Database, kind: string, mail: OutgoingMail): Promise<void> {
  await db.insert(outbox).values({
    kind,
    toAddress: mail.to,
    subject: mail.subject,
    textBody: mail.text,
    htmlBody: mail.html ?? null,
    sendAfter: new Date(),
  });
}

interface OutboxRow {
  id: number;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attempts: number;
}

const maxAttempts = 12;

/**
 * Sends waiting mail. Each row is claimed inside a transaction with FOR UPDATE SKIP LOCKED, so
 * several API instances can run this at once without sending a mail twice. A failed send is
 * retried with a growing delay; nothing is dropped while the mail server is down.
 */
export interface DeliverOptions {
  /** At most this many mails in one call. */
  batch?: number;
  /** Only the mail to this address (an operator's resend, or a test waiting for its own mail). */
  toAddress?: string;
}

export async function deliverOutbox(db: Database, transport: MailTransport, log: Logger, options: DeliverOptions = {}): Promise<number> {
  const { batch = 20, toAddress } = options;
  const onlyTo = toAddress === undefined ? sql`` : sql`AND to_address = ${toAddress}`;
  let sent = 0;
  for (let i = 0; i < batch; i++) {
    const done = await db.transaction(async (tx) => {
      const [rows] = (await tx.execute(
        sql`SELECT id, to_address, subject, text_body, html_body, attempts FROM outbox
            WHERE status = 'waiting' AND send_after <= NOW(3) ${onlyTo}
            ORDER BY id LIMIT 1 FOR UPDATE SKIP LOCKED`,
      )) as unknown as [OutboxRow[]];
      const row = rows[0];
      if (!row) return 'empty';
      try {
        await transport.send({ to: row.to_address, subject: row.subject, text: row.text_body, html: row.html_body });
        await tx.execute(sql`UPDATE outbox SET status = 'sent', sent_at = NOW(3), attempts = attempts + 1 WHERE id = ${row.id}`);
        return 'sent';
      } catch (error) {
        const attempts = row.attempts + 1;
        const delaySeconds = Math.min(600, 5 * 2 ** Math.min(attempts, 7));
        const message = error instanceof Error ? error.message.slice(0, 480) : 'send failed';
        await tx.execute(
          sql`UPDATE outbox SET attempts = ${attempts}, last_error = ${message},
              status = ${attempts >= maxAttempts ? 'failed' : 'waiting'},
              send_after = NOW(3) + INTERVAL ${delaySeconds} SECOND WHERE id = ${row.id}`,
        );
        log.warn({ outboxId: row.id, attempts, err: message }, 'mail not sent, will retry');
        return 'failed';
      }
    });
    if (done === 'empty' || done === 'failed') break;
    sent++;
  }
  return sent;
}
