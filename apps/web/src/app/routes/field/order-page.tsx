import type { QueryClient } from '@tanstack/react-query';
import { data, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { fieldQueries } from '../../../features/field/api/field-queries';
import { loadWalkForms, OrderWalkthrough, walkShownAtOnce } from '../../../features/field/components/order-walkthrough';
import { isApiError } from '../../../lib/api-client';

function orderIdOf(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id < 1) throw data({ message: 'This address does not lead to a work order.' }, { status: 404 });
  return id;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    // The walk's forms load beside the session and the order's data: awaited when the walk shows
    // at once (no placeholder that the forms would push down), otherwise ready by the time the
    // card is read.
    const walkForms = loadWalkForms();
    walkForms.catch(() => undefined); // not awaited below: a failure shows when the walk is opened
    await requirePermission(queryClient, request, 'work-orders:perform');
    const id = orderIdOf(params.id);
    let order;
    try {
      order = await queryClient.ensureQueryData(fieldQueries.order(id));
    } catch (error) {
      if (isApiError(error) && error.status === 404) throw data({ message: error.message }, { status: 404 });
      throw error;
    }
    if (walkShownAtOnce(order)) await walkForms;
    return null;
  };

/**
 * A first view drawn on the server has the walk's forms in it when the walk shows at once: they
 * are loaded before hydrating, so the page does not fall back to "Loading the forms…" meanwhile.
 */
export const firstViewReady = loadWalkForms;

/** An order on the technician's phone: the safety card, the walk through the bank, submit. */
export default function FieldOrderPage() {
  const { id } = useParams();
  const orderId = orderIdOf(id);
  return <OrderWalkthrough key={orderId} orderId={orderId} />;
}
