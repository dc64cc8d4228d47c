import { healthReport, type HealthReport } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';

export { serviceNames, type HealthReport, type ServiceName } from '@varden/schemas';

/** Reads a health report with the shared contract; throws when the body is something else. */
export function parseHealthReport(json: unknown): HealthReport {
  return healthReport.parse(json);
}

/** GET /api/health. A 503 carries the same report with the failing service down: it is data. */
export function getHealth(signal?: AbortSignal): Promise<HealthReport> {
  return apiRequest('/api/health', { parse: parseHealthReport, acceptStatuses: [503], ...(signal ? { signal } : {}) });
}
