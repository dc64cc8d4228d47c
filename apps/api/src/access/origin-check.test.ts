import { describe, expect, test } from 'vitest';
import { requestOrigin } from './origin-check';

describe('requestOrigin', () => {
  test('prefers Origin', () => {
    expect(requestOrigin('https://a.test', 'https://b.test/page')).toBe('https://a.test');
  });
  test('falls back to the origin of Referer', () => {
    expect(requestOrigin(undefined, 'https://b.test:8443/x/y?z=1')).toBe('https://b.test:8443');
  });
  test('is undefined when neither is usable', () => {
    expect(requestOrigin(undefined, undefined)).toBeUndefined();
    expect(requestOrigin(undefined, 'not a url')).toBeUndefined();
  });
});
