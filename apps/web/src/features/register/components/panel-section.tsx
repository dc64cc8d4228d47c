import { useId, type ReactNode } from 'react';
import { classNames } from '../../../lib/class-names';

type PanelSectionProps = {
  title: string;
  /** Commands beside the heading (export, add …). */
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  'data-print'?: 'hide';
};

/** A titled block of a record page: a card on paper with its heading as the region's name. */
export function PanelSection({ title, actions, children, className, ...rest }: PanelSectionProps) {
  const headingId = useId();
  return (
    <section
      aria-labelledby={headingId}
      className={classNames('min-w-0 rounded-md border border-line bg-surface p-4 desk:p-6', className)}
      {...rest}
    >
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 id={headingId} className="text-lg font-semibold">
          {title}
        </h2>
        {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
      </div>
      {children}
    </section>
  );
}
