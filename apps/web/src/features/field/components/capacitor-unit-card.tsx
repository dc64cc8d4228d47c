import { type ChecklistItem, type FieldMethod, type Photo, type Reading } from '@varden/schemas';
import { Controller, useWatch, type Path } from 'react-hook-form';
import { Button } from '../../../components/button';
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
import { useComponentReading } from '../readings/use-component-reading';
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
  const methods = methodsFor(unit, place);
  const subject = `Step ${stepNumber}, unit ${unit.position}`;
  const reading = useComponentReading({
    orderId,
    target: 'capacitor-unit',
    targetId: unit.id,
    readings,
    label: `${subject} · capacitance`,
    formFrom: (previous) => (previous ? capacitorFormFrom(previous, methods[0] ?? 'per-element') : emptyCapacitorForm(methods[0] ?? 'per-element')),
    fieldOf: (issue) => (capacitorFieldOf(issue.path) ?? 'root') as Path<CapacitorForm>,
  });
  const { latestWaiting, latestStored, recorded, submitWith } = reading;

  const { control, register, formState } = reading.form;
  const form = useWatch({ control }) as CapacitorForm;
  const live = liveCapacitorResult(unit, place, capacitorValuesOf(form));
  const server = latestStored ? serverCapacitorResult(latestStored) : null;
  const asks = (item: ChecklistItem) => checklist.includes(item);
  const labels = tripletLabels[form.method](unit.connection);
  const field = tripletField[form.method];
  const unitOf = form.method === 'line-currents' ? 'A' : 'µF';

  const onSubmit = submitWith((values, stamp) => capacitorInputOf(values, unit, checklist, stamp));

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
