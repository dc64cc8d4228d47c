import type { RouteObject } from 'react-router-dom';
import { SectionErrorBoundary } from '../../../components/errors/route-error';
import { paths } from '../../../config/paths';
import type { PageMapper, RouteModule } from '../../router';

/**
 * The planner's and the supervisor's work-order pages, each lazily loaded with its own error
 * boundary so a failing page keeps the rail: spread into the shell's signed-in children.
 */
export function workOrderRoutes(page: PageMapper): RouteObject[] {
  const route = (path: string, load: () => Promise<RouteModule>): RouteObject => ({
    path,
    errorElement: <SectionErrorBoundary />,
    lazy: () => load().then(page),
  });
  const w = paths.workOrders;
  return [
    route(w.list.path, () => import('./work-orders-page')),
    route(w.calendar.path, () => import('./due-calendar-page')),
    route(w.workload.path, () => import('./technician-load-page')),
    route(w.create.path, () => import('./new-work-order-page')),
    route(w.detail.path, () => import('./work-order-page')),
    route(w.review.path, () => import('./review-page')),
    route(w.record.path, () => import('./signed-record-page')),
    route(paths.plans.list.path, () => import('./plans-page')),
    route(paths.plans.create.path, () => import('./new-plan-page')),
    route(paths.plans.edit.path, () => import('./plan-page')),
    route(paths.flagQueue.path, () => import('./flag-queue-page')),
  ];
}
