import { readingInput, type ReadingInput } from '@varden/schemas';
// zod's English messages for a check without a message of its own, before the first reading is checked.
import '../../../lib/schema-messages';
import type { OutboxItem } from './outbox-types';
import { fieldOutbox } from './use-field-outbox';

export type ContractIssue = { path: PropertyKey[]; message: string };

/**
 * Checks a reading against the shared contract, then writes it to the outbox (which sends it).
 * A new record of a component replaces one of its readings the server refused. Returns the
 * contract's issues when it does not pass, so the form can show them on their fields.
 */
export async function recordReading(orderId: number, label: string, input: ReadingInput, earlier: readonly OutboxItem[]): Promise<ContractIssue[] | null> {
  const checked = readingInput.safeParse(input);
  if (!checked.success) return checked.error.issues.map((issue) => ({ path: issue.path, message: issue.message }));
  for (const item of earlier) if (item.status === 'refused') await fieldOutbox().discard(item.id);
  await fieldOutbox().add({ orderId, label, payload: { kind: 'reading', input } });
  return null;
}
