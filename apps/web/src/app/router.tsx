import { type QueryClient, useQueryClient } from '@tanstack/react-query';
import { useState, type ComponentType } from 'react';
import { createBrowserRouter, RouterProvider, type LoaderFunction } from 'react-router-dom';
import { RootErrorBoundary, SectionErrorBoundary } from '../components/errors/route-error';
import { paths } from '../config/paths';
import { AppShell, ShellFallback } from './routes/app-shell';

/** What a page module in routes/ exports: the page as default, optionally a loader factory. */
type RouteModule = {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
};

/** Maps a lazily loaded page module onto React Router's route properties. */
const toRoute =
  (queryClient: QueryClient) =>
  ({ default: Component, clientLoader }: RouteModule) => ({
    Component,
    ...(clientLoader ? { loader: clientLoader(queryClient) } : {}),
  });

export function createAppRouter(queryClient: QueryClient) {
  const page = toRoute(queryClient);
  return createBrowserRouter([
    {
      path: paths.home.path,
      Component: AppShell,
      HydrateFallback: ShellFallback,
      errorElement: <RootErrorBoundary />,
      children: [
        // One route per section, each with its own boundary so a failing section keeps the
        // rail. Register, Work orders, Fleet health and People are added beside Overview.
        {
          index: true,
          errorElement: <SectionErrorBoundary />,
          lazy: () => import('./routes/home').then(page),
        },
        {
          path: '*',
          errorElement: <SectionErrorBoundary />,
          lazy: () => import('./routes/not-found').then(page),
        },
      ],
    },
  ]);
}

export function AppRouter() {
  const queryClient = useQueryClient();
  const [router] = useState(() => createAppRouter(queryClient));
  return <RouterProvider router={router} />;
}
