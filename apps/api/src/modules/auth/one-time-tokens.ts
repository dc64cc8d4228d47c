import type { TokenPurpose } from '@varden/schemas';
import { generateSecretToken, hashSecretToken } from '../../security/secret-token';
import type { Executor } from '../../access/executor';
import { insertToken } from './tokens.repository';

/** How long a link stays valid: an invitation waits for the person, a reset is urgent. */
export const tokenLifetimeMs: Record<TokenPurpose, number> = {
  invitation: 7 * 24 * 3_600_000,
  reset: 3_600_000,
};

/** Issues a single-use token; only its hash is stored, the token goes into the mailed link. */
export async function issueToken(db: Executor, userId: number, purpose: TokenPurpose, now = new Date()): Promise<string> {
  const token = generateSecretToken();
  await insertToken(db, {
    tokenHash: hashSecretToken(token),
    userId,
    purpose,
    createdAt: now,
    expiresAt: new Date(now.getTime() + tokenLifetimeMs[purpose]),
  });
  return token;
}

export function setPasswordLink(origin: string, token: string, purpose: TokenPurpose): string {
  return `${origin}/set-password?token=${encodeURIComponent(token)}&purpose=${purpose}`;
}
