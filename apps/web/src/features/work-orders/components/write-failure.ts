import { useQueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-client';
import { workOrders } from '../api/work-order-queries';

/**
 * What a refused write on an order means for the person, and the reload it calls for: a 409
 * says the order changed (another planner, the technician, a supervisor sealing it) since the
 * page read it, so the order is read again and the message says to check and try again.
 */
export function useOrderWriteFailure() {
  const queryClient = useQueryClient();
  return (error: unknown, formMessage: string | undefined): string | undefined => {
    if (!isApiError(error) || error.status !== 409) return formMessage;
    void queryClient.invalidateQueries({ queryKey: workOrders.all });
    if (error.code === 'locked') return 'This order was sealed meanwhile, so it no longer changes. The page now shows the sealed order.';
    return `${error.message.replace(/\s*Reload[^.]*\.?\s*$/, '')} The page now shows the current version: check it and try again.`;
  };
}
