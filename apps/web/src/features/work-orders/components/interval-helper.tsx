import { equipmentConditions, reliabilityNeeds } from '@varden/schemas';
import { useId, useState } from 'react';
import { Button } from '../../../components/button';
import { TextField } from '../../../components/form/text-field';
import { conditionLabels, intervalSource, reliabilityLabels, suggestInterval, type EquipmentCondition, type ReliabilityNeed } from '../lib/inspection-interval';
import { SelectField } from './form-controls';
import { readerNumberFormat } from '../../../lib/reader-format';

const factorFormat = readerNumberFormat({ minimumFractionDigits: 2, maximumFractionDigits: 2 });
const monthsFormat = readerNumberFormat({ maximumFractionDigits: 2 });

/**
 * The interval helper: base interval × reliability need × equipment condition (NETA MTS
 * Appendix B), worked out in front of the planner, who may take the result for the plan.
 */
export function IntervalHelper({ onUse }: { onUse: (months: number) => void }) {
  const headingId = useId();
  const [base, setBase] = useState('12');
  const [reliability, setReliability] = useState<ReliabilityNeed>('medium');
  const [condition, setCondition] = useState<EquipmentCondition>('average');
  const baseMonths = Number(base);
  const suggestion = base.trim() === '' ? undefined : suggestInterval(baseMonths, reliability, condition);

  return (
    <section aria-labelledby={headingId} className="grid gap-3 rounded border border-line-strong bg-sunken p-4">
      <h3 id={headingId} className="font-semibold">
        Interval helper
      </h3>
      <p className="text-base text-ink-muted desk:text-sm">{intervalSource}. Optional: the interval is yours to set.</p>
      <div className="grid gap-3 desk:grid-cols-3">
        <TextField
          label="Base interval (months)"
          type="number"
          inputMode="numeric"
          min={1}
          max={120}
          step={1}
          value={base}
          onChange={(e) => setBase(e.target.value)}
          error={base.trim() !== '' && !suggestion ? 'Whole months from 1 to 120' : undefined}
        />
        <SelectField
          label="Reliability need"
          value={reliability}
          onChange={(e) => setReliability(reliabilityNeeds.find((r) => r === e.target.value) ?? 'medium')}
          options={reliabilityNeeds.map((r) => ({ value: r, label: reliabilityLabels[r] }))}
        />
        <SelectField
          label="Equipment condition"
          value={condition}
          onChange={(e) => setCondition(equipmentConditions.find((c) => c === e.target.value) ?? 'average')}
          options={equipmentConditions.map((c) => ({ value: c, label: conditionLabels[c] }))}
        />
      </div>
      <output aria-live="polite" className="block">
        {suggestion ? (
          <span className="numeric">
            {monthsFormat.format(baseMonths)} months × {factorFormat.format(suggestion.factor)} = {monthsFormat.format(suggestion.exactMonths)} months
            {suggestion.exactMonths !== suggestion.intervalMonths && <> → {suggestion.intervalMonths} whole {suggestion.intervalMonths === 1 ? 'month' : 'months'} (rounded)</>}
          </span>
        ) : (
          <span className="text-ink-muted">Enter a base interval to work it out.</span>
        )}
      </output>
      <div>
        <Button disabled={!suggestion} onClick={() => suggestion && onUse(suggestion.intervalMonths)}>
          {suggestion ? `Use ${suggestion.intervalMonths} ${suggestion.intervalMonths === 1 ? 'month' : 'months'}` : 'Use this interval'}
        </Button>
      </div>
    </section>
  );
}
