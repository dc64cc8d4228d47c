import { describe, expect, it } from 'vitest';
import { readPeopleSearch, writePeopleSearch } from './people-search';

describe('people search in the URL', () => {
  it('round-trips the table state through the URL, defaults left out', () => {
    const search = readPeopleSearch(new URLSearchParams('page=2&sort=-createdAt&q=kestrel&status=invited'));
    expect(search).toEqual({ page: 2, pageSize: 25, sort: '-createdAt', q: 'kestrel', status: 'invited' });
    expect(writePeopleSearch(search).toString()).toBe('page=2&sort=-createdAt&q=kestrel&status=invited');
    expect(writePeopleSearch(readPeopleSearch(new URLSearchParams())).toString()).toBe('');
  });
});
