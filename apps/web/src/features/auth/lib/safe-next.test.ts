import { describe, expect, it } from 'vitest';
import { safeNext } from './safe-next';

describe('safeNext', () => {
  it('keeps a path inside the app with its search and hash', () => {
    expect(safeNext('/people?page=2&sort=-name')).toBe('/people?page=2&sort=-name');
    expect(safeNext('/people/12#sign-in')).toBe('/people/12#sign-in');
  });

  it('refuses anything that would leave the app', () => {
    for (const next of ['https://evil.example/', '//evil.example/x', '/\\evil.example', '/\t/evil.example', 'javascript:alert(1)', 'people']) {
      expect(safeNext(next), next).toBeUndefined();
    }
  });

  it('drops a missing next, the root and the entry pages, which would only loop back', () => {
    for (const next of [null, undefined, '', '/', '/sign-in?next=%2F', '/reset-password', '/set-password?token=x']) {
      expect(safeNext(next), String(next)).toBeUndefined();
    }
  });

  it('normalises dot segments instead of trusting them', () => {
    expect(safeNext('/people/../audit-log')).toBe('/audit-log');
  });
});
