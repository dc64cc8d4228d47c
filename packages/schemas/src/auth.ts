import * as z from 'zod/mini';
import { emailSchema, user } from './users';

// Contracts for signing in, sessions, invitations and setting passwords.

/**
 * Every permission a route can declare. The API's access policy maps each to the roles that
 * hold it; /api/auth/me lists the signed-in user's, so the web can hide what they may not do.
 */
export const permissions = [
  'public',
  'signed-in',
  'users:manage',
  'audit-log:read',
  'settings:manage',
  'register:read',
  'register:write',
  'plans:manage',
  'work-orders:read',
  'work-orders:schedule',
  'work-orders:perform',
  'work-orders:review',
  'reports:read',
] as const;
export const permissionSchema = z.enum(permissions);
export type Permission = z.infer<typeof permissionSchema>;

/** NIST SP 800-63B: at least 12 characters, long passphrases welcome; counted in code points. */
export const passwordLength = { min: 12, max: 256 } as const;

const codePoints = (s: string) => [...s].length;

/** A new password. The server also refuses common, patterned and e-mail-equal passwords. */
export const newPassword = z.string({ error: 'Enter a password' }).check(
  z.refine((s) => codePoints(s) >= passwordLength.min, `Use at least ${passwordLength.min} characters`),
  z.refine((s) => codePoints(s) <= passwordLength.max, `Use at most ${passwordLength.max} characters`),
);

/** A password typed to prove who you are; never checked against the policy, only bounded. */
const presentedPassword = z
  .string({ error: 'Enter your password' })
  .check(z.minLength(1, 'Enter your password'), z.maxLength(1024, 'At most 1024 characters'));

export const signInRequest = z.strictObject({ email: emailSchema, password: presentedPassword });
export type SignInRequest = z.input<typeof signInRequest>;

export const sessionResponse = z.object({ user, permissions: z.array(permissionSchema) });
export type SessionResponse = z.infer<typeof sessionResponse>;

export const passwordResetRequest = z.strictObject({ email: emailSchema });
export type PasswordResetRequest = z.input<typeof passwordResetRequest>;

export const tokenPurposes = ['invitation', 'reset'] as const;
export type TokenPurpose = (typeof tokenPurposes)[number];

export const setPasswordRequest = z.strictObject({
  token: z.string({ error: 'The link is incomplete' }).check(z.minLength(20, 'The link is incomplete'), z.maxLength(200, 'The link is not valid')),
  password: newPassword,
});
export type SetPasswordRequest = z.input<typeof setPasswordRequest>;
export const setPasswordResponse = z.object({ email: z.string(), purpose: z.enum(tokenPurposes) });
export type SetPasswordResponse = z.infer<typeof setPasswordResponse>;

export const changePasswordRequest = z.strictObject({ currentPassword: presentedPassword, newPassword });
export type ChangePasswordRequest = z.input<typeof changePasswordRequest>;

export const messageResponse = z.object({ message: z.string() });
export type MessageResponse = z.infer<typeof messageResponse>;
