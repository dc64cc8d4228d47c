import { type ChecklistItem, type FieldMethod, type Photo, type Reading } from '@varden/schemas';
import { useMemo } from 'react';
import { Controller, useForm, useWatch, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
import { newIdempotencyKey } from '../outbox/answer-outcome';
import { readingItemsOf } from '../outbox/outbox-queries';
import { recordReading } from '../outbox/record-reading';
import { useOutboxSnapshot } from '../outbox/use-field-outbox';
import { capacitorFieldOf, capacitorFormFrom, capacitorInputOf, capacitorValuesOf, emptyCapacitorForm, visualFindings, type CapacitorForm } from '../readings/capacitor-form';
import {
  differsFromServer,
  liveCapacitorResult,
  methodLabels,
  methodsFor,
  serverCapacitorResult,
  type UnitPlace,
  type WalkthroughUnit,
} from '../readings/live-capacitor-result';
import { LiveCapacitorResultView, ServerCapacitorResultView } from './capacitor-result';
import { ComponentCard, FieldGroup } from './component-card';
import { BigToggle, ChoiceGroup, DecimalField, NotesField } from './field-controls';
import { OutboxItemStatus } from './outbox-item-status';
import { PhotoCapture } from './photo-capture';

const tripletLabels: Record<FieldMethod, (connection: WalkthroughUnit['connection']) => string[]> = {
  'open-pairs': () => ['Terminals 1–2, 3 open', 'Terminals 2–3, 1 open', 'Terminals 3–1, 2 open'],
  shorted: () => ['Terminal 1 against 2+3', 'Terminal 2 against 1+3', 'Terminal 3 against 1+2'],
  'line-currents': () => ['Line current I1', 'Line current I2', 'Line current I3'],
  'per-element': (connection) =>
    connection === 'single-phase' ? ['Element C'] : connection === 'star' ? ['Phase C1', 'Phase C2', 'Phase C3'] : ['Leg C12', 'Leg C23', 'Leg C31'],
};

const tripletField: Record<FieldMethod, 'readings' | 'elements' | 'currents'> = {
  'open-pairs': 'readings',
  shorted: 'readings',
  'line-currents': 'currents',
  'per-element': 'elements',
};

type CapacitorUnitCardProps = {
  orderId: number;
  stepNumber: number;
  unit: WalkthroughUnit;
  place: UnitPlace;
  checklist: readonly ChecklistItem[];
  /** This unit's readings stored on this order, oldest first. */
  readings: readonly Reading[];
  photos: readonly Photo[];
  editable: boolean;
};

/**
 * One capacitor unit on the walk: the measurement method, the values (number keyboard), the
 * result right under them as the technician types, the visual checks and temperatures the
 * checklist asks for, notes and photos; then where the reading stands (on the phone, sent,
 * refused) and the server's own result.
 */
export function CapacitorUnitCard({ orderId, stepNumber, unit, place, checklist, readings, photos, editable }: CapacitorUnitCardProps) {
  const { items } = useOutboxSnapshot();
  const methods = methodsFor(unit, place);
  const waiting = readingItemsOf(items, orderId, 'capacitor-unit', unit.id);
  const latestWaiting = waiting.at(-1);
  const latestStored = readings.at(-1);
  const subject = `Step ${stepNumber}, unit ${unit.position}`;

  const defaults = useMemo(() => {
    const previous = latestWaiting?.payload.kind === 'reading' ? latestWaiting.payload.input : latestStored?.input;
    return previous ? capacitorFormFrom(previous as Record<string, unknown>, methods[0] ?? 'per-element') : emptyCapacitorForm(methods[0] ?? 'per-element');
    // The form starts from what was recorded when the card first draws; later records reset it themselves.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  const { control, register, handleSubmit, setError, reset, formState } = useForm<CapacitorForm>({ defaultValues: defaults });
  const form = useWatch({ control }) as CapacitorForm;
  const live = liveCapacitorResult(unit, place, capacitorValuesOf(form));
  const server = latestStored ? serverCapacitorResult(latestStored) : null;
  const recorded = Boolean(latestWaiting || latestStored);
  const asks = (item: ChecklistItem) => checklist.includes(item);
  const labels = tripletLabels[form.method](unit.connection);
  const field = tripletField[form.method];
  const unitOf = form.method === 'line-currents' ? 'A' : 'µF';

  const onSubmit = handleSubmit(async (values) => {
    const input = capacitorInputOf(values, unit, checklist, { idempotencyKey: newIdempotencyKey(), recordedAt: new Date().toISOString() });
    const issues = await recordReading(orderId, `${subject} · capacitance`, input, waiting);
    if (issues) {
      for (const issue of issues) setError((capacitorFieldOf(issue.path) ?? 'root') as Path<CapacitorForm>, { message: issue.message });
      return;
    }
    reset(values);
  });

  const errors = formState.errors;
  const tripletErrors = errors[field];

  return (
    <ComponentCard
      title={`Step ${stepNumber} · Unit ${unit.position}`}
      testId={`unit-${unit.id}`}
      facts={
        <>
          <span className="numeric">
            {unit.nameplateKvar} kvar · {unit.nameplateVoltageV} V · {unit.nameplateFrequencyHz} Hz
          </span>{' '}
          · {unit.connection}
          {unit.serial && <> · serial {unit.serial}</>}
        </>
      }
    >
      <form onSubmit={(event) => void onSubmit(event)} noValidate className="grid gap-4">
        <FieldGroup legend="Capacitance">
          <Controller
            control={control}
            name="method"
            render={({ field: method }) => (
              <ChoiceGroup
                legend="Method"
                options={methods.map((m) => ({ value: m, label: methodLabels[m] }))}
                value={method.value}
                onChange={method.onChange}
                columns={methods.length > 1 ? 2 : 1}
              />
            )}
          />
          <div className="grid gap-3 desk:grid-cols-3">
            {labels.map((label, i) => (
              <DecimalField
                key={`${field}.${i}`}
                label={label}
                unit={unitOf}
                disabled={!editable}
                error={tripletErrors?.[i]?.message}
                {...register(`${field}.${i as 0 | 1 | 2}`)}
              />
            ))}
          </div>
          {form.method === 'line-currents' && (
            <div className="grid gap-3 desk:grid-cols-3">
              <DecimalField label="Measured voltage" unit="V" disabled={!editable} error={errors.voltage?.message} {...register('voltage')} />
              <DecimalField label="Measured frequency" unit="Hz" disabled={!editable} error={errors.frequency?.message} {...register('frequency')} />
              <DecimalField label="Voltage THD (if known)" unit="%" disabled={!editable} error={errors.thd?.message} {...register('thd')} />
            </div>
          )}
          <LiveCapacitorResultView result={live} nameplateKvar={unit.nameplateKvar} connection={unit.connection} />
        </FieldGroup>

        {asks('visual') && (
          <FieldGroup legend="Visual checks">
            {visualFindings.map((finding) => (
              <Controller
                key={finding.name}
                control={control}
                name={finding.name}
                render={({ field: toggle }) => (
                  <BigToggle label={finding.label} checked={toggle.value} onChange={toggle.onChange} onWord="Found" offWord="None" onIsFinding disabled={!editable} />
                )}
              />
            ))}
          </FieldGroup>
        )}

        {(asks('case-temperature') || asks('discharge-resistor') || asks('insulation-resistance')) && (
          <FieldGroup legend="Temperatures and resistances">
            <div className="grid gap-3 desk:grid-cols-2">
              {asks('case-temperature') && (
                <>
                  <DecimalField label="Case temperature" unit="°C" hint="Investigate above 55 °C; limit 65 °C." disabled={!editable} error={errors.caseTemperature?.message} {...register('caseTemperature')} />
                  <DecimalField label="Ambient temperature" unit="°C" disabled={!editable} error={errors.ambientTemperature?.message} {...register('ambientTemperature')} />
                </>
              )}
              {asks('discharge-resistor') && (
                <DecimalField label="Discharge resistance, one element" unit="Ω" disabled={!editable} error={errors.dischargeResistor?.message} {...register('dischargeResistor')} />
              )}
              {asks('insulation-resistance') && (
                <DecimalField label="Insulation resistance, terminals to case" unit="MΩ" disabled={!editable} error={errors.insulation?.message} {...register('insulation')} />
              )}
            </div>
          </FieldGroup>
        )}

        <NotesField disabled={!editable} error={errors.notes?.message} {...register('notes')} />
        {errors.root?.message && <p className="font-medium text-replace">{errors.root.message}</p>}

        {editable && (
          <Button type="submit" variant={recorded && !formState.isDirty ? 'secondary' : 'primary'} disabled={recorded && !formState.isDirty} className="w-full desk:w-auto">
            {recorded ? (formState.isDirty ? 'Record again' : 'Recorded') : 'Record reading'}
          </Button>
        )}
        <OutboxItemStatus item={latestWaiting} storedAt={latestStored?.recordedAt} />
        {server && !latestWaiting && <ServerCapacitorResultView result={server} differs={!formState.isDirty && differsFromServer(live, server)} />}
      </form>

      {asks('photos') && (
        <FieldGroup legend="Photos">
          <PhotoCapture orderId={orderId} target="capacitor-unit" targetId={unit.id} subject={subject} stored={photos} />
        </FieldGroup>
      )}
    </ComponentCard>
  );
}
