import type { ReactElement } from 'react';
import { classNames } from '../lib/class-names';

export const conditionBands = ['healthy', 'watch', 'replace', 'remeasure'] as const;
export type ConditionBand = (typeof conditionBands)[number];

export const conditionBandLabels: Record<ConditionBand, string> = {
  healthy: 'Healthy',
  watch: 'Watch',
  replace: 'Replace',
  remeasure: 'Remeasure',
};

// Shapes on a 16-unit grid, each filling about the same area so none looks louder.
const shapes: Record<ConditionBand, ReactElement> = {
  healthy: <circle cx="8" cy="8" r="6" />,
  watch: <path d="M8 1.5 15 14.5H1Z" />,
  replace: <rect x="2.5" y="2.5" width="11" height="11" />,
  remeasure: <path d="M8 .8 15.2 8 8 15.2.8 8Z" />,
};

// Whole class names so Tailwind finds them.
const fills: Record<ConditionBand, string> = {
  healthy: 'fill-healthy',
  watch: 'fill-watch',
  replace: 'fill-replace',
  remeasure: 'fill-remeasure',
};

type ConditionGlyphProps = {
  band: ConditionBand;
  className?: string;
};

/** A condition band as colour + shape + word, the same everywhere it appears. */
export function ConditionGlyph({ band, className }: ConditionGlyphProps) {
  return (
    <span data-band={band} className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap', className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className={classNames('size-[1em] shrink-0', fills[band])}>
        {shapes[band]}
      </svg>
      <span>{conditionBandLabels[band]}</span>
    </span>
  );
}
