import type { WalkthroughBank, Reading } from '@varden/schemas';
import { Controller, useWatch, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
import { Quantity } from '../../../components/quantity';
import { parseDecimal } from '../readings/decimal';
import { contactorFlagAbovePct, liveContactorResult } from '../readings/live-component-results';
import { useComponentReading } from '../readings/use-component-reading';
import { ComponentCard } from './component-card';
import { ChoiceGroup, DecimalField, NotesField } from './field-controls';
import { OutboxItemStatus } from './outbox-item-status';
import { StoredReasons } from './stored-reasons';
import { readerLocale } from '../../../lib/reader-format';

type Contactor = NonNullable<WalkthroughBank['steps'][number]['contactor']>;
type Condition = 'good' | 'worn' | 'burnt';
type ContactorForm = { counter: string; condition: Condition | undefined; resistors: [string, string, string]; notes: string };

const conditionOptions = [
  { value: 'good', label: 'Good' },
  { value: 'worn', label: 'Worn' },
  { value: 'burnt', label: 'Burnt' },
] as const;

const text = (v: unknown) => (typeof v === 'number' ? String(v) : '');

function formFrom(input: Record<string, unknown> | undefined): ContactorForm {
  const resistors = Array.isArray(input?.prechargeResistorsOhm) ? input.prechargeResistorsOhm : [];
  const condition = input?.contactCondition;
  return {
    counter: text(input?.operationsCounter),
    condition: condition === 'good' || condition === 'worn' || condition === 'burnt' ? condition : undefined,
    resistors: [text(resistors[0]), text(resistors[1]), text(resistors[2])],
    notes: typeof input?.notes === 'string' ? input.notes : '',
  };
}

const fieldOf = ({ path }: { path: PropertyKey[] }): Path<ContactorForm> | 'root' => {
  const [head, index] = path.map(String);
  if (head === 'operationsCounter') return 'counter';
  if (head === 'contactCondition') return 'condition';
  if (head === 'prechargeResistorsOhm') return `resistors.${(Number(index) || 0) as 0 | 1 | 2}`;
  if (head === 'notes') return 'notes';
  return 'root';
};

/** A step's contactor: the operations counter (share of its rated endurance at once), contact condition, pre-charge resistors. */
export function ContactorCard({ orderId, stepNumber, contactor, readings, editable }: { orderId: number; stepNumber: number; contactor: Contactor; readings: readonly Reading[]; editable: boolean }) {
  const { form: methods, latestWaiting, latestStored, recorded, submitWith } = useComponentReading({
    orderId,
    target: 'contactor',
    targetId: contactor.id,
    readings,
    label: `Step ${stepNumber} contactor`,
    formFrom,
    fieldOf,
  });
  const { control, register, formState } = methods;
  const form = useWatch({ control }) as ContactorForm;
  const live = liveContactorResult(parseDecimal(form.counter), contactor);
  const errors = formState.errors;

  const onSubmit = submitWith((values, stamp) => ({
    ...stamp,
    target: 'contactor',
    targetId: contactor.id,
    // An empty counter goes to the contract as NaN, so its own message says what is missing.
    operationsCounter: parseDecimal(values.counter) ?? Number.NaN,
    contactCondition: values.condition as Condition,
    prechargeResistorsOhm: values.resistors.map(parseDecimal).filter((v) => v !== undefined),
    notes: values.notes.trim(),
  }));

  return (
    <ComponentCard
      title={`Step ${stepNumber} · Contactor`}
      testId={`contactor-${contactor.id}`}
      facts={
        <>
          Rated <span className="numeric">{contactor.ratedOperations.toLocaleString(readerLocale())}</span> operations · counter at install{' '}
          <span className="numeric">{contactor.counterAtInstall.toLocaleString(readerLocale())}</span>
          {contactor.model && <> · {contactor.model}</>}
        </>
      }
    >
      <form onSubmit={(event) => void onSubmit(event)} noValidate className="grid gap-4">
        <DecimalField label="Operations counter" whole disabled={!editable} error={errors.counter?.message} {...register('counter')} />
        <div aria-live="polite" className="rounded border border-line bg-sunken p-3" data-testid="live-result">
          {live.kind === 'incomplete' && <p className="text-ink-muted">Enter the counter to see the share of its rated life used.</p>}
          {live.kind === 'not-accepted' && (
            <p className="font-medium text-replace">
              <span className="font-semibold">Value not accepted: </span>
              {live.reason}
            </p>
          )}
          {live.kind === 'result' && (
            <p>
              <Quantity value={live.usedPct} unit="%" maximumFractionDigits={1} minimumFractionDigits={1} /> of its rated operations used (
              <span className="numeric">{live.operations.toLocaleString(readerLocale())}</span> since installation).
              {live.flag && <span className="block font-semibold text-replace">Past {contactorFlagAbovePct} %: plan its replacement.</span>}
            </p>
          )}
        </div>
        <Controller
          control={control}
          name="condition"
          render={({ field }) => (
            <ChoiceGroup legend="Contact condition" options={conditionOptions} value={field.value} onChange={field.onChange} columns={3} error={errors.condition?.message} />
          )}
        />
        <fieldset className="grid min-w-0 gap-2">
          <legend className="mb-1 font-medium">Pre-charge resistors (if fitted)</legend>
          <div className="grid grid-cols-3 gap-2">
            {([0, 1, 2] as const).map((i) => (
              <DecimalField key={i} label={`R${i + 1}`} unit="Ω" disabled={!editable} error={errors.resistors?.[i]?.message} {...register(`resistors.${i}`)} />
            ))}
          </div>
        </fieldset>
        <NotesField disabled={!editable} error={errors.notes?.message} {...register('notes')} />
        {errors.root?.message && <p className="font-medium text-replace">{errors.root.message}</p>}
        {editable && (
          <Button type="submit" variant={recorded && !formState.isDirty ? 'secondary' : 'primary'} disabled={recorded && !formState.isDirty} className="w-full desk:w-auto">
            {recorded ? (formState.isDirty ? 'Record again' : 'Recorded') : 'Record contactor'}
          </Button>
        )}
        <OutboxItemStatus item={latestWaiting} storedAt={latestStored?.recordedAt} />
        {!latestWaiting && <StoredReasons reading={latestStored} />}
      </form>
    </ComponentCard>
  );
}
