import type { OutgoingMail } from '../../mail/transport';

// The texts of the work-order mails. Plain text, like every Varden mail: each client shows it,
// and a link in plain text cannot hide a different target behind its label.

export interface MailOrder {
  id: number;
  title: string;
  siteName: string;
  bankName: string;
  dueOn: string;
}

const about = (o: MailOrder) => `Work order ${o.id}: ${o.title}\n${o.siteName}, ${o.bankName}; due ${o.dueOn}`;

export function orderAssignedMail(to: { email: string; name: string }, order: MailOrder, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: `Work order ${order.id} is yours: ${order.title}`,
    text: [
      `Hello ${to.name},`,
      '',
      'This work order has been dispatched to you:',
      '',
      about(order),
      '',
      'It opens with the safety card; acknowledge it on site before you record anything:',
      link,
    ].join('\n'),
  };
}

export function orderSubmittedMail(to: { email: string; name: string }, order: MailOrder, technicianName: string, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: `For review: work order ${order.id}, ${order.siteName}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${technicianName} has submitted this work order for review:`,
      '',
      about(order),
      '',
      'Review its results, flags and photos, then seal it or send it back with a reason:',
      link,
    ].join('\n'),
  };
}

export function orderReturnedMail(to: { email: string; name: string }, order: MailOrder, supervisorName: string, reason: string, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: `Sent back: work order ${order.id}, ${order.siteName}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${supervisorName} has sent this work order back to the field:`,
      '',
      about(order),
      '',
      'The reason given:',
      reason,
      '',
      'Open it to resume work (the safety card comes first again):',
      link,
    ].join('\n'),
  };
}

export function orderSealedMail(to: { email: string; name: string }, order: MailOrder, signerName: string, signedAt: Date, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: `Sealed: work order ${order.id}, ${order.siteName}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${signerName} signed off this work order on ${signedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC. Its record is now sealed and can no longer change.`,
      '',
      about(order),
      '',
      'The signed record:',
      link,
    ].join('\n'),
  };
}

export interface DigestLine extends MailOrder {
  state: string;
  assigneeName: string | null;
  daysOverdue: number;
}

/** A digest lists this many orders at most; the rest are counted, and the list page shows them all. */
export const digestLineLimit = 50;

export function overdueDigestMail(
  to: { email: string; name: string },
  date: string,
  lines: DigestLine[],
  linkOf: (id: number) => string,
  listLink: string,
): OutgoingMail {
  const shown = lines.slice(0, digestLineLimit);
  const body = shown.flatMap((l) => [
    `- ${l.id} ${l.title} (${l.siteName}, ${l.bankName}): due ${l.dueOn}, ${l.daysOverdue} day${l.daysOverdue === 1 ? '' : 's'} overdue, ${l.state}, ${l.assigneeName ?? 'nobody assigned'}`,
    `  ${linkOf(l.id)}`,
  ]);
  const more = lines.length - shown.length;
  return {
    to: to.email,
    subject: `Overdue work orders on ${date}: ${lines.length}`,
    text: [
      `Hello ${to.name},`,
      '',
      `${lines.length} work order${lines.length === 1 ? ' is' : 's are'} past ${lines.length === 1 ? 'its' : 'their'} due date and not yet sealed:`,
      '',
      ...body,
      ...(more > 0 ? ['', `…and ${more} more. All of them, oldest first:`, listLink] : []),
    ].join('\n'),
  };
}
