import { Link } from 'react-router-dom';
import { formatDate } from '../../../lib/date-format';
import type { UnitResultRow } from '../lib/order-results';
import { methodLabels } from '../lib/work-order-words';
import { paths } from '../../../config/paths';
import { Band, Kvar, Legs, SignedPercent } from './result-values';

const th = 'border-b border-line-strong px-3 py-2 text-left text-sm font-medium text-ink-muted align-bottom';
const td = 'px-3 py-3 align-top';

function Reasons({ row }: { row: UnitResultRow }) {
  const current = row.current;
  if (!current) return null;
  const all = [...current.reasons, ...current.warnings];
  return (
    <>
      {all.length > 0 && (
        <ul className="grid list-disc gap-0.5 pl-4 text-sm">
          {all.map((reason, i) => (
            <li key={i}>{reason}</li>
          ))}
        </ul>
      )}
      {current.earlierOnOrder > 0 && (
        <p className="mt-1 text-sm text-ink-muted">
          Measured {current.earlierOnOrder + 1} times on this order; the latest counts.
        </p>
      )}
    </>
  );
}

const methodOf = (row: UnitResultRow) => (row.current?.method ? (methodLabels[row.current.method] ?? row.current.method) : null);

function UnitName({ row, withMethod = false }: { row: UnitResultRow; withMethod?: boolean }) {
  const method = withMethod ? methodOf(row) : null;
  return (
    <span className="grid">
      <span className="font-medium whitespace-nowrap">
        Step {row.stepNumber}, unit {row.position}
      </span>
      <span className="text-sm text-ink-muted [overflow-wrap:anywhere]">{row.serial || 'No serial'}</span>
      {method && <span className="mt-1 text-sm">Method: {method}</span>}
    </span>
  );
}

function Previous({ row, linkOrders }: { row: UnitResultRow; linkOrders: boolean }) {
  const previous = row.previous;
  if (!previous) return <span className="text-ink-muted">No earlier reading</span>;
  const date = formatDate(previous.recordedAt);
  return (
    <span className="grid gap-1">
      {linkOrders ? <Link to={paths.workOrders.detail.getHref(previous.workOrderId)}>{date}</Link> : <span>{date}</span>}
      <Kvar value={previous.kvarAtRated} />
      <SignedPercent value={previous.deviationPct} />
      <Band band={previous.band} />
    </span>
  );
}

type UnitResultsProps = {
  rows: readonly UnitResultRow[];
  /** The review shows each unit's previous reading beside this order's. */
  withPrevious: boolean;
  caption: string;
  /** Links to earlier orders; left out of the printed record. */
  linkOrders?: boolean;
};

/**
 * Each capacitor unit's result on this order: method, legs, kvar at rated, deviation, band and
 * its reasons; with the previous reading beside it for the review. A desk gets a table, a
 * phone one card per unit.
 */
export function UnitResults({ rows, withPrevious, caption, linkOrders = true }: UnitResultsProps) {
  if (rows.length === 0) return <p className="text-ink-muted">This bank has no capacitor units in the register.</p>;
  return (
    <>
      <div role="region" aria-label={caption} tabIndex={0} className="relative hidden overflow-x-auto rounded-md border border-line bg-surface desk:block print:block print:overflow-visible print:border-0">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-sunken">
            {withPrevious && (
              <tr>
                <td className="border-b border-line" />
                <th scope="colgroup" colSpan={5} className="border-b border-line px-3 pt-2 text-left text-sm font-semibold">
                  This order
                </th>
                <th scope="colgroup" colSpan={2} className="border-b border-l border-line px-3 pt-2 text-left text-sm font-semibold">
                  Previous reading
                </th>
              </tr>
            )}
            <tr>
              <th scope="col" className={th}>
                Unit and method
              </th>
              <th scope="col" className={`${th} text-right`}>
                Legs
              </th>
              <th scope="col" className={`${th} text-right`}>
                kvar at rated
              </th>
              <th scope="col" className={`${th} text-right`}>
                Deviation
              </th>
              <th scope="col" className={th}>
                Band
              </th>
              <th scope="col" className={th}>
                Reasons
              </th>
              {withPrevious && (
                <>
                  <th scope="col" className={`${th} border-l border-line`}>
                    When and result
                  </th>
                  <th scope="col" className={`${th} text-right`}>
                    Change
                  </th>
                </>
              )}
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.unitId} className="border-b border-line last:border-b-0 print:break-inside-avoid">
                <th scope="row" className={`${td} text-left font-normal`}>
                  <UnitName row={row} withMethod />
                </th>
                {row.current ? (
                  <>
                    <td className={td}>
                      <Legs values={row.current.legsUF} stacked />
                    </td>
                    <td className={`${td} text-right`}>
                      <Kvar value={row.current.kvarAtRated} />
                    </td>
                    <td className={`${td} text-right`}>
                      <SignedPercent value={row.current.deviationPct} />
                    </td>
                    <td className={td}>
                      <Band band={row.current.band} />
                    </td>
                    <td className={`${td} min-w-[14rem]`}>
                      <Reasons row={row} />
                    </td>
                  </>
                ) : (
                  <td colSpan={5} className={`${td} text-ink-muted`}>
                    Not measured on this order
                  </td>
                )}
                {withPrevious && (
                  <>
                    <td className={`${td} border-l border-line`}>
                      <Previous row={row} linkOrders={linkOrders} />
                    </td>
                    <td className={`${td} text-right`}>
                      <SignedPercent value={row.deviationChangePct} unit="% pts" />
                    </td>
                  </>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      <ul aria-label={caption} className="grid gap-3 desk:hidden print:hidden">
        {rows.map((row) => (
          <li key={row.unitId} className="rounded-md border border-line bg-surface p-4">
            <UnitName row={row} />
            {row.current ? (
              <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
                <dt className="text-ink-muted">Band</dt>
                <dd>
                  <Band band={row.current.band} />
                </dd>
                <dt className="text-ink-muted">kvar at rated</dt>
                <dd>
                  <Kvar value={row.current.kvarAtRated} />
                </dd>
                <dt className="text-ink-muted">Deviation</dt>
                <dd>
                  <SignedPercent value={row.current.deviationPct} />
                </dd>
                <dt className="text-ink-muted">Legs</dt>
                <dd>
                  <Legs values={row.current.legsUF} />
                </dd>
                <dt className="text-ink-muted">Method</dt>
                <dd>{methodOf(row) ?? '—'}</dd>
              </dl>
            ) : (
              <p className="mt-2 text-ink-muted">Not measured on this order</p>
            )}
            <div className="mt-2">
              <Reasons row={row} />
            </div>
            {withPrevious && (
              <div className="mt-3 border-t border-line pt-3">
                <p className="mb-1 font-medium">Previous reading</p>
                <Previous row={row} linkOrders={linkOrders} />
                {row.deviationChangePct !== null && (
                  <p className="mt-1">
                    Change: <SignedPercent value={row.deviationChangePct} unit="% pts" />
                  </p>
                )}
              </div>
            )}
          </li>
        ))}
      </ul>
    </>
  );
}
