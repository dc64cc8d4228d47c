import { z } from 'zod';
import { listQuery, listResponse } from './common';

// Contracts for people and their access: roles, viewer site grants, the users admin list and the
// audit log. The web's admin screens and the API validate with the same schemas.

export const roles = ['admin', 'planner', 'technician', 'supervisor', 'viewer'] as const;
export const roleSchema = z.enum(roles, { error: 'Choose admin, planner, technician, supervisor or viewer' });
export type Role = z.infer<typeof roleSchema>;

/** invited: has not set a password yet; active: may sign in; deactivated: may no longer sign in. */
export const userStatuses = ['invited', 'active', 'deactivated'] as const;
export type UserStatus = (typeof userStatuses)[number];

/** E-mail addresses are compared and stored in lower case. */
export const emailSchema = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, 'At most 254 characters')
  .pipe(z.email({ error: 'Enter an e-mail address such as name@example.com' }));

export const personName = z
  .string({ error: 'Enter a name' })
  .trim()
  .min(1, 'Enter a name')
  .max(200, 'At most 200 characters');

const roleList = z
  .array(roleSchema, { error: 'Choose at least one role' })
  .min(1, 'Choose at least one role')
  .max(roles.length)
  .transform((list) => [...new Set(list)]);

const siteIdList = z
  .array(z.number().int().positive(), { error: 'A list of site ids' })
  .max(1000, 'At most 1000 sites')
  .transform((list) => [...new Set(list)]);

export const user = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  active: z.boolean(),
  status: z.enum(userStatuses),
  roles: z.array(roleSchema),
  /** Sites a viewer may read; empty for other roles, who read every site. */
  siteIds: z.array(z.number()),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type User = z.infer<typeof user>;

/**
 * GET /api/technicians: the active technicians a planner may give an order to, by name; only
 * what assigning needs (the people administration keeps the rest).
 */
export const technician = z.object({ id: z.number(), name: z.string(), email: z.string() });
export type Technician = z.infer<typeof technician>;
export const technicianList = listResponse(technician);
export type TechnicianList = z.infer<typeof technicianList>;

export const userIdParams = z.object({ id: z.coerce.number().int().positive('A user id') });

export const userSorts = ['name', '-name', 'email', '-email', 'createdAt', '-createdAt', 'lastSignInAt', '-lastSignInAt'] as const;
export const userListQuery = listQuery(userSorts, 'name').extend({
  role: roleSchema.optional(),
  status: z.enum(userStatuses).optional(),
});
export type UserListQuery = z.input<typeof userListQuery>;
export const userList = listResponse(user);
export type UserList = z.infer<typeof userList>;

/** An administrator's change to a person; at least one field. */
export const userUpdate = z
  .object({
    name: personName.optional(),
    roles: roleList.optional(),
    active: z.boolean({ error: 'Active is true or false' }).optional(),
    siteIds: siteIdList.optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Change at least one field' });
export type UserUpdate = z.input<typeof userUpdate>;

export const invitationCreate = z
  .object({
    email: emailSchema,
    name: personName,
    roles: roleList,
    siteIds: siteIdList.default([]),
  })
  .strict()
  .superRefine((v, ctx) => {
    if (v.siteIds.length > 0 && !v.roles.includes('viewer')) {
      ctx.addIssue({ code: 'custom', path: ['siteIds'], message: 'Sites are granted to viewers only' });
    }
  });
export type InvitationCreate = z.input<typeof invitationCreate>;

export const auditEntry = z.object({
  id: z.number(),
  at: z.string(),
  actor: z.object({ id: z.number(), name: z.string(), email: z.string() }).nullable(),
  action: z.string(),
  targetType: z.string(),
  targetId: z.number().nullable(),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEntry = z.infer<typeof auditEntry>;

export const auditLogQuery = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  actorId: z.coerce.number().int().positive().optional(),
  targetType: z.string().trim().max(32).optional(),
  targetId: z.coerce.number().int().positive().optional(),
  action: z.string().trim().max(64).optional(),
});
export type AuditLogQuery = z.input<typeof auditLogQuery>;
export const auditLog = listResponse(auditEntry);
export type AuditLog = z.infer<typeof auditLog>;
