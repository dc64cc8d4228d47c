import { useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { ListParams } from '../api/list-params';

/** Page sizes a table offers; the API allows up to 200. */
export const pageSizes = [10, 25, 50, 100] as const;

export type ListSearchOptions<S extends string> = {
  /** Keeps two tables on one page apart in the URL: "banks." gives banks.page, banks.sort … */
  prefix?: string;
  sorts: readonly S[];
  defaultSort: S;
  defaultPageSize?: number;
};

function positiveInteger(raw: string | null): number | undefined {
  if (raw === null) return undefined;
  const value = Number(raw);
  return Number.isInteger(value) && value >= 1 ? value : undefined;
}

/** A table's paging, sorting and search as the URL holds them; unknown values fall back to defaults. */
export function readListParams<S extends string>(search: URLSearchParams, options: ListSearchOptions<S>): ListParams<S> {
  const prefix = options.prefix ?? '';
  const pageSize = positiveInteger(search.get(`${prefix}pageSize`));
  const sort = search.get(`${prefix}sort`);
  return {
    page: positiveInteger(search.get(`${prefix}page`)) ?? 1,
    pageSize: pageSize !== undefined && (pageSizes as readonly number[]).includes(pageSize) ? pageSize : (options.defaultPageSize ?? 25),
    sort: sort !== null && (options.sorts as readonly string[]).includes(sort) ? (sort as S) : options.defaultSort,
    q: (search.get(`${prefix}q`) ?? '').slice(0, 200),
  };
}

/**
 * A server-paged table's state in the URL search params, so a filtered, sorted page can be
 * bookmarked, shared and reached again with Back.
 */
export function useListSearch<S extends string>(options: ListSearchOptions<S>) {
  const [search, setSearch] = useSearchParams();
  const params = readListParams(search, options);
  const prefix = options.prefix ?? '';
  const defaultPageSize = options.defaultPageSize ?? 25;
  const { defaultSort } = options;

  const setParams = useCallback(
    (changes: Partial<ListParams<S>>) => {
      setSearch(
        (previous) => {
          const next = new URLSearchParams(previous);
          const write = (key: keyof ListParams<S>, value: string | number, fallback: string | number) => {
            if (value === fallback || value === '') next.delete(`${prefix}${key}`);
            else next.set(`${prefix}${key}`, String(value));
          };
          if (changes.q !== undefined) write('q', changes.q, '');
          if (changes.sort !== undefined) write('sort', changes.sort, defaultSort);
          if (changes.pageSize !== undefined) write('pageSize', changes.pageSize, defaultPageSize);
          // A new search, sort or page size starts again from the first page.
          const page = changes.page ?? (changes.q !== undefined || changes.sort !== undefined || changes.pageSize !== undefined ? 1 : undefined);
          if (page !== undefined) write('page', page, 1);
          return next;
        },
        // Typing a search should not fill the history with one entry per letter.
        { replace: changes.q !== undefined, preventScrollReset: true },
      );
    },
    [setSearch, prefix, defaultPageSize, defaultSort],
  );

  return [params, setParams] as const;
}
