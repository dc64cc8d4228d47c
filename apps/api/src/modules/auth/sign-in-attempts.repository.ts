import { and, desc, eq, gt, inArray, lt } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { signInAttempts, type attemptOutcomeValues } from '../../db/schema/index';

export type AttemptOutcome = (typeof attemptOutcomeValues)[number];
export interface PastAttempt {
  outcome: AttemptOutcome;
  at: Date;
}

export async function recordAttempt(db: Database, email: string, ip: string, outcome: AttemptOutcome, now: Date): Promise<number> {
  const [created] = await db
    .insert(signInAttempts)
    .values({ email: email.slice(0, 320), ip: ip.slice(0, 45), outcome, attemptedAt: now })
    .$returningId();
  return created!.id;
}

export async function settleAttempt(db: Database, id: number, outcome: AttemptOutcome): Promise<void> {
  await db.update(signInAttempts).set({ outcome }).where(eq(signInAttempts.id, id));
}

/** An account's attempts recorded before `beforeId`, newest first. */
export async function attemptsForEmail(db: Database, email: string, beforeId: number, since: Date, limit: number): Promise<PastAttempt[]> {
  const rows = await db
    .select({ outcome: signInAttempts.outcome, at: signInAttempts.attemptedAt })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.email, email), lt(signInAttempts.id, beforeId), gt(signInAttempts.attemptedAt, since)))
    .orderBy(desc(signInAttempts.id))
    .limit(limit);
  return rows;
}

/** Failed (or still unsettled) attempts from one address before `beforeId`, newest first. */
export async function failuresFromAddress(db: Database, ip: string, beforeId: number, since: Date, limit: number): Promise<Date[]> {
  const rows = await db
    .select({ at: signInAttempts.attemptedAt })
    .from(signInAttempts)
    .where(
      and(
        eq(signInAttempts.ip, ip),
        lt(signInAttempts.id, beforeId),
        gt(signInAttempts.attemptedAt, since),
        inArray(signInAttempts.outcome, ['failed', 'pending']),
      ),
    )
    .orderBy(desc(signInAttempts.id))
    .limit(limit);
  return rows.map((r) => r.at);
}

/** Removes attempts older than any rule looks back; for a periodic job. */
export async function deleteAttemptsBefore(db: Database, before: Date): Promise<void> {
  await db.delete(signInAttempts).where(lt(signInAttempts.attemptedAt, before));
}
