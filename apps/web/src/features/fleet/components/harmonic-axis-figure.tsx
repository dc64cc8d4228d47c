import type { SiteHealth } from '@varden/schemas';
import type { CSSProperties } from 'react';
import { useElementWidth } from '../hooks/use-element-width';
import {
  assignLanes,
  axisLastOrder,
  beyondOrder,
  harmonicAxisMarkers,
  harmonicAxisSummary,
  harmonicTicks,
  labelExtent,
  needsThirdHarmonic,
  orderX,
  type AxisMarker,
} from '../lib/harmonic-axis';
import { formatNumber, nbsp, ordinal } from '../lib/number-format';
import { ChartWithTable } from './chart-with-table';
import { FigureTable, type FigureColumn } from './figure-table';
import { StatusWord } from './status-word';

const halo: CSSProperties = { paintOrder: 'stroke', stroke: 'var(--v-surface)', strokeWidth: 4, strokeLinejoin: 'round' };
const laneHeight = 20;
/** Within this distance of a characteristic harmonic a resonance or a tuning warns [COMMON] §4–5. */
const warningMarginPct = 10;

function markerTone(marker: AxisMarker) {
  if (marker.warning) return { stroke: 'stroke-replace', fill: 'fill-replace', text: 'fill-replace font-semibold' };
  if (marker.shifted) return { stroke: 'stroke-watch', fill: 'fill-watch', text: 'fill-watch font-semibold' };
  return { stroke: 'stroke-ink-muted', fill: 'fill-ink', text: 'fill-ink' };
}

/** The text on the drawing: the marker's label and, when it warns or drifted, the word for it. */
const drawnText = (marker: AxisMarker) =>
  marker.kind === 'tuning' && marker.shifted ? `${marker.label} shifted` : marker.beyond && marker.kind === 'resonance' ? `${marker.label} →` : marker.label;

function AxisDrawing({ health, describedBy }: { health: SiteHealth; describedBy: string }) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const scale = { width, left: 14, right: 14 };
  const ticks = harmonicTicks(health.frequencyHz, needsThirdHarmonic(health));
  const markers = harmonicAxisMarkers(health);
  const above = markers.filter((m) => m.kind === 'resonance');
  const below = markers.filter((m) => m.kind !== 'resonance');
  const place = (list: AxisMarker[]) => {
    const extents = list.map((m) => labelExtent(orderX(m.shownOrder, scale), drawnText(m), width));
    const lanes = assignLanes(extents);
    return list.map((marker, i) => ({ marker, x: orderX(marker.shownOrder, scale), lane: lanes[i]!, anchor: extents[i]!.anchor }));
  };
  const top = place(above);
  const bottom = place(below);
  const topLanes = Math.max(1, ...top.map((p) => p.lane + 1));
  const bottomLanes = bottom.length === 0 ? 0 : Math.max(1, ...bottom.map((p) => p.lane + 1));
  const axisY = 22 + topLanes * laneHeight + 10;
  const tickLabelY = axisY + 18;
  const bottomStart = tickLabelY + (bottom.length === 0 ? 20 : 46);
  const height = bottomStart + bottomLanes * laneHeight + 8;
  const x = (order: number) => orderX(order, scale);

  return (
    <div ref={ref} className="min-w-0">
      <svg role="img" aria-label="Harmonic axis" aria-describedby={describedBy} viewBox={`0 0 ${width} ${height}`} style={{ width: '100%', height: 'auto' }} className="block overflow-visible">
        {/* Shaded: within 10 % of a characteristic harmonic. */}
        {ticks
          .filter((t) => t.characteristic)
          .map((t) => (
            <g key={`zone-${t.order}`}>
              <rect
                x={x(t.order * (1 - warningMarginPct / 100))}
                width={x(t.order * (1 + warningMarginPct / 100)) - x(t.order * (1 - warningMarginPct / 100))}
                y={18}
                height={height - 26}
                className="fill-sunken"
              />
              <line x1={x(t.order)} x2={x(t.order)} y1={18} y2={height - 8} className="stroke-line-strong" strokeWidth="1" strokeDasharray="2 3" />
            </g>
          ))}
        {top.length > 0 && (
          <text x={scale.left} y={12} className="fill-ink-muted text-xs" style={halo}>
            Resonance with the supply
          </text>
        )}
        {/* Detuned steps tune low (orders 2–5): their heading sits at the right, clear of their pins. */}
        {bottom.length > 0 && (
          <text x={width - scale.right} y={bottomStart - 10} textAnchor="end" className="fill-ink-muted text-xs" style={halo}>
            Detuned steps’ tuning
          </text>
        )}
        <line x1={x(1)} x2={x(axisLastOrder)} y1={axisY} y2={axisY} className="stroke-ink" strokeWidth="2" />
        <path d={`M ${x(axisLastOrder) + 4} ${axisY} H ${x(beyondOrder) + 6}`} className="stroke-ink-muted" strokeWidth="1.5" strokeDasharray="3 3" />
        <path d={`M ${x(beyondOrder) + 2} ${axisY - 4} l 6 4 -6 4`} className="fill-none stroke-ink-muted" strokeWidth="1.5" />
        {ticks.map((t) => (
          <g key={t.order}>
            <line x1={x(t.order)} x2={x(t.order)} y1={axisY - (t.characteristic ? 7 : 4)} y2={axisY + (t.characteristic ? 7 : 4)} className="stroke-ink" strokeWidth={t.characteristic ? 2.5 : 1.5} />
            {(t.characteristic || t.order === 1 || (width >= 480 && t.order % 2 === 0) || width >= 720) && (
              <text x={x(t.order)} y={tickLabelY} textAnchor="middle" className={t.characteristic ? 'fill-ink text-xs font-semibold' : 'fill-ink-muted text-xs'} style={halo}>
                {t.characteristic ? ordinal(t.order) : t.order}
              </text>
            )}
            {t.characteristic && width >= 400 && (
              <text x={x(t.order)} y={tickLabelY + 14} textAnchor="middle" className="fill-ink-muted text-xs" style={halo}>
                {formatNumber(t.hz, 0)}
                {nbsp}Hz
              </text>
            )}
          </g>
        ))}

        {top.map(({ marker, x: mx, lane, anchor }) => {
          const tone = markerTone(marker);
          const labelY = 22 + (topLanes - 1 - lane) * laneHeight + 12;
          return (
            <g key={marker.id} data-marker={marker.kind} data-warning={marker.warning || undefined}>
              <line x1={mx} x2={mx} y1={axisY - 2} y2={labelY + 4} className={tone.stroke} strokeWidth={marker.warning ? 2 : 1.25} />
              {/* A resonance point: a cross on the axis. */}
              <path d={`M ${mx - 5} ${axisY - 5} l 10 10 M ${mx + 5} ${axisY - 5} l -10 10`} className={tone.stroke} strokeWidth={marker.warning ? 3 : 2} strokeLinecap="round" />
              <text x={anchor === 'start' ? mx + 4 : mx - 4} y={labelY} textAnchor={anchor} className={`text-xs ${tone.text}`} style={halo}>
                {drawnText(marker)}
              </text>
            </g>
          );
        })}

        {bottom.map(({ marker, x: mx, lane, anchor }) => {
          const tone = markerTone(marker);
          const labelY = bottomStart + lane * laneHeight + 12;
          const design = marker.kind === 'design';
          return (
            <g key={marker.id} data-marker={marker.kind} data-warning={marker.warning || undefined}>
              <line
                x1={mx}
                x2={mx}
                y1={axisY + 2}
                y2={labelY - 10}
                className={design ? 'stroke-ink-muted' : tone.stroke}
                strokeWidth={design ? 1.25 : marker.warning ? 2 : 1.25}
                strokeDasharray={design ? '3 3' : undefined}
              />
              {/* A step's tuning: a bar across the axis, hollow where it was designed, solid where it is now. */}
              <rect
                x={mx - 2.5}
                y={axisY - 8}
                width="5"
                height="16"
                rx="1"
                className={design ? 'fill-surface stroke-ink-muted' : `${tone.fill} ${tone.stroke}`}
                strokeWidth="1.5"
              />
              <text x={anchor === 'start' ? mx + 4 : mx - 4} y={labelY} textAnchor={anchor} className={`text-xs ${design ? 'fill-ink-muted' : tone.text}`} style={halo}>
                {drawnText(marker)}
              </text>
            </g>
          );
        })}
      </svg>
    </div>
  );
}

function MarkerStanding({ marker }: { marker: AxisMarker }) {
  if (marker.warning && marker.nearestHarmonic !== null)
    return <StatusWord standing="fault">{`Near the ${ordinal(marker.nearestHarmonic)}`}</StatusWord>;
  if (marker.shifted) return <StatusWord standing="short">Shifted from design</StatusWord>;
  if (marker.kind === 'design') return <span className="text-ink-muted">Design</span>;
  return <span className="text-ink-muted">Clear</span>;
}

const kindWords: Record<AxisMarker['kind'], string> = { resonance: 'Resonance', tuning: 'Tuning now', design: 'Design tuning' };

const columns: FigureColumn<AxisMarker>[] = [
  { header: 'Bank and steps', rowHeader: true, cell: (m) => (m.steps ? `${m.bankName}, ${m.steps}` : m.bankName) },
  { header: 'What', cell: (m) => kindWords[m.kind] },
  { header: 'Order', align: 'end', cell: (m) => formatNumber(m.order, 2) },
  { header: 'Frequency', align: 'end', cell: (m) => (m.hz === null ? '—' : `${formatNumber(m.hz, 0)}${nbsp}Hz`) },
  { header: 'Steps in', align: 'end', cell: (m) => (m.kvar === null ? '—' : `${formatNumber(m.kvar, 1)}${nbsp}kvar`) },
  {
    header: 'Nearest harmonic',
    align: 'end',
    cell: (m) => (m.nearestHarmonic === null || m.distancePct === null ? '—' : `${ordinal(m.nearestHarmonic)}, ${formatNumber(m.distancePct, 1)}${nbsp}% away`),
  },
  { header: 'Standing', cell: (m) => <MarkerStanding marker={m} /> },
];

/** The harmonic axis: orders 1 to 15, the characteristic harmonics, resonance orders above and tuning below. */
export function HarmonicAxisFigure({ health }: { health: SiteHealth }) {
  const markers = harmonicAxisMarkers(health);
  return (
    <ChartWithTable
      subject="harmonic axis"
      chart={(describedBy) => <AxisDrawing health={health} describedBy={describedBy} />}
      legend={
        <ul className="flex flex-wrap gap-x-5 gap-y-1">
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 12 12" className="size-3">
              <path d="M1 1l10 10M11 1 1 11" className="stroke-ink" strokeWidth="2" strokeLinecap="round" />
            </svg>
            Resonance order of the steps switched in
          </li>
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 8 16" className="h-4 w-2">
              <rect x="1.5" y="1" width="5" height="14" rx="1" className="fill-ink stroke-ink" strokeWidth="1.5" />
            </svg>
            Detuned step’s tuning now
          </li>
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 8 16" className="h-4 w-2">
              <rect x="1.5" y="1" width="5" height="14" rx="1" className="fill-surface stroke-ink-muted" strokeWidth="1.5" />
            </svg>
            Design tuning
          </li>
          <li className="inline-flex items-center gap-2">
            <span aria-hidden="true" className="inline-block h-3 w-4 border border-line-strong bg-sunken" />
            Within {warningMarginPct}&nbsp;% of a characteristic harmonic
          </li>
          <li>Red and “near”: a warning; ochre and “shifted”: drifted from design</li>
        </ul>
      }
      table={
        <FigureTable
          caption="Resonance orders and tuning of the site's banks"
          columns={columns}
          rows={markers}
          rowKey={(m) => m.id}
          empty="No bank has undetuned steps or detuned steps to place on the axis."
        />
      }
      caption={harmonicAxisSummary(health)}
    />
  );
}
