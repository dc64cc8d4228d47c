import type { Reading, WalkthroughBank } from '@varden/schemas';
import { Controller, useWatch, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
import { parseDecimal } from '../readings/decimal';
import { liveReactorResult, reactorTolerancePct } from '../readings/live-component-results';
import { useComponentReading } from '../readings/use-component-reading';
import { ComponentCard } from './component-card';
import { ChoiceGroup, DecimalField, NotesField } from './field-controls';
import { OutboxItemStatus } from './outbox-item-status';
import { StoredReasons } from './stored-reasons';
import { readerNumberFormat } from '../../../lib/reader-format';

type Reactor = NonNullable<WalkthroughBank['steps'][number]['reactor']>;
type ReactorForm = { thermalSwitch: 'closed' | 'open' | undefined; inductance: [string, string, string]; temperature: string; notes: string };

const switchOptions = [
  { value: 'closed', label: 'Closed (continuity)' },
  { value: 'open', label: 'Open (tripped)' },
] as const;

const text = (v: unknown) => (typeof v === 'number' ? String(v) : '');
const signed = readerNumberFormat({ signDisplay: 'exceptZero', minimumFractionDigits: 1, maximumFractionDigits: 1 });

function formFrom(input: Record<string, unknown> | undefined): ReactorForm {
  const inductance = Array.isArray(input?.inductanceMH) ? input.inductanceMH : [];
  return {
    thermalSwitch: input?.thermalSwitchClosed === true ? 'closed' : input?.thermalSwitchClosed === false ? 'open' : undefined,
    inductance: [text(inductance[0]), text(inductance[1]), text(inductance[2])],
    temperature: text(input?.temperatureC),
    notes: typeof input?.notes === 'string' ? input.notes : '',
  };
}

const fieldOf = ({ path }: { path: PropertyKey[] }): Path<ReactorForm> | 'root' => {
  const [head, index] = path.map(String);
  if (head === 'thermalSwitchClosed') return 'thermalSwitch';
  if (head === 'inductanceMH') return `inductance.${(Number(index) || 0) as 0 | 1 | 2}`;
  if (head === 'temperatureC') return 'temperature';
  if (head === 'notes') return 'notes';
  return 'root';
};

/** A detuned step's reactor: thermal switch, optional inductance per phase against the register, temperature. */
export function ReactorCard({ orderId, stepNumber, reactor, readings, editable }: { orderId: number; stepNumber: number; reactor: Reactor; readings: readonly Reading[]; editable: boolean }) {
  const { form: methods, latestWaiting, latestStored, recorded, submitWith } = useComponentReading({
    orderId,
    target: 'reactor',
    targetId: reactor.id,
    readings,
    label: `Step ${stepNumber} reactor`,
    formFrom,
    fieldOf,
  });
  const { control, register, formState } = methods;
  const form = useWatch({ control }) as ReactorForm;
  const live = liveReactorResult(form.inductance.map(parseDecimal), reactor.inductanceMH);
  const errors = formState.errors;

  const onSubmit = submitWith((values, stamp) => {
    const inductance = values.inductance.map(parseDecimal);
    const temperature = parseDecimal(values.temperature);
    return {
      ...stamp,
      target: 'reactor',
      targetId: reactor.id,
      // Undefined goes to the contract as is, so its own message asks for the thermal switch.
      thermalSwitchClosed: (values.thermalSwitch === undefined ? undefined : values.thermalSwitch === 'closed') as boolean,
      ...(inductance.some((v) => v !== undefined) ? { inductanceMH: inductance.map((v) => v ?? Number.NaN) as [number, number, number] } : {}),
      ...(temperature !== undefined ? { temperatureC: temperature } : {}),
      notes: values.notes.trim(),
    };
  });

  return (
    <ComponentCard
      title={`Step ${stepNumber} · Reactor`}
      testId={`reactor-${reactor.id}`}
      facts={
        <>
          <span className="numeric">{reactor.inductanceMH} mH</span> per phase · detuning <span className="numeric">{(reactor.detuningFactor * 100).toFixed(1)} %</span>
          {reactor.model && <> · {reactor.model}</>}
        </>
      }
    >
      <form onSubmit={(event) => void onSubmit(event)} noValidate className="grid gap-4">
        <Controller
          control={control}
          name="thermalSwitch"
          render={({ field }) => (
            <ChoiceGroup legend="Thermal switch" options={switchOptions} value={field.value} onChange={field.onChange} columns={2} error={errors.thermalSwitch?.message} />
          )}
        />
        {form.thermalSwitch === 'open' && <p className="font-semibold text-replace">An open thermal switch means the reactor overheated: find the cause before the step goes back in.</p>}
        <fieldset className="grid min-w-0 gap-2">
          <legend className="mb-1 font-medium">Inductance per phase (optional)</legend>
          <div className="grid grid-cols-3 gap-2">
            {([0, 1, 2] as const).map((i) => (
              <DecimalField key={i} label={`L${i + 1}`} unit="mH" disabled={!editable} error={errors.inductance?.[i]?.message} {...register(`inductance.${i}`)} />
            ))}
          </div>
        </fieldset>
        {live.kind !== 'none' && (
          <div aria-live="polite" className="rounded border border-line bg-sunken p-3" data-testid="live-result">
            {live.kind === 'incomplete' ? (
              <p className="text-ink-muted">Enter all three phases to compare them with the register.</p>
            ) : (
              <p>
                Against the register’s {reactor.inductanceMH} mH:{' '}
                <span className="numeric">{live.deviationsPct.map((d) => `${signed.format(d)} %`).join(' · ')}</span>.{' '}
                <span className={live.within ? '' : 'font-semibold text-replace'}>
                  {live.within ? `Within ± ${reactorTolerancePct} %.` : `Outside ± ${reactorTolerancePct} %: check for shorted turns and the register.`}
                </span>
              </p>
            )}
          </div>
        )}
        <DecimalField label="Reactor temperature" unit="°C" disabled={!editable} error={errors.temperature?.message} {...register('temperature')} />
        <NotesField disabled={!editable} error={errors.notes?.message} {...register('notes')} />
        {errors.root?.message && <p className="font-medium text-replace">{errors.root.message}</p>}
        {editable && (
          <Button type="submit" variant={recorded && !formState.isDirty ? 'secondary' : 'primary'} disabled={recorded && !formState.isDirty} className="w-full desk:w-auto">
            {recorded ? (formState.isDirty ? 'Record again' : 'Recorded') : 'Record reactor'}
          </Button>
        )}
        <OutboxItemStatus item={latestWaiting} storedAt={latestStored?.recordedAt} />
        {!latestWaiting && <StoredReasons reading={latestStored} />}
      </form>
    </ComponentCard>
  );
}
