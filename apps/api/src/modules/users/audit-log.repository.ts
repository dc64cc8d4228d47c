import { and, count, desc, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { auditLog, users } from '../../db/schema/index';
import { offset } from '../../db/versioned';

export interface AuditFilter {
  page: number;
  pageSize: number;
  actorId?: number | undefined;
  targetType?: string | undefined;
  targetId?: number | undefined;
  action?: string | undefined;
}

/** Newest first, with the actor's name and e-mail. */
export async function listAuditRows(db: Database, f: AuditFilter) {
  const where = and(
    f.actorId ? eq(auditLog.actorUserId, f.actorId) : undefined,
    f.targetType ? eq(auditLog.targetType, f.targetType) : undefined,
    f.targetId ? eq(auditLog.targetId, f.targetId) : undefined,
    f.action ? eq(auditLog.action, f.action) : undefined,
  );
  const [rows, [totalRow]] = await Promise.all([
    db
      .select({ entry: auditLog, actorName: users.name, actorEmail: users.email })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorUserId))
      .where(where)
      .orderBy(desc(auditLog.at), desc(auditLog.id))
      .limit(f.pageSize)
      .offset(offset(f.page, f.pageSize)),
    db.select({ n: count() }).from(auditLog).where(where),
  ]);
  return { rows, total: totalRow?.n ?? 0 };
}
