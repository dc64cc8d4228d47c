import { useMutation, useQueryClient } from '@tanstack/react-query';
import { checklistItems, inspectionPlanCreate, type InspectionPlan } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { Controller, useForm, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '../../../components/button';
import { CheckboxGroup } from '../../../components/form/checkbox-group';
import { FormAlert } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { planMutations, plans, type PlanCreate } from '../api/plan-queries';
import { defaultChecklists } from '../lib/default-checklists';
import { addDays, localToday } from '../lib/month-grid';
import { checklistLabels } from '../lib/work-order-words';
import { BankPicker } from './bank-picker';
import { IntervalHelper } from './interval-helper';

type Output = z.output<typeof inspectionPlanCreate>;
const fieldNames = Object.keys(inspectionPlanCreate.shape) as Array<Path<PlanCreate>>;

const asNumber = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));

type PlanFormProps = {
  /** The plan to change; a new plan when absent. */
  plan?: InspectionPlan;
  prefill?: { siteId?: number; bankId?: number };
  onSaved: (plan: InspectionPlan) => void;
  cancel: ReactNode;
};

/** An inspection plan: its bank, interval (with the interval helper), lead time, checklist and next due date. */
export function PlanForm({ plan, prefill = {}, onSaved, cancel }: PlanFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(planMutations.create(queryClient));
  const update = useMutation(planMutations.update(queryClient));
  const [siteId, setSiteId] = useState<number | undefined>(plan?.siteId ?? prefill.siteId);
  const [failure, setFailure] = useState<string | undefined>();
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors, isSubmitting },
  } = useForm<PlanCreate, unknown, Output>({
    resolver: zodResolver(inspectionPlanCreate),
    mode: 'onTouched',
    defaultValues: plan
      ? { bankId: plan.bankId, name: plan.name, intervalMonths: plan.intervalMonths, leadDays: plan.leadDays, checklist: plan.checklist, nextDueOn: plan.nextDueOn, active: plan.active }
      : {
          ...(prefill.bankId ? { bankId: prefill.bankId } : {}),
          name: 'Half-yearly inspection',
          intervalMonths: 6,
          leadDays: 14,
          checklist: defaultChecklists.inspection,
          nextDueOn: addDays(localToday(), 30),
          active: true,
        },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(undefined);
    try {
      if (plan) {
        const { bankId: _bank, ...changes } = values;
        onSaved(await update.mutateAsync({ id: plan.id, body: { ...changes, version: plan.version } }));
      } else onSaved(await create.mutateAsync(values));
    } catch (error) {
      const message = applyFieldErrors(error, setError, fieldNames);
      if (isApiError(error) && error.status === 409 && plan) {
        void queryClient.invalidateQueries({ queryKey: plans.detail(plan.id).queryKey });
        setFailure(`${error.message} The page now shows the current plan: check it and save again.`);
      } else setFailure(message);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-measure gap-6">
      <fieldset className="grid gap-4">
        <legend className="mb-2 text-lg font-semibold">Bank and plan</legend>
        {plan ? (
          <p>
            <span className="text-ink-muted">Bank:</span> {plan.siteName} · {plan.bankName}
          </p>
        ) : (
          <BankPicker
            siteId={siteId}
            onSiteChange={(next) => {
              setSiteId(next);
              setValue('bankId', undefined as unknown as number);
            }}
            bankField={register('bankId', { setValueAs: asNumber })}
            bankError={errors.bankId?.message}
          />
        )}
        <TextField label="Name" autoComplete="off" {...register('name')} error={errors.name?.message} hint="The title of the orders the plan makes." />
      </fieldset>

      <fieldset className="grid gap-4">
        <legend className="mb-2 text-lg font-semibold">When</legend>
        <TextField
          label="Interval (months)"
          type="number"
          inputMode="numeric"
          min={1}
          max={120}
          {...register('intervalMonths', { setValueAs: asNumber })}
          error={errors.intervalMonths?.message}
          hint="A new inspection falls due this many months after the last one."
        />
        <IntervalHelper onUse={(months) => setValue('intervalMonths', months, { shouldDirty: true, shouldValidate: true })} />
        <div className="grid gap-4 desk:grid-cols-2">
          <TextField
            label="Lead time (days)"
            type="number"
            inputMode="numeric"
            min={0}
            max={120}
            {...register('leadDays', { setValueAs: asNumber })}
            error={errors.leadDays?.message}
            hint="The order is made this many days before it falls due."
          />
          <TextField label="Next due on" type="date" {...register('nextDueOn')} error={errors.nextDueOn?.message} />
        </div>
        <label className="flex min-h-touch cursor-pointer items-start gap-3 rounded px-2 py-2 hover:bg-sunken desk:min-h-control">
          <input type="checkbox" {...register('active')} className="mt-1 size-5 shrink-0 accent-copper" />
          <span>
            <span className="block">Active</span>
            <span className="block text-base text-ink-muted desk:text-sm">A paused plan makes no orders until it is active again.</span>
          </span>
        </label>
      </fieldset>

      <Controller
        control={control}
        name="checklist"
        render={({ field, fieldState }) => (
          <CheckboxGroup
            legend="Readings each inspection records"
            columns={2}
            options={checklistItems.map((item) => ({ value: item, label: checklistLabels[item] }))}
            value={field.value ?? []}
            onChange={field.onChange}
            onBlur={field.onBlur}
            error={fieldState.error?.message}
          />
        )}
      />

      {failure && <FormAlert>{failure}</FormAlert>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : plan ? 'Save the plan' : 'Create the plan'}
        </Button>
        {cancel}
      </div>
    </form>
  );
}
