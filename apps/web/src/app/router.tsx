import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunction, RouteObject } from 'react-router-dom';
import { RootErrorBoundary, SectionErrorBoundary } from '../components/errors/route-error';
import { paths } from '../config/paths';
import { AppShell, ShellFallback, shellLoader } from './routes/app-shell';
import { SignedInPages, signedInLoader } from './routes/signed-in-pages';
import { registerRoutes } from './routes/register/register-routes';
import { fleetRoutes } from './routes/fleet/fleet-routes';
import { fieldRoutes } from './routes/field/field-routes';
import { workOrderRoutes } from './routes/work-orders/work-orders-routes';

/** What a page module in routes/ exports: the page as default, optionally a loader factory. */
export type RouteModule = {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
  /** What the page's first render needs loaded beyond its data, awaited before hydrating a first view drawn on the server. */
  firstViewReady?: () => Promise<unknown>;
};

/** A route's `handle`: what prepareFirstView (first-view.ts) awaits before hydrating. */
export type PageHandle = { firstViewReady?: () => Promise<unknown> };

/** Turns a loaded page module into React Router's route properties (`lazy: () => import(…).then(page)`). */
export type PageMapper = (module: RouteModule) => Pick<RouteObject, 'Component' | 'loader' | 'handle'>;

/** Maps a lazily loaded page module onto React Router's route properties. */
const toRoute =
  (queryClient: QueryClient): PageMapper =>
  ({ default: Component, clientLoader, firstViewReady }: RouteModule) => ({
    Component,
    ...(clientLoader ? { loader: clientLoader(queryClient) } : {}),
    ...(firstViewReady ? { handle: { firstViewReady } satisfies PageHandle } : {}),
  });

/** One page: its path, its lazily loaded module, and a boundary so a failing page keeps the frame. */
const pageRoute = (path: string, load: () => Promise<RouteModule>, page: PageMapper): RouteObject => ({
  path,
  errorElement: <SectionErrorBoundary />,
  lazy: () => load().then(page),
});

/** Every route of the app (public/page-modules.json names each page's module for the API's preload hints). */
export function appRoutes(queryClient: QueryClient): RouteObject[] {
  const page = toRoute(queryClient);
  return [
    {
      path: paths.home.path,
      Component: AppShell,
      HydrateFallback: ShellFallback,
      errorElement: <RootErrorBoundary />,
      loader: shellLoader(queryClient),
      children: [
        // Open to everyone: signing in and choosing a password.
        pageRoute(paths.signIn.path, () => import('./routes/sign-in'), page),
        pageRoute(paths.resetPassword.path, () => import('./routes/reset-password'), page),
        pageRoute(paths.setPassword.path, () => import('./routes/set-password'), page),
        {
          // Signed in only: a signed-out visitor is sent to sign-in with ?next= and brought back.
          Component: SignedInPages,
          loader: signedInLoader(queryClient),
          errorElement: <SectionErrorBoundary />,
          children: [
            { index: true, errorElement: <SectionErrorBoundary />, lazy: () => import('./routes/home').then(page) },
            pageRoute(paths.planningDesk.path, () => import('./routes/planning-desk'), page),
            pageRoute(paths.todaysOrders.path, () => import('./routes/todays-orders'), page),
            pageRoute(paths.reviewQueue.path, () => import('./routes/review-queue'), page),
            pageRoute(paths.siteHealth.path, () => import('./routes/site-health'), page),
            pageRoute(paths.people.path, () => import('./routes/people'), page),
            pageRoute(paths.invitePerson.path, () => import('./routes/invite-person'), page),
            pageRoute(paths.person.path, () => import('./routes/person'), page),
            pageRoute(paths.auditLog.path, () => import('./routes/audit-log'), page),
            pageRoute(paths.serviceHealth.path, () => import('./routes/service-health'), page),
            pageRoute(paths.account.path, () => import('./routes/account'), page),
            // Each feature's own route array joins here, e.g. ...registerRoutes(page),
            ...registerRoutes(page),
            ...fleetRoutes(page),
            ...fieldRoutes(page),
            ...workOrderRoutes(page),
          ],
        },
        // Open to everyone, inside the frame of whoever is (or is not) signed in.
        pageRoute('*', () => import('./routes/not-found'), page),
      ],
    },
  ];
}
