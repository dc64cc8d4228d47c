import { startTransition, StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { prepareFirstView } from './first-view';
import type { FirstViewState } from './first-view-state';
import { AppProvider } from './provider';
import { createQueryClient } from './query-client';
import { appRoutes } from './router';

/**
 * Starts the app in #root: hydrates the first view the server drew (keeping its markup), or
 * draws the page from nothing when there is none. main.tsx loads this module.
 */
export async function startApp(root: HTMLElement, firstView: FirstViewState | undefined): Promise<void> {
  const queryClient = createQueryClient();
  const routes = appRoutes(queryClient);
  if (firstView) await prepareFirstView(queryClient, routes, firstView, window.location);
  const router = createBrowserRouter(routes, firstView ? { hydrationData: firstView.router } : undefined);
  const app = (
    <StrictMode>
      <AppProvider client={queryClient}>
        <RouterProvider router={router} />
      </AppProvider>
    </StrictMode>
  );
  // As a transition, the hydration yields to the browser every few milliseconds instead of
  // holding the main thread for the whole page (a long fleet table took 200 ms at once).
  if (firstView) startTransition(() => void hydrateRoot(root, app));
  else createRoot(root).render(app);
}
