import { userListQuery } from '@varden/schemas';
import type { z } from 'zod';
import { readListSearch, writeListSearch } from '../../../lib/server-table';

/** The people table's state as the URL holds it and GET /api/users takes it. */
export type PeopleSearch = z.output<typeof userListQuery>;

const keys = ['page', 'pageSize', 'sort', 'q', 'role', 'status'] as const;
export const peopleSearchDefaults = { page: 1, pageSize: 25, sort: 'name' } as const satisfies Partial<PeopleSearch>;

export function readPeopleSearch(params: URLSearchParams): PeopleSearch {
  return readListSearch(userListQuery, params, keys);
}

export function writePeopleSearch(search: PeopleSearch): URLSearchParams {
  return writeListSearch(search, peopleSearchDefaults);
}
