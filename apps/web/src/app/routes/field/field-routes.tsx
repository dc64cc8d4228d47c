import type { RouteObject } from 'react-router-dom';
import { SectionErrorBoundary } from '../../../components/errors/route-error';
import { paths } from '../../../config/paths';
import type { PageMapper } from '../../router';

/** The technician's phone pages, each lazily loaded with its own error boundary: spread into the shell's signed-in children. */
export function fieldRoutes(page: PageMapper): RouteObject[] {
  return [
    {
      path: paths.fieldOrder.path,
      errorElement: <SectionErrorBoundary />,
      lazy: () => import('./order-page').then(page),
    },
  ];
}
