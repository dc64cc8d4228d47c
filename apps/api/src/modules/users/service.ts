import type { User, UserList, userListQuery, userUpdate } from '@varden/schemas';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { AppError } from '../../http/app-error';
import { recordAudit } from '../../access/audit';
import type { SessionUser } from '../../access/current-user';
import { endAllSessionsOf } from '../../access/sessions';
import { deleteUnusedTokens } from '../auth/tokens.repository';
import { findUserRecord, listUserRecords, replaceRoles, replaceSiteGrants, updateUserRow, type UserRecord } from './repository';
import { statusOf, toUser } from './to-user';

export async function listUsers(db: Database, query: z.output<typeof userListQuery>): Promise<UserList> {
  const { records, total } = await listUserRecords(db, query);
  return { items: records.map(toUser), total };
}

async function existingUser(db: Database, id: number): Promise<UserRecord> {
  const record = await findUserRecord(db, id);
  if (!record) throw new AppError('not_found', `User ${id} does not exist.`);
  return record;
}

export async function getUser(db: Database, id: number): Promise<User> {
  return toUser(await existingUser(db, id));
}

const sameList = (a: readonly unknown[], b: readonly unknown[]) => a.length === b.length && a.every((x) => b.includes(x));

/**
 * An administrator's change to a person. Administrators cannot lock themselves out: they keep
 * their own admin role and stay active, so the organisation always has an active administrator.
 * Deactivation ends the person's sessions and voids their links; every change is audited.
 */
export async function updateUser(db: Database, actor: SessionUser, id: number, patch: z.output<typeof userUpdate>): Promise<User> {
  const before = await existingUser(db, id);
  if (actor.id === id && patch.active === false) {
    throw new AppError('conflict', 'You cannot deactivate your own account. Another administrator can.');
  }
  if (actor.id === id && patch.roles && before.roles.includes('admin') && !patch.roles.includes('admin')) {
    throw new AppError('conflict', 'You cannot remove your own administrator role. Another administrator can.', {
      roles: 'Keep your administrator role',
    });
  }
  const roles = patch.roles ?? before.roles;
  if (patch.siteIds && patch.siteIds.length > 0 && !roles.includes('viewer')) {
    throw new AppError('invalid', 'Sites are granted to viewers only.', { siteIds: 'Sites are granted to viewers only' });
  }
  if (patch.active === true && !before.passwordHash) {
    throw new AppError('conflict', `${before.name} has not accepted the invitation yet. Invite them again instead.`);
  }
  const siteIds = roles.includes('viewer') ? (patch.siteIds ?? before.siteIds) : [];

  const changes: Record<string, { from: unknown; to: unknown }> = {};
  if (patch.name !== undefined && patch.name !== before.name) changes.name = { from: before.name, to: patch.name };
  if (!sameList(roles, before.roles)) changes.roles = { from: before.roles, to: roles };
  if (!sameList(siteIds, before.siteIds)) changes.siteIds = { from: before.siteIds, to: siteIds };
  const deactivating = patch.active === false && statusOf(before) !== 'deactivated';
  const reactivating = patch.active === true && !before.active;
  if (deactivating || reactivating) changes.active = { from: before.active, to: patch.active };
  if (Object.keys(changes).length === 0) return toUser(before);

  const now = new Date();
  await db.transaction(async (tx) => {
    if (changes.name) await updateUserRow(tx, id, { name: patch.name });
    if (deactivating) await updateUserRow(tx, id, { active: false, deactivatedAt: now });
    if (reactivating) await updateUserRow(tx, id, { active: true, deactivatedAt: null });
    if (changes.roles) await replaceRoles(tx, id, roles);
    if (changes.siteIds) await replaceSiteGrants(tx, id, siteIds);
    if (deactivating) {
      await endAllSessionsOf(tx, id);
      await deleteUnusedTokens(tx, id);
    }
    await recordAudit(tx, { actorUserId: actor.id, action: 'user.updated', targetType: 'user', targetId: id, details: { changes }, at: now });
  });
  return toUser(await existingUser(db, id));
}
