import { hydrate, type QueryClient } from '@tanstack/react-query';
import { matchRoutes, type RouteObject } from 'react-router-dom';
import type { FirstViewState } from './first-view-state';
import type { PageHandle } from './router';
import { nextTask } from '../lib/next-task';

/**
 * Prepares the browser's router and cache for hydrating the server's markup: the server's data
 * into the cache, and the page's lazily loaded route modules loaded before the router is made,
 * so its first render is the server's, not the "Loading Varden…" frame; then what each page
 * says its first render needs beyond that (its `firstViewReady`).
 */
export async function prepareFirstView(queryClient: QueryClient, routes: RouteObject[], state: FirstViewState, location: Location): Promise<void> {
  hydrate(queryClient, state.queries);
  await nextTask();
  const lazyMatches = (matchRoutes(routes, location) ?? []).filter((match) => match.route.lazy);
  await Promise.all(
    lazyMatches.map(async ({ route }) => {
      const lazy = route.lazy as () => Promise<Partial<RouteObject>>;
      const loaded = await lazy();
      Object.assign(route, { ...loaded, lazy: undefined });
    }),
  );
  await nextTask();
  const pages = matchRoutes(routes, location) ?? [];
  await Promise.all(pages.map(({ route }) => (route.handle as PageHandle | undefined)?.firstViewReady?.()));
}
