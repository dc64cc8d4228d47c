import { useId, useState, type ReactNode } from 'react';
import { classNames } from '../../../lib/class-names';

type View = 'chart' | 'table';

type ChartWithTableProps = {
  /** What the chart shows, for the view switch's name ("power triangle"). */
  subject: string;
  /** The chart; it gets `describedBy` to point at the caption. */
  chart: (describedBy: string) => ReactNode;
  table: ReactNode;
  /** The text alternative: the chart's content in words. */
  caption: ReactNode;
  /** What the legend says about marks, line styles and colours. */
  legend?: ReactNode;
};

const views: { view: View; label: string }[] = [
  { view: 'chart', label: 'Chart' },
  { view: 'table', label: 'Table' },
];

/**
 * A chart and the same figures as a table, one at a time on screen with a switch between
 * them, both on paper. The caption under either is the chart's text alternative.
 */
export function ChartWithTable({ subject, chart, table, caption, legend }: ChartWithTableProps) {
  const [view, setView] = useState<View>('chart');
  const captionId = useId();
  return (
    <figure className="grid min-w-0 gap-3">
      <div role="group" aria-label={`Show the ${subject} as`} data-print="hide" className="inline-flex w-fit rounded border border-line-strong">
        {views.map((option) => (
          <button
            key={option.view}
            type="button"
            aria-pressed={view === option.view}
            onClick={() => setView(option.view)}
            className={classNames(
              'min-h-touch min-w-[5.5rem] px-4 text-base first:rounded-l last:rounded-r desk:min-h-control desk:text-sm',
              view === option.view ? 'bg-sunken font-semibold text-ink' : 'text-ink-muted hover:bg-sunken',
            )}
          >
            {view === option.view && (
              <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mr-1 inline size-3 fill-none stroke-current stroke-2">
                <path d="M2.5 8.5 6.5 12 13.5 4" />
              </svg>
            )}
            {option.label}
          </button>
        ))}
      </div>
      <div className={classNames('min-w-0', view === 'chart' ? 'block' : 'hidden print:block')}>
        {chart(captionId)}
        {legend && <div className="mt-2 text-base text-ink-muted desk:text-sm">{legend}</div>}
      </div>
      <div className={classNames('min-w-0', view === 'table' ? 'block' : 'hidden print:mt-2 print:block')}>{table}</div>
      <figcaption id={captionId} className="max-w-measure text-base text-ink-muted desk:text-sm">
        {caption}
      </figcaption>
    </figure>
  );
}
