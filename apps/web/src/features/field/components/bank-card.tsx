import type { Reading, WalkthroughBank } from '@varden/schemas';
import { Controller, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
import { parseDecimal } from '../readings/decimal';
import { useComponentReading } from '../readings/use-component-reading';
import { ComponentCard } from './component-card';
import { BigToggle, DecimalField, NotesField } from './field-controls';
import { OutboxItemStatus } from './outbox-item-status';
import { StoredReasons } from './stored-reasons';

type BankForm = { pf: string; loadKw: string; thd: string; cleaningDone: boolean; filtersDone: boolean; notes: string };

const text = (v: unknown) => (typeof v === 'number' ? String(v) : '');

function formFrom(input: Record<string, unknown> | undefined): BankForm {
  return {
    pf: text(input?.controllerPf),
    loadKw: text(input?.loadKw),
    thd: text(input?.voltageThdPct),
    cleaningDone: input?.cleaningDone === true,
    filtersDone: input?.filtersDone === true,
    notes: typeof input?.notes === 'string' ? input.notes : '',
  };
}

const fieldOf = ({ path }: { path: PropertyKey[] }): Path<BankForm> | 'root' => {
  const head = String(path[0]);
  const fields: Record<string, Path<BankForm>> = { controllerPf: 'pf', loadKw: 'loadKw', voltageThdPct: 'thd', notes: 'notes' };
  return fields[head] ?? 'root';
};

/** The bank as a whole: the controller's power factor and the load it was read at, voltage THD, cleaning and filters. */
export function BankCard({ orderId, bank, readings, editable }: { orderId: number; bank: WalkthroughBank; readings: readonly Reading[]; editable: boolean }) {
  const { form, latestWaiting, latestStored, recorded, submitWith } = useComponentReading({ orderId, target: 'bank', targetId: bank.id, readings, label: 'Bank readings', formFrom, fieldOf });
  const { control, register, formState } = form;
  const errors = formState.errors;

  const optional = (key: string, v: string) => {
    const n = parseDecimal(v);
    return n === undefined ? {} : { [key]: n };
  };
  const onSubmit = submitWith((values, stamp) => ({
    ...stamp,
    target: 'bank',
    targetId: bank.id,
    ...optional('controllerPf', values.pf),
    ...optional('loadKw', values.loadKw),
    ...optional('voltageThdPct', values.thd),
    cleaningDone: values.cleaningDone,
    filtersDone: values.filtersDone,
    notes: values.notes.trim(),
  }));

  return (
    <ComponentCard title="Bank" testId="bank-card" facts={`${bank.name} · ${bank.location || bank.siteName}`}>
      <form onSubmit={(event) => void onSubmit(event)} noValidate className="grid gap-4">
        <div className="grid gap-3 desk:grid-cols-3">
          <DecimalField label="Controller PF" hint="Negative when leading." disabled={!editable} error={errors.pf?.message} {...register('pf')} />
          <DecimalField label="Load when read" unit="kW" disabled={!editable} error={errors.loadKw?.message} {...register('loadKw')} />
          <DecimalField label="Voltage THD" unit="%" disabled={!editable} error={errors.thd?.message} {...register('thd')} />
        </div>
        <Controller
          control={control}
          name="cleaningDone"
          render={({ field }) => <BigToggle label="Cleaning done" checked={field.value} onChange={field.onChange} onWord="Done" offWord="Not done" disabled={!editable} />}
        />
        <Controller
          control={control}
          name="filtersDone"
          render={({ field }) => <BigToggle label="Filters changed or cleaned" checked={field.value} onChange={field.onChange} onWord="Done" offWord="Not done" disabled={!editable} />}
        />
        <NotesField disabled={!editable} error={errors.notes?.message} {...register('notes')} />
        {errors.root?.message && <p className="font-medium text-replace">{errors.root.message}</p>}
        {editable && (
          <Button type="submit" variant={recorded && !formState.isDirty ? 'secondary' : 'primary'} disabled={recorded && !formState.isDirty} className="w-full desk:w-auto">
            {recorded ? (formState.isDirty ? 'Record again' : 'Recorded') : 'Record bank readings'}
          </Button>
        )}
        <OutboxItemStatus item={latestWaiting} storedAt={latestStored?.recordedAt} />
        {!latestWaiting && <StoredReasons reading={latestStored} />}
      </form>
    </ComponentCard>
  );
}
