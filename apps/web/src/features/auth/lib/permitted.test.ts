import type { Permission } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { hasPermission, type SessionResponse } from '../api/session-queries';
import { permitted } from './permitted';

const signedIn = (permissions: Permission[]): SessionResponse => ({
  user: {
    id: 7,
    email: 'aino@example.test',
    name: 'Aino Tervala',
    active: true,
    status: 'active',
    roles: ['technician'],
    siteIds: [],
    createdAt: '2026-12-01T08:00:00.000Z',
    lastSignInAt: null,
  },
  permissions,
});

const sections = [
  { label: 'Today’s orders', href: '/today', permission: 'work-orders:perform' as const },
  { label: 'People', href: '/people', permission: 'users:manage' as const },
  { label: 'Your account', href: '/account' },
];

describe('hasPermission', () => {
  it('answers from the permissions /api/auth/me sent', () => {
    const me = signedIn(['public', 'signed-in', 'work-orders:perform']);
    expect(hasPermission(me, 'work-orders:perform')).toBe(true);
    expect(hasPermission(me, 'users:manage')).toBe(false);
  });

  it('gives nothing but public to someone signed out', () => {
    expect(hasPermission(null, 'signed-in')).toBe(false);
    expect(hasPermission(undefined, 'register:read')).toBe(false);
    expect(hasPermission(null, 'public')).toBe(true);
  });
});

describe('permitted', () => {
  it('keeps the entries whose permission the person holds, and those that need none', () => {
    const me = signedIn(['public', 'signed-in', 'work-orders:perform']);
    expect(permitted(sections, me).map((s) => s.label)).toEqual(['Today’s orders', 'Your account']);
  });

  it('hides every entry from someone signed out', () => {
    expect(permitted(sections, null)).toEqual([]);
  });
});
