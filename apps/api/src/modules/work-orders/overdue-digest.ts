import { openWorkOrderStates } from '@varden/schemas';
import { and, count, eq, gte, inArray, lt } from 'drizzle-orm';
import { appOrigin } from '../../config';
import type { AppContext } from '../../context';
import { outbox, sites, banks, users, workOrders } from '../../db/schema/index';
import { withNamedLock } from '../../jobs/named-lock';
import { enqueueMail } from '../../mail/outbox';
import { addDays, isOverdue, localDate, utcDate } from './calendar';
import { overdueDigestMail, type DigestLine } from './mails';
import { orderLink } from './notices';
import { activePeopleWithRole } from './work-orders.repository';

const digestKind = 'work-order.overdue-digest';

const daysBetween = (from: string, to: string) => Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);

/**
 * The daily mail to planners listing every order past its due date (on its site's calendar)
 * and not yet sealed or withdrawn. At most one digest a day whatever the number of instances:
 * the digest is queued under a named lock, and a day whose digest is already in the outbox is
 * skipped. Returns the number of mails queued.
 */
export async function sendOverdueDigest(ctx: AppContext, now: Date = new Date()): Promise<number> {
  const day = utcDate(now);
  const queued = await withNamedLock(ctx.pool, 'varden:overdue-digest:queue', async () => {
    const [already] = await ctx.db
      .select({ n: count() })
      .from(outbox)
      .where(and(eq(outbox.kind, digestKind), gte(outbox.createdAt, new Date(`${day}T00:00:00Z`))));
    if ((already?.n ?? 0) > 0) return 0;

    // Oldest first, so the digest's first lines are the longest overdue. Due before tomorrow in UTC covers every zone's "before today"; each site's calendar decides.
    const rows = await ctx.db
      .select({
        id: workOrders.id,
        title: workOrders.title,
        dueOn: workOrders.dueOn,
        state: workOrders.state,
        siteName: sites.name,
        timeZone: sites.timeZone,
        bankName: banks.name,
        assigneeName: users.name,
      })
      .from(workOrders)
      .innerJoin(sites, eq(sites.id, workOrders.siteId))
      .innerJoin(banks, eq(banks.id, workOrders.bankId))
      .leftJoin(users, eq(users.id, workOrders.assigneeId))
      .where(and(inArray(workOrders.state, [...openWorkOrderStates]), lt(workOrders.dueOn, addDays(day, 1))))
      .orderBy(workOrders.dueOn, workOrders.id);
    const lines: DigestLine[] = rows
      .filter((r) => isOverdue(r, r.timeZone, now))
      .map((r) => ({ ...r, daysOverdue: daysBetween(r.dueOn, localDate(r.timeZone, now)) }));
    if (lines.length === 0) return 0;
    const planners = await activePeopleWithRole(ctx.db, 'planner');
    for (const planner of planners) {
      await enqueueMail(ctx.db, digestKind, overdueDigestMail(planner, day, lines, (id) => orderLink(ctx.config, id), `${appOrigin(ctx.config)}/work-orders?sort=dueOn`));
    }
    return planners.length;
  });
  return queued ?? 0;
}
