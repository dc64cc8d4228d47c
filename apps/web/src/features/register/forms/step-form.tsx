import { useMutation, useQueryClient } from '@tanstack/react-query';
import { stepCreate, type Step } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '../../../lib/schema-messages';
import { stepMutations, type StepCreate } from '../api/step-queries';
import { NumberField } from './form-field';
import { FormActions } from './form-actions';
import { asNumber } from './form-values';
import { applyServerErrors, type FormFailure } from './server-errors';

type StepOutput = z.output<typeof stepCreate>;
const fieldNames = Object.keys(stepCreate.shape);

type StepFormProps = {
  bankId: number;
  /** The step to change; a new step when absent. */
  step?: Step;
  /** Suggestions for a new step: the next number and the last step's rating. */
  suggested?: { number: number; ratedKvar?: number | undefined };
  onSaved: (step: Step) => void;
  cancel?: ReactNode;
};

/** A step of a bank: its number and its rated kvar at network voltage. */
export function StepForm({ bankId, step, suggested, onSaved, cancel }: StepFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(stepMutations.create(queryClient));
  const update = useMutation(stepMutations.update(queryClient));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<StepCreate, unknown, StepOutput>({
    resolver: zodResolver(stepCreate),
    defaultValues: step
      ? { bankId, number: step.number, ratedKvar: step.ratedKvar }
      : { bankId, number: suggested?.number ?? 1, ...(suggested?.ratedKvar ? { ratedKvar: suggested.ratedKvar } : {}) },
    mode: 'onTouched',
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const { bankId: _bankId, ...changes } = values;
      onSaved(step ? await update.mutateAsync({ id: step.id, body: { ...changes, version: step.version } }) : await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, fieldNames));
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-measure gap-6">
      <div className="grid gap-4 desk:grid-cols-2">
        <NumberField label="Step number" registration={register('number', { setValueAs: asNumber })} error={errors.number} input={{ inputMode: 'numeric' }} />
        <NumberField
          label="Rated output"
          unit="kvar"
          hint="At network voltage"
          registration={register('ratedKvar', { setValueAs: asNumber })}
          error={errors.ratedKvar}
        />
      </div>
      <FormActions failure={failure} submitting={isSubmitting} submitLabel={step ? 'Save the step' : 'Add the step'} cancel={cancel} />
    </form>
  );
}
