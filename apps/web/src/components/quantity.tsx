import { classNames } from '../lib/class-names';
import { fractionDigitsFormat } from '../lib/reader-format';

type QuantityProps = {
  value: number | null | undefined;
  /** As written after the number: "µF", "kvar", "V", "ms". */
  unit: string;
  maximumFractionDigits?: number;
  minimumFractionDigits?: number;
  className?: string;
};

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
      <span className="font-medium">{fractionDigitsFormat(minimumFractionDigits, digits).format(value)}</span>
      {'\u00A0'}
      <span className="font-normal text-ink-muted">{unit}</span>
    </span>
  );
}
