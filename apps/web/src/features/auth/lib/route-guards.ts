import type { QueryClient } from '@tanstack/react-query';
import type { Permission } from '@varden/schemas';
import { data, redirect } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { hasPermission, session, type SessionResponse } from '../api/session-queries';
import { homeFor } from './role-home';
import { safeNext } from './safe-next';

/** The session as loaders see it: from the cache, refreshed in the background when stale. */
export function loadSession(queryClient: QueryClient): Promise<SessionResponse | null> {
  return queryClient.ensureQueryData({ ...session, revalidateIfStale: true });
}

/** For a loader: the signed-in person, or a redirect to sign-in that comes back here. */
export async function requireSession(queryClient: QueryClient, request: Request): Promise<SessionResponse> {
  const me = await loadSession(queryClient);
  if (!me) {
    const url = new URL(request.url);
    throw redirect(paths.signIn.getHref(url.pathname + url.search));
  }
  return me;
}

/** For a loader: the signed-in person when they hold the permission; 403 for the section's boundary otherwise. */
export async function requirePermission(queryClient: QueryClient, request: Request, permission: Permission): Promise<SessionResponse> {
  const me = await requireSession(queryClient, request);
  if (!hasPermission(me, permission)) {
    throw data({ message: 'Your role does not include this page. Ask an administrator if you need it.' }, { status: 403 });
  }
  return me;
}

/** Where to go once signed in: the `next` the sign-in page was given, or the home of the person's role. */
export function destinationAfterSignIn(me: SessionResponse, next: string | null): string {
  return safeNext(next) ?? homeFor(me.user.roles);
}
