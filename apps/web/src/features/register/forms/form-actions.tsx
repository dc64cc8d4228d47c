import type { ReactNode } from 'react';
import { Button } from '../../../components/button';
import { FormAlert } from '../components/form-alert';
import type { FormFailure } from './server-errors';

/** The foot of every register form: what went wrong, then save and a way out. */
export function FormActions({
  failure,
  submitting,
  submitLabel,
  cancel,
}: {
  failure: FormFailure | null;
  submitting: boolean;
  submitLabel: string;
  cancel?: ReactNode;
}) {
  return (
    <div className="grid gap-4">
      <FormAlert failure={failure} />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" variant="primary" disabled={submitting}>
          {submitting ? 'Saving…' : submitLabel}
        </Button>
        {cancel}
      </div>
    </div>
  );
}
