import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Link, Outlet, useLocation } from 'react-router-dom';
import { paths } from '../../config/paths';
import { session } from '../../features/auth/api/session-queries';
import { requireSession } from '../../features/auth/lib/route-guards';

/** Every page below needs a signed-in person; a signed-out visitor is sent to sign in and brought back. */
export const signedInLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requireSession(queryClient, request);
    return null;
  };

/**
 * The layout of the signed-in pages. When the session ends while a page is open (it expired, or
 * the person signed out in another tab), the page gives way to a way back in rather than to a
 * redirect that would lose what was on screen without a word.
 */
export function SignedInPages() {
  const { data: me } = useQuery(session);
  const location = useLocation();
  if (me) return <Outlet />;
  return (
    <div role="alert" className="max-w-measure">
      <title>Signed out · Varden</title>
      <h1 className="text-xl font-semibold desk:text-2xl">You are signed out</h1>
      <p className="mt-2 text-ink-muted">Your session has ended, perhaps after a while without use or on another device. Sign in again to carry on here.</p>
      <p className="mt-4">
        <Link to={paths.signIn.getHref(location.pathname + location.search)}>Sign in again</Link>
      </p>
    </div>
  );
}
