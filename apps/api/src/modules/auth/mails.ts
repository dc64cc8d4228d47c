import type { OutgoingMail } from '../../mail/transport';

// The texts of the access mails. Plain text only: every mail client shows it, and a link in
// plain text cannot hide a different target behind its label.

export function invitationMail(to: { email: string; name: string }, invitedBy: string, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: 'You are invited to Varden',
    text: [
      `Hello ${to.name},`,
      '',
      `${invitedBy} has invited you to Varden, where your team keeps the maintenance record of its capacitor banks.`,
      '',
      'Choose your password here (the link works once, for 7 days):',
      link,
      '',
      'If you did not expect this invitation, ignore this mail; nothing happens until the link is used.',
    ].join('\n'),
  };
}

export function passwordResetMail(to: { email: string; name: string }, link: string): OutgoingMail {
  return {
    to: to.email,
    subject: 'Set a new Varden password',
    text: [
      `Hello ${to.name},`,
      '',
      'Someone asked to set a new password for your Varden account. To choose one, open this link (it works once, for 1 hour):',
      link,
      '',
      'If it was not you, ignore this mail: your password stays as it is.',
    ].join('\n'),
  };
}
