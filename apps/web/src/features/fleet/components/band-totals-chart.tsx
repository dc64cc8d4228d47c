import type { SiteHealth } from '@varden/schemas';
import { lazy, Suspense } from 'react';
import { ConditionGlyph, conditionBandLabels, conditionBands, type ConditionBand } from '../../../components/condition-glyph';
import { useNearView } from '../../../lib/use-near-view';
import { formatNumber, nbsp } from '../lib/number-format';
import { NoReadingMark, noReadingLabel } from './band-counts';
import { ChartWithTable } from './chart-with-table';
import { FigureTable, type FigureColumn } from './figure-table';

const BandTotalsBars = lazy(() => import('./band-totals-bars'));

type Bands = SiteHealth['bands'];
type Key = ConditionBand | 'noReading';
export type BandRow = { key: Key; label: string; units: number; sharePct: number };
type Row = BandRow;

// Worst first: what needs doing leads.
const order: Key[] = ['replace', 'remeasure', 'watch', 'healthy', 'noReading'];

export function bandRows(bands: Bands): Row[] {
  const total = Object.values(bands).reduce((a, b) => a + b, 0);
  return order.map((key) => ({
    key,
    label: key === 'noReading' ? noReadingLabel : conditionBandLabels[key],
    units: bands[key],
    sharePct: total > 0 ? (100 * bands[key]) / total : 0,
  }));
}

export const isBand = (key: Key): key is ConditionBand => (conditionBands as readonly string[]).includes(key);

const columns: FigureColumn<Row>[] = [
  { header: 'Condition', rowHeader: true, cell: (r) => (isBand(r.key) ? <ConditionGlyph band={r.key} /> : <NoReadingMark />) },
  { header: 'Units', align: 'end', cell: (r) => <span className="font-medium">{r.units}</span> },
  { header: 'Share', align: 'end', cell: (r) => `${formatNumber(r.sharePct, 1)}${nbsp}%` },
];

export function bandTotalsSummary(rows: readonly Row[]): string {
  const total = rows.reduce((sum, r) => sum + r.units, 0);
  if (total === 0) return 'No capacitor units are registered at these sites yet.';
  return `${total} capacitor units by the band of their latest reading: ${rows.map((r) => `${r.label.toLowerCase()} ${r.units}`).join(', ')}.`;
}

/** "Units by condition": every unit of the fleet counted by the band of its latest reading. */
export function BandTotalsChart({ totals }: { totals: Bands }) {
  const rows = bandRows(totals);
  // Below the sites on a phone: its code loads and draws when the reader comes near it. Until the
  // bars are drawn, a space of their height keeps the page from moving.
  const [area, near] = useNearView<HTMLDivElement>();
  const space = <div className="h-[240px]" />;
  return (
    <ChartWithTable
      subject="units by condition"
      chart={(describedBy) => (
        <div ref={area} role="img" aria-label="Capacitor units by condition band" aria-describedby={describedBy} className="min-w-0">
          {near ? (
            <Suspense fallback={space}>
              <BandTotalsBars rows={rows} />
            </Suspense>
          ) : (
            space
          )}
        </div>
      )}
      table={<FigureTable caption="Capacitor units by condition band" columns={columns} rows={rows} rowKey={(r) => r.key} />}
      caption={bandTotalsSummary(rows)}
    />
  );
}
