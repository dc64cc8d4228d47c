import type { UnitReading } from '@varden/schemas';
import { useId } from 'react';
import { Link } from 'react-router-dom';
import { ConditionGlyph } from '../../../components/condition-glyph';
import { paths } from '../../../config/paths';
import { methodLabels } from '../../work-orders/lib/work-order-words';
import { EmptyState } from '../components/empty-state';
import { formatDate } from '../components/formats';
import { readerNumberFormat } from '../../../lib/reader-format';

const nbsp = '\u00A0';
const uf = readerNumberFormat({ minimumFractionDigits: 1, maximumFractionDigits: 1 });
const signedPct = (v: number) => `${v > 0 ? '+' : v < 0 ? '−' : ''}${uf.format(Math.abs(v))}${nbsp}%`;

/**
 * A unit's readings, newest first, as a table: when, by which method, each leg's capacitance,
 * the deviation from nameplate, the band, and the order it was taken on. Until the first
 * inspection it shows its columns and says that nothing has been recorded yet.
 */
export function ReadingHistoryTable({ readings }: { readings: readonly UnitReading[] }) {
  const captionId = useId();
  const headings = ['Date', 'Method', 'Capacitance per leg', 'Deviation', 'Condition', 'Order'];
  return (
    <div className="grid gap-3">
      <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
        <table className="w-full border-collapse text-left text-base desk:text-sm">
          <caption id={captionId} className="sr-only">
            Reading history of this unit
          </caption>
          <thead className="bg-sunken">
            <tr>
              {headings.map((heading) => (
                <th key={heading} scope="col" className={`border-b border-line-strong px-3 py-2 font-medium whitespace-nowrap${heading === 'Deviation' ? ' text-right' : ''}`}>
                  {heading}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {readings.length === 0 ? (
              <tr>
                <td colSpan={headings.length} className="p-3">
                  <EmptyState title="No readings recorded yet">Readings taken on inspections will be listed here, each with its condition band.</EmptyState>
                </td>
              </tr>
            ) : (
              readings.map((r) => (
                <tr key={r.id} className="border-b border-line last:border-b-0">
                  <th scope="row" className="px-3 py-2 font-medium whitespace-nowrap">
                    {formatDate(r.recordedAt)}
                  </th>
                  <td className="px-3 py-2">{methodLabels[r.method] ?? r.method}</td>
                  <td className="numeric px-3 py-2 whitespace-nowrap">
                    {r.legsUF.map((leg) => uf.format(leg)).join(' · ')}
                    <span className="text-ink-muted">{nbsp}µF</span>
                  </td>
                  <td className="numeric px-3 py-2 text-right whitespace-nowrap">{signedPct(r.deviationPct)}</td>
                  <td className="px-3 py-2">
                    <ConditionGlyph band={r.band} />
                  </td>
                  <td className="px-3 py-2 whitespace-nowrap">
                    <Link to={r.workOrderState === 'sealed' ? paths.workOrders.record.getHref(r.workOrderId) : paths.workOrders.detail.getHref(r.workOrderId)}>
                      #{r.workOrderId}
                    </Link>
                  </td>
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
