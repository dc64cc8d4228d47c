import type { workOrderListQuery } from '@varden/schemas';
import Papa from 'papaparse';
import type { z } from 'zod';
import type { SessionUser } from '../../access/current-user';
import type { AppContext } from '../../context';
import { toWorkOrder } from './to-work-order';
import { allOrderViews } from './work-orders.repository';
import { filterOf } from './work-orders.service';

/** An export holds at most this many orders; narrow the filters for more. */
export const exportRowLimit = 10_000;

const columns = [
  'id',
  'kind',
  'site',
  'bank',
  'title',
  'dueOn',
  'priority',
  'state',
  'overdue',
  'assignee',
  'submittedAt',
  'signedAt',
  'signedBy',
  'createdAt',
] as const;

/**
 * The orders a list with these filters shows, all pages, as CSV. Cells that a spreadsheet
 * would run as a formula are quoted with a leading apostrophe (papaparse's escapeFormulae).
 */
export async function exportWorkOrdersCsv(ctx: AppContext, user: SessionUser, q: z.output<typeof workOrderListQuery>): Promise<string> {
  const views = await allOrderViews(ctx.db, filterOf(user, q), q.sort, exportRowLimit);
  const now = new Date();
  const data = views.map((v) => {
    const o = toWorkOrder(v, now);
    return [
      o.id,
      o.kind,
      o.siteName,
      o.bankName,
      o.title,
      o.dueOn,
      o.priority,
      o.state,
      o.overdue ? 'yes' : 'no',
      o.assigneeName ?? '',
      o.submittedAt ?? '',
      o.signedAt ?? '',
      o.signedByName ?? '',
      o.createdAt,
    ];
  });
  return Papa.unparse({ fields: [...columns], data }, { escapeFormulae: true, newline: '\r\n' });
}
