import type { QueryClient } from '@tanstack/react-query';
import { session, type SessionResponse } from '../api/session-queries';

/**
 * Forgets everything the previous person loaded and records who is signed in now (null after
 * signing out). The session query itself stays in the cache so the frame, which watches it,
 * sees the change at once.
 */
export function replaceSession(queryClient: QueryClient, me: SessionResponse | null): void {
  void queryClient.cancelQueries();
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== session.queryKey[0] });
  queryClient.getMutationCache().clear();
  queryClient.setQueryData(session.queryKey, me);
}
