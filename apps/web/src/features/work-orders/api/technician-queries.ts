import { queryOptions } from '@tanstack/react-query';
import { workload } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';
import { localToday } from '../lib/month-grid';
import { workOrders } from './work-order-queries';

export type Technician = { id: number; name: string };

/**
 * The technicians a planner can give an order to. GET /api/users is for administrators only,
 * so the list comes from the technician load (GET /api/work-orders/workload), which names
 * every active technician, busy or not.
 */
export const technicians = {
  list: () => {
    const today = localToday();
    return queryOptions({
      queryKey: [...workOrders.all, 'technicians', today] as const,
      queryFn: async ({ signal }): Promise<Technician[]> => {
        const load = await apiRequest(`/api/work-orders/workload?${new URLSearchParams({ from: today, to: today }).toString()}`, {
          parse: (json) => workload.parse(json),
          signal,
        });
        return load.technicians
          .filter((row): row is typeof row & { userId: number } => row.userId !== null)
          .map((row) => ({ id: row.userId, name: row.name }))
          .sort((a, b) => a.name.localeCompare(b.name));
      },
      staleTime: 5 * 60_000,
      meta: { subject: 'list of technicians' },
    });
  },
};
