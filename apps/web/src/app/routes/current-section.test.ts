import { describe, expect, test } from 'vitest';
import { currentSection } from './current-section';

const sections = [
  { label: 'Site health', href: '/site-health' },
  { label: 'Fleet health', href: '/fleet', alsoOn: ['/sites/:siteId/health'] },
  { label: 'Register', href: '/sites' },
  { label: 'Work orders', href: '/work-orders?state=queued,dispatched' },
];
const at = (pathname: string) => currentSection(sections, pathname)?.label;

describe('currentSection', () => {
  test('a site’s health belongs to fleet health, not to the register it lives under', () => {
    expect(at('/sites/12/health')).toBe('Fleet health');
    expect(at('/sites/12')).toBe('Register');
    expect(at('/sites/12/banks')).toBe('Register');
    expect(at('/sites')).toBe('Register');
  });

  test('whole segments only: /site-health is not the register’s /sites', () => {
    expect(at('/site-health')).toBe('Site health');
    expect(at('/work-orders/7')).toBe('Work orders');
    expect(at('/work-orders-archive')).toBeUndefined();
    expect(at('/people')).toBeUndefined();
  });

  test('a section whose address carries a default filter still owns its pages', () => {
    expect(at('/work-orders')).toBe('Work orders');
    expect(at('/work-orders/7')).toBe('Work orders');
  });
});
