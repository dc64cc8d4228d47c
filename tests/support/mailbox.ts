import { deliverOutbox } from '../../apps/api/src/mail/outbox';
import type { TestApp } from './test-app';

interface FakeMail {
  subject: string;
  text: string;
  to: Array<{ address: string }>;
}

/**
 * Sends what waits in the outbox (as the job would) and returns the newest mail the mail fake
 * received for `to`. maildev 3 lists messages at GET /api/email on its web port.
 */
export async function latestMailTo(app: TestApp, to: string, subject?: string, timeoutMs = 25_000): Promise<FakeMail | undefined> {
  const deadline = Date.now() + timeoutMs;
  const address = to.toLowerCase();
  while (Date.now() < deadline) {
    // Other files' mail shares the outbox and the mail fake: send and fetch only this address's.
    await deliverOutbox(app.ctx.db, app.ctx.mail, app.ctx.log, { batch: 50, toAddress: address });
    const res = await fetch(`${process.env.MAIL_WEB_URL}/api/email?${new URLSearchParams({ 'to.address': address })}`);
    const mails = (await res.json()) as FakeMail[];
    // maildev lists in arrival order; its times have only second resolution.
    const newest = mails
      .filter((m) => m.to.some((t) => t.address.toLowerCase() === address) && (subject === undefined || m.subject === subject))
      .at(-1);
    if (newest) return newest;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return undefined;
}

/** The set-password link in a mail, split into its token and purpose. */
export function setPasswordLinkIn(mail: FakeMail | undefined): { url: URL; token: string; purpose: string } {
  const match = mail?.text.match(/https?:\/\/\S+\/set-password\?\S+/);
  if (!match) throw new Error(`no set-password link in ${JSON.stringify(mail?.text)}`);
  const url = new URL(match[0]);
  return { url, token: url.searchParams.get('token') ?? '', purpose: url.searchParams.get('purpose') ?? '' };
}
