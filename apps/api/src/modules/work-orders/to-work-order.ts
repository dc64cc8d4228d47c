import type { ChecklistItem, WorkOrder } from '@varden/schemas';
import { isOverdue } from './calendar';
import type { WorkOrderView } from './work-orders.repository';

/** MariaDB hands JSON columns back as text; this gives callers the value either way. */
export function fromJson<T>(value: T | string): T {
  return typeof value === 'string' ? (JSON.parse(value) as T) : value;
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toWorkOrder(view: WorkOrderView, now: Date = new Date()): WorkOrder {
  const o = view.order;
  return {
    id: o.id,
    kind: o.kind,
    siteId: o.siteId,
    siteName: view.siteName,
    bankId: o.bankId,
    bankName: view.bankName,
    planId: o.planId,
    flagId: o.flagId,
    title: o.title,
    instructions: o.instructions,
    checklist: fromJson<ChecklistItem[]>(o.checklist as ChecklistItem[] | string),
    dueOn: o.dueOn,
    priority: o.priority,
    assigneeId: o.assigneeId,
    assigneeName: view.assigneeName,
    state: o.state,
    returnReason: view.returnReason ?? null,
    locked: o.locked,
    overdue: isOverdue(o, view.siteTimeZone, now),
    safetyAcknowledgedAt: iso(o.safetyAcknowledgedAt),
    submittedAt: iso(o.submittedAt),
    signedAt: iso(o.signedAt),
    signedByName: o.signedByName,
    signatureMeaning: o.signatureMeaning,
    version: o.version,
    createdAt: o.createdAt.toISOString(),
  };
}
