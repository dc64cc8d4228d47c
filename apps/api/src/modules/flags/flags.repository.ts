import { and, asc, count, desc, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../access/executor';
import type { SiteScope } from '../../access/site-scope';
import type { Database } from '../../db/client';
import { banks, flags, type flagKinds, readings, sites } from '../../db/schema/index';
import { offset } from '../../db/versioned';
import { inScope } from '../register/scope-filter';

export type FlagRow = typeof flags.$inferSelect;
export type FlagKind = (typeof flagKinds)[number];
export interface FlagView {
  flag: FlagRow;
  siteName: string;
  siteTimeZone: string;
  bankName: string;
}

const viewFrom = (db: Executor) =>
  db
    .select({ flag: flags, siteName: sites.name, siteTimeZone: sites.timeZone, bankName: banks.name })
    .from(flags)
    .innerJoin(sites, eq(sites.id, flags.siteId))
    .innerJoin(banks, eq(banks.id, flags.bankId));

export interface FlagFilter {
  scope: SiteScope;
  state?: FlagRow['state'] | undefined;
  siteId?: number | undefined;
  bankId?: number | undefined;
  kind?: string | undefined;
  severity?: FlagRow['severity'] | undefined;
}

// Severity sorts action before advisory when descending: the enum's order is advisory, action.
const sorts = {
  raisedAt: [asc(flags.raisedAt), asc(flags.id)],
  '-raisedAt': [desc(flags.raisedAt), desc(flags.id)],
  severity: [asc(flags.severity), desc(flags.raisedAt), desc(flags.id)],
  '-severity': [desc(flags.severity), desc(flags.raisedAt), desc(flags.id)],
} as const;

export async function listFlagViews(
  db: Database,
  f: FlagFilter,
  page: { sort: keyof typeof sorts; page: number; pageSize: number },
): Promise<{ rows: FlagView[]; total: number }> {
  const where = and(
    inScope(f.scope, flags.siteId),
    f.state ? eq(flags.state, f.state) : undefined,
    f.siteId ? eq(flags.siteId, f.siteId) : undefined,
    f.bankId ? eq(flags.bankId, f.bankId) : undefined,
    f.kind ? sql`${flags.kind} = ${f.kind}` : undefined,
    f.severity ? eq(flags.severity, f.severity) : undefined,
  );
  const [rows, [total]] = await Promise.all([
    viewFrom(db)
      .where(where)
      .orderBy(...sorts[page.sort])
      .limit(page.pageSize)
      .offset(offset(page.page, page.pageSize)),
    db.select({ n: count() }).from(flags).where(where),
  ]);
  return { rows, total: total?.n ?? 0 };
}

export async function findFlagView(db: Executor, id: number): Promise<FlagView | undefined> {
  const [row] = await viewFrom(db).where(eq(flags.id, id));
  return row;
}

/** The flag's row locked for this transaction, so two planners cannot both take it in hand. */
export async function lockFlag(db: Executor, id: number): Promise<FlagRow | undefined> {
  const [row] = await db.select().from(flags).where(eq(flags.id, id)).for('update');
  return row;
}

export async function markInHand(db: Executor, id: number, correctiveOrderId: number): Promise<void> {
  await db.update(flags).set({ state: 'in-hand', correctiveOrderId }).where(eq(flags.id, id));
}

/** The order whose reading raised the flag, for links. */
export async function orderOfReading(db: Executor, readingId: number): Promise<number | undefined> {
  const [row] = await db.select({ workOrderId: readings.workOrderId }).from(readings).where(eq(readings.id, readingId));
  return row?.workOrderId;
}
