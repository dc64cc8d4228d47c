import type { SetPasswordResponse, TokenPurpose } from '@varden/schemas';
import { appOrigin } from '../../config';
import type { AppContext } from '../../context';
import { AppError } from '../../http/app-error';
import { enqueueMail } from '../../mail/outbox';
import { recordAudit } from '../../access/audit';
import type { SessionUser } from '../../access/current-user';
import { endAllSessionsOf, startSession, type ClientInfo } from '../../access/sessions';
import { hashPassword, verifyPassword } from '../../security/password-hashing';
import { passwordProblem } from '../../security/password-policy';
import { hashSecretToken } from '../../security/secret-token';
import { findUserRecord, findUserRowByEmail, updateUserRow } from '../users/repository';
import { statusOf } from '../users/to-user';
import { passwordResetMail } from './mails';
import { issueToken, setPasswordLink } from './one-time-tokens';
import { addressKey } from './address-key';
import { beginAttempt, recordOwnerProof } from './sign-in-guard';
import { consumeToken, countTokensSince, deleteUnusedTokens, findToken } from './tokens.repository';

/** At most this many reset mails per account per hour, so the form cannot flood a mailbox. */
const resetMailsPerHour = 3;

/**
 * Mails a reset link when the e-mail belongs to an active account with a password; does
 * nothing otherwise. The caller answers the same either way, so the form reveals no accounts.
 */
export async function requestPasswordReset(ctx: AppContext, email: string): Promise<void> {
  const row = await findUserRowByEmail(ctx.db, email);
  if (!row || !row.active || !row.passwordHash) return;
  const now = new Date();
  if ((await countTokensSince(ctx.db, row.id, 'reset', new Date(now.getTime() - 3_600_000))) >= resetMailsPerHour) return;
  const token = await issueToken(ctx.db, row.id, 'reset', now);
  await enqueueMail(ctx.db, 'password-reset', passwordResetMail(row, setPasswordLink(appOrigin(ctx.config), token, 'reset')));
}

const linkNoLongerValid = (purpose: TokenPurpose | undefined) =>
  new AppError(
    'invalid',
    purpose === 'invitation'
      ? 'This invitation link has expired or was already used. Ask your administrator to invite you again.'
      : 'This link has expired or was already used. Ask for a new link to set your password.',
    { token: 'The link is no longer valid' },
  );

const refuse = (field: string, problem: string) => new AppError('invalid', problem, { [field]: problem });

/**
 * Sets a password from an invitation or reset link. The token works once and only before it
 * expires; an invitation activates the account; every session of the account ends.
 */
export async function setPasswordWithToken(
  ctx: AppContext,
  input: { token: string; password: string },
  client: ClientInfo,
): Promise<SetPasswordResponse> {
  const now = new Date();
  const token = await findToken(ctx.db, hashSecretToken(input.token));
  if (!token) throw linkNoLongerValid(undefined);
  if (token.usedAt || token.expiresAt <= now) throw linkNoLongerValid(token.purpose);
  const user = await findUserRecord(ctx.db, token.userId);
  const expectedStatus = token.purpose === 'invitation' ? 'invited' : 'active';
  if (!user || statusOf(user) !== expectedStatus) throw linkNoLongerValid(token.purpose);
  const problem = passwordProblem(input.password, user.email);
  if (problem) throw refuse('password', problem);
  const passwordHash = await hashPassword(input.password);

  await ctx.db.transaction(async (tx) => {
    if (!(await consumeToken(tx, token.id, now))) throw linkNoLongerValid(token.purpose);
    await updateUserRow(tx, user.id, {
      passwordHash,
      passwordChangedAt: now,
      ...(token.purpose === 'invitation' ? { active: true, deactivatedAt: null } : {}),
    });
    await deleteUnusedTokens(tx, user.id);
    await endAllSessionsOf(tx, user.id);
    await recordAudit(tx, {
      actorUserId: user.id,
      action: token.purpose === 'invitation' ? 'user.invitation-accepted' : 'user.password-reset',
      targetType: 'user',
      targetId: user.id,
      details: {},
      at: now,
    });
  });
  await recordOwnerProof(ctx.db, user.email, addressKey(client.ip), now);
  return { email: user.email, purpose: token.purpose };
}

/**
 * Changes the signed-in user's password after checking the current one (throttled like a
 * sign-in, so a borrowed session cannot guess it). Every session ends, then a new one opens
 * for this browser: the caller stays signed in, every other device is signed out.
 */
export async function changePassword(
  ctx: AppContext,
  user: SessionUser,
  input: { currentPassword: string; newPassword: string },
  client: ClientInfo,
): Promise<{ token: string; expiresAt: Date }> {
  const now = new Date();
  const row = await findUserRowByEmail(ctx.db, user.email);
  if (!row?.passwordHash) throw new AppError('unauthenticated', 'Sign in to continue.');
  const attempt = await beginAttempt(ctx.db, user.email, addressKey(client.ip), now);
  if (!(await verifyPassword(row.passwordHash, input.currentPassword))) {
    await attempt.failed();
    throw refuse('currentPassword', 'This is not your current password.');
  }
  await attempt.succeeded();
  const problem = passwordProblem(input.newPassword, user.email);
  if (problem) throw refuse('newPassword', problem);
  const passwordHash = await hashPassword(input.newPassword);
  await ctx.db.transaction(async (tx) => {
    await updateUserRow(tx, user.id, { passwordHash, passwordChangedAt: now });
    await deleteUnusedTokens(tx, user.id, 'reset');
    await endAllSessionsOf(tx, user.id);
    await recordAudit(tx, { actorUserId: user.id, action: 'user.password-changed', targetType: 'user', targetId: user.id, details: {}, at: now });
  });
  const session = await startSession(ctx.db, ctx.config, user.id, client, now);
  return { token: session.token, expiresAt: session.expiresAt };
}
