import type { SiteHealth } from '@varden/schemas';
import { Bar, BarChart, CartesianGrid, ReferenceArea, ReferenceLine, XAxis, YAxis, type BarShapeProps } from 'recharts';
import { needsThirdHarmonic } from '../lib/harmonic-axis';
import { formatNumber, nbsp, ordinal } from '../lib/number-format';
import { tuningDomain, tuningRows, type TuningRow } from '../lib/tuning-rows';
import { ChartWithTable } from './chart-with-table';
import { FigureTable, type FigureColumn } from './figure-table';
import { StatusWord } from './status-word';

const hz = (v: number) => `${formatNumber(v, 0)}${nbsp}Hz`;
const signedPct = (v: number) => `${v >= 0 ? '+' : '−'}${formatNumber(Math.abs(v), 1)}${nbsp}%`;
const rowHeight = 46;

const standingWords: Record<TuningRow['standing'], string> = { near: 'near', shifted: 'shifted', 'as-designed': 'as designed' };
const tones: Record<TuningRow['standing'], { fill: string; stroke: string; text: string }> = {
  near: { fill: 'fill-replace', stroke: 'stroke-replace', text: 'fill-replace font-semibold' },
  shifted: { fill: 'fill-watch', stroke: 'stroke-watch', text: 'fill-watch font-semibold' },
  'as-designed': { fill: 'fill-ink', stroke: 'stroke-ink', text: 'fill-ink' },
};

/** One step's drift: a hollow bar at its design, a solid bar where it tunes now, a line between and the figures above. */
function DriftMark({ x, y, width, height, row }: { x: number; y: number; width: number; height: number; row: TuningRow | undefined }) {
  if (!row) return null;
  const rising = row.tuningHz >= row.designHz;
  const designX = rising ? x : x + width;
  const nowX = rising ? x + width : x;
  const mid = y + height / 2 + 6;
  const tone = tones[row.standing];
  const words =
    row.standing === 'as-designed'
      ? Math.abs(row.shiftPct) < 0.05
        ? `${hz(row.tuningHz)}, as designed`
        : `${hz(row.tuningHz)}, ${signedPct(row.shiftPct)} · within 5 % of design`
      : `${hz(row.tuningHz)}, ${signedPct(row.shiftPct)} · ${row.standing === 'near' ? `near the ${ordinal(row.nearestHarmonic)}` : standingWords[row.standing]}`;
  return (
    <g data-step={row.stepId} data-standing={row.standing}>
      <line x1={designX} x2={nowX} y1={mid} y2={mid} className={tone.stroke} strokeWidth="2" />
      <rect x={designX - 3} y={mid - 8} width="6" height="16" rx="1" className="fill-surface stroke-ink-muted" strokeWidth="1.5" />
      <rect x={nowX - 3} y={mid - 9} width="6" height="18" rx="1" className={`${tone.fill} ${tone.stroke}`} strokeWidth="1" />
      <text x={Math.min(designX, nowX)} y={mid - 13} className={`text-xs ${tone.text}`} style={{ paintOrder: 'stroke', stroke: 'var(--v-surface)', strokeWidth: 4 }}>
        {words}
      </text>
    </g>
  );
}

type TickProps = { x?: number | string; y?: number | string; payload?: { value?: string } };

/** A step's name beside its row in two lines: the bank, then the step. */
function StepTick({ x = 0, y = 0, payload, rows }: TickProps & { rows: TuningRow[] }) {
  const row = rows.find((r) => r.label === payload?.value);
  if (!row) return null;
  return (
    <text x={Number(x) - 6} y={Number(y)} textAnchor="end" className="fill-ink text-xs">
      <tspan x={Number(x) - 6} dy={-1}>
        {row.bankName}
      </tspan>
      <tspan x={Number(x) - 6} dy={14}>
        step {row.stepNumber}
      </tspan>
    </text>
  );
}

function DriftChart({ health, rows, describedBy }: { health: SiteHealth; rows: TuningRow[]; describedBy: string }) {
  const [low, high] = tuningDomain(rows, health);
  const fifth = 5 * health.frequencyHz;
  const third = 3 * health.frequencyHz;
  return (
    <div role="img" aria-label="Tuning frequency of each detuned step against its design and the 5th harmonic" aria-describedby={describedBy} className="min-w-0">
      <BarChart
        responsive
        accessibilityLayer={false}
        layout="vertical"
        data={rows}
        style={{ width: '100%', height: rows.length * rowHeight + 56 }}
        margin={{ top: 22, right: 16, bottom: 4, left: 0 }}
        barCategoryGap={6}
      >
        <CartesianGrid horizontal={false} strokeDasharray="2 4" stroke="var(--v-line)" />
        <ReferenceArea x1={fifth * 0.9} x2={fifth} fill="var(--v-sunken)" fillOpacity={1} stroke="var(--v-line-strong)" strokeDasharray="2 3" ifOverflow="hidden" />
        <XAxis
          type="number"
          domain={[low, high]}
          allowDataOverflow
          tickFormatter={(v: number) => `${formatNumber(v, 0)}`}
          tick={{ fill: 'var(--v-ink-muted)', fontSize: 12 }}
          stroke="var(--v-line-strong)"
          unit=" Hz"
          tickCount={6}
        />
        <YAxis type="category" dataKey="label" width={84} tick={(props: TickProps) => <StepTick {...props} rows={rows} />} stroke="var(--v-line-strong)" interval={0} />
        <ReferenceLine
          x={fifth}
          stroke="var(--v-replace)"
          strokeWidth={2}
          label={{ value: `5th ${hz(fifth)}`, position: 'top', fill: 'var(--v-replace)', fontSize: 12, fontWeight: 600 }}
        />
        {needsThirdHarmonic(health) && (
          <ReferenceLine x={third} stroke="var(--v-replace)" strokeWidth={2} label={{ value: `3rd ${hz(third)}`, position: 'top', fill: 'var(--v-replace)', fontSize: 12, fontWeight: 600 }} />
        )}
        <Bar
          dataKey={(row: TuningRow) => [Math.min(row.designHz, row.tuningHz), Math.max(row.designHz, row.tuningHz)]}
          isAnimationActive={false}
          // Above the reference lines (400), below the axes (500): the figures stay readable over the 5th.
          zIndex={450}
          shape={(props: BarShapeProps) => <DriftMark x={props.x} y={props.y} width={props.width} height={props.height} row={rows[props.index]} />}
        />
      </BarChart>
    </div>
  );
}

function RowStanding({ row }: { row: TuningRow }) {
  if (row.standing === 'near') return <StatusWord standing="fault">{`Near the ${ordinal(row.nearestHarmonic)}`}</StatusWord>;
  if (row.standing === 'shifted') return <StatusWord standing="short">Shifted</StatusWord>;
  return <StatusWord standing="met">As designed</StatusWord>;
}

const columns: FigureColumn<TuningRow>[] = [
  { header: 'Step', rowHeader: true, cell: (r) => r.label },
  { header: 'Design', align: 'end', cell: (r) => hz(r.designHz) },
  { header: 'Now', align: 'end', cell: (r) => <span className="font-medium">{hz(r.tuningHz)}</span> },
  { header: 'Shift', align: 'end', cell: (r) => signedPct(r.shiftPct) },
  { header: '5th harmonic', align: 'end', cell: (r) => hz(r.fifthHarmonicHz) },
  { header: 'Nearest harmonic', align: 'end', cell: (r) => `${ordinal(r.nearestHarmonic)}, ${formatNumber(r.distancePct, 1)}${nbsp}% away` },
  { header: 'Standing', cell: (r) => <RowStanding row={r} /> },
];

/** The words for the chart: each step's tuning against its design and the 5th. */
export function tuningSummary(rows: readonly TuningRow[], frequencyHz: number): string {
  const fifth = 5 * frequencyHz;
  const parts = rows.map(
    (r) =>
      `${r.label}: ${hz(r.tuningHz)} against ${hz(r.designHz)} designed (${signedPct(r.shiftPct)}), ${formatNumber((100 * (fifth - r.tuningHz)) / fifth, 0)}${nbsp}% below the 5th${r.standing === 'near' ? ', warning' : r.standing === 'shifted' ? ', shifted' : ''}`,
  );
  return `Tuning frequency of each detuned step, with the 5th harmonic at ${hz(fifth)} and the band within 10 % below it shaded. ${parts.join('; ')}.`;
}

/** "Tuning drift": each detuned step's tuning frequency against its design and the 5th harmonic. */
export function TuningDriftChart({ health }: { health: SiteHealth }) {
  const rows = tuningRows(health);
  return (
    <ChartWithTable
      subject="tuning drift"
      chart={(describedBy) => <DriftChart health={health} rows={rows} describedBy={describedBy} />}
      legend={
        <ul className="flex flex-wrap gap-x-5 gap-y-1">
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 8 16" className="h-4 w-2">
              <rect x="1" y="1" width="6" height="14" rx="1" className="fill-surface stroke-ink-muted" strokeWidth="1.5" />
            </svg>
            Design
          </li>
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 8 16" className="h-4 w-2">
              <rect x="1" y="1" width="6" height="14" rx="1" className="fill-ink" />
            </svg>
            Now (ochre: shifted over 5&nbsp;%; red: within 10&nbsp;% of a harmonic)
          </li>
          <li className="inline-flex items-center gap-2">
            <span aria-hidden="true" className="inline-block h-3 w-4 border border-dashed border-line-strong bg-sunken" />
            Within 10&nbsp;% below the 5th
          </li>
        </ul>
      }
      table={<FigureTable caption="Tuning of each detuned step" columns={columns} rows={rows} rowKey={(r) => String(r.stepId)} />}
      caption={tuningSummary(rows, health.frequencyHz)}
    />
  );
}
