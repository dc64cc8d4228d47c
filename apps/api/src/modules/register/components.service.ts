import { contactorCreate, contactorUpdate, fuseSetCreate, fuseSetUpdate, reactorCreate, reactorUpdate, type componentListQuery } from '@varden/schemas';
import { and, count, eq, isNull } from 'drizzle-orm';
import type { MySqlColumn, MySqlTable } from 'drizzle-orm/mysql-core';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { banks, contactors, fuseSets, reactors, steps } from '../../db/schema/index';
import { deleteUnreferenced, offset, orderBy, updateVersioned } from '../../db/versioned';
import { AppError } from '../../http/app-error';
import { findStepWithSite } from './steps.service';
import { assertInScope, inScope, type SiteScope } from './scope-filter';

type ComponentTable = MySqlTable & { id: MySqlColumn; stepId: MySqlColumn; version: MySqlColumn; removedOn: MySqlColumn };

/**
 * Contactors, detuning reactors and fuse sets share one shape: they belong to a step, can be
 * removed from service with a date, and carry a version. One definition serves all three.
 */
export interface ComponentKind<C extends z.ZodType, U extends z.ZodType> {
  table: ComponentTable;
  label: string;
  create: C;
  update: U;
}

export const componentKinds = {
  contactors: { table: contactors, label: 'Contactor', create: contactorCreate, update: contactorUpdate },
  reactors: { table: reactors, label: 'Detuning reactor', create: reactorCreate, update: reactorUpdate },
  'fuse-sets': { table: fuseSets, label: 'Fuse set', create: fuseSetCreate, update: fuseSetUpdate },
} as const;
export type ComponentKindName = keyof typeof componentKinds;

function serialise(row: Record<string, unknown>) {
  const { createdAt: _c, updatedAt: _u, ...rest } = row;
  return rest;
}

export async function listComponents(db: Database, kind: ComponentKindName, scope: SiteScope, q: z.output<typeof componentListQuery>) {
  const { table } = componentKinds[kind];
  const where = and(
    inScope(scope, banks.siteId),
    isNull(table.removedOn),
    q.stepId ? eq(table.stepId, q.stepId) : undefined,
    q.bankId ? eq(steps.bankId, q.bankId) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    db
      .select({ row: table })
      .from(table)
      .innerJoin(steps, eq(steps.id, table.stepId))
      .innerJoin(banks, eq(banks.id, steps.bankId))
      .where(where)
      .orderBy(orderBy(q.sort, { id: table.id }))
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db.select({ n: count() }).from(table).innerJoin(steps, eq(steps.id, table.stepId)).innerJoin(banks, eq(banks.id, steps.bankId)).where(where),
  ]);
  return { items: rows.map((r) => serialise(r.row as Record<string, unknown>)), total: total?.n ?? 0 };
}

export async function getComponent(db: Database, kind: ComponentKindName, scope: SiteScope, id: number) {
  const { table, label } = componentKinds[kind];
  const [found] = await db
    .select({ row: table, siteId: banks.siteId })
    .from(table)
    .innerJoin(steps, eq(steps.id, table.stepId))
    .innerJoin(banks, eq(banks.id, steps.bankId))
    .where(eq(table.id, id));
  if (!found) throw new AppError('not_found', `${label} ${id} does not exist.`);
  assertInScope(scope, found.siteId, label, id);
  return serialise(found.row as Record<string, unknown>);
}

export async function createComponent(db: Database, kind: ComponentKindName, input: { stepId: number } & Record<string, unknown>) {
  const { table } = componentKinds[kind];
  if (!(await findStepWithSite(db, input.stepId))) throw new AppError('invalid', `Step ${input.stepId} does not exist.`, { stepId: 'No such step' });
  const [created] = await db.insert(table).values(input as never).$returningId();
  return getComponent(db, kind, 'all', (created as { id: number }).id);
}

export async function updateComponent(db: Database, kind: ComponentKindName, id: number, input: { version: number } & Record<string, unknown>) {
  const { table, label } = componentKinds[kind];
  const { version, ...values } = input;
  await updateVersioned(db, table as never, id, version, values, label);
  return getComponent(db, kind, 'all', id);
}

export async function deleteComponent(db: Database, kind: ComponentKindName, id: number) {
  const { table, label } = componentKinds[kind];
  await deleteUnreferenced(db, table as never, id, label, 'Set its removal date instead.');
}
