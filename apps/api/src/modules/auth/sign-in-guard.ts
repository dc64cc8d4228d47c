import type { Database } from '../../db/client';
import { AppError } from '../../http/app-error';
import { attemptsForEmail, failuresFromAddress, recordAttempt, settleAttempt } from './sign-in-attempts.repository';
import { accountLockedUntil, addressLockedUntil, retryAfterSeconds, throttledMessage, throttleRules } from './sign-in-throttle';

export interface Attempt {
  succeeded(): Promise<void>;
  failed(): Promise<void>;
}

/**
 * Opens a password check for an e-mail from an address. The attempt is written first, as
 * pending, and the rules read only what was written before it: a burst of parallel guesses
 * sees itself and is stopped, across every API instance, because the state is in the database.
 * Throws 'throttled' with the wait when the account or the address is held.
 */
export async function beginAttempt(db: Database, email: string, ip: string, now = new Date()): Promise<Attempt> {
  const id = await recordAttempt(db, email, ip, 'pending', now);
  const { account, address } = throttleRules;
  const [accountHistory, addressFailures] = await Promise.all([
    attemptsForEmail(db, email, id, new Date(now.getTime() - account.lookbackMs), 200),
    failuresFromAddress(db, ip, id, new Date(now.getTime() - address.windowMs), address.failures),
  ]);
  const until = [accountLockedUntil(accountHistory, now), addressLockedUntil(addressFailures, now)]
    .filter((d): d is Date => d !== undefined)
    .sort((a, b) => b.getTime() - a.getTime())[0];
  if (until) {
    await settleAttempt(db, id, 'throttled');
    const seconds = retryAfterSeconds(until, now);
    throw new AppError('throttled', throttledMessage(seconds), undefined, seconds);
  }
  return {
    succeeded: () => settleAttempt(db, id, 'succeeded'),
    failed: () => settleAttempt(db, id, 'failed'),
  };
}

/** Records proof of the account's owner other than a password (a used reset link): unlocks it. */
export async function recordOwnerProof(db: Database, email: string, ip: string, now = new Date()): Promise<void> {
  await recordAttempt(db, email, ip, 'succeeded', now);
}
