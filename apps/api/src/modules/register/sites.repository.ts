import { and, count, eq, isNull, like, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { sites } from '../../db/schema/index';
import { offset, orderBy } from '../../db/versioned';
import { inScope, type SiteScope } from './scope-filter';

export type SiteRow = typeof sites.$inferSelect & { bankCount: number };

const sortable = { name: sites.name, voltageV: sites.voltageV, createdAt: sites.createdAt };

// Spelled out with table names: in a one-table query Drizzle leaves columns unqualified, and
// the correlated subquery would then compare banks with themselves.
const bankCount = sql<number>`(SELECT COUNT(*) FROM \`banks\` b WHERE b.\`site_id\` = \`sites\`.\`id\` AND b.\`retired_at\` IS NULL)`.mapWith(Number);

export async function listSites(
  db: Database,
  scope: SiteScope,
  q: { page: number; pageSize: number; sort: string; q?: string | undefined; includeRetired: boolean },
): Promise<{ rows: SiteRow[]; total: number }> {
  const where = and(
    inScope(scope, sites.id),
    q.includeRetired ? undefined : isNull(sites.retiredAt),
    q.q ? like(sites.name, `%${q.q.replace(/[\\%_]/g, '\\$&')}%`) : undefined,
  );
  const [rows, [totalRow]] = await Promise.all([
    db
      .select({ site: sites, bankCount })
      .from(sites)
      .where(where)
      .orderBy(orderBy(q.sort, sortable), sites.id)
      .limit(q.pageSize)
      .offset(offset(q.page, q.pageSize)),
    db.select({ n: count() }).from(sites).where(where),
  ]);
  return { rows: rows.map((r) => ({ ...r.site, bankCount: r.bankCount })), total: totalRow?.n ?? 0 };
}

export async function findSite(db: Database, id: number): Promise<SiteRow | undefined> {
  const [row] = await db.select({ site: sites, bankCount }).from(sites).where(eq(sites.id, id));
  return row ? { ...row.site, bankCount: row.bankCount } : undefined;
}

export async function insertSite(db: Database, values: typeof sites.$inferInsert): Promise<number> {
  const [created] = await db.insert(sites).values(values).$returningId();
  return created!.id;
}
