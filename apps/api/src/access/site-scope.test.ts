import { describe, expect, test } from 'vitest';
import { siteScope } from './site-scope';

describe('siteScope', () => {
  test('a viewer reads only the granted sites', () => {
    expect(siteScope({ roles: ['viewer'], siteIds: [3, 7] })).toEqual([3, 7]);
    expect(siteScope({ roles: ['viewer'], siteIds: [] })).toEqual([]);
  });

  test('every other role reads all sites, also when combined with viewer', () => {
    for (const role of ['admin', 'planner', 'technician', 'supervisor'] as const) {
      expect(siteScope({ roles: [role], siteIds: [] })).toBe('all');
      expect(siteScope({ roles: ['viewer', role], siteIds: [1] })).toBe('all');
    }
  });

  test('no roles reads nothing', () => {
    expect(siteScope({ roles: [], siteIds: [] })).toEqual([]);
  });
});
