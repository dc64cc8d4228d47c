import type { Executor } from './executor';
import { auditLog } from '../db/schema/index';

export interface AuditEvent {
  /** Null when the system acts (the demo seed, a job). */
  actorUserId: number | null;
  /** What happened, as area.verb, e.g. 'user.invited'. */
  action: string;
  targetType: string;
  targetId: number | null;
  details: Record<string, unknown>;
  at?: Date;
}

/**
 * Appends to the audit log. Pass the transaction that makes the change, so the change and its
 * record are written together or not at all.
 */
export async function recordAudit(db: Executor, event: AuditEvent): Promise<void> {
  await db.insert(auditLog).values({ ...event, at: event.at ?? new Date() });
}
