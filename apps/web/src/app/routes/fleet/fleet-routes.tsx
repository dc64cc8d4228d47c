import type { RouteObject } from 'react-router-dom';
import { SectionErrorBoundary } from '../../../components/errors/route-error';
import { paths } from '../../../config/paths';
import type { PageMapper, RouteModule } from '../../router';

/** Fleet health's pages, each lazily loaded with its own error boundary: spread into the shell's signed-in children. */
export function fleetRoutes(page: PageMapper): RouteObject[] {
  const route = (path: string, load: () => Promise<RouteModule>): RouteObject => ({
    path,
    errorElement: <SectionErrorBoundary />,
    lazy: () => load().then(page),
  });
  return [route(paths.fleetHealth.path, () => import('./fleet-page')), route(paths.siteHealthOf.path, () => import('./site-health-page'))];
}
