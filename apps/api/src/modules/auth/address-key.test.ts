import { describe, expect, test } from 'vitest';
import { addressKey } from './address-key';

describe('addressKey', () => {
  test('keeps IPv4 addresses, also when IPv4-mapped', () => {
    expect(addressKey('203.0.113.7')).toBe('203.0.113.7');
    expect(addressKey('::ffff:203.0.113.7')).toBe('203.0.113.7');
  });

  test('groups IPv6 addresses by their /64', () => {
    expect(addressKey('2001:db8:85a3:0042:1000:8a2e:0370:7334')).toBe('2001:db8:85a3:42::/64');
    expect(addressKey('2001:db8:85a3:42::1')).toBe('2001:db8:85a3:42::/64');
    expect(addressKey('2001:db8::1')).toBe('2001:db8:0:0::/64');
    expect(addressKey('::1')).toBe('0:0:0:0::/64');
  });

  test('an unknown address has one shared key', () => {
    expect(addressKey(undefined)).toBe('unknown');
    expect(addressKey(null)).toBe('unknown');
  });
});
