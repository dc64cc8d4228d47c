import { ConditionGlyph, conditionBands, type ConditionBand } from '../../../components/condition-glyph';
import { flagKindLabel, severityLabels } from '../lib/work-order-words';

const asBand = (kind: string): ConditionBand | undefined => conditionBands.find((band) => band === kind);

/**
 * A flag's kind: flags named after a condition band (replace, watch, remeasure) carry its glyph
 * and word; the others a pennant of their own with their name.
 */
export function FlagKind({ kind }: { kind: string }) {
  const band = asBand(kind);
  if (band) return <ConditionGlyph band={band} className="font-medium" />;
  return (
    <span className="inline-flex items-center gap-1.5 font-medium whitespace-nowrap">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0 fill-none stroke-ink stroke-[1.6]">
        {/* A pennant on its staff. */}
        <path d="M3.5 14.5V1.5M3.5 2h9l-2.5 3 2.5 3h-9" strokeLinejoin="round" />
      </svg>
      <span>{flagKindLabel(kind)}</span>
    </span>
  );
}

/** A flag's severity in words; "Action" is drawn heavier, with a mark. */
export function Severity({ severity }: { severity: 'action' | 'advisory' }) {
  return severity === 'action' ? (
    <strong className="inline-flex items-center gap-1 whitespace-nowrap">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0 fill-ink">
        <path d="M6.5 1.5h3l-.5 9h-2zM8 12a1.5 1.5 0 1 1 0 3 1.5 1.5 0 0 1 0-3z" />
      </svg>
      {severityLabels.action}
    </strong>
  ) : (
    <span className="whitespace-nowrap">{severityLabels.advisory}</span>
  );
}
