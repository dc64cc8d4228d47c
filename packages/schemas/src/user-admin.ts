import * as z from 'zod/mini';
import { listQuery, listResponse, queryId } from './common';
import { emailSchema, personName, roles, roleSchema, user, userStatuses, type Role } from './users';

// Contracts for administering people and their access: roles, viewer site grants, invitations,
// the users list and the audit log. The web's admin screens and the API validate with the same schemas.

const roleList = z.pipe(
  z.array(roleSchema, { error: 'Choose at least one role' }).check(z.minLength(1, 'Choose at least one role'), z.maxLength(roles.length)),
  z.transform((list: Role[]) => [...new Set(list)]),
);

const siteIdList = z.pipe(
  z.array(z.number().check(z.int(), z.positive()), { error: 'A list of site ids' }).check(z.maxLength(1000, 'At most 1000 sites')),
  z.transform((list: number[]) => [...new Set(list)]),
);
export const userIdParams = z.object({ id: z.coerce.number().check(z.int(), z.positive('A user id')) });

export const userSorts = ['name', '-name', 'email', '-email', 'createdAt', '-createdAt', 'lastSignInAt', '-lastSignInAt'] as const;
export const userListQuery = z.extend(listQuery(userSorts, 'name'), {
  role: z.optional(roleSchema),
  status: z.optional(z.enum(userStatuses)),
});
export type UserListQuery = z.input<typeof userListQuery>;
export const userList = listResponse(user);
export type UserList = z.infer<typeof userList>;

/** An administrator's change to a person; at least one field. */
export const userUpdate = z
  .strictObject({
    name: z.optional(personName),
    roles: z.optional(roleList),
    active: z.optional(z.boolean({ error: 'Active is true or false' })),
    siteIds: z.optional(siteIdList),
  })
  .check(z.refine((v) => Object.keys(v).length > 0, 'Change at least one field'));
export type UserUpdate = z.input<typeof userUpdate>;

export const invitationCreate = z
  .strictObject({
    email: emailSchema,
    name: personName,
    roles: roleList,
    siteIds: z._default(siteIdList, []),
  })
  .check(
    z.superRefine((v, ctx) => {
      if (v.siteIds.length > 0 && !v.roles.includes('viewer')) {
        ctx.addIssue({ code: 'custom', path: ['siteIds'], message: 'Sites are granted to viewers only' });
      }
    }),
  );
export type InvitationCreate = z.input<typeof invitationCreate>;

export const auditEntry = z.object({
  id: z.number(),
  at: z.string(),
  actor: z.nullable(z.object({ id: z.number(), name: z.string(), email: z.string() })),
  action: z.string(),
  targetType: z.string(),
  targetId: z.nullable(z.number()),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEntry = z.infer<typeof auditEntry>;

export const auditLogQuery = z.object({
  page: z._default(z.coerce.number().check(z.int(), z.gte(1)), 1),
  pageSize: z._default(z.coerce.number().check(z.int(), z.gte(1), z.lte(200)), 50),
  actorId: z.optional(queryId),
  targetType: z.optional(z.string().check(z.trim(), z.maxLength(32))),
  targetId: z.optional(queryId),
  action: z.optional(z.string().check(z.trim(), z.maxLength(64))),
});
export type AuditLogQuery = z.input<typeof auditLogQuery>;
export const auditLog = listResponse(auditEntry);
export type AuditLog = z.infer<typeof auditLog>;
