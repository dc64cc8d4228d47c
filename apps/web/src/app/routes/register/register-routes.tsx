import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunction, RouteObject } from 'react-router-dom';
import { SectionErrorBoundary } from '../../../components/errors/route-error';
import { paths } from '../../../config/paths';

/** A page module of the register: the page as default, optionally a loader factory (as router.tsx expects). */
export type RegisterPageModule = {
  default: ComponentType;
  clientLoader?: (queryClient: QueryClient) => LoaderFunction;
};

/** router.tsx's mapper from a page module to the route's Component and loader. */
export type PageMapper = (module: RegisterPageModule) => Pick<RouteObject, 'Component' | 'loader'>;

/**
 * The register's pages, each lazily loaded with its own error boundary so a failing page keeps
 * the rail: spread into the shell's children.
 */
export function registerRoutes(page: PageMapper): RouteObject[] {
  const r = paths.register;
  const route = (path: string, load: () => Promise<RegisterPageModule>): RouteObject => ({
    path,
    errorElement: <SectionErrorBoundary />,
    lazy: () => load().then(page),
  });
  return [
    route(r.sites.path, () => import('./sites-page')),
    route(r.newSite.path, () => import('./site-new-page')),
    route(r.site.path, () => import('./site-page')),
    route(r.editSite.path, () => import('./site-edit-page')),
    route(r.newBank.path, () => import('./bank-new-page')),
    route(r.bank.path, () => import('./bank-page')),
    route(r.editBank.path, () => import('./bank-edit-page')),
    route(r.bankImport.path, () => import('./bank-import-page')),
    route(r.bankLabels.path, () => import('./bank-labels-page')),
    route(r.step.path, () => import('./step-page')),
    route(r.unit.path, () => import('./unit-page')),
    route(r.editUnit.path, () => import('./unit-edit-page')),
    route(r.replaceUnit.path, () => import('./unit-replace-page')),
    route(r.contactor.path, () => import('./contactor-page')),
    route(r.reactor.path, () => import('./reactor-page')),
    route(r.fuseSet.path, () => import('./fuse-set-page')),
  ];
}
