import { useId } from 'react';
import { pageCount } from '../lib/server-table';
import { Button } from './button';
import { readerNumberFormat } from '../lib/reader-format';

type PagerProps = {
  page: number;
  pageSize: number;
  total: number;
  /** Plural noun for what is counted: "people", "entries". */
  noun: string;
  onPage: (page: number) => void;
  onPageSize: (pageSize: number) => void;
  pageSizes?: readonly number[];
};

const numberFormat = readerNumberFormat();

/** Previous/next and rows per page for a server-paged table; the counts in tabular figures. */
export function Pager({ page, pageSize, total, noun, onPage, onPageSize, pageSizes = [25, 50, 100] }: PagerProps) {
  const sizeId = useId();
  const pages = pageCount(total, pageSize);
  const first = total === 0 ? 0 : (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  const sizes = pageSizes.includes(pageSize) ? pageSizes : [...pageSizes, pageSize].sort((a, b) => a - b);
  const atStart = page <= 1;
  const atEnd = page >= pages;
  return (
    <nav aria-label={`Pages of ${noun}`} className="mt-3 grid gap-3 desk:flex desk:flex-wrap desk:items-center desk:justify-between">
      <p className="numeric text-ink-muted" aria-live="polite">
        {total === 0
          ? `No ${noun}`
          : `${numberFormat.format(first)}–${numberFormat.format(last)} of ${numberFormat.format(total)} ${noun}`}
      </p>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-3">
        <div className="flex items-center gap-2">
          <label htmlFor={sizeId} className="text-base text-ink-muted desk:text-sm">
            Per page
          </label>
          <select
            id={sizeId}
            value={pageSize}
            onChange={(event) => onPageSize(Number(event.target.value))}
            className="min-h-touch rounded border border-line-strong bg-surface px-2 text-base desk:min-h-control desk:text-sm"
          >
            {sizes.map((size) => (
              <option key={size} value={size}>
                {size}
              </option>
            ))}
          </select>
        </div>
        <div className="flex items-center gap-2">
          {/* aria-disabled rather than disabled, so focus stays on the button at the first or last page. */}
          <Button aria-disabled={atStart} onClick={() => !atStart && onPage(page - 1)} className="aria-disabled:cursor-not-allowed aria-disabled:opacity-60">
            Previous
          </Button>
          <span className="numeric px-1 text-base whitespace-nowrap desk:text-sm">
            Page {numberFormat.format(Math.min(page, pages))} of {numberFormat.format(pages)}
          </span>
          <Button aria-disabled={atEnd} onClick={() => !atEnd && onPage(page + 1)} className="aria-disabled:cursor-not-allowed aria-disabled:opacity-60">
            Next
          </Button>
        </div>
      </div>
    </nav>
  );
}
