import { eq } from 'drizzle-orm';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { freePort, startStandaloneMail } from '../../scripts/lib/services.mjs';
import { applyMigrations } from '../../apps/api/src/db/migrate';
import { outbox } from '../../apps/api/src/db/schema/index';
import { deliverOutbox, enqueueMail } from '../../apps/api/src/mail/outbox';
import { createMailTransport } from '../../apps/api/src/mail/transport';
import { startTestApp, unique, type TestApp } from '../support/test-app';

// The mail server being down loses nothing: mail waits in the outbox, retried with a growing
// delay, and goes out once the server answers again. The outage is a transport pointed at a
// closed port, so the shared mail fake stays up for the other test files, and the outbox is
// a database of its own, so no other file's mail is delayed by the failed sends.
const database = `varden_mail_${process.pid}`;
let app: TestApp;
let admin: mysql.Connection;
beforeAll(async () => {
  const url = new URL(process.env.DATABASE_URL!);
  admin = await mysql.createConnection({ host: url.hostname, port: Number(url.port), user: url.username, password: decodeURIComponent(url.password) });
  await admin.query(`CREATE DATABASE IF NOT EXISTS \`${database}\``);
  url.pathname = `/${database}`;
  app = await startTestApp({ DATABASE_URL: url.toString() });
  await applyMigrations(app.ctx.db);
});
afterAll(async () => {
  await app?.close();
  await admin?.query(`DROP DATABASE IF EXISTS \`${database}\``);
  await admin?.end();
});

test('mail queued while the mail server is down goes out when it is back', async () => {
  const to = `${unique('outage')}@example.test`;
  await enqueueMail(app.ctx.db, 'test', { to, subject: 'Order 12 assigned to you', text: 'Open it in Varden.' });
  const [row] = await app.ctx.db.select().from(outbox).where(eq(outbox.toAddress, to));
  expect(row).toMatchObject({ status: 'waiting', attempts: 0 });

  const down = createMailTransport({ ...app.ctx.config, SMTP_URL: 'smtp://127.0.0.1:9' });
  expect(await deliverOutbox(app.ctx.db, down, app.ctx.log)).toBe(0);
  down.close();
  const [failed] = await app.ctx.db.select().from(outbox).where(eq(outbox.id, row!.id));
  expect(failed).toMatchObject({ status: 'waiting', attempts: 1 });
  expect(failed!.lastError).toBeTruthy();
  expect(failed!.sendAfter.getTime()).toBeGreaterThan(Date.now());

  // The server is back; the retry time has come.
  await app.ctx.db.update(outbox).set({ sendAfter: new Date(Date.now() - 1000) }).where(eq(outbox.id, row!.id));
  expect(await deliverOutbox(app.ctx.db, app.ctx.mail, app.ctx.log)).toBe(1);
  const [sent] = await app.ctx.db.select().from(outbox).where(eq(outbox.id, row!.id));
  expect(sent).toMatchObject({ status: 'sent', attempts: 2 });
  const inbox = (await (await fetch(`${process.env.MAIL_WEB_URL}/api/email`)).json()) as Array<{ to: Array<{ address: string }>; subject: string }>;
  expect(inbox.filter((m) => m.to.some((t) => t.address === to)).map((m) => m.subject)).toEqual(['Order 12 assigned to you']);
});

test('the mail fake really stopped and started again: the waiting mail goes out once, through the same transport', async () => {
  const fake = await startStandaloneMail({ smtpPort: await freePort(), webPort: await freePort() });
  const transport = createMailTransport({ ...app.ctx.config, SMTP_URL: fake.smtpUrl });
  try {
    const to = `${unique('stopped')}@example.test`;
    await fake.stop();
    await enqueueMail(app.ctx.db, 'test', { to, subject: 'Bank 2 inspection sent back', text: 'See the supervisor’s reason.' });
    const [row] = await app.ctx.db.select().from(outbox).where(eq(outbox.toAddress, to));
    const started = Date.now();
    expect(await deliverOutbox(app.ctx.db, transport, app.ctx.log, { toAddress: to })).toBe(0);
    const failedInMs = Date.now() - started;
    const [waiting] = await app.ctx.db.select().from(outbox).where(eq(outbox.id, row!.id));
    expect(waiting).toMatchObject({ status: 'waiting', attempts: 1 });
    expect(waiting!.lastError).toBeTruthy();

    await fake.restart();
    await app.ctx.db.update(outbox).set({ sendAfter: new Date(Date.now() - 1000) }).where(eq(outbox.id, row!.id));
    expect(await deliverOutbox(app.ctx.db, transport, app.ctx.log, { toAddress: to })).toBe(1);
    const [sent] = await app.ctx.db.select().from(outbox).where(eq(outbox.id, row!.id));
    expect(sent).toMatchObject({ status: 'sent', attempts: 2 });
    // Sent once: a further run finds nothing to send.
    expect(await deliverOutbox(app.ctx.db, transport, app.ctx.log, { toAddress: to })).toBe(0);
    const inbox = (await (await fetch(`${fake.webUrl}/api/email`)).json()) as Array<{ to: Array<{ address: string }>; subject: string }>;
    expect(inbox.filter((m) => m.to.some((t) => t.address === to)).map((m) => m.subject)).toEqual(['Bank 2 inspection sent back']);
    console.log(`mail outage figures ${JSON.stringify({ failedSendMs: failedInMs })}`);
  } finally {
    transport.close();
    await fake.stop();
  }
}, 60_000);
