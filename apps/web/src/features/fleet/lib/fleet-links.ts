import { paths } from '../../../config/paths';

/**
 * Where fleet health links to: its own pages and the register's from config/paths; the work
 * orders' and flags' pages are written here until their entries join config/paths.
 */
export const fleetLinks = {
  fleet: paths.fleetHealth.getHref(),
  siteHealth: (siteId: number) => paths.siteHealthOf.getHref(siteId),
  siteRecord: (siteId: number) => paths.register.site.getHref(siteId),
  bank: (bankId: number) => paths.register.bank.getHref(bankId),
  step: (stepId: number) => paths.register.step.getHref(stepId),
  capacitorUnit: (unitId: number) => paths.register.unit.getHref(unitId),
  workOrder: (orderId: number) => `/work-orders/${orderId}`,
  /** The flag queue on one site's open flags, of one kind when given (the queue reads ?siteId= and ?kind=). */
  flagQueue: (siteId: number, kind?: string) => `/flags?${new URLSearchParams({ siteId: String(siteId), ...(kind ? { kind } : {}) }).toString()}`,
} as const;
