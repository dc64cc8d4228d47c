import { useId, type ReactNode } from 'react';
import { classNames } from '../../../lib/class-names';

type HealthPanelProps = {
  title: string;
  /** A line under the heading saying what the panel answers. */
  lead?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  id?: string;
};

/** One titled block of the health pages: a card on paper, named by its heading, kept whole on a printed page. */
export function HealthPanel({ title, lead, actions, children, className, id }: HealthPanelProps) {
  const headingId = useId();
  return (
    <section
      id={id}
      aria-labelledby={headingId}
      className={classNames('min-w-0 rounded-md border border-line bg-surface p-4 desk:p-6 print:break-inside-avoid print:border-line-strong print:p-3', className)}
    >
      <div className="mb-3 flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0 max-w-measure">
          <h2 id={headingId} className="text-lg font-semibold">
            {title}
          </h2>
          {lead && <p className="mt-1 text-base text-ink-muted desk:text-sm">{lead}</p>}
        </div>
        {actions && (
          <div data-print="hide" className="flex flex-wrap gap-2">
            {actions}
          </div>
        )}
      </div>
      {children}
    </section>
  );
}
