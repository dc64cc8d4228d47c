import { classNames } from '../lib/class-names';
import { readerLocale } from '../lib/reader-format';

type QuantityProps = {
  value: number | null | undefined;
  /** As written after the number: "µF", "kvar", "V", "ms". */
  unit: string;
  maximumFractionDigits?: number;
  minimumFractionDigits?: number;
  className?: string;
};

const formatters = new Map<string, Intl.NumberFormat>();

function formatter(minimumFractionDigits: number, maximumFractionDigits: number): Intl.NumberFormat {
  const locale = readerLocale();
  const key = `${locale ?? ''}:${minimumFractionDigits}:${maximumFractionDigits}`;
  let format = formatters.get(key);
  if (!format) {
    format = new Intl.NumberFormat(locale, { minimumFractionDigits, maximumFractionDigits });
    formatters.set(key, format);
  }
  return format;
}

/**
 * A measured value with its unit: tabular figures, the unit lighter beside it, joined by a
 * no-break space so a line never separates them.
 */
export function Quantity({ value, unit, maximumFractionDigits = 2, minimumFractionDigits = 0, className }: QuantityProps) {
  if (value === null || value === undefined || !Number.isFinite(value)) {
    return (
      <span className={classNames('numeric text-ink-muted', className)}>
        <span aria-hidden="true">—</span>
        <span className="sr-only">no value</span>
      </span>
    );
  }
  const digits = Math.max(minimumFractionDigits, maximumFractionDigits);
  return (
    <span className={classNames('numeric whitespace-nowrap', className)}>
      <span className="font-medium">{formatter(minimumFractionDigits, digits).format(value)}</span>
      {'\u00A0'}
      <span className="font-normal text-ink-muted">{unit}</span>
    </span>
  );
}
