import * as z from 'zod/mini';

export const serviceNames = ['database', 'storage', 'mail'] as const;
export const serviceStatus = z.enum(['up', 'down']);
export const serviceReport = z.object({ status: serviceStatus, latencyMs: z.number(), detail: z.optional(z.string()) });

/** GET /api/health: 200 when every service answers, 503 with the same body when one does not. */
export const healthReport = z.object({
  status: serviceStatus,
  services: z.object({ database: serviceReport, storage: serviceReport, mail: serviceReport }),
  version: z.string(),
  time: z.string(),
});
export type HealthReport = z.infer<typeof healthReport>;
export type ServiceReport = z.infer<typeof serviceReport>;
export type ServiceName = (typeof serviceNames)[number];
