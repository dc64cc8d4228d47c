import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { session } from '../features/auth/api/session-queries';
import { isApiError } from '../lib/api-client';
import { pushNotice } from '../lib/notices';

declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: {
      /** What the data is, for the notice when a background refresh of it fails ("site list"). */
      subject?: string;
    };
    mutationMeta: {
      /** Set when the caller shows the failure itself, beyond a 400's field errors. */
      handlesErrors?: boolean;
    };
  }
}

function errorMessage(error: unknown): string {
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/** Never retry what the server refused (4xx); retry twice what may be passing (no answer, 5xx). */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

const isSignedOut = (error: unknown) => isApiError(error) && error.status === 401;

/** A fresh client per app start and per test (tests pass `retry: false` through defaults). */
export function createQueryClient(): QueryClient {
  // A 401 means the session ended (expired, revoked, signed out elsewhere): ask again who is
  // signed in, and the frame shows the way back in. Navigation stays with the pages.
  const recheckSession = () => void queryClient.invalidateQueries({ queryKey: session.queryKey });

  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isSignedOut(error)) {
          if (query.queryKey[0] !== session.queryKey[0]) recheckSession();
          return;
        }
        // A first load shows its failure in place; only a failed refresh of data already on
        // screen needs a notice, because the page keeps showing the older data.
        if (query.state.data === undefined) return;
        const subject = query.meta?.subject ?? 'data';
        pushNotice(`Could not refresh the ${subject}: ${errorMessage(error)}`);
      },
    }),
    mutationCache: new MutationCache({
      onError: (error, _variables, _context, mutation) => {
        if (isSignedOut(error)) recheckSession();
        if (mutation.meta?.handlesErrors) return;
        // Field errors go back into their form with setError.
        if (isApiError(error) && error.status === 400 && Object.keys(error.fields).length > 0) return;
        pushNotice(errorMessage(error));
      },
    }),
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry },
      mutations: { retry: false },
    },
  });
  return queryClient;
}
