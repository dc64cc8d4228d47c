import { useMutation, useQueryClient } from '@tanstack/react-query';
import { contactorCreate, fuseSetCreate, reactorCreate } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import {
  componentMutations,
  type ComponentCreate,
  type Contactor,
  type FuseSet,
  type Reactor,
} from '../api/component-queries';
import { zodResolver } from '../../../lib/schema-messages';
import { DateField, NumberField, TextField } from './form-field';
import { FormActions } from './form-actions';
import { asNullableText, asNumber } from './form-values';
import { applyServerErrors, type FormFailure } from './server-errors';

// The step's other components: contactor, detuning reactor, fuse set. Each form holds the
// shared create schema's values; an edit sends the same fields less stepId, with the version.

type FormProps<R> = {
  stepId: number;
  record?: R;
  onSaved: (record: R) => void;
  cancel?: ReactNode;
};

const grid = 'grid gap-4 desk:grid-cols-2';

export function ContactorForm({ stepId, record, onSaved, cancel }: FormProps<Contactor>) {
  const queryClient = useQueryClient();
  const create = useMutation(componentMutations.create(queryClient, 'contactors'));
  const update = useMutation(componentMutations.update(queryClient, 'contactors'));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ComponentCreate['contactors'], unknown, z.output<typeof contactorCreate>>({
    resolver: zodResolver(contactorCreate),
    defaultValues: record
      ? { stepId, ratedOperations: record.ratedOperations, counterAtInstall: record.counterAtInstall, maker: record.maker, model: record.model, installedOn: record.installedOn }
      : { stepId, counterAtInstall: 0, maker: '', model: '', installedOn: null },
    mode: 'onTouched',
  });
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { stepId: _s, ...changes } = values;
      onSaved(record ? await update.mutateAsync({ id: record.id, body: { ...changes, version: record.version } }) : await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, Object.keys(contactorCreate.shape)));
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-6">
      <div className={grid}>
        <NumberField
          label="Rated electrical endurance"
          unit="operations"
          hint="Capacitor-duty switching operations, from the contactor's data"
          registration={register('ratedOperations', { setValueAs: asNumber })}
          error={errors.ratedOperations}
          input={{ inputMode: 'numeric' }}
        />
        <NumberField
          label="Operations counter at installation"
          hint="0 for a new contactor"
          registration={register('counterAtInstall', { setValueAs: asNumber })}
          error={errors.counterAtInstall}
          input={{ inputMode: 'numeric' }}
        />
        <TextField label="Maker" registration={register('maker')} error={errors.maker} />
        <TextField label="Model" registration={register('model')} error={errors.model} />
        <DateField label="Installed on" hint="Optional" registration={register('installedOn', { setValueAs: asNullableText })} error={errors.installedOn} />
      </div>
      <FormActions failure={failure} submitting={formState.isSubmitting} submitLabel={record ? 'Save the contactor' : 'Add the contactor'} cancel={cancel} />
    </form>
  );
}

export function ReactorForm({ stepId, record, onSaved, cancel, detuningFactor }: FormProps<Reactor> & { detuningFactor?: number | null }) {
  const queryClient = useQueryClient();
  const create = useMutation(componentMutations.create(queryClient, 'reactors'));
  const update = useMutation(componentMutations.update(queryClient, 'reactors'));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ComponentCreate['reactors'], unknown, z.output<typeof reactorCreate>>({
    resolver: zodResolver(reactorCreate),
    defaultValues: record
      ? {
          stepId,
          inductanceMH: record.inductanceMH,
          ratedCurrentA: record.ratedCurrentA,
          detuningFactor: record.detuningFactor,
          maker: record.maker,
          model: record.model,
          installedOn: record.installedOn,
        }
      : { stepId, ...(detuningFactor ? { detuningFactor } : {}), maker: '', model: '', installedOn: null },
    mode: 'onTouched',
  });
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { stepId: _s, ...changes } = values;
      onSaved(record ? await update.mutateAsync({ id: record.id, body: { ...changes, version: record.version } }) : await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, Object.keys(reactorCreate.shape)));
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-6">
      <div className={grid}>
        <NumberField label="Inductance per phase" unit="mH" registration={register('inductanceMH', { setValueAs: asNumber })} error={errors.inductanceMH} />
        <NumberField label="Rated current" unit="A" registration={register('ratedCurrentA', { setValueAs: asNumber })} error={errors.ratedCurrentA} />
        <NumberField
          label="Detuning factor p"
          hint="As a fraction: 0.07 for 7 %"
          registration={register('detuningFactor', { setValueAs: asNumber })}
          error={errors.detuningFactor}
        />
        <TextField label="Maker" registration={register('maker')} error={errors.maker} />
        <TextField label="Model" registration={register('model')} error={errors.model} />
        <DateField label="Installed on" hint="Optional" registration={register('installedOn', { setValueAs: asNullableText })} error={errors.installedOn} />
      </div>
      <FormActions failure={failure} submitting={formState.isSubmitting} submitLabel={record ? 'Save the reactor' : 'Add the reactor'} cancel={cancel} />
    </form>
  );
}

export function FuseSetForm({ stepId, record, onSaved, cancel }: FormProps<FuseSet>) {
  const queryClient = useQueryClient();
  const create = useMutation(componentMutations.create(queryClient, 'fuse-sets'));
  const update = useMutation(componentMutations.update(queryClient, 'fuse-sets'));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<ComponentCreate['fuse-sets'], unknown, z.output<typeof fuseSetCreate>>({
    resolver: zodResolver(fuseSetCreate),
    defaultValues: record
      ? { stepId, ratedCurrentA: record.ratedCurrentA, type: record.type, installedOn: record.installedOn }
      : { stepId, type: 'gG', installedOn: null },
    mode: 'onTouched',
  });
  const errors = formState.errors;
  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { stepId: _s, ...changes } = values;
      onSaved(record ? await update.mutateAsync({ id: record.id, body: { ...changes, version: record.version } }) : await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, Object.keys(fuseSetCreate.shape)));
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-6">
      <div className={grid}>
        <NumberField label="Rated current" unit="A" registration={register('ratedCurrentA', { setValueAs: asNumber })} error={errors.ratedCurrentA} />
        <TextField label="Fuse type" hint="e.g. gG, aM or NH-00 gG" registration={register('type')} error={errors.type} />
        <DateField label="Installed on" hint="Optional" registration={register('installedOn', { setValueAs: asNullableText })} error={errors.installedOn} />
      </div>
      <FormActions failure={failure} submitting={formState.isSubmitting} submitLabel={record ? 'Save the fuse set' : 'Add the fuse set'} cancel={cancel} />
    </form>
  );
}
