import { classNames } from '../../../lib/class-names';

/** Words for a component that has no reading yet; readings arrive with inspections. */
export const noReadingLabel = 'No reading yet';

/**
 * The outline of a condition glyph, dashed and in the muted ink: no band has been decided, so
 * it borrows none of the four bands' shapes or colours. Drawn in a 16-unit box.
 */
export function NoReadingShape({ x = 0, y = 0, size = 16 }: { x?: number; y?: number; size?: number }) {
  const scale = size / 16;
  return (
    <g transform={`translate(${x} ${y}) scale(${scale})`} className="fill-none stroke-ink-muted" aria-hidden="true">
      <circle cx="8" cy="8" r="5.75" strokeWidth="1.5" strokeDasharray="2.4 1.8" />
      <path d="M5.5 8h5" strokeWidth="1.5" strokeLinecap="round" />
    </g>
  );
}

/** The "no reading yet" condition as glyph + words, in line with text. */
export function NoReadingGlyph({ className, label = noReadingLabel }: { className?: string; label?: string }) {
  return (
    <span data-band="none" className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap text-ink-muted', className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0">
        <NoReadingShape />
      </svg>
      <span>{label}</span>
    </span>
  );
}
