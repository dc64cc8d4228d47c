import type { invitationCreate, User } from '@varden/schemas';
import type { z } from 'zod';
import { appOrigin } from '../../config';
import type { AppContext } from '../../context';
import { isDuplicateKey } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { enqueueMail } from '../../mail/outbox';
import { recordAudit } from '../../access/audit';
import type { SessionUser } from '../../access/current-user';
import { findUserRecord, findUserRowByEmail, insertUser, replaceRoles, replaceSiteGrants, updateUserRow } from '../users/repository';
import { toUser } from '../users/to-user';
import { invitationMail } from './mails';
import { issueToken, setPasswordLink } from './one-time-tokens';
import { deleteUnusedTokens } from './tokens.repository';

const alreadyHasAccount = (email: string) =>
  new AppError('conflict', `${email} already has an account. Change it in the users list instead.`, {
    email: 'Someone with this e-mail already has an account',
  });

/**
 * Invites a person: an account that cannot sign in until they choose a password from the
 * mailed link. Inviting someone who never accepted replaces their pending invitation (the old
 * link stops working) with the roles given now.
 */
export async function invite(ctx: AppContext, actor: SessionUser, input: z.output<typeof invitationCreate>): Promise<User> {
  const now = new Date();
  const existing = await findUserRowByEmail(ctx.db, input.email);
  if (existing?.passwordHash) throw alreadyHasAccount(input.email);
  const siteIds = input.roles.includes('viewer') ? input.siteIds : [];

  let userId: number;
  let token: string;
  try {
    ({ userId, token } = await ctx.db.transaction(async (tx) => {
      const id = existing
        ? (await updateUserRow(tx, existing.id, { name: input.name, active: false, deactivatedAt: null }), existing.id)
        : await insertUser(tx, { email: input.email, name: input.name, active: false });
      await replaceRoles(tx, id, input.roles);
      await replaceSiteGrants(tx, id, siteIds);
      await deleteUnusedTokens(tx, id, 'invitation');
      const issued = await issueToken(tx, id, 'invitation', now);
      await recordAudit(tx, {
        actorUserId: actor.id,
        action: existing ? 'user.re-invited' : 'user.invited',
        targetType: 'user',
        targetId: id,
        details: { email: input.email, name: input.name, roles: input.roles, siteIds },
        at: now,
      });
      return { userId: id, token: issued };
    }));
  } catch (error) {
    // Two administrators inviting the same address at once: the unique index decides.
    if (isDuplicateKey(error)) throw alreadyHasAccount(input.email);
    throw error;
  }
  // Queued after the commit: enqueueMail takes the database, not a transaction. A failure here
  // leaves the invitation in place and an administrator can invite again.
  await enqueueMail(ctx.db, 'invitation', invitationMail(input, actor.name, setPasswordLink(appOrigin(ctx.config), token, 'invitation')));
  const record = await findUserRecord(ctx.db, userId);
  return toUser(record!);
}
