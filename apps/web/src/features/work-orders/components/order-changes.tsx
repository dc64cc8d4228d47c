import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { priorities, workOrderUpdate, type WorkOrder } from '@varden/schemas';
import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { technicians } from '../api/technician-queries';
import { workOrderMutations, type WorkOrderUpdate } from '../api/work-order-queries';
import { formatCalendarDate } from '../lib/calendar-date';
import { priorityLabels } from '../lib/work-order-words';
import { SelectField } from './form-controls';
import { useOrderWriteFailure } from './write-failure';

type Output = z.output<typeof workOrderUpdate>;
const fieldNames = Object.keys(workOrderUpdate.shape) as Array<Path<WorkOrderUpdate>>;

function useOrderUpdate() {
  const queryClient = useQueryClient();
  const update = useMutation(workOrderMutations.update(queryClient));
  const explainFailure = useOrderWriteFailure();
  const [failure, setFailure] = useState<string | undefined>();
  const [done, setDone] = useState<string | undefined>();
  return { update, explainFailure, failure, setFailure, done, setDone };
}

/** Reschedule: a new due date or priority, saved with the version the page read (409 when stale). */
export function RescheduleForm({ order }: { order: WorkOrder }) {
  const { update, explainFailure, failure, setFailure, done, setDone } = useOrderUpdate();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<WorkOrderUpdate, unknown, Output>({
    resolver: zodResolver(workOrderUpdate),
    // When the order is read again (after a 409), the fields the planner left alone follow it.
    values: { dueOn: order.dueOn, priority: order.priority, version: order.version },
    resetOptions: { keepDirtyValues: true },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFailure(undefined);
    setDone(undefined);
    try {
      const saved = await update.mutateAsync({ id: order.id, body: { dueOn: values.dueOn, priority: values.priority, version: order.version } });
      setDone(`Saved: due ${formatCalendarDate(saved.dueOn)}, ${priorityLabels[saved.priority].toLowerCase()} priority.`);
    } catch (error) {
      setFailure(explainFailure(error, applyFieldErrors(error, setError, fieldNames)));
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} aria-label="Reschedule" className="grid gap-3">
      <div className="grid gap-3 desk:grid-cols-2">
        <TextField label="Due on" type="date" {...register('dueOn')} error={errors.dueOn?.message} />
        <SelectField label="Priority" {...register('priority')} options={priorities.map((p) => ({ value: p, label: priorityLabels[p] }))} error={errors.priority?.message} />
      </div>
      {failure && <FormAlert>{failure}</FormAlert>}
      {done && <FormSuccess>{done}</FormSuccess>}
      <div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Reschedule'}
        </Button>
      </div>
    </form>
  );
}

const asNullableId = (value: unknown) => (value === '' || value === null || value === undefined ? null : Number(value));

/** Assign or reassign the technician; "Nobody" only while the order is still queued. */
export function ReassignForm({ order }: { order: WorkOrder }) {
  const { update, explainFailure, failure, setFailure, done, setDone } = useOrderUpdate();
  const people = useQuery(technicians.list());
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<WorkOrderUpdate, unknown, Output>({
    resolver: zodResolver(workOrderUpdate),
    values: { assigneeId: order.assigneeId, version: order.version },
    resetOptions: { keepDirtyValues: true },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFailure(undefined);
    setDone(undefined);
    try {
      const saved = await update.mutateAsync({ id: order.id, body: { assigneeId: values.assigneeId ?? null, version: order.version } });
      setDone(saved.assigneeName ? `Assigned to ${saved.assigneeName}.` : 'Nobody is assigned now.');
    } catch (error) {
      setFailure(explainFailure(error, applyFieldErrors(error, setError, fieldNames)));
    }
  });
  const options = (people.data ?? []).map((p) => ({ value: String(p.id), label: p.name }));
  // The current technician stays choosable even when the list no longer names them (deactivated).
  if (order.assigneeId !== null && !options.some((o) => o.value === String(order.assigneeId))) {
    options.unshift({ value: String(order.assigneeId), label: order.assigneeName ?? `Person ${order.assigneeId}` });
  }
  return (
    <form noValidate onSubmit={onSubmit} aria-label={order.assigneeId === null ? 'Assign' : 'Reassign'} className="grid gap-3">
      <SelectField
        label="Technician"
        {...register('assigneeId', { setValueAs: asNullableId })}
        {...(order.state === 'queued' ? { placeholder: 'Nobody yet' } : {})}
        options={options}
        error={errors.assigneeId?.message}
        hint={order.state === 'dispatched' ? 'The new technician is told by e-mail.' : undefined}
      />
      {failure && <FormAlert>{failure}</FormAlert>}
      {done && <FormSuccess>{done}</FormSuccess>}
      <div>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : order.assigneeId === null ? 'Assign' : 'Reassign'}
        </Button>
      </div>
    </form>
  );
}
