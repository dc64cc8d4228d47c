import type { Step, stepCreate, stepListQuery, stepUpdate } from '@varden/schemas';
import { and, count, eq, isNull } from 'drizzle-orm';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { banks, steps } from '../../db/schema/index';
import { deleteUnreferenced, isDuplicateKey, offset, orderBy, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { assertInScope, inScope, type SiteScope } from './scope-filter';

function toStep(row: typeof steps.$inferSelect): Step {
  return {
    id: row.id,
    bankId: row.bankId,
    number: row.number,
    ratedKvar: row.ratedKvar,
    retiredAt: row.retiredAt ? row.retiredAt.toISOString() : null,
    version: row.version,
  };
}

export async function listSteps(db: Database, scope: SiteScope, q: z.output<typeof stepListQuery>) {
  const where = and(inScope(scope, banks.siteId), isNull(steps.retiredAt), q.bankId ? eq(steps.bankId, q.bankId) : undefined);
  const [rows, [total]] = await Promise.all([
    db
      .select({ step: steps })
      .from(steps)
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(where)
      .orderBy(orderBy(q.sort, { number: steps.number }), steps.id)
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db.select({ n: count() }).from(steps).innerJoin(banks, eq(banks.id, steps.bankId)).where(where),
  ]);
  return { items: rows.map((r) => toStep(r.step)), total: total?.n ?? 0 };
}

export async function findStepWithSite(db: Database, id: number) {
  const [row] = await db.select({ step: steps, siteId: banks.siteId }).from(steps).innerJoin(banks, eq(banks.id, steps.bankId)).where(eq(steps.id, id));
  return row;
}

export async function getStep(db: Database, scope: SiteScope, id: number): Promise<Step> {
  const row = await findStepWithSite(db, id);
  if (!row) throw new AppError('not_found', `Step ${id} does not exist.`);
  assertInScope(scope, row.siteId, 'Step', id);
  return toStep(row.step);
}

const duplicate = (n: number | undefined) =>
  new AppError('conflict', `This bank already has a step number ${n ?? ''}.`, { number: 'Another step of this bank has this number' });

export async function createStep(db: Database, input: z.output<typeof stepCreate>): Promise<Step> {
  const [bank] = await db.select({ id: banks.id }).from(banks).where(eq(banks.id, input.bankId));
  if (!bank) throw new AppError('invalid', `Bank ${input.bankId} does not exist.`, { bankId: 'No such bank' });
  try {
    const [created] = await db.insert(steps).values(input).$returningId();
    return getStep(db, 'all', created!.id);
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicate(input.number);
    throw error;
  }
}

export async function updateStep(db: Database, id: number, input: z.output<typeof stepUpdate>): Promise<Step> {
  const { version, retired, ...values } = input;
  try {
    await updateVersioned(db, steps, id, version, { ...values, ...(retired === undefined ? {} : { retiredAt: retired ? new Date() : null }) }, 'Step');
  } catch (error) {
    if (isDuplicateKey(error)) throw duplicate(values.number);
    throw error;
  }
  return getStep(db, 'all', id);
}

export async function deleteStep(db: Database, id: number): Promise<void> {
  await deleteUnreferenced(db, steps, id, 'Step', 'Retire it instead: it stays in the records but leaves the lists.');
}
