import { queryOptions } from '@tanstack/react-query';
import { technicianList, type Technician } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';
import { workOrders } from './work-order-queries';

export type { Technician };

/** The technicians a planner can give an order to: GET /api/technicians, active ones by name. */
export const technicians = {
  list: () =>
    queryOptions({
      queryKey: [...workOrders.all, 'technicians'] as const,
      queryFn: async ({ signal }): Promise<Technician[]> => (await apiRequest('/api/technicians', { parse: (json) => technicianList.parse(json), signal })).items,
      staleTime: 5 * 60_000,
      meta: { subject: 'list of technicians' },
    }),
};
