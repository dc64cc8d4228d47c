import type { Reading, ReadingInput } from '@varden/schemas';
import { useMemo } from 'react';
import { useForm, type DefaultValues, type FieldValues, type Path } from 'react-hook-form';
import { newIdempotencyKey } from '../outbox/answer-outcome';
import { readingItemsOf } from '../outbox/outbox-queries';
import type { PhotoTarget } from '../outbox/outbox-types';
import { recordReading, type ContractIssue } from '../outbox/record-reading';
import { useOutboxSnapshot } from '../outbox/use-field-outbox';

interface ComponentReadingOptions<T extends FieldValues> {
  orderId: number;
  target: PhotoTarget;
  targetId: number;
  /** This component's readings stored on this order, oldest first. */
  readings: readonly Reading[];
  /** What the outbox shows while the reading waits, e.g. "Step 2 fuses". */
  label: string;
  /** The form's values from the last reading recorded (waiting or stored), or empty ones. */
  formFrom: (previous: Record<string, unknown> | undefined) => T;
  /** The form field a contract issue belongs on ('root' for the whole card). */
  fieldOf: (issue: ContractIssue) => Path<T> | 'root';
  messageOf?: (issue: ContractIssue) => string;
}

/** A new reading's stamp: its idempotency key (the server stores it once) and when it was taken. */
export type ReadingStamp = { idempotencyKey: string; recordedAt: string };

/**
 * One component's reading form on the walk: starts from what was last recorded, checks the
 * input against the shared contract, writes it to the phone's outbox (which sends it), puts the
 * contract's issues on their fields, and tells what is still waiting to be sent.
 */
export function useComponentReading<T extends FieldValues>(options: ComponentReadingOptions<T>) {
  const { orderId, target, targetId, readings, label, formFrom, fieldOf, messageOf } = options;
  const { items } = useOutboxSnapshot();
  const waiting = readingItemsOf(items, orderId, target, targetId);
  const latestWaiting = waiting.at(-1);
  const latestStored = readings.at(-1);
  const defaults = useMemo(
    () => formFrom((latestWaiting?.payload.kind === 'reading' ? latestWaiting.payload.input : latestStored?.input) as Record<string, unknown> | undefined),
    // The form starts from what was recorded when the card first draws; later records reset it themselves.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [],
  );
  const form = useForm<T>({ defaultValues: defaults as DefaultValues<T> });

  /** The submit handler for a card, given how its values become a reading. */
  const submitWith = (build: (values: T, stamp: ReadingStamp) => ReadingInput) =>
    form.handleSubmit(async (values) => {
      const input = build(values, { idempotencyKey: newIdempotencyKey(), recordedAt: new Date().toISOString() });
      const issues = await recordReading(orderId, label, input, waiting);
      if (issues) {
        for (const issue of issues) form.setError(fieldOf(issue), { message: messageOf ? messageOf(issue) : issue.message });
        return;
      }
      form.reset(values);
    });

  return { form, waiting, latestWaiting, latestStored, recorded: Boolean(latestWaiting || latestStored), submitWith };
}
