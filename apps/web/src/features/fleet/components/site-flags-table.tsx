import type { SiteHealth } from '@varden/schemas';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../lib/date-format';
import { FlagKind, Severity } from '../../work-orders/components/flag-mark';
import { targetLabel } from '../../work-orders/lib/work-order-words';
import { fleetLinks } from '../lib/fleet-links';
import { FigureTable, type FigureColumn } from './figure-table';

type SiteFlag = SiteHealth['openFlags'][number];

const stateWords: Record<SiteFlag['state'], string> = { open: 'Open', 'in-hand': 'In hand' };

/** What a flag is about, linked to its page: a capacitor unit to its own, any other part to its bank. */
function FlagTarget({ flag }: { flag: SiteFlag }) {
  const href = flag.target === 'capacitor-unit' ? fleetLinks.capacitorUnit(flag.targetId) : fleetLinks.bank(flag.bankId);
  return (
    <Link to={href} className="whitespace-nowrap">
      {flag.target === 'bank' ? flag.bankName : `${targetLabel(flag.target)}, ${flag.bankName}`}
    </Link>
  );
}

const columns: FigureColumn<SiteFlag>[] = [
  { header: 'Flag', rowHeader: true, cell: (f) => <FlagKind kind={f.kind} /> },
  { header: 'Severity', cell: (f) => <Severity severity={f.severity} /> },
  { header: 'On', cell: (f) => <FlagTarget flag={f} /> },
  { header: 'Finding', cell: (f) => <span className="block min-w-[16rem]">{f.message}</span> },
  {
    header: 'State',
    cell: (f) =>
      f.correctiveOrderId !== null ? (
        <Link to={fleetLinks.workOrder(f.correctiveOrderId)} className="whitespace-nowrap">
          {stateWords[f.state]}: order #{f.correctiveOrderId}
        </Link>
      ) : (
        stateWords[f.state]
      ),
  },
  { header: 'Raised', align: 'end', cell: (f) => <span className="whitespace-nowrap">{formatDate(f.raisedAt)}</span> },
];

/** "Open flags" of one site: every flag not yet cleared, newest first, each leading to what it is about. */
export function SiteFlagsTable({ flags }: { flags: SiteHealth['openFlags'] }) {
  return <FigureTable caption="Open flags of this site" columns={columns} rows={flags} rowKey={(f) => String(f.id)} empty="No open flag: every finding of this site is cleared." />;
}
