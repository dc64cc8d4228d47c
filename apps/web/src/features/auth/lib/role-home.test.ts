import { roles } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { homeFor, homePrecedence, roleHomes } from './role-home';

describe('homeFor', () => {
  it('sends each role to its own home', () => {
    expect(homeFor(['planner'])).toBe('/planning');
    expect(homeFor(['technician'])).toBe('/today');
    expect(homeFor(['supervisor'])).toBe('/review');
    expect(homeFor(['viewer'])).toBe('/site-health');
    expect(homeFor(['admin'])).toBe('/people');
  });

  it('gives every role a home of its own, and ranks every role', () => {
    expect(new Set(Object.values(roleHomes)).size).toBe(roles.length);
    expect([...homePrecedence].sort()).toEqual([...roles].sort());
  });

  it('puts the maintenance work before administration and the viewer last, whatever the order given', () => {
    expect(homeFor(['admin', 'planner'])).toBe('/planning');
    expect(homeFor(['technician', 'supervisor'])).toBe('/review');
    expect(homeFor(['viewer', 'technician'])).toBe('/today');
    expect(homeFor(['viewer', 'admin'])).toBe('/people');
  });

  it('sends someone without a role to their account page', () => {
    expect(homeFor([])).toBe('/account');
  });
});
