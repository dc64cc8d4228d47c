import type { Bank, bankCreate, bankListQuery, bankUpdate } from '@varden/schemas';
import { and, count, eq, isNull, like, sql } from 'drizzle-orm';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { banks, sites } from '../../db/schema/index';
import { deleteUnreferenced, isDuplicateKey, offset, orderBy, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { assertInScope, inScope, type SiteScope } from './scope-filter';

const stepCount = sql<number>`(SELECT COUNT(*) FROM \`steps\` s WHERE s.\`bank_id\` = \`banks\`.\`id\` AND s.\`retired_at\` IS NULL)`.mapWith(Number);
const columns = { bank: banks, siteName: sites.name, stepCount };
type BankRow = { bank: typeof banks.$inferSelect; siteName: string; stepCount: number };

function toBank({ bank, siteName, stepCount }: BankRow): Bank {
  return {
    id: bank.id,
    siteId: bank.siteId,
    siteName,
    name: bank.name,
    location: bank.location,
    controllerTargetPf: bank.controllerTargetPf,
    detuned: bank.detuned,
    detuningFactor: bank.detuningFactor,
    commissionedOn: bank.commissionedOn,
    stepCount,
    retiredAt: bank.retiredAt ? bank.retiredAt.toISOString() : null,
    version: bank.version,
  };
}

export async function listBanks(db: Database, scope: SiteScope, q: z.output<typeof bankListQuery>) {
  const where = and(
    inScope(scope, banks.siteId),
    isNull(banks.retiredAt),
    q.siteId ? eq(banks.siteId, q.siteId) : undefined,
    q.q ? like(banks.name, `%${q.q.replace(/[\\%_]/g, '\\$&')}%`) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    db
      .select(columns)
      .from(banks)
      .innerJoin(sites, eq(sites.id, banks.siteId))
      .where(where)
      .orderBy(orderBy(q.sort, { name: banks.name, createdAt: banks.createdAt }), banks.id)
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db.select({ n: count() }).from(banks).where(where),
  ]);
  return { items: rows.map(toBank), total: total?.n ?? 0 };
}

export async function getBank(db: Database, scope: SiteScope, id: number): Promise<Bank> {
  const [row] = await db.select(columns).from(banks).innerJoin(sites, eq(sites.id, banks.siteId)).where(eq(banks.id, id));
  if (!row) throw new AppError('not_found', `Bank ${id} does not exist.`);
  assertInScope(scope, row.bank.siteId, 'Bank', id);
  return toBank(row);
}

const duplicate = (name: string | undefined) =>
  new AppError('conflict', `This site already has a bank named “${name ?? ''}”.`, { name: 'Another bank of this site has this name' });

export async function createBank(db: Database, input: z.output<typeof bankCreate>): Promise<Bank> {
  const [site] = await db.select({ id: sites.id }).from(sites).where(eq(sites.id, input.siteId));
  if (!site) throw new AppError('invalid', `Site ${input.siteId} does not exist.`, { siteId: 'No such site' });
  try {
    const [created] = await db.insert(banks).values(input).$returningId();
    return getBank(db, 'all', created!.id);
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicate(input.name);
    throw error;
  }
}

export async function updateBank(db: Database, id: number, input: z.output<typeof bankUpdate>): Promise<Bank> {
  const { version, retired, ...values } = input;
  if (values.detuned === false) values.detuningFactor = null;
  try {
    await updateVersioned(db, banks, id, version, { ...values, ...(retired === undefined ? {} : { retiredAt: retired ? new Date() : null }) }, 'Bank');
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicate(values.name);
    throw error;
  }
  return getBank(db, 'all', id);
}

export async function deleteBank(db: Database, id: number): Promise<void> {
  await deleteUnreferenced(db, banks, id, 'Bank', 'Retire it instead: it stays in the records but leaves the lists.');
}

/** The site a bank belongs to, for scope checks on its children. */
export async function siteOfBank(db: Database, bankId: number): Promise<number | undefined> {
  const [row] = await db.select({ siteId: banks.siteId }).from(banks).where(eq(banks.id, bankId));
  return row?.siteId;
}
