import type { AuditLog, auditLogQuery } from '@varden/schemas';
import type { z } from 'zod';
import type { Database } from '../../db/client';
import { listAuditRows } from './audit-log.repository';

export async function listAuditLog(db: Database, query: z.output<typeof auditLogQuery>): Promise<AuditLog> {
  const { rows, total } = await listAuditRows(db, query);
  return {
    items: rows.map(({ entry, actorName, actorEmail }) => ({
      id: entry.id,
      at: entry.at.toISOString(),
      actor: entry.actorUserId !== null && actorName !== null && actorEmail !== null ? { id: entry.actorUserId, name: actorName, email: actorEmail } : null,
      action: entry.action,
      targetType: entry.targetType,
      targetId: entry.targetId,
      details: entry.details,
    })),
    total,
  };
}
