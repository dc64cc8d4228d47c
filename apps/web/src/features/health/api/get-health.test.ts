import { describe, expect, it } from 'vitest';
import { parseHealthReport } from './get-health';

const report = {
  status: 'down',
  services: {
    database: { status: 'up', latencyMs: 2 },
    storage: { status: 'up', latencyMs: 5 },
    mail: { status: 'down', latencyMs: 1500, detail: 'connect ECONNREFUSED' },
  },
  version: '0.1.0',
  time: '2026-12-01T10:00:00.000Z',
};

describe('parseHealthReport', () => {
  it('reads the report the API sends, 200 or 503 alike', () => {
    expect(parseHealthReport(report)).toEqual(report);
  });

  it('refuses a body that is not a health report', () => {
    expect(() => parseHealthReport({ ...report, status: 'degraded' })).toThrow();
    expect(() => parseHealthReport({ ...report, services: { database: report.services.database } })).toThrow();
    expect(() => parseHealthReport('<!doctype html>')).toThrow();
  });
});
