import { describe, expect, it } from 'vitest';
import { readListParams } from './list-search';

const options = { sorts: ['name', '-name', 'voltageV', '-voltageV'] as const, defaultSort: 'name' as const };

describe('readListParams', () => {
  it('reads page, page size, sort and search from the URL', () => {
    const params = readListParams(new URLSearchParams('page=3&pageSize=50&sort=-voltageV&q=quay'), options);
    expect(params).toEqual({ page: 3, pageSize: 50, sort: '-voltageV', q: 'quay' });
  });

  it('falls back to the defaults for missing or unknown values', () => {
    expect(readListParams(new URLSearchParams('page=0&pageSize=7&sort=password'), options)).toEqual({ page: 1, pageSize: 25, sort: 'name', q: '' });
    expect(readListParams(new URLSearchParams('page=2.5'), options).page).toBe(1);
  });

  it('reads only its own prefix', () => {
    const search = new URLSearchParams('page=4&banks.page=2&banks.sort=-name');
    expect(readListParams(search, { ...options, prefix: 'banks.' })).toMatchObject({ page: 2, sort: '-name' });
  });
});
