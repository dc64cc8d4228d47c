import type { AppContext } from '../../context';
import { deleteExpiredSessions } from '../../access/session-store';
import { deleteAttemptsBefore } from './sign-in-attempts.repository';
import { throttleRules } from './sign-in-throttle';
import { deleteTokensExpiredBefore } from './tokens.repository';

/** Attempts and spent links stay this long after they stop mattering, for looking into incidents. */
const keepForMs = 30 * 24 * 3_600_000;

/**
 * Deletes what the access tables no longer need: expired sessions, links expired for a month,
 * sign-in attempts older than a month (throttling looks back one day). Meant for a job that
 * runs every hour or so under a named lock; safe to run on several instances at once.
 */
export async function purgeStaleAccessRecords(ctx: AppContext, now = new Date()): Promise<void> {
  const cutoff = new Date(now.getTime() - Math.max(keepForMs, throttleRules.account.lookbackMs));
  await deleteExpiredSessions(ctx.db, now, ctx.config.SESSION_IDLE_MINUTES);
  await deleteTokensExpiredBefore(ctx.db, cutoff);
  await deleteAttemptsBefore(ctx.db, cutoff);
}
