import { queryOptions } from '@tanstack/react-query';
import { sessionResponse, type Permission, type SessionResponse } from '@varden/schemas';
import { apiRequest, isApiError } from '../../../lib/api-client';

export type { SessionResponse };

/** GET /api/auth/me: who is signed in and what they may do; null when nobody is (401). */
async function getSession(signal: AbortSignal): Promise<SessionResponse | null> {
  try {
    return await apiRequest('/api/auth/me', { parse: (json) => sessionResponse.parse(json), signal });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

/**
 * The signed-in person and their permissions. Route loaders call
 * `queryClient.ensureQueryData(session)`; components call `useQuery(session)`. Signing in
 * writes it with setQueryData, signing out clears the cache; a 401 anywhere refetches it.
 */
export const session = queryOptions({
  queryKey: ['session'] as const,
  queryFn: ({ signal }) => getSession(signal),
  staleTime: 60_000,
  meta: { subject: 'sign-in state' },
});

/**
 * Whether the signed-in person holds a permission, for hiding what they may not do. The
 * server decides anyway: this only keeps the page honest about what will work.
 */
export function hasPermission(sessionData: SessionResponse | null | undefined, permission: Permission): boolean {
  if (permission === 'public') return true;
  return sessionData?.permissions.includes(permission) ?? false;
}
