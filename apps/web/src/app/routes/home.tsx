import type { QueryClient } from '@tanstack/react-query';
import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { homeFor } from '../../features/auth/lib/role-home';
import { requireSession } from '../../features/auth/lib/route-guards';

/** The root address leads each person to the home of their role. */
export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = await requireSession(queryClient, request);
    throw redirect(homeFor(me.user.roles));
  };

export default function HomeRoute() {
  return null;
}
