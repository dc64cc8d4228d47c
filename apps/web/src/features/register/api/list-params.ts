/** The paging, sorting and search every register list endpoint takes (packages/schemas listQuery). */
export type ListParams<S extends string = string> = {
  page: number;
  pageSize: number;
  sort: S;
  q: string;
};

type SearchValue = string | number | boolean | null | undefined;

/** A query string from the values that are set, in a stable order: `?page=1&pageSize=25`. */
export function searchOf(values: Readonly<Record<string, SearchValue>>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(values)) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, String(value));
  }
  const text = search.toString();
  return text === '' ? '' : `?${text}`;
}

/** Largest page the API serves (packages/schemas listQuery). */
export const maxPageSize = 200;

export type Page<T> = { items: T[]; total: number };

/**
 * Every item of a list, page by page at the largest page size, until `total` is reached: for
 * CSV exports and the panel drawing, which need the whole list rather than a screenful.
 */
export async function fetchAllPages<T>(fetchPage: (page: number, pageSize: number) => Promise<Page<T>>): Promise<Page<T>> {
  const items: T[] = [];
  for (let page = 1; ; page++) {
    const result = await fetchPage(page, maxPageSize);
    items.push(...result.items);
    // An empty page means the list shrank while we read it: stop rather than loop.
    if (items.length >= result.total || result.items.length === 0) return { items, total: result.total };
  }
}
