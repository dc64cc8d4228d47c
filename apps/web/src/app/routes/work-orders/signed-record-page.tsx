import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Button, buttonClassName } from '../../../components/button';
import { requirePermission } from '../../../features/auth/lib/route-guards';
import { recordPdfHref, workOrders } from '../../../features/work-orders/api/work-order-queries';
import { SignedRecord } from '../../../features/work-orders/components/signed-record';
import { paths } from '../../../config/paths';
import { classNames } from '../../../lib/class-names';
import { controlClass } from '../../../components/form/field-parts';
import { idParam, orNotFound } from './route-helpers';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'work-orders:read');
    await orNotFound(queryClient.ensureQueryData(workOrders.detail(idParam(params, 'orderId'))));
    return null;
  };

const paperSizes = { a4: 'A4', letter: 'letter' } as const;
type Paper = keyof typeof paperSizes;

/** Print rules of the record: the paper, its margins, and nothing of the app's frame. */
function printStyle(paper: Paper): string {
  return `@media print {
  @page { size: ${paperSizes[paper]}; margin: 16mm 14mm 18mm; }
  html, body { background: #fff; }
  footer:not([data-record]) { display: none !important; }
  main { max-width: none !important; }
}`;
}

/** The signed record: a printable page (A4 or Letter) and the PDF the API makes of it. */
export default function SignedRecordPage() {
  const id = idParam(useParams(), 'orderId');
  const { data: order } = useSuspenseQuery(workOrders.detail(id));
  const [paper, setPaper] = useState<Paper>(() => (navigator.language === 'en-US' || navigator.language === 'en-CA' ? 'letter' : 'a4'));
  const paperId = useId();

  return (
    <>
      <title>{`Record #${order.id} ${order.title} · Varden`}</title>
      <style>{printStyle(paper)}</style>
      <div data-print="hide" className="mb-4 flex flex-wrap items-end gap-3">
        <Link to={paths.workOrders.detail.getHref(order.id)} className={buttonClassName('secondary')}>
          Order page
        </Link>
        <div className="grid gap-1">
          <label htmlFor={paperId} className="font-medium">
            Paper
          </label>
          <select id={paperId} value={paper} onChange={(e) => setPaper(e.target.value === 'letter' ? 'letter' : 'a4')} className={classNames(controlClass, 'border-line-strong desk:w-auto')}>
            <option value="a4">A4</option>
            <option value="letter">Letter</option>
          </select>
        </div>
        <Button variant="primary" onClick={() => window.print()}>
          Print record
        </Button>
        {order.locked && (
          <a href={recordPdfHref(order.id)} download className={buttonClassName('secondary')}>
            Download PDF
          </a>
        )}
      </div>
      {!order.locked && (
        <p role="status" data-print="hide" className="mb-4 rounded border-2 border-line-strong bg-sunken p-3">
          This order is not sealed yet: the record below is a draft, and the PDF is made once it is signed off.
        </p>
      )}
      <SignedRecord order={order} />
    </>
  );
}
