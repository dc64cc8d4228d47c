import { startTransition, StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { prepareFirstView } from './first-view';
import type { FirstViewState } from './first-view-state';
import { AppProvider } from './provider';
import { createQueryClient } from './query-client';
import { appRoutes } from './router';
import { nextTask } from '../lib/next-task';
import { ownReaderFormat, rememberReaderFormat } from '../lib/reader-format';

/**
 * Starts the app in #root: hydrates the first view the server drew (keeping its markup), or
 * draws the page from nothing when there is none. main.tsx loads this module.
 */
export async function startApp(root: HTMLElement, firstView: FirstViewState | undefined): Promise<void> {
  // The server draws the next first view in this browser's locale and zone (lib/reader-format.ts).
  rememberReaderFormat(document, window.location.protocol === 'https:');
  const queryClient = createQueryClient();
  const routes = appRoutes(queryClient);
  if (firstView) await prepareFirstView(queryClient, routes, firstView, window.location);
  await nextTask();
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
  if (firstView && readsAsThisBrowser(firstView)) startTransition(() => void hydrateRoot(root, app));
  // Markup drawn in another locale or zone (a browser that had not yet told the server its own,
  // or has moved zone since) is drawn again, from the same data, rather than hydrated wrongly.
  else createRoot(root).render(app);
}

/** Whether the server wrote numbers and dates as this browser does. */
function readsAsThisBrowser(firstView: FirstViewState): boolean {
  const own = ownReaderFormat();
  return firstView.reader?.locale === own.locale && firstView.reader.timeZone === own.timeZone;
}
