import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { checklistItems, priorities, workOrderCreate, workOrderKinds, type WorkOrder, type WorkOrderCreate, type WorkOrderKind } from '@varden/schemas';
import { useState, type ReactNode } from 'react';
import { Controller, useForm, useWatch, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '../../../components/button';
import { CheckboxGroup } from '../../../components/form/checkbox-group';
import { FormAlert } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { pushNotice } from '../../../lib/notices';
import { zodResolver } from '../../../lib/schema-messages';
import { technicians } from '../api/technician-queries';
import { workOrderMutations } from '../api/work-order-queries';
import { defaultChecklists } from '../lib/default-checklists';
import { addDays, localToday } from '../lib/month-grid';
import { checklistLabels, kindLabels, priorityLabels } from '../lib/work-order-words';
import { BankPicker } from './bank-picker';
import { SelectField, TextAreaField } from './form-controls';

type Output = z.output<typeof workOrderCreate>;
const fieldNames = Object.keys(workOrderCreate.shape) as Array<Path<WorkOrderCreate>>;

const asId = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));
const asNullableId = (value: unknown) => (value === '' || value === null || value === undefined ? null : Number(value));

type NewWorkOrderFormProps = {
  prefill: { siteId?: number; bankId?: number; kind?: WorkOrderKind };
  onCreated: (order: WorkOrder) => void;
  cancel: ReactNode;
};

/**
 * A new order by hand: kind, bank (site first), what to do and record, when, how urgent, and
 * who. Checked by the shared workOrderCreate schema; with a technician chosen it is dispatched
 * to them at once unless the planner unticks that.
 */
export function NewWorkOrderForm({ prefill, onCreated, cancel }: NewWorkOrderFormProps) {
  const queryClient = useQueryClient();
  const create = useMutation(workOrderMutations.create(queryClient));
  const transition = useMutation(workOrderMutations.transition(queryClient));
  const people = useQuery(technicians.list());
  const [siteId, setSiteId] = useState<number | undefined>(prefill.siteId);
  const [dispatchNow, setDispatchNow] = useState(true);
  const [failure, setFailure] = useState<string | undefined>();
  const kind = prefill.kind ?? 'inspection';

  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors, isSubmitting },
  } = useForm<WorkOrderCreate, unknown, Output>({
    resolver: zodResolver(workOrderCreate),
    mode: 'onTouched',
    defaultValues: {
      kind,
      ...(prefill.bankId ? { bankId: prefill.bankId } : {}),
      title: '',
      instructions: '',
      checklist: defaultChecklists[kind],
      dueOn: addDays(localToday(), 14),
      priority: 'normal',
      assigneeId: null,
    },
  });
  const assigneeId = useWatch({ control, name: 'assigneeId' });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(undefined);
    let created: WorkOrder;
    try {
      created = await create.mutateAsync(values);
    } catch (error) {
      setFailure(applyFieldErrors(error, setError, fieldNames));
      return;
    }
    if (created.assigneeId !== null && dispatchNow) {
      try {
        created = await transition.mutateAsync({ id: created.id, body: { to: 'dispatched', version: created.version, comment: '' } });
      } catch (error) {
        pushNotice(`Work order #${created.id} was created but not dispatched: ${error instanceof Error ? error.message : 'the server refused.'}`);
      }
    }
    onCreated(created);
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid max-w-measure gap-6">
      <fieldset className="grid gap-4">
        <legend className="mb-2 text-lg font-semibold">What and where</legend>
        <SelectField
          label="Kind"
          {...register('kind', {
            onChange: (event: { target: { value: string } }) => {
              const next = workOrderKinds.find((k) => k === event.target.value);
              if (next) setValue('checklist', defaultChecklists[next]);
            },
          })}
          options={workOrderKinds.map((k) => ({ value: k, label: kindLabels[k] }))}
          error={errors.kind?.message}
        />
        <BankPicker
          siteId={siteId}
          onSiteChange={(next) => {
            setSiteId(next);
            setValue('bankId', undefined as unknown as number);
          }}
          bankField={register('bankId', { setValueAs: asId })}
          bankError={errors.bankId?.message}
        />
        <TextField label="Title" autoComplete="off" {...register('title')} error={errors.title?.message} hint="What the technician sees first, e.g. “Half-yearly inspection”." />
        <TextAreaField label="Instructions" {...register('instructions')} error={errors.instructions?.message} hint="Anything the technician should know: access, keys, what to look at." />
        <Controller
          control={control}
          name="checklist"
          render={({ field, fieldState }) => (
            <CheckboxGroup
              legend="Readings to record"
              columns={2}
              options={checklistItems.map((item) => ({ value: item, label: checklistLabels[item] }))}
              value={field.value ?? []}
              onChange={field.onChange}
              onBlur={field.onBlur}
              error={fieldState.error?.message}
            />
          )}
        />
      </fieldset>

      <fieldset className="grid gap-4">
        <legend className="mb-2 text-lg font-semibold">When and who</legend>
        <div className="grid gap-4 desk:grid-cols-2">
          <TextField label="Due on" type="date" {...register('dueOn')} error={errors.dueOn?.message} />
          <SelectField label="Priority" {...register('priority')} options={priorities.map((p) => ({ value: p, label: priorityLabels[p] }))} error={errors.priority?.message} />
        </div>
        <SelectField
          label="Technician"
          {...register('assigneeId', { setValueAs: asNullableId })}
          placeholder="Nobody yet"
          options={(people.data ?? []).map((person) => ({ value: String(person.id), label: person.name }))}
          error={errors.assigneeId?.message}
          hint={people.isError ? `The technicians could not be listed: ${people.error.message}` : undefined}
        />
        {assigneeId !== null && assigneeId !== undefined && (
          <label className="flex min-h-touch cursor-pointer items-start gap-3 rounded px-2 py-2 hover:bg-sunken desk:min-h-control">
            <input type="checkbox" checked={dispatchNow} onChange={(event) => setDispatchNow(event.target.checked)} className="mt-1 size-5 shrink-0 accent-copper" />
            <span>
              <span className="block">Dispatch to the technician now</span>
              <span className="block text-base text-ink-muted desk:text-sm">They are told by e-mail and see it among their orders. Untick to keep it queued.</span>
            </span>
          </label>
        )}
      </fieldset>

      {failure && <FormAlert>{failure}</FormAlert>}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? 'Creating…' : 'Create work order'}
        </Button>
        {cancel}
      </div>
    </form>
  );
}
