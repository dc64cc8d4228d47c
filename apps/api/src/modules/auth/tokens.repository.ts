import { and, count, eq, gt, isNull, lt } from 'drizzle-orm';
import type { TokenPurpose } from '@varden/schemas';
import type { ResultSetHeader } from 'mysql2';
import { authTokens } from '../../db/schema/index';
import type { Executor } from '../../access/executor';

export type TokenRow = typeof authTokens.$inferSelect;

export async function insertToken(
  db: Executor,
  values: { tokenHash: string; userId: number; purpose: TokenPurpose; expiresAt: Date; createdAt: Date },
): Promise<void> {
  await db.insert(authTokens).values(values);
}

export async function findToken(db: Executor, tokenHash: string): Promise<TokenRow | undefined> {
  const [row] = await db.select().from(authTokens).where(eq(authTokens.tokenHash, tokenHash));
  return row;
}

/** Marks the token used if it still was unused and unexpired; false when another request won. */
export async function consumeToken(db: Executor, id: number, now: Date): Promise<boolean> {
  const result = (await db
    .update(authTokens)
    .set({ usedAt: now })
    .where(and(eq(authTokens.id, id), isNull(authTokens.usedAt), gt(authTokens.expiresAt, now)))) as unknown as [ResultSetHeader];
  return result[0].affectedRows === 1;
}

/** Voids every unused token of a user, e.g. when a new one replaces them or the user is deactivated. */
export async function deleteUnusedTokens(db: Executor, userId: number, purpose?: TokenPurpose): Promise<void> {
  await db
    .delete(authTokens)
    .where(and(eq(authTokens.userId, userId), isNull(authTokens.usedAt), purpose ? eq(authTokens.purpose, purpose) : undefined));
}

export async function countTokensSince(db: Executor, userId: number, purpose: TokenPurpose, since: Date): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(authTokens)
    .where(and(eq(authTokens.userId, userId), eq(authTokens.purpose, purpose), gt(authTokens.createdAt, since)));
  return row?.n ?? 0;
}

/** Removes tokens whose expiry is older than `before`, used or not; for a periodic job. */
export async function deleteTokensExpiredBefore(db: Executor, before: Date): Promise<void> {
  await db.delete(authTokens).where(lt(authTokens.expiresAt, before));
}
