import type { Bank, Step } from '@varden/schemas';
import { useId, type CSSProperties } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { NoReadingShape, noReadingLabel } from '../components/no-reading-glyph';
import { layoutPanel, panelGeometry, type PanelSymbol, type StepComponents, type SymbolKind } from './panel-layout';
import { ComponentSymbol } from './panel-symbols';
import { readerNumberFormat } from '../../../lib/reader-format';

const recordHref: Record<SymbolKind, (id: number) => string> = {
  'fuse-set': paths.register.fuseSet.getHref,
  contactor: paths.register.contactor.getHref,
  reactor: paths.register.reactor.getHref,
  unit: paths.register.unit.getHref,
};

const kvar = readerNumberFormat({ maximumFractionDigits: 2 });

type PanelDrawingProps = {
  bank: Bank;
  steps: readonly Step[];
  componentsOf: (step: Step) => StepComponents;
  /** Where a missing component can be added, for people who may write; none otherwise. */
  addHref?: (kind: SymbolKind, step: Step) => string;
};

/**
 * The bank as it is built: the busbar across the top, one column per step hanging from it,
 * each component a small symbol carrying its condition glyph (for now "no reading yet": bands
 * arrive with readings) and linking to its record. It keeps its natural size and scrolls
 * sideways inside its frame on a narrow screen, so the page itself never does.
 */
export function PanelDrawing({ bank, steps, componentsOf, addHref }: PanelDrawingProps) {
  const titleId = useId();
  const layout = layoutPanel(steps, componentsOf, bank.detuned);
  const g = panelGeometry;
  const busbarY = g.padding + 10;

  return (
    <figure className="grid min-w-0 gap-2">
      <div
        role="region"
        aria-labelledby={titleId}
        tabIndex={0}
        className="min-w-0 overflow-x-auto rounded-md border border-line bg-surface"
        data-testid="panel-drawing"
      >
        {/* Natural size on a phone (scrolls inside its frame); on a desk it shrinks to fit, down to 80 %. */}
        <svg
          role="group"
          aria-labelledby={titleId}
          viewBox={`0 0 ${layout.width} ${layout.height}`}
          style={{ '--panel-width': `${layout.width}px` } as CSSProperties}
          className="block h-auto w-full max-w-[var(--panel-width)] min-w-[var(--panel-width)] font-sans desk:min-w-[calc(var(--panel-width)*0.8)]"
        >
          <title id={titleId}>{`Panel drawing of ${bank.name}: ${steps.length} step${steps.length === 1 ? '' : 's'}`}</title>
          {/* The cabinet. */}
          <rect x="4" y="4" width={layout.width - 8} height={layout.height - 8} rx="6" className="fill-none stroke-line-strong" strokeWidth="1" />
          {/* The busbar, in copper. */}
          <path d={`M${g.padding} ${busbarY}H${layout.width - g.padding}`} className="stroke-copper" strokeWidth="4" strokeLinecap="round" />

          {layout.columns.length === 0 && (
            <text x={g.padding} y={busbarY + 44} className="fill-ink-muted text-base">
              No steps yet.
            </text>
          )}

          {layout.columns.map((column) => {
            const centre = column.x + 26;
            const lastSymbol = column.symbols[column.symbols.length - 1];
            return (
              <g key={column.step.id} data-step={column.step.number}>
                {/* The drop from the busbar through every component of the step. */}
                <path
                  d={`M${centre} ${busbarY}V${(lastSymbol?.y ?? busbarY) + 16}`}
                  className="stroke-line-strong"
                  strokeWidth="1.5"
                />
                <circle cx={centre} cy={busbarY} r="3.5" className="fill-copper" />
                <Link to={paths.register.step.getHref(column.step.id)} className="group no-underline">
                  <rect
                    x={column.x}
                    y={g.padding + g.busbarHeight}
                    width={g.columnWidth}
                    height={g.headerHeight - 8}
                    rx="4"
                    className="fill-sunken stroke-line group-hover:stroke-copper group-focus-visible:stroke-focus"
                    strokeWidth="1.5"
                  />
                  <text className="text-sm">
                    <tspan x={column.x + 10} y={g.padding + g.busbarHeight + 18} className="fill-ink font-semibold">
                      {`Step ${column.step.number} `}
                    </tspan>
                    <tspan x={column.x + 10} y={g.padding + g.busbarHeight + 36} className="numeric fill-ink-muted">
                      {`${kvar.format(column.step.ratedKvar)} kvar rated`}
                    </tspan>
                  </text>
                </Link>
                {column.symbols.map((symbol, index) => (
                  <SymbolRow
                    key={`${symbol.kind}-${symbol.id ?? `missing-${index}`}`}
                    symbol={symbol}
                    x={column.x}
                    href={symbol.id !== undefined ? recordHref[symbol.kind](symbol.id) : addHref?.(symbol.kind, column.step)}
                    stepNumber={column.step.number}
                  />
                ))}
              </g>
            );
          })}
        </svg>
      </div>
      <figcaption className="flex flex-wrap items-center gap-x-4 gap-y-1 text-base text-ink-muted desk:text-sm">
        <span>Each step hangs from the busbar: fuses, contactor{bank.detuned ? ', reactor' : ''}, then its capacitor units by position.</span>
        <span className="inline-flex items-center gap-1.5">
          <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4">
            <NoReadingShape />
          </svg>
          {noReadingLabel}: condition bands appear once readings are recorded.
        </span>
      </figcaption>
    </figure>
  );
}

function SymbolRow({ symbol, x, href, stepNumber }: { symbol: PanelSymbol; x: number; href: string | undefined; stepNumber: number }) {
  const g = panelGeometry;
  const missing = symbol.id === undefined;
  const body = (
    <>
      <rect
        x={x}
        y={symbol.y - 4}
        width={g.columnWidth}
        height={g.rowHeight - 6}
        rx="4"
        strokeWidth="1.5"
        strokeDasharray={missing ? '4 3' : undefined}
        className={
          missing
            ? 'fill-paper stroke-line-strong group-hover:stroke-copper group-focus-visible:stroke-focus'
            : 'fill-surface stroke-line group-hover:stroke-copper group-focus-visible:stroke-focus'
        }
      />
      {/* A white plate behind the symbol so the step's drop line passes behind it. */}
      <rect x={x + 12} y={symbol.y + 2} width="28" height="40" className={missing ? 'fill-paper' : 'fill-surface'} />
      <g opacity={missing ? 0.55 : 1}>
        <ComponentSymbol kind={symbol.kind} x={x + 12} y={symbol.y + 6} />
      </g>
      {/* One text element whose lines end in a space, so its words read apart (the accessible name starts with them). */}
      <text className="fill-ink-muted text-xs">
        <tspan x={x + 48} y={symbol.y + 13} className={missing ? 'text-sm' : 'fill-ink text-sm font-medium'}>
          {`${symbol.title} `}
        </tspan>
        <tspan x={x + 48} y={symbol.y + 29} className="numeric">
          {`${symbol.detail} `}
        </tspan>
        {!missing && (
          <tspan x={x + 64} y={symbol.y + 44}>
            {noReadingLabel}
          </tspan>
        )}
      </text>
      {!missing && <NoReadingShape x={x + 48} y={symbol.y + 34} size={12} />}
    </>
  );
  // The accessible name starts with the words drawn, then says where the symbol sits.
  const name = missing
    ? `${symbol.title} ${symbol.detail}, step ${stepNumber}${href ? ': add it' : ''}`
    : `${symbol.title} ${symbol.detail} ${noReadingLabel}, step ${stepNumber}`;
  if (!href) {
    return (
      <g role="img" aria-label={name}>
        {body}
      </g>
    );
  }
  return (
    <Link to={href} aria-label={name} className="group no-underline" data-symbol={symbol.kind}>
      {body}
    </Link>
  );
}
