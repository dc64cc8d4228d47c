import { userListQuery } from '@varden/schemas';
import { describe, expect, it } from 'vitest';
import { pageCount, readListSearch, sortingToSort, sortToSorting, writeListSearch } from './server-table';

const keys = ['page', 'pageSize', 'sort', 'q', 'role', 'status'];

describe('readListSearch', () => {
  it("reads a list's state with the endpoint's own schema", () => {
    const params = new URLSearchParams('page=3&pageSize=50&sort=-createdAt&q=aino&role=viewer');
    expect(readListSearch(userListQuery, params, keys)).toEqual({ page: 3, pageSize: 50, sort: '-createdAt', q: 'aino', role: 'viewer' });
  });

  it('falls back to the default for each value the schema refuses, keeping the rest', () => {
    const params = new URLSearchParams('page=0&pageSize=5000&sort=shoeSize&q=aino&status=asleep');
    expect(readListSearch(userListQuery, params, keys)).toEqual({ page: 1, pageSize: 25, sort: 'name', q: 'aino' });
  });

  it('ignores empty values and keys the list does not know', () => {
    expect(readListSearch(userListQuery, new URLSearchParams('q=&role=&utm=x'), keys)).toEqual({ page: 1, pageSize: 25, sort: 'name' });
  });
});

describe('writeListSearch', () => {
  it('leaves out the defaults and what is unset, so a first page has a bare URL', () => {
    const defaults = { page: 1, pageSize: 25, sort: 'name' };
    expect(writeListSearch({ page: 1, pageSize: 25, sort: 'name', q: undefined }, defaults).toString()).toBe('');
    expect(writeListSearch({ page: 2, pageSize: 25, sort: '-email', q: 'kes' }, defaults).toString()).toBe('page=2&sort=-email&q=kes');
  });
});

describe('sorting', () => {
  it('turns the API sort into TanStack sorting and back', () => {
    expect(sortToSorting('name')).toEqual([{ id: 'name', desc: false }]);
    expect(sortToSorting('-createdAt')).toEqual([{ id: 'createdAt', desc: true }]);
    expect(sortingToSort([{ id: 'email', desc: true }], 'name')).toBe('-email');
    expect(sortingToSort([], 'name')).toBe('name');
  });
});

describe('pageCount', () => {
  it('counts at least one page', () => {
    expect(pageCount(0, 25)).toBe(1);
    expect(pageCount(25, 25)).toBe(1);
    expect(pageCount(26, 25)).toBe(2);
  });
});
