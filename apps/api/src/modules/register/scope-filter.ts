import { inArray, sql, type SQL } from 'drizzle-orm';
import type { MySqlColumn } from 'drizzle-orm/mysql-core';
import { AppError } from '../../http/app-error';

import type { SiteScope } from '../../access/site-scope';

export type { SiteScope };

/** A WHERE fragment limiting rows to the scope (always true for 'all', false for no grants). */
export function inScope(scope: SiteScope, siteColumn: MySqlColumn): SQL {
  if (scope === 'all') return sql`1 = 1`;
  if (scope.length === 0) return sql`1 = 0`;
  return inArray(siteColumn, [...scope]);
}

/** Out-of-scope records answer exactly like missing ones, so a viewer learns nothing of others' sites. */
export function assertInScope(scope: SiteScope, siteId: number, what: string, id: number): void {
  if (scope !== 'all' && !scope.includes(siteId)) throw new AppError('not_found', `${what} ${id} does not exist.`);
}
