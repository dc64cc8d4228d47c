import type { SessionResponse } from '@varden/schemas';
import type { AppContext } from '../../context';
import { AppError } from '../../http/app-error';
import { permissionsOf } from '../../access/policy';
import { endSession, startSession, type ClientInfo } from '../../access/sessions';
import { verifyAgainstDummy, verifyPassword } from '../../security/password-hashing';
import { findUserRecord, findUserRowByEmail, updateUserRow, type UserRecord } from '../users/repository';
import { toUser } from '../users/to-user';
import { addressKey } from './address-key';
import { beginAttempt } from './sign-in-guard';

/** One answer for an unknown e-mail, a wrong password and an account that may not sign in. */
export const wrongCredentials = () => new AppError('unauthenticated', 'The e-mail or password is not right.');

export function sessionResponse(record: UserRecord): SessionResponse {
  return { user: toUser(record), permissions: permissionsOf(record.roles) };
}

export interface SignedIn {
  token: string;
  expiresAt: Date;
  response: SessionResponse;
}

/**
 * Checks the password and opens a new session with a fresh token (a token from before sign-in
 * is never promoted, so a planted cookie cannot fixate the session). An unknown e-mail is
 * checked against a dummy hash, so it takes as long as a wrong password.
 */
export async function signIn(
  ctx: AppContext,
  input: { email: string; password: string },
  client: ClientInfo,
  previousSessionId: number | undefined,
): Promise<SignedIn> {
  const now = new Date();
  const attempt = await beginAttempt(ctx.db, input.email, addressKey(client.ip), now);
  const row = await findUserRowByEmail(ctx.db, input.email);
  const passwordRight = row?.passwordHash ? await verifyPassword(row.passwordHash, input.password) : await verifyAgainstDummy(input.password);
  if (!row || !passwordRight || !row.active) {
    await attempt.failed();
    ctx.log.info({ event: 'sign-in-failed', userId: row?.id, ip: client.ip }, 'sign-in failed');
    throw wrongCredentials();
  }
  await attempt.succeeded();
  if (previousSessionId !== undefined) await endSession(ctx.db, previousSessionId);
  const session = await startSession(ctx.db, ctx.config, row.id, client, now);
  await updateUserRow(ctx.db, row.id, { lastSignInAt: now });
  const record = await findUserRecord(ctx.db, row.id);
  ctx.log.info({ event: 'signed-in', userId: row.id, ip: client.ip }, 'signed in');
  return { token: session.token, expiresAt: session.expiresAt, response: sessionResponse(record!) };
}

export async function currentUserResponse(ctx: AppContext, userId: number): Promise<SessionResponse> {
  const record = await findUserRecord(ctx.db, userId);
  if (!record) throw new AppError('unauthenticated', 'Sign in to continue.');
  return sessionResponse(record);
}

export async function signOut(ctx: AppContext, sessionId: number): Promise<void> {
  await endSession(ctx.db, sessionId);
}
