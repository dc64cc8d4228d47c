import type { Site, siteCreate, siteListQuery, siteUpdate } from '@varden/schemas';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { sites } from '../../db/schema/index';
import { deleteUnreferenced, isDuplicateKey, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { findSite, insertSite, listSites, type SiteRow } from './sites.repository';
import { assertInScope, type SiteScope } from './scope-filter';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toSite(row: SiteRow): Site {
  return {
    id: row.id,
    name: row.name,
    address: row.address,
    voltageV: row.voltageV,
    frequencyHz: row.frequencyHz as 50 | 60,
    transformerKva: row.transformerKva,
    transformerImpedancePct: row.transformerImpedancePct,
    utilityShortCircuitKva: row.utilityShortCircuitKva,
    targetPf: row.targetPf,
    tariffBasis: row.tariffBasis,
    tariffLimit: row.tariffLimit,
    pricePerKvarh: row.pricePerKvarh,
    currency: row.currency,
    timeZone: row.timeZone,
    plannedLoadKw: row.plannedLoadKw,
    plannedLoadPf: row.plannedLoadPf,
    bankCount: row.bankCount,
    retiredAt: iso(row.retiredAt),
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

export async function listSitesFor(db: Database, scope: SiteScope, query: z.output<typeof siteListQuery>) {
  const { rows, total } = await listSites(db, scope, { ...query, includeRetired: query.includeRetired === 'true' });
  return { items: rows.map(toSite), total };
}

export async function getSite(db: Database, scope: SiteScope, id: number): Promise<Site> {
  const row = await findSite(db, id);
  if (!row) throw new AppError('not_found', `Site ${id} does not exist.`);
  assertInScope(scope, row.id, 'Site', id);
  return toSite(row);
}

const duplicateName = (name: string | undefined) =>
  new AppError('conflict', `A site named “${name ?? ''}” already exists.`, { name: 'Another site has this name' });

export async function createSite(db: Database, input: z.output<typeof siteCreate>): Promise<Site> {
  try {
    const id = await insertSite(db, input);
    return getSite(db, 'all', id);
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicateName(input.name);
    throw error;
  }
}

export async function updateSite(db: Database, id: number, input: z.output<typeof siteUpdate>): Promise<Site> {
  const { version, retired, ...values } = input;
  try {
    await updateVersioned(db, sites, id, version, { ...values, ...(retired === undefined ? {} : { retiredAt: retired ? new Date() : null }) }, 'Site');
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicateName(values.name);
    throw error;
  }
  return getSite(db, 'all', id);
}

export async function deleteSite(db: Database, id: number): Promise<void> {
  await deleteUnreferenced(db, sites, id, 'Site', 'Retire it instead: it stays in the records but leaves the lists.');
}
