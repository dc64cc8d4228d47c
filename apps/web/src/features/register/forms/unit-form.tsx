import { useMutation, useQueryClient } from '@tanstack/react-query';
import { unitCreate, type Site, type Unit, type UnitCreate } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { FormProvider, useForm, type DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '../../../lib/schema-messages';
import { unitMutations } from '../api/unit-queries';
import { FormActions } from './form-actions';
import { applyServerErrors, type FormFailure } from './server-errors';
import { UnitFields } from './unit-fields';

type UnitOutput = z.output<typeof unitCreate>;
const fieldNames = Object.keys(unitCreate.shape);

/** A new unit starts from its site's network (voltage, frequency) and the usual presets. */
export function newUnitDefaults(stepId: number, site: Pick<Site, 'voltageV' | 'frequencyHz'>, position: number): DefaultValues<UnitCreate> {
  return {
    stepId,
    position,
    nameplateVoltageV: site.voltageV,
    nameplateFrequencyHz: site.frequencyHz,
    connection: 'delta',
    capacitanceUF: null,
    tolerancePreset: 'iec',
    temperatureCategory: '',
    dischargeTimeS: 180,
    serial: '',
    maker: '',
    model: '',
    installedOn: null,
  };
}

/** The record's editable fields as the form holds them. */
export function unitDefaults(unit: Unit): DefaultValues<UnitCreate> {
  return {
    stepId: unit.stepId,
    position: unit.position,
    nameplateKvar: unit.nameplateKvar,
    nameplateVoltageV: unit.nameplateVoltageV,
    nameplateFrequencyHz: unit.nameplateFrequencyHz,
    connection: unit.connection,
    // A capacitance the API worked out from the nameplate is not shown as if someone had typed it.
    capacitanceUF: unit.capacitanceGiven ? unit.capacitanceUF : null,
    tolerancePreset: unit.tolerancePreset,
    ...(unit.tolerancePreset === 'custom' ? { toleranceMinusPct: unit.toleranceMinusPct, tolerancePlusPct: unit.tolerancePlusPct } : {}),
    temperatureCategory: unit.temperatureCategory,
    dischargeTimeS: unit.dischargeTimeS,
    serial: unit.serial,
    maker: unit.maker,
    model: unit.model,
    installedOn: unit.installedOn,
  };
}

type UnitFormProps = {
  defaults: DefaultValues<UnitCreate>;
  /** The unit to change; a new unit when absent. */
  unit?: Unit;
  onSaved: (unit: Unit) => void;
  cancel?: ReactNode;
};

/** A capacitor unit: its nameplate with the rated capacitance shown live, tolerance and record. */
export function UnitForm({ defaults, unit, onSaved, cancel }: UnitFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(unitMutations.create(queryClient));
  const update = useMutation(unitMutations.update(queryClient));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const form = useForm<UnitCreate, unknown, UnitOutput>({
    resolver: zodResolver(unitCreate),
    defaultValues: defaults,
    mode: 'onTouched',
  });

  const onSubmit = form.handleSubmit(async (values) => {
    setFailure(null);
    try {
      if (unit) {
        const { stepId: _stepId, ...changes } = values;
        onSaved(await update.mutateAsync({ id: unit.id, body: { ...changes, version: unit.version } }));
      } else onSaved(await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, form.setError, fieldNames));
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-8">
        <UnitFields />
        <FormActions
          failure={failure}
          submitting={form.formState.isSubmitting}
          submitLabel={unit ? 'Save the unit' : 'Add the unit'}
          cancel={cancel}
        />
      </form>
    </FormProvider>
  );
}
