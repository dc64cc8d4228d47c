import cron from 'node-cron';
import type { AppContext } from '../context';
import { deliverOutbox } from '../mail/outbox';
import { purgeStaleAccessRecords } from '../modules/auth/housekeeping';
import { withNamedLock } from './named-lock';

type Job = { name: string; schedule: string; run: (ctx: AppContext) => Promise<unknown> };

/** Jobs every instance schedules; each takes a MariaDB lock so only one instance works at a time. */
export const jobs: Job[] = [
  { name: 'outbox', schedule: '*/5 * * * * *', run: (ctx) => deliverOutbox(ctx.db, ctx.mail, ctx.log) },
  { name: 'access-housekeeping', schedule: '17 * * * *', run: (ctx) => purgeStaleAccessRecords(ctx) },
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
