import { classNames } from '../lib/class-names';

export type ServiceStatus = 'up' | 'down';

// Strokes, not filled shapes, so a service state never reads as a condition band.
const glyphs: Record<ServiceStatus, { path: string; stroke: string }> = {
  up: { path: 'M2.5 8.5 6.5 12.5 13.5 3.5', stroke: 'stroke-up' },
  down: { path: 'M3.5 3.5 12.5 12.5M12.5 3.5 3.5 12.5', stroke: 'stroke-down' },
};

type ServiceStatusBadgeProps = { status: ServiceStatus; className?: string };

/** Up or down as glyph + word. The word stays lower-case: it reads as a state, not a label. */
export function ServiceStatusBadge({ status, className }: ServiceStatusBadgeProps) {
  const glyph = glyphs[status];
  return (
    <span
      data-status={status}
      className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap font-medium', className)}
    >
      <svg
        aria-hidden="true"
        focusable="false"
        viewBox="0 0 16 16"
        className={classNames('size-[1em] shrink-0 fill-none stroke-[2.5]', glyph.stroke)}
        strokeLinecap="round"
        strokeLinejoin="round"
      >
        <path d={glyph.path} />
      </svg>
      <span>{status}</span>
    </span>
  );
}
