import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import { user, userList, type User, type UserList } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';
import { writePeopleSearch, type PeopleSearch } from '../lib/people-search';

function listUsers(search: PeopleSearch, signal: AbortSignal): Promise<UserList> {
  // The defaults left out are the API's own, so the request means the same as the URL.
  const query = writePeopleSearch(search);
  return apiRequest(`/api/users?${query.toString()}`, { parse: (json) => userList.parse(json), signal });
}

function getUser(id: number, signal: AbortSignal): Promise<User> {
  return apiRequest(`/api/users/${id}`, { parse: (json) => user.parse(json), signal });
}

/** People (GET /api/users, GET /api/users/:id): one factory, keys from general to particular. */
export const users = {
  all: ['users'] as const,
  lists: () => [...users.all, 'list'] as const,
  list: (search: PeopleSearch) =>
    queryOptions({
      queryKey: [...users.lists(), search] as const,
      queryFn: ({ signal }) => listUsers(search, signal),
      placeholderData: keepPreviousData,
      meta: { subject: 'list of people' },
    }),
  details: () => [...users.all, 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...users.details(), id] as const,
      queryFn: ({ signal }) => getUser(id, signal),
      meta: { subject: 'person' },
    }),
};
