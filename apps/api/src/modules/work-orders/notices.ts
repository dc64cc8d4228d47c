import { appOrigin, type Config } from '../../config';
import type { AppContext } from '../../context';
import { enqueueMail } from '../../mail/outbox';
import { orderAssignedMail, orderReturnedMail, orderSealedMail, orderSubmittedMail, type MailOrder } from './mails';
import { activePeopleWithRole, findPerson, type WorkOrderView } from './work-orders.repository';

// Who hears of what happens to an order. Mail goes through the outbox, so a mail-server outage
// delays it and loses nothing.

type Mailing = Pick<AppContext, 'db' | 'config'>;

export const orderLink = (config: Config, orderId: number) => `${appOrigin(config)}/work-orders/${orderId}`;

const mailOrder = (v: WorkOrderView): MailOrder => ({
  id: v.order.id,
  title: v.order.title,
  siteName: v.siteName,
  bankName: v.bankName,
  dueOn: v.order.dueOn,
});

/** To the technician an order was dispatched (or reassigned) to. */
export async function noticeAssigned(ctx: Mailing, view: WorkOrderView): Promise<void> {
  if (!view.order.assigneeId) return;
  const person = await findPerson(ctx.db, view.order.assigneeId);
  if (!person?.active) return;
  await enqueueMail(ctx.db, 'work-order.assigned', orderAssignedMail(person, mailOrder(view), orderLink(ctx.config, view.order.id)));
}

/** To every supervisor who may review it (not the technician who did the work). */
export async function noticeSubmitted(ctx: Mailing, view: WorkOrderView, technicianName: string): Promise<void> {
  const supervisors = (await activePeopleWithRole(ctx.db, 'supervisor')).filter((p) => p.id !== view.order.assigneeId);
  for (const to of supervisors) {
    await enqueueMail(ctx.db, 'work-order.submitted', orderSubmittedMail(to, mailOrder(view), technicianName, orderLink(ctx.config, view.order.id)));
  }
}

/** To the technician, with the supervisor's reason. */
export async function noticeReturned(ctx: Mailing, view: WorkOrderView, supervisorName: string, reason: string): Promise<void> {
  if (!view.order.assigneeId) return;
  const person = await findPerson(ctx.db, view.order.assigneeId);
  if (!person?.active) return;
  await enqueueMail(ctx.db, 'work-order.returned', orderReturnedMail(person, mailOrder(view), supervisorName, reason, orderLink(ctx.config, view.order.id)));
}

/** To the planner who created the order; orders made by a plan or the system go to every planner. */
export async function noticeSealed(ctx: Mailing, view: WorkOrderView, signerName: string, signedAt: Date): Promise<void> {
  const creator = view.order.createdById ? await findPerson(ctx.db, view.order.createdById) : undefined;
  const recipients = creator?.active ? [creator] : await activePeopleWithRole(ctx.db, 'planner');
  for (const to of recipients) {
    await enqueueMail(ctx.db, 'work-order.sealed', orderSealedMail(to, mailOrder(view), signerName, signedAt, orderLink(ctx.config, view.order.id)));
  }
}
