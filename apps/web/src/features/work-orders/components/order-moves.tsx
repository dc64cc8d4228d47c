import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { workOrderTransitionRequest, type WorkOrder, type WorkOrderState } from '@varden/schemas';
import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import * as z from 'zod/mini';
import { Button, type ButtonVariant } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { technicians } from '../api/technician-queries';
import { workOrderMutations, type TransitionRequest } from '../api/work-order-queries';
import { SelectField, TextAreaField } from './form-controls';
import { useOrderWriteFailure } from './write-failure';

type MoveValues = TransitionRequest;
type MoveOutput = z.output<typeof workOrderTransitionRequest>;
const fieldNames = ['comment', 'assigneeId', 'signatureMeaning'] as Array<Path<MoveValues>>;

/** The shared request schema, with the reason the API requires for some moves asked for here too. */
export function moveSchema(needsReason: string | undefined) {
  if (!needsReason) return workOrderTransitionRequest;
  return workOrderTransitionRequest.check(z.refine((v) => v.comment.trim() !== '', { path: ['comment'], error: needsReason }));
}

type MoveFormProps = {
  order: WorkOrder;
  to: WorkOrderState;
  /** The command on the button: "Withdraw this order". */
  command: string;
  /** What the move does, above the form. */
  explanation: string;
  /** The message when no reason is given; the reason field is optional when absent. */
  needsReason?: string;
  reasonLabel?: string;
  /** Dispatching an order that has no technician yet asks for one. */
  asksTechnician?: boolean;
  /** Sealing: the meaning of the signature, shown and editable. */
  signatureMeaning?: string;
  variant?: ButtonVariant;
  onMoved?: (order: WorkOrder) => void;
};

const asOptionalId = (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value));

/** One move of the transition table as a small form: reason, technician or signature as the move needs. */
export function MoveForm({ order, to, command, explanation, needsReason, reasonLabel = 'Comment (optional)', asksTechnician = false, signatureMeaning, variant = 'secondary', onMoved }: MoveFormProps) {
  const queryClient = useQueryClient();
  const transition = useMutation(workOrderMutations.transition(queryClient));
  const people = useQuery({ ...technicians.list(), enabled: asksTechnician });
  const explainFailure = useOrderWriteFailure();
  const [failure, setFailure] = useState<string | undefined>();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<MoveValues, unknown, MoveOutput>({
    resolver: zodResolver(moveSchema(needsReason)),
    defaultValues: {
      to,
      version: order.version,
      comment: '',
      ...(signatureMeaning !== undefined ? { signatureMeaning } : {}),
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFailure(undefined);
    try {
      const moved = await transition.mutateAsync({ id: order.id, body: { ...values, to, version: order.version } });
      onMoved?.(moved);
    } catch (error) {
      setFailure(explainFailure(error, applyFieldErrors(error, setError, fieldNames)));
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-3" aria-label={command}>
      <p className="text-ink-muted">{explanation}</p>
      {asksTechnician && (
        <SelectField
          label="Technician"
          {...register('assigneeId', { setValueAs: asOptionalId })}
          placeholder="Choose a technician"
          options={(people.data ?? []).map((p) => ({ value: String(p.id), label: p.name }))}
          error={errors.assigneeId?.message}
        />
      )}
      {signatureMeaning !== undefined && (
        <TextAreaField
          label="Meaning of your signature"
          rows={4}
          {...register('signatureMeaning')}
          error={errors.signatureMeaning?.message}
          hint="Recorded with your name and the time. Word it as your site requires."
        />
      )}
      <TextAreaField label={needsReason ? (reasonLabel ?? 'Reason') : reasonLabel} rows={3} {...register('comment')} error={errors.comment?.message} />
      {failure && <FormAlert>{failure}</FormAlert>}
      <div>
        <Button type="submit" variant={variant} disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : command}
        </Button>
      </div>
    </form>
  );
}
