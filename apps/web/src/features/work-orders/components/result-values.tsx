import { ConditionGlyph } from '../../../components/condition-glyph';
import { readerNumberFormat } from '../../../lib/reader-format';

const signed = readerNumberFormat({ signDisplay: 'exceptZero', minimumFractionDigits: 1, maximumFractionDigits: 1 });
const plain = readerNumberFormat({ minimumFractionDigits: 1, maximumFractionDigits: 1 });
const legs = readerNumberFormat({ minimumFractionDigits: 1, maximumFractionDigits: 1 });

const noValue = (
  <span className="numeric text-ink-muted">
    <span aria-hidden="true">—</span>
    <span className="sr-only">no value</span>
  </span>
);

/** A deviation or change in percent with its sign: "−4.8 %", "+1.2 %". */
export function SignedPercent({ value, unit = '%' }: { value: number | null | undefined; unit?: string }) {
  if (value === null || value === undefined || !Number.isFinite(value)) return noValue;
  return (
    <span className="numeric whitespace-nowrap">
      <span className="font-medium">{signed.format(value)}</span>
      {'\u00A0'}
      <span className="text-ink-muted">{unit}</span>
    </span>
  );
}

/** kvar at rated voltage and frequency. */
export function Kvar({ value }: { value: number | null | undefined }) {
  if (value === null || value === undefined || !Number.isFinite(value)) return noValue;
  return (
    <span className="numeric whitespace-nowrap">
      <span className="font-medium">{plain.format(value)}</span>
      {'\u00A0'}
      <span className="text-ink-muted">kvar</span>
    </span>
  );
}

/** The legs of a unit in µF: "130.2 · 131.0 · 129.4 µF", or one under the other in a narrow column. */
export function Legs({ values, stacked = false }: { values: readonly number[]; stacked?: boolean }) {
  if (values.length === 0) return noValue;
  if (stacked) {
    return (
      <span className="numeric grid text-right">
        {values.map((v, i) => (
          <span key={i} className="whitespace-nowrap">
            <span className="font-medium">{legs.format(v)}</span>
            {'\u00A0'}
            <span className="text-ink-muted">µF</span>
          </span>
        ))}
      </span>
    );
  }
  return (
    <span className="numeric">
      {values.map((v, i) => (
        <span key={i} className="whitespace-nowrap">
          {i > 0 && <span className="text-ink-muted"> · </span>}
          <span className="font-medium">{legs.format(v)}</span>
        </span>
      ))}
      {'\u00A0'}
      <span className="whitespace-nowrap text-ink-muted">µF</span>
    </span>
  );
}

/** A condition band (glyph + word), or a dash when there is none. */
export function Band({ band }: { band: 'healthy' | 'watch' | 'replace' | 'remeasure' | null | undefined }) {
  return band ? <ConditionGlyph band={band} className="font-medium" /> : noValue;
}
