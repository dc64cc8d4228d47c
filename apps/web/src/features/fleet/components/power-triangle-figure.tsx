import type { SiteHealth } from '@varden/schemas';
import type { CSSProperties } from 'react';
import { useElementWidth } from '../hooks/use-element-width';
import { formatNumber, nbsp, pfText, targetPfText } from '../lib/number-format';
import { layoutPowerTriangles, targetKvar, type TriangleFigures, type TriangleLabel } from '../lib/power-triangle-geometry';
import { ChartWithTable } from './chart-with-table';
import { FigureTable, type FigureColumn } from './figure-table';

type Triangles = NonNullable<SiteHealth['triangle']>;

// Text on lines stays legible: a halo in the panel's colour under every label.
const halo: CSSProperties = { paintOrder: 'stroke', stroke: 'var(--v-surface)', strokeWidth: 4, strokeLinejoin: 'round' };

const kw = (v: number) => `${formatNumber(v, 0)}${nbsp}kW`;
const kvar = (v: number) => `${formatNumber(v, 0)}${nbsp}kvar`;
const kva = (v: number) => `${formatNumber(v, 0)}${nbsp}kVA`;
const deg = (v: number) => `${formatNumber(v, 1)}°`;
const pf = (t: TriangleFigures) => `${pfText(t.pf)}${t.leading ? ' leading' : ''}`;

function Label({ at, lines, strong = false }: { at: TriangleLabel; lines: string[]; strong?: boolean }) {
  return (
    <text x={at.x} y={at.y} textAnchor={at.anchor} style={halo} className={strong ? 'fill-ink text-xs font-semibold' : 'fill-ink-muted text-xs'}>
      {lines.map((line, i) => (
        <tspan key={i} x={at.x} dy={i === 0 ? 0 : 14}>
          {line}
        </tspan>
      ))}
    </text>
  );
}

function TriangleDrawing({ triangles, targetPf, lostKvar, describedBy }: { triangles: Triangles; targetPf: number; lostKvar: number; describedBy: string }) {
  const [ref, width] = useElementWidth<HTMLDivElement>();
  const layout = layoutPowerTriangles({ asInstalled: triangles.asInstalled, now: triangles.now, targetPf, width, maxHeight: width < 500 ? 300 : 380 });
  const { origin, now, asInstalled } = layout;
  const hatchId = `lost-hatch-${describedBy.replace(/[^A-Za-z0-9_-]/g, '')}`;
  const pathOf = (t: typeof now) => `M ${origin.x} ${origin.y} L ${t.ground.x} ${t.ground.y} L ${t.apex.x} ${t.apex.y} Z`;
  return (
    <div ref={ref} className="min-w-0">
      <svg
        role="img"
        aria-label="Power triangle before and after the lost correction"
        aria-describedby={describedBy}
        viewBox={`0 0 ${layout.width} ${layout.height}`}
        style={{ width: '100%', height: 'auto' }}
        className="block overflow-visible"
      >
        <defs>
          <pattern id={hatchId} patternUnits="userSpaceOnUse" width="6" height="6" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2="6" className="stroke-replace" strokeWidth="1.5" />
          </pattern>
        </defs>
        {/* The ground: P. */}
        <line x1={origin.x} y1={origin.y} x2={now.ground.x} y2={origin.y} className="stroke-ink" strokeWidth="2.5" />
        {!layout.coincident && (
          <>
            {/* What the lost correction added: the wedge between the two hypotenuses. */}
            <path d={`M ${origin.x} ${origin.y} L ${asInstalled.apex.x} ${asInstalled.apex.y} L ${now.apex.x} ${now.apex.y} Z`} fill={`url(#${hatchId})`} opacity="0.55" />
            <path d={pathOf(asInstalled)} className="fill-none stroke-ink-muted" strokeWidth="2" strokeDasharray="7 5" />
            <path d={asInstalled.arcPath} className="fill-none stroke-ink-muted" strokeWidth="1.5" strokeDasharray="3 3" />
          </>
        )}
        {layout.target && (
          <line
            x1={origin.x}
            y1={origin.y}
            x2={layout.target.end.x}
            y2={layout.target.end.y}
            className="stroke-copper"
            strokeWidth="1.5"
            strokeDasharray="1.5 4"
            strokeLinecap="round"
          />
        )}
        <path d={pathOf(now)} className="fill-none stroke-ink" strokeWidth="2.5" strokeLinejoin="round" />
        <path d={now.arcPath} className="fill-none stroke-ink" strokeWidth="1.5" />

        {layout.compact ? (
          <>
            <Label at={layout.pLabel} lines={['P']} strong />
            <Label at={now.qLabel} lines={['Q']} strong />
            <Label at={now.sLabel} lines={['S']} strong />
            <Label at={now.phiLabel} lines={['φ']} strong />
          </>
        ) : (
          <>
            <Label at={layout.pLabel} lines={[`P ${kw(now.figures.kw)}`]} strong />
            <Label at={now.qLabel} lines={layout.coincident ? ['Q now = as installed', kvar(now.figures.kvar)] : ['Q now', kvar(now.figures.kvar)]} strong />
            {!layout.coincident && <Label at={asInstalled.qLabel} lines={['Q as installed', kvar(asInstalled.figures.kvar)]} />}
            {layout.target && <Label at={layout.target.label} lines={[`Target PF ${targetPfText(targetPf)}`, kvar(layout.target.kvar)]} />}
            <Label at={now.sLabel} lines={[`S now ${kva(now.figures.kva)}`]} strong />
            {!layout.coincident && <Label at={asInstalled.sLabel} lines={[`S as installed ${kva(asInstalled.figures.kva)}`]} />}
            <Label at={now.phiLabel} lines={[`φ now ${deg(now.figures.phiDeg)}`]} strong />
            {!layout.coincident && lostKvar > 0 && <Label at={asInstalled.phiLabel} lines={[`φ as installed ${deg(asInstalled.figures.phiDeg)}`]} />}
          </>
        )}
      </svg>
      {layout.compact && (
        <dl data-testid="triangle-key" className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-base">
          <dt className="font-semibold">P</dt>
          <dd className="numeric">{kw(now.figures.kw)}</dd>
          <dt className="font-semibold">Q</dt>
          <dd className="numeric">
            now {kvar(now.figures.kvar)}
            {!layout.coincident && <span className="text-ink-muted">, as installed {kvar(asInstalled.figures.kvar)}</span>}
          </dd>
          <dt className="font-semibold">S</dt>
          <dd className="numeric">
            now {kva(now.figures.kva)}
            {!layout.coincident && <span className="text-ink-muted">, as installed {kva(asInstalled.figures.kva)}</span>}
          </dd>
          <dt className="font-semibold">φ</dt>
          <dd className="numeric">
            now {deg(now.figures.phiDeg)}
            {!layout.coincident && <span className="text-ink-muted">, as installed {deg(asInstalled.figures.phiDeg)}</span>}
          </dd>
          {layout.target && (
            <>
              <dt className="font-semibold">Target</dt>
              <dd className="numeric">
                PF {targetPfText(targetPf)}, {kvar(layout.target.kvar)}
              </dd>
            </>
          )}
        </dl>
      )}
    </div>
  );
}

type Row = { quantity: string; symbol: string; asInstalled: string; now: string; change: string };

function rowsOf(t: Triangles): Row[] {
  const signed = (v: number, unit: (n: number) => string) => (Math.abs(v) < 0.05 ? '—' : `${v > 0 ? '+' : '−'}${unit(Math.abs(v))}`);
  return [
    { quantity: 'Active power', symbol: 'P', asInstalled: kw(t.asInstalled.kw), now: kw(t.now.kw), change: signed(t.now.kw - t.asInstalled.kw, kw) },
    { quantity: 'Reactive power', symbol: 'Q', asInstalled: kvar(t.asInstalled.kvar), now: kvar(t.now.kvar), change: signed(t.now.kvar - t.asInstalled.kvar, kvar) },
    { quantity: 'Apparent power', symbol: 'S', asInstalled: kva(t.asInstalled.kva), now: kva(t.now.kva), change: signed(t.now.kva - t.asInstalled.kva, kva) },
    { quantity: 'Power factor', symbol: 'PF', asInstalled: pf(t.asInstalled), now: pf(t.now), change: Math.abs(t.now.pf - t.asInstalled.pf) < 0.0005 ? '—' : `${t.now.pf > t.asInstalled.pf ? '+' : '−'}${formatNumber(Math.abs(t.now.pf - t.asInstalled.pf), 3)}` },
    { quantity: 'Phase angle', symbol: 'φ', asInstalled: deg(t.asInstalled.phiDeg), now: deg(t.now.phiDeg), change: signed(t.now.phiDeg - t.asInstalled.phiDeg, deg) },
  ];
}

const columns: FigureColumn<Row>[] = [
  { header: 'Quantity', rowHeader: true, cell: (row) => `${row.quantity} ${row.symbol}` },
  { header: 'As installed', align: 'end', cell: (row) => row.asInstalled },
  { header: 'Now', align: 'end', cell: (row) => <span className="font-medium">{row.now}</span> },
  { header: 'Change', align: 'end', cell: (row) => row.change },
];

/** The words for the drawing: both triangles' sides and angle, the lost kvar and the target. */
export function powerTriangleSummary(t: Triangles, targetPf: number, lostKvar: number): string {
  const side = (x: TriangleFigures) => `Q ${kvar(x.kvar)}, S ${kva(x.kva)}, PF ${pf(x)}, φ ${deg(x.phiDeg)}`;
  const target = `The target PF ${targetPfText(targetPf)} allows ${kvar(targetKvar(t.now.kw, targetPf))} at this load (the dotted ray).`;
  if (lostKvar <= 0) return `At P ${kw(t.now.kw)} the bank delivers what was installed: ${side(t.now)}. ${target}`;
  return `At P ${kw(t.now.kw)}: as installed (dashed) ${side(t.asInstalled)}; now (solid) ${side(t.now)}. The ${formatNumber(lostKvar, 1)}${nbsp}kvar lost raise Q and widen φ (the hatched wedge). ${target}`;
}

/** The power triangle before and after the lost correction, drawn over each other, with its table. */
export function PowerTriangleFigure({ triangles, targetPf, lostKvar }: { triangles: Triangles; targetPf: number; lostKvar: number }) {
  return (
    <ChartWithTable
      subject="power triangle"
      chart={(describedBy) => <TriangleDrawing triangles={triangles} targetPf={targetPf} lostKvar={lostKvar} describedBy={describedBy} />}
      legend={
        <ul className="flex flex-wrap gap-x-5 gap-y-1">
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 28 8" className="h-2 w-7">
              <line x1="0" y1="4" x2="28" y2="4" className="stroke-ink" strokeWidth="2.5" />
            </svg>
            Now (solid)
          </li>
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 28 8" className="h-2 w-7">
              <line x1="0" y1="4" x2="28" y2="4" className="stroke-ink-muted" strokeWidth="2" strokeDasharray="7 5" />
            </svg>
            As installed (dashed)
          </li>
          <li className="inline-flex items-center gap-2">
            <svg aria-hidden="true" viewBox="0 0 28 8" className="h-2 w-7">
              <line x1="1" y1="4" x2="28" y2="4" className="stroke-copper" strokeWidth="1.5" strokeDasharray="1.5 4" strokeLinecap="round" />
            </svg>
            Target PF (dotted)
          </li>
          {lostKvar > 0 && (
            <li className="inline-flex items-center gap-2">
              <svg aria-hidden="true" viewBox="0 0 16 12" className="h-3 w-4">
                <rect x="0.5" y="0.5" width="15" height="11" className="fill-none stroke-replace" />
                <path d="M0 12 12 0M4 12 16 0M-4 8 4 0" className="stroke-replace" strokeWidth="1.2" />
              </svg>
              Lost correction (hatched)
            </li>
          )}
        </ul>
      }
      table={<FigureTable caption="Power triangle as installed and now" columns={columns} rows={rowsOf(triangles)} rowKey={(row) => row.symbol} />}
      caption={powerTriangleSummary(triangles, targetPf, lostKvar)}
    />
  );
}
