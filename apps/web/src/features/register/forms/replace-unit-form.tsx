import { useMutation, useQueryClient } from '@tanstack/react-query';
import { unitReplace, type Unit } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { FormProvider, useForm, type DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '../../../lib/schema-messages';
import { unitMutations, type UnitReplace, type UnitReplacement } from '../api/unit-queries';
import { DateField, FieldGroup, TextField } from './form-field';
import { FormActions } from './form-actions';
import { applyServerErrors, type FormFailure } from './server-errors';
import { UnitFields } from './unit-fields';

type ReplaceOutput = z.output<typeof unitReplace>;

const replacementFields = [
  'nameplateKvar',
  'nameplateVoltageV',
  'nameplateFrequencyHz',
  'connection',
  'capacitanceUF',
  'tolerancePreset',
  'toleranceMinusPct',
  'tolerancePlusPct',
  'temperatureCategory',
  'dischargeTimeS',
  'serial',
  'maker',
  'model',
  'installedOn',
];
const fieldNames = ['removedOn', 'reason', 'version', ...replacementFields.map((field) => `replacement.${field}`)];

function today(): string {
  const now = new Date();
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** The new unit usually matches the old one's nameplate: start from it, with a blank serial. */
function defaultsOf(unit: Unit): DefaultValues<UnitReplace> {
  return {
    version: unit.version,
    removedOn: today(),
    reason: '',
    replacement: {
      nameplateKvar: unit.nameplateKvar,
      nameplateVoltageV: unit.nameplateVoltageV,
      nameplateFrequencyHz: unit.nameplateFrequencyHz,
      connection: unit.connection,
      capacitanceUF: null,
      tolerancePreset: unit.tolerancePreset,
      ...(unit.tolerancePreset === 'custom' ? { toleranceMinusPct: unit.toleranceMinusPct, tolerancePlusPct: unit.tolerancePlusPct } : {}),
      temperatureCategory: unit.temperatureCategory,
      dischargeTimeS: unit.dischargeTimeS,
      serial: '',
      maker: unit.maker,
      model: unit.model,
      installedOn: null,
    },
  };
}

type ReplaceUnitFormProps = {
  unit: Unit;
  onReplaced: (result: UnitReplacement) => void;
  cancel?: ReactNode;
};

/** Takes a unit out of service with a date and a reason and puts a new one at its position. */
export function ReplaceUnitForm({ unit, onReplaced, cancel }: ReplaceUnitFormProps) {
  const queryClient = useQueryClient();
  const replace = useMutation(unitMutations.replace(queryClient));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const form = useForm<UnitReplace, unknown, ReplaceOutput>({
    resolver: zodResolver(unitReplace),
    defaultValues: defaultsOf(unit),
    mode: 'onTouched',
  });
  const errors = form.formState.errors;

  const onSubmit = form.handleSubmit(async (values) => {
    setFailure(null);
    try {
      onReplaced(await replace.mutateAsync({ id: unit.id, body: values }));
    } catch (error) {
      setFailure(applyServerErrors(error, form.setError, fieldNames));
    }
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-8">
        <FieldGroup legend="The unit leaving service">
          <DateField label="Removed on" registration={form.register('removedOn')} error={errors.removedOn} />
          <TextField
            label="Reason"
            hint="What was found, e.g. over-pressure disconnector operated"
            registration={form.register('reason')}
            error={errors.reason}
          />
        </FieldGroup>
        <div className="grid gap-2">
          <h3 className="text-lg font-semibold">The new unit at position {unit.position}</h3>
          <p className="text-base text-ink-muted desk:text-sm">
            Filled in from the unit it replaces; change what differs. Installed on defaults to the removal date.
          </p>
        </div>
        <UnitFields prefix="replacement." withPosition={false} />
        <FormActions failure={failure} submitting={form.formState.isSubmitting} submitLabel="Replace the unit" cancel={cancel} />
      </form>
    </FormProvider>
  );
}
