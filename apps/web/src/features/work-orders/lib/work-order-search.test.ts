import { describe, expect, test } from 'vitest';
import { exportSearch, isFiltered, openStatesFilter, readWorkOrderSearch, statesOf, writeWorkOrderSearch } from './work-order-search';

describe('work-order table search in the URL', () => {
  test('reads filters, sort and page; a refused value falls back to its default', () => {
    const search = readWorkOrderSearch(new URLSearchParams('state=queued,dispatched&siteId=4&assigneeId=none&sort=-dueOn&page=2&dueFrom=2026-05-01&kind=bogus'));
    expect(search).toMatchObject({ state: 'queued,dispatched', siteId: 4, assigneeId: 'none', sort: '-dueOn', page: 2, pageSize: 25, dueFrom: '2026-05-01' });
    expect(search.kind).toBeUndefined();
  });

  test('writes back without the defaults, so a shared link says only what differs', () => {
    const search = readWorkOrderSearch(new URLSearchParams('assigneeId=12&state=on-site'));
    expect(writeWorkOrderSearch(search).toString()).toBe('state=on-site&assigneeId=12');
    expect(writeWorkOrderSearch(readWorkOrderSearch(new URLSearchParams(''))).toString()).toBe('');
  });

  test('the export carries the filters and sort but not the page', () => {
    const search = readWorkOrderSearch(new URLSearchParams('state=sealed&page=3&pageSize=50&sort=priority'));
    expect(exportSearch(search).toString()).toBe('sort=priority&state=sealed');
  });

  test('states of a filter and whether anything is filtered', () => {
    expect(statesOf(openStatesFilter)).toEqual(['queued', 'dispatched', 'on-site', 'awaiting-review', 'sent-back']);
    expect(statesOf('sealed,nonsense')).toEqual(['sealed']);
    expect(statesOf(undefined)).toEqual([]);
    expect(isFiltered(readWorkOrderSearch(new URLSearchParams('page=2')))).toBe(false);
    expect(isFiltered(readWorkOrderSearch(new URLSearchParams('kind=baseline')))).toBe(true);
  });
});
