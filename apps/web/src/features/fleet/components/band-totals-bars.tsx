import { Bar, BarChart, CartesianGrid, LabelList, XAxis, YAxis, type BarShapeProps } from 'recharts';
import type { ConditionBand } from '../../../components/condition-glyph';
import { isBand, type BandRow } from './band-totals-chart';

// The bar chart of "Units by condition", in a module of its own: recharts is most of the fleet
// dashboard's code, so the page draws its figures and tables first and the bars when this arrives.

type Row = BandRow;

const colours: Record<ConditionBand, string> = {
  healthy: 'var(--v-healthy)',
  watch: 'var(--v-watch)',
  replace: 'var(--v-replace)',
  remeasure: 'var(--v-remeasure)',
};

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

/** The bars: one per band, worst first, each in its band's colour and glyph. */
export default function BandTotalsBars({ rows }: { rows: Row[] }) {
  const highest = Math.max(1, ...rows.map((r) => r.units));
  return (
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
  );
}
