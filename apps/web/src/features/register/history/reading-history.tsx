import { useId } from 'react';
import { EmptyState } from '../components/empty-state';

/**
 * A unit's readings, newest first, as a table. Readings arrive with inspection orders; until
 * then the table shows its columns and says that nothing has been recorded yet.
 */
export function ReadingHistoryTable() {
  const captionId = useId();
  const headings = ['Date', 'Method', 'Capacitance per leg', 'Deviation', 'Condition', 'Order'];
  return (
    <div className="grid gap-3">
      <div role="region" aria-labelledby={captionId} tabIndex={0} className="min-w-0 overflow-x-auto rounded-md border border-line">
        <table className="w-full border-collapse text-left">
          <caption id={captionId} className="sr-only">
            Reading history of this unit
          </caption>
          <thead className="bg-sunken">
            <tr>
              {headings.map((heading) => (
                <th key={heading} scope="col" className="border-b border-line-strong px-3 py-2 text-base font-medium whitespace-nowrap desk:text-sm">
                  {heading}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <tr>
              <td colSpan={headings.length} className="p-3">
                <EmptyState title="No readings recorded yet">Readings taken on inspections will be listed here, each with its condition band.</EmptyState>
              </td>
            </tr>
          </tbody>
        </table>
      </div>
    </div>
  );
}
