import { appOrigin } from '../../config';
import type { AppContext } from '../../context';
import { enqueueMail } from '../../mail/outbox';
import type { OutgoingMail } from '../../mail/transport';
import { orderLink } from '../work-orders/notices';
import { activePeopleWithRole, type Person } from '../work-orders/work-orders.repository';
import { siteAndBankOf } from '../work-orders/record.repository';
import { orderOfReading } from './flags.repository';

/** What notifyReplaceFlag needs of a flag: a flag row or the flag contract both fit. */
export interface RaisedFlag {
  id: number;
  kind: string;
  severity: string;
  message: string;
  bankId: number;
  readingId: number | null;
}

function replaceFlagMail(to: Person, flag: RaisedFlag, place: { siteName: string; bankName: string } | undefined, link: string): OutgoingMail {
  const where = place ? `${place.siteName}, ${place.bankName}` : 'a bank';
  return {
    to: to.email,
    subject: `Replace flag at ${where}`,
    text: [
      `Hello ${to.name},`,
      '',
      `A reading at ${where} was evaluated in the replace band:`,
      '',
      flag.message,
      '',
      'Open the work order the reading belongs to; a planner can raise a corrective order from the flag queue in one action:',
      link,
    ].join('\n'),
  };
}

/**
 * Tells planners and supervisors of a new replace flag (the readings module calls this when it
 * raises one). Each person gets one mail, through the outbox; the link opens the order the
 * reading belongs to, or the flag queue when the flag has no reading.
 */
export async function notifyReplaceFlag(ctx: Pick<AppContext, 'db' | 'config'>, flag: RaisedFlag): Promise<void> {
  const [view, orderId, planners, supervisors] = await Promise.all([
    siteAndBankOf(ctx.db, flag.bankId),
    flag.readingId ? orderOfReading(ctx.db, flag.readingId) : Promise.resolve(undefined),
    activePeopleWithRole(ctx.db, 'planner'),
    activePeopleWithRole(ctx.db, 'supervisor'),
  ]);
  const link = orderId ? orderLink(ctx.config, orderId) : `${appOrigin(ctx.config)}/flags`;
  const recipients = new Map<number, Person>([...planners, ...supervisors].map((p) => [p.id, p]));
  for (const person of recipients.values()) {
    await enqueueMail(ctx.db, 'flag.replace', replaceFlagMail(person, flag, view, link));
  }
}
