import { useQuery } from '@tanstack/react-query';
import { useId } from 'react';
import { Button } from '../../../components/button';
import { Quantity } from '../../../components/quantity';
import { ServiceStatusBadge } from '../../../components/service-status-badge';
import { isApiError } from '../../../lib/api-client';
import { serviceNames, type HealthReport, type ServiceName } from '../api/get-health';
import { healthQueries } from '../api/health-queries';
import { readerDateFormat } from '../../../lib/reader-format';

const serviceLabels: Record<ServiceName, string> = {
  database: 'Database',
  storage: 'File storage',
  mail: 'Mail',
};

const timeFormat = readerDateFormat({ hour: '2-digit', minute: '2-digit', second: '2-digit' });

function checkedAt(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : timeFormat.format(date);
}

function ServiceTable({ report }: { report: HealthReport }) {
  return (
    <table className="w-full border-collapse text-left">
      <caption className="sr-only">Each service Varden depends on, whether it answers and how fast</caption>
      <thead>
        <tr className="border-b border-line text-base text-ink-muted desk:text-sm">
          <th scope="col" className="py-2 pr-3 font-medium">
            Service
          </th>
          <th scope="col" className="py-2 pr-3 font-medium">
            State
          </th>
          <th scope="col" className="py-2 text-right font-medium">
            Latency
          </th>
        </tr>
      </thead>
      <tbody>
        {serviceNames.map((name) => {
          const service = report.services[name];
          return (
            <tr key={name} data-testid={`health-${name}`} className="border-b border-line last:border-b-0">
              <th scope="row" className="py-3 pr-3 align-top font-normal">
                {serviceLabels[name]}
                {service.detail && <span className="block text-base text-ink-muted desk:text-sm">{service.detail}</span>}
              </th>
              <td className="py-3 pr-3 align-top">
                <ServiceStatusBadge status={service.status} />
              </td>
              <td className="py-3 text-right align-top">
                <Quantity value={service.latencyMs} unit="ms" maximumFractionDigits={0} />
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** Whether the database, file storage and mail answer, from GET /api/health. */
export function ServiceHealthPanel() {
  const health = useQuery(healthQueries.report());
  const headingId = useId();

  return (
    <section aria-labelledby={headingId} className="rounded-md border border-line bg-surface p-4 desk:p-6">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 id={headingId} className="text-lg font-semibold">
          Service health
        </h2>
        {/* Stays enabled while checking so focus is never dropped; a click joins the check in flight. */}
        <Button data-print="hide" onClick={() => void health.refetch({ cancelRefetch: false })}>
          {health.isFetching ? 'Checking…' : 'Check again'}
        </Button>
      </div>

      <div>
        {health.isPending ? (
          <p className="text-ink-muted">Checking the services…</p>
        ) : health.isError ? (
          <div role="alert">
            <p className="font-semibold">
              {isApiError(health.error) && health.error.isUnreachable
                ? 'Could not reach the server'
                : 'The health check failed'}
            </p>
            <p className="mt-1 text-ink-muted">
              {isApiError(health.error) && health.error.isUnreachable
                ? 'Varden’s server did not answer, so the state of the database, file storage and mail is unknown. Varden asks again every 30 seconds.'
                : health.error.message}
            </p>
          </div>
        ) : (
          <>
            <p className="mb-2 flex flex-wrap items-center gap-x-2">
              <ServiceStatusBadge status={health.data.status} />
              <span>{health.data.status === 'up' ? 'All services answer.' : 'At least one service is not answering.'}</span>
            </p>
            <ServiceTable report={health.data} />
            <p className="mt-3 text-base text-ink-muted desk:text-sm">
              Checked at <span className="numeric">{checkedAt(health.data.time)}</span> · version{' '}
              <span className="numeric">{health.data.version}</span>
            </p>
          </>
        )}
      </div>
    </section>
  );
}
