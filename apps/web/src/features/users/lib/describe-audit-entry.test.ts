import type { AuditEntry } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { describeAuditEntry } from './describe-audit-entry';

const entry = (action: string, details: Record<string, unknown>): AuditEntry => ({
  id: 1,
  at: '2026-12-03T09:15:00.000Z',
  actor: { id: 1, name: 'Odile Brannock', email: 'admin@demo.varden.test' },
  action,
  targetType: 'user',
  targetId: 9,
  details,
});

const sites = new Map([[4, 'Alder Quay Cold Store']]);
const siteName = (id: number) => sites.get(id);

describe('describeAuditEntry', () => {
  it('describes an invitation with the roles and sites it gave', () => {
    const invited = entry('user.invited', { email: 'roisin@example.test', name: 'Roisin Pellandry', roles: ['viewer'], siteIds: [4, 7] });
    expect(describeAuditEntry(invited, siteName)).toEqual({
      what: 'Invited',
      lines: ['Roisin Pellandry <roisin@example.test>', 'Roles: Viewer', 'Sites: Alder Quay Cold Store, site 7'],
    });
    expect(describeAuditEntry(entry('user.re-invited', { email: 'a@example.test', name: 'A', roles: ['planner'], siteIds: [] })).what).toBe(
      'Invited again',
    );
  });

  it('describes each part of a change from what it was to what it became', () => {
    const changed = entry('user.updated', {
      changes: {
        name: { from: 'Bex Ardalan', to: 'Bex Ardalan-Moor' },
        roles: { from: ['technician'], to: ['technician', 'supervisor'] },
        siteIds: { from: [], to: [4] },
        active: { from: true, to: false },
      },
    });
    expect(describeAuditEntry(changed, siteName)).toEqual({
      what: 'Changed access',
      lines: [
        'Name: Bex Ardalan → Bex Ardalan-Moor',
        'Roles: Technician → Technician, Supervisor',
        'Sites: none → Alder Quay Cold Store',
        'Sign-in: may sign in → deactivated',
      ],
    });
  });

  it('names the password events', () => {
    expect(describeAuditEntry(entry('user.invitation-accepted', {})).what).toBe('Accepted the invitation');
    expect(describeAuditEntry(entry('user.password-reset', {})).what).toBe('Set a new password');
    expect(describeAuditEntry(entry('user.password-changed', {})).what).toBe('Changed their password');
  });

  it('keeps the code and the raw details of an action it does not know', () => {
    expect(describeAuditEntry(entry('site.retired', { name: 'Brinmoor', banks: 1 }))).toEqual({
      what: 'site.retired',
      lines: ['name: Brinmoor', 'banks: 1'],
    });
  });
});
