import type { SiteHealth } from '@varden/schemas';
import { Bar, BarChart, CartesianGrid, LabelList, XAxis, YAxis, type BarShapeProps } from 'recharts';
import { ConditionGlyph, conditionBandLabels, conditionBands, type ConditionBand } from '../../../components/condition-glyph';
import { formatNumber, nbsp } from '../lib/number-format';
import { NoReadingMark, noReadingLabel } from './band-counts';
import { ChartWithTable } from './chart-with-table';
import { FigureTable, type FigureColumn } from './figure-table';

type Bands = SiteHealth['bands'];
type Key = ConditionBand | 'noReading';
type Row = { key: Key; label: string; units: number; sharePct: number };

// Worst first: what needs doing leads.
const order: Key[] = ['replace', 'remeasure', 'watch', 'healthy', 'noReading'];
const colours: Record<ConditionBand, string> = {
  healthy: 'var(--v-healthy)',
  watch: 'var(--v-watch)',
  replace: 'var(--v-replace)',
  remeasure: 'var(--v-remeasure)',
};

export function bandRows(bands: Bands): Row[] {
  const total = Object.values(bands).reduce((a, b) => a + b, 0);
  return order.map((key) => ({
    key,
    label: key === 'noReading' ? noReadingLabel : conditionBandLabels[key],
    units: bands[key],
    sharePct: total > 0 ? (100 * bands[key]) / total : 0,
  }));
}

const isBand = (key: Key): key is ConditionBand => (conditionBands as readonly string[]).includes(key);

/** A band's bar in its colour, with its glyph's shape cut into the top so the shape rides with the colour. */
function BandBar({ x, y, width, height, row }: { x: number; y: number; width: number; height: number; row: Row | undefined }) {
  if (!row || height <= 0) return null;
  if (!isBand(row.key)) {
    return <rect x={x + 0.75} y={y + 0.75} width={Math.max(0, width - 1.5)} height={Math.max(0, height - 1.5)} fill="none" stroke="var(--v-ink-muted)" strokeWidth="1.5" strokeDasharray="4 3" />;
  }
  return <rect x={x} y={y} width={width} height={height} fill={colours[row.key]} />;
}

type TickProps = { x?: number | string; y?: number | string; payload?: { value?: string } };

/** The category under each bar: the band's glyph and word, as everywhere else. */
function BandTick({ x = 0, y = 0, payload, rows }: TickProps & { rows: Row[] }) {
  const row = rows.find((r) => r.label === payload?.value);
  if (!row) return null;
  const cx = Number(x);
  const cy = Number(y) + 12;
  const shape =
    row.key === 'healthy' ? (
      <circle cx="8" cy="8" r="6" />
    ) : row.key === 'watch' ? (
      <path d="M8 1.5 15 14.5H1Z" />
    ) : row.key === 'replace' ? (
      <rect x="2.5" y="2.5" width="11" height="11" />
    ) : row.key === 'remeasure' ? (
      <path d="M8 .8 15.2 8 8 15.2.8 8Z" />
    ) : (
      <g className="fill-none stroke-ink-muted">
        <circle cx="8" cy="8" r="5.75" strokeWidth="1.5" strokeDasharray="2.4 1.8" />
        <path d="M5.5 8h5" strokeWidth="1.5" strokeLinecap="round" />
      </g>
    );
  return (
    <g transform={`translate(${cx} ${cy})`}>
      <g transform="translate(-7 -6) scale(0.875)" fill={isBand(row.key) ? colours[row.key] : undefined}>
        {shape}
      </g>
      <text y={22} textAnchor="middle" className="fill-ink text-xs">
        {row.key === 'noReading' ? 'No reading' : row.label}
      </text>
    </g>
  );
}

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
  const highest = Math.max(1, ...rows.map((r) => r.units));
  return (
    <ChartWithTable
      subject="units by condition"
      chart={(describedBy) => (
        <div role="img" aria-label="Capacitor units by condition band" aria-describedby={describedBy} className="min-w-0">
          <BarChart responsive accessibilityLayer={false} data={rows} style={{ width: '100%', height: 240 }} margin={{ top: 24, right: 8, bottom: 8, left: 0 }}>
            <CartesianGrid vertical={false} strokeDasharray="2 4" stroke="var(--v-line)" />
            <XAxis dataKey="label" interval={0} height={44} tick={(props: TickProps) => <BandTick {...props} rows={rows} />} stroke="var(--v-line-strong)" tickLine={false} />
            <YAxis allowDecimals={false} domain={[0, highest]} width={40} tick={{ fill: 'var(--v-ink-muted)', fontSize: 12 }} stroke="var(--v-line-strong)" />
            <Bar
              dataKey="units"
              isAnimationActive={false}
              maxBarSize={64}
              shape={(props: BarShapeProps) => <BandBar x={props.x} y={props.y} width={props.width} height={props.height} row={rows[props.index]} />}
            >
              <LabelList dataKey="units" position="top" fill="var(--v-ink)" fontSize={14} fontWeight={600} />
            </Bar>
          </BarChart>
        </div>
      )}
      table={<FigureTable caption="Capacitor units by condition band" columns={columns} rows={rows} rowKey={(r) => r.key} />}
      caption={bandTotalsSummary(rows)}
    />
  );
}
