import { describe, expect, test } from 'vitest';
import { permissions, roles } from '@varden/schemas';
import { can, permissionsOf, policy } from './policy';

describe('access policy', () => {
  test('names every permission the contracts list', () => {
    expect(Object.keys(policy).sort()).toEqual([...permissions].sort());
  });

  test('public needs nobody signed in; signed-in needs any role', () => {
    expect(can(undefined, 'public')).toBe(true);
    expect(can(undefined, 'signed-in')).toBe(false);
    for (const role of roles) expect(can([role], 'signed-in')).toBe(true);
  });

  test('maps each role to what product.md gives it', () => {
    expect(permissionsOf(['admin'])).toEqual([
      'public', 'signed-in', 'users:manage', 'audit-log:read', 'settings:manage', 'register:read', 'register:write', 'work-orders:read', 'reports:read',
    ]);
    expect(permissionsOf(['planner'])).toEqual([
      'public', 'signed-in', 'register:read', 'register:write', 'plans:manage', 'work-orders:read', 'work-orders:schedule', 'reports:read',
    ]);
    expect(permissionsOf(['technician'])).toEqual(['public', 'signed-in', 'register:read', 'work-orders:read', 'work-orders:perform', 'reports:read']);
    expect(permissionsOf(['supervisor'])).toEqual(['public', 'signed-in', 'register:read', 'work-orders:read', 'work-orders:review', 'reports:read']);
    expect(permissionsOf(['viewer'])).toEqual(['public', 'signed-in', 'register:read', 'work-orders:read', 'reports:read']);
  });

  test('several roles hold the union of their permissions', () => {
    expect(can(['viewer', 'planner'], 'register:write')).toBe(true);
    expect(can(['technician', 'supervisor'], 'work-orders:review')).toBe(true);
    expect(can(['technician'], 'work-orders:review')).toBe(false);
  });
});
