import { useMutation, useQueryClient } from '@tanstack/react-query';
import { bankCreate, type Bank, type BankCreate } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { useForm, useWatch, type DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import { zodResolver } from '../../../lib/schema-messages';
import { bankMutations } from '../api/bank-queries';
import { CheckboxField, DateField, FieldGroup, NumberField, TextField } from './form-field';
import { FormActions } from './form-actions';
import { asNullableNumber, asNullableText } from './form-values';
import { applyServerErrors, type FormFailure } from './server-errors';
import { readerLocale } from '../../../lib/reader-format';

type BankOutput = z.output<typeof bankCreate>;
const fieldNames = Object.keys(bankCreate.shape);

function defaultsOf(siteId: number, bank: Bank | undefined): DefaultValues<BankCreate> {
  if (bank) {
    const { id: _id, siteName: _s, stepCount: _c, retiredAt: _r, version: _v, ...fields } = bank;
    return fields;
  }
  return { siteId, name: '', location: '', controllerTargetPf: null, detuned: false, detuningFactor: null, commissionedOn: null };
}

type BankFormProps = {
  siteId: number;
  bank?: Bank;
  onSaved: (bank: Bank) => void;
  cancel?: ReactNode;
};

/** A bank (a correction panel): name, where it stands, its controller's target and its detuning. */
export function BankForm({ siteId, bank, onSaved, cancel }: BankFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(bankMutations.create(queryClient));
  const update = useMutation(bankMutations.update(queryClient));
  const [failure, setFailure] = useState<FormFailure | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors, isSubmitting },
  } = useForm<BankCreate, unknown, BankOutput>({
    resolver: zodResolver(bankCreate),
    defaultValues: defaultsOf(siteId, bank),
    mode: 'onTouched',
  });
  const detuned = useWatch({ control, name: 'detuned' });
  const detuningFactor = useWatch({ control, name: 'detuningFactor' });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      if (bank) {
        const { siteId: _siteId, ...changes } = values;
        onSaved(await update.mutateAsync({ id: bank.id, body: { ...changes, version: bank.version } }));
      } else onSaved(await create.mutateAsync(values));
    } catch (error) {
      setFailure(applyServerErrors(error, setError, fieldNames));
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-content gap-8">
      <FieldGroup legend="Bank">
        <TextField label="Name" hint="As painted on the panel, e.g. Bank A" registration={register('name')} error={errors.name} />
        <TextField label="Location in the site" hint="e.g. Main switchroom" registration={register('location')} error={errors.location} />
        <NumberField
          label="Controller target PF"
          hint="Optional: the power factor the bank's controller aims for"
          registration={register('controllerTargetPf', { setValueAs: asNullableNumber })}
          error={errors.controllerTargetPf}
        />
        <DateField
          label="Commissioned on"
          hint="Optional"
          registration={register('commissionedOn', { setValueAs: asNullableText })}
          error={errors.commissionedOn}
        />
      </FieldGroup>

      <FieldGroup legend="Detuning">
        <CheckboxField
          label="Detuned: each step has a reactor in series"
          registration={register('detuned', {
            onChange: (event: { target: { checked: boolean } }) => {
              if (!event.target.checked) setValue('detuningFactor', null, { shouldValidate: true });
            },
          })}
        />
        {detuned && (
          <NumberField
            label="Detuning factor p"
            hint="As a fraction: 0.07 for 7 %, 0.14 for 14 %"
            registration={register('detuningFactor', { setValueAs: asNullableNumber })}
            error={errors.detuningFactor}
            live={
              typeof detuningFactor === 'number' && detuningFactor > 0 && detuningFactor < 0.5 ? (
                <span className="text-ink-muted">
                  = <span className="numeric">{(detuningFactor * 100).toLocaleString(readerLocale(), { maximumFractionDigits: 2 })}</span> %
                </span>
              ) : null
            }
          />
        )}
      </FieldGroup>

      <FormActions failure={failure} submitting={isSubmitting} submitLabel={bank ? 'Save the bank' : 'Add the bank'} cancel={cancel} />
    </form>
  );
}
