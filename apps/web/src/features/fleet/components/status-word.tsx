import type { ReactNode } from 'react';
import { classNames } from '../../../lib/class-names';

/** How a figure stands: met (a tick), short (an arrow down), fault (a cross). Never a condition band's shape. */
export type Standing = 'met' | 'short' | 'fault';

const paths: Record<Standing, string> = {
  met: 'M2.5 8.5 6.5 12 13.5 4',
  short: 'M8 2.5v10M3.5 8.5 8 13l4.5-4.5',
  fault: 'M3.5 3.5l9 9M12.5 3.5l-9 9',
};

const tones: Record<Standing, string> = {
  met: 'text-healthy',
  short: 'text-watch',
  fault: 'text-replace',
};

/** A standing as a mark and words, coloured by meaning; the words say it all without the colour. */
export function StatusWord({ standing, children, className }: { standing: Standing; children: ReactNode; className?: string }) {
  return (
    <span data-standing={standing} className={classNames('inline-flex items-center gap-1.5 font-medium', tones[standing], className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0 fill-none stroke-current stroke-[2.5]">
        <path d={paths[standing]} strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      <span>{children}</span>
    </span>
  );
}
