import cron from 'node-cron';
import type { AppContext } from '../context';
import { pruneReadCache } from '../db/read-cache';
import { deliverOutbox } from '../mail/outbox';
import { purgeStaleAccessRecords } from '../modules/auth/housekeeping';
import { createDueInspectionOrders } from '../modules/plans/due-inspections';
import { sendOverdueDigest } from '../modules/work-orders/overdue-digest';
import { queueMonthlySummaries } from '../modules/site-health/monthly-summary';
import { withNamedLock } from './named-lock';

type Job = { name: string; schedule: string; run: (ctx: AppContext) => Promise<unknown> };

/** Jobs every instance schedules; each takes a MariaDB lock so only one instance works at a time. */
export const jobs: Job[] = [
  { name: 'outbox', schedule: '*/5 * * * * *', run: (ctx) => deliverOutbox(ctx.db, ctx.mail, ctx.log) },
  { name: 'access-housekeeping', schedule: '17 * * * *', run: (ctx) => purgeStaleAccessRecords(ctx) },
  // Looked at every hour so a restart never skips a day; each due plan still makes one order.
  { name: 'inspection-orders', schedule: '7 * * * *', run: (ctx) => createDueInspectionOrders(ctx) },
  { name: 'overdue-digest', schedule: '30 6 * * *', run: (ctx) => sendOverdueDigest(ctx) },
  // Every morning, so a month whose 1st fell in an outage still gets its summary; once per month.
  { name: 'site-summaries', schedule: '45 6 * * *', run: (ctx) => queueMonthlySummaries(ctx) },
  // Stored answers hold for a quarter hour at most; those of the hour before are dead weight.
  { name: 'read-cache-pruning', schedule: '23 * * * *', run: (ctx) => pruneReadCache(ctx.db, new Date(Date.now() - 3_600_000)) },
];

export function startJobs(ctx: AppContext, list: Job[] = jobs): { stop: () => void } {
  const tasks = list.map((job) =>
    cron.schedule(
      job.schedule,
      async () => {
        try {
          await withNamedLock(ctx.pool, `varden:${job.name}`, () => job.run(ctx));
        } catch (error) {
          ctx.log.warn({ err: error, job: job.name }, 'job run failed');
        }
      },
      { name: job.name, noOverlap: true },
    ),
  );
  return { stop: () => tasks.forEach((t) => t.stop()) };
}
