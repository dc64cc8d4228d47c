import type { QueryClient } from '@tanstack/react-query';
import { useId } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { TodaysOrdersList } from '../../features/field/components/todays-orders-list';
import { fieldQueries } from '../../features/field/api/field-queries';
import { formatLongDate } from '../../lib/date-format';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:perform');
    // Started here, not awaited: the page draws at once and the list fills in (or says it is offline).
    void queryClient.prefetchQuery(fieldQueries.myOrders());
    return null;
  };

const safetySteps = [
  'Isolate the bank and lock it out.',
  'Wait the discharge time on the unit’s nameplate.',
  'Verify the absence of voltage with a tested meter.',
  'Short and earth the terminals, and keep the shorts on while you work.',
  'Wear the PPE the site’s arc-flash assessment calls for.',
];

function BeforeAnyWork() {
  const headingId = useId();
  return (
    <section aria-labelledby={headingId} className="rounded-md border-2 border-line-strong bg-surface p-4 desk:p-6">
      <h2 id={headingId} className="flex items-center gap-2 text-lg font-semibold">
        <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-5 shrink-0 fill-none stroke-ink stroke-[1.5]">
          {/* Two plates of a capacitor between their leads. */}
          <path d="M1 8h5M10 8h5M6 3v10M10 3v10" strokeLinecap="round" />
        </svg>
        Before any work on a bank
      </h2>
      <p className="mt-1 text-ink-muted">Capacitors hold their charge after isolation.</p>
      <ol className="mt-3 grid list-decimal gap-2 pl-6">
        {safetySteps.map((step) => (
          <li key={step}>{step}</li>
        ))}
      </ol>
      <p className="mt-3 text-base text-ink-muted desk:text-sm">Your site’s safety rules, local codes and licensed practice come first.</p>
    </section>
  );
}

/** The technician's home: the orders assigned to them, then the safety steps that come before any of them. */
export default function TodaysOrdersRoute() {
  return (
    <>
      <PageHeader title="Today’s orders" eyebrow={formatLongDate(new Date())} documentTitle="Today’s orders" />
      <div className="grid max-w-measure gap-6">
        <TodaysOrdersList />
        <BeforeAnyWork />
      </div>
    </>
  );
}
