import type { PastAttempt } from './sign-in-attempts.repository';

const minute = 60_000;

/**
 * Sign-in throttling rules (OWASP ASVS 2.2.1). Per account: 5 failures within 15 minutes lock
 * it for 5 minutes; each further failure after a lock, without a success in between, doubles
 * the lock up to an hour; failures older than a day are forgotten. Per address: 20 failures
 * within 15 minutes hold the address until the oldest of them is 15 minutes old. Keyed by the
 * e-mail as typed, whether or not an account has it, so throttling reveals no accounts.
 */
export const throttleRules = {
  account: { failures: 5, windowMs: 15 * minute, firstLockMs: 5 * minute, longestLockMs: 60 * minute, lookbackMs: 24 * 60 * minute },
  address: { failures: 20, windowMs: 15 * minute },
} as const;

const isFailure = (a: PastAttempt) => a.outcome === 'failed' || a.outcome === 'pending';

/** Until when the account is locked, given its attempts newest first; undefined when open. */
export function accountLockedUntil(attempts: readonly PastAttempt[], now: Date): Date | undefined {
  const rule = throttleRules.account;
  const sinceSuccess: Date[] = [];
  for (const attempt of attempts) {
    if (attempt.outcome === 'succeeded') break;
    if (isFailure(attempt)) sinceSuccess.push(attempt.at);
  }
  const failures = sinceSuccess.reverse(); // oldest first
  const burstStart = failures.findIndex((at, i) => {
    const fifth = failures[i + rule.failures - 1];
    return fifth !== undefined && fifth.getTime() - at.getTime() <= rule.windowMs;
  });
  if (burstStart < 0) return undefined;
  const failuresAfterLock = failures.length - (burstStart + rule.failures);
  const lockMs = Math.min(rule.firstLockMs * 2 ** failuresAfterLock, rule.longestLockMs);
  const last = failures[failures.length - 1]!;
  const until = new Date(last.getTime() + lockMs);
  return until > now ? until : undefined;
}

/** Until when the address is held, given its failures newest first; undefined when open. */
export function addressLockedUntil(failures: readonly Date[], now: Date): Date | undefined {
  const rule = throttleRules.address;
  const oldestCounted = failures[rule.failures - 1];
  if (!oldestCounted) return undefined;
  const until = new Date(oldestCounted.getTime() + rule.windowMs);
  return until > now ? until : undefined;
}

export function retryAfterSeconds(until: Date, now: Date): number {
  return Math.max(1, Math.ceil((until.getTime() - now.getTime()) / 1000));
}

export function throttledMessage(seconds: number): string {
  const minutes = Math.max(1, Math.ceil(seconds / 60));
  return `Too many failed sign-ins. Try again in ${minutes} ${minutes === 1 ? 'minute' : 'minutes'}.`;
}
