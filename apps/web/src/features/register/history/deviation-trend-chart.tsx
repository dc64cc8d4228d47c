import { defaultPolicy } from '@varden/engineering';
import { CartesianGrid, Line, LineChart, ReferenceLine, XAxis, YAxis } from 'recharts';
import { useId, useState } from 'react';
import { readerDateFormat } from '../../../lib/reader-format';

/** One reading's deviation from nameplate, for the trend. */
export type DeviationPoint = { date: string; deviationPct: number };

/** The policy's thresholds: below −5 % a unit is watched, below −10 % replaced (engineering defaultPolicy). */
export const trendThresholds = {
  watchPct: defaultPolicy.watchBelowPct,
  replacePct: defaultPolicy.replaceBelowPct,
} as const;

const dayMs = 86_400_000;
const dateFormat = readerDateFormat({ year: 'numeric', month: 'short' });
/** −5 with a true minus sign, as the axis writes it. */
const signed = (pct: number) => `${pct < 0 ? '−' : ''}${Math.abs(pct)}`;
const dateOf = (iso: string) => Date.parse(`${iso.slice(0, 10)}T00:00:00Z`);

type ThresholdLabelProps = { viewBox?: { x?: number; y?: number; width?: number }; text: string; shape: 'triangle' | 'square'; tone: 'watch' | 'replace' };

/** A threshold's name beside its line, with its band's shape: colour, shape and word together. */
function ThresholdLabel({ viewBox, text, shape, tone }: ThresholdLabelProps) {
  const x = (viewBox?.x ?? 0) + 8;
  const y = (viewBox?.y ?? 0) - 6;
  return (
    <g className={tone === 'watch' ? 'fill-watch' : 'fill-replace'}>
      {shape === 'triangle' ? <path d={`M${x + 5} ${y - 10} ${x + 10} ${y}H${x}Z`} /> : <rect x={x} y={y - 10} width="10" height="10" />}
      <text x={x + 15} y={y} className="text-xs font-medium">
        {text}
      </text>
    </g>
  );
}

type DeviationTrendChartProps = {
  points: readonly DeviationPoint[];
  /** The unit's installation date, where the time axis starts when known. */
  from: string | null;
};

/**
 * Deviation from nameplate over time with the watch and replace thresholds drawn. With no
 * readings yet it still draws the frame and the thresholds, and says so; the reading history
 * table beside it is the same data as text.
 */
export function DeviationTrendChart({ points, from }: DeviationTrendChartProps) {
  const descriptionId = useId();
  const data: Array<{ t: number; deviationPct: number | null; frame?: number }> = points.map((point) => ({ t: dateOf(point.date), deviationPct: point.deviationPct }));
  // Today, fixed when the chart first draws, so the axis does not creep on every render.
  const [now] = useState(Date.now);
  const start = Math.min(from ? dateOf(from) : now - 365 * dayMs, ...data.map((point) => point.t));
  const end = Math.max(now, start + 90 * dayMs, ...data.map((point) => point.t));
  const lowest = Math.min(-15, ...data.map((point) => Math.floor((point.deviationPct ?? 0) / 5) * 5));
  const highest = Math.max(10, ...data.map((point) => Math.ceil((point.deviationPct ?? 0) / 5) * 5));

  return (
    <figure className="grid min-w-0 gap-2">
      <div className="relative min-w-0" role="img" aria-describedby={descriptionId} aria-label="Deviation from nameplate over time">
        <LineChart
          responsive
          accessibilityLayer={false}
          style={{ width: '100%', height: 260 }}
          // Without points the library draws no axes: two invisible frame points at 0 % keep them and the thresholds.
          data={data.length > 0 ? data : [{ t: start, deviationPct: null, frame: 0 }, { t: end, deviationPct: null, frame: 0 }]}
          margin={{ top: 20, right: 16, bottom: 4, left: 0 }}
        >
          <CartesianGrid strokeDasharray="2 4" stroke="var(--v-line)" />
          <XAxis
            dataKey="t"
            type="number"
            scale="time"
            domain={[start, end]}
            tickFormatter={(t: number) => dateFormat.format(new Date(t))}
            tick={{ fill: 'var(--v-ink-muted)', fontSize: 12 }}
            stroke="var(--v-line-strong)"
            minTickGap={24}
          />
          <YAxis
            type="number"
            domain={[lowest, highest]}
            ticks={Array.from({ length: (highest - lowest) / 5 + 1 }, (_, i) => lowest + i * 5)}
            tickFormatter={(value: number) => `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(value)} %`}
            tick={{ fill: 'var(--v-ink-muted)', fontSize: 12 }}
            stroke="var(--v-line-strong)"
            width={52}
            allowDataOverflow
          />
          <ReferenceLine y={0} stroke="var(--v-line-strong)" />
          <ReferenceLine
            y={trendThresholds.watchPct}
            stroke="var(--v-watch)"
            strokeDasharray="6 4"
            strokeWidth={2}
            label={(props: ThresholdLabelProps) => <ThresholdLabel {...props} text={`Watch below ${signed(trendThresholds.watchPct)} %`} shape="triangle" tone="watch" />}
          />
          <ReferenceLine
            y={trendThresholds.replacePct}
            stroke="var(--v-replace)"
            strokeWidth={2}
            label={(props: ThresholdLabelProps) => (
              <ThresholdLabel {...props} text={`Replace below ${signed(trendThresholds.replacePct)} %`} shape="square" tone="replace" />
            )}
          />
          {data.length > 0 ? (
            <Line type="linear" dataKey="deviationPct" stroke="var(--v-ink)" strokeWidth={2} dot={{ r: 4, fill: 'var(--v-ink)' }} isAnimationActive={false} />
          ) : (
            <Line dataKey="frame" stroke="transparent" dot={false} activeDot={false} isAnimationActive={false} legendType="none" />
          )}
        </LineChart>
        {data.length === 0 && (
          <p className="pointer-events-none absolute inset-x-0 top-8 mx-auto w-fit max-w-[80%] rounded bg-surface/90 px-3 py-2 text-center text-base text-ink-muted shadow-sm desk:text-sm">
            No readings recorded yet: the trend starts with the first inspection.
          </p>
        )}
      </div>
      <figcaption id={descriptionId} className="text-base text-ink-muted desk:text-sm">
        Deviation of the measured capacitance from the nameplate, in %, over time. The dashed line marks the watch threshold (
        {signed(trendThresholds.watchPct)} %), the solid line the replace threshold ({signed(trendThresholds.replacePct)} %).{' '}
        {data.length === 0 ? 'No points yet.' : `${data.length} readings; the reading history table lists them.`}
      </figcaption>
    </figure>
  );
}
