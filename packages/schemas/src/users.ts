import * as z from 'zod/mini';
import { listResponse } from './common';

// Contracts for people: roles, a user as the API shows them (also in every session) and the
// technicians a planner assigns. The administration's own contracts are in user-admin.ts.

export const roles = ['admin', 'planner', 'technician', 'supervisor', 'viewer'] as const;
export const roleSchema = z.enum(roles, { error: 'Choose admin, planner, technician, supervisor or viewer' });
export type Role = z.infer<typeof roleSchema>;

/** invited: has not set a password yet; active: may sign in; deactivated: may no longer sign in. */
export const userStatuses = ['invited', 'active', 'deactivated'] as const;
export type UserStatus = (typeof userStatuses)[number];

/** E-mail addresses are compared and stored in lower case. */
export const emailSchema = z.pipe(
  z.string({ error: 'Enter an e-mail address' }).check(z.trim(), z.toLowerCase(), z.maxLength(254, 'At most 254 characters')),
  z.email({ error: 'Enter an e-mail address such as name@example.com' }),
);

export const personName = z
  .string({ error: 'Enter a name' })
  .check(z.trim(), z.minLength(1, 'Enter a name'), z.maxLength(200, 'At most 200 characters'));

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
  lastSignInAt: z.nullable(z.string()),
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
