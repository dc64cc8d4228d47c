import type { FormFailure } from '../forms/server-errors';

/** A refused save in words, above the form's buttons; a conflict says what to do about it. */
export function FormAlert({ failure }: { failure: FormFailure | null }) {
  if (!failure?.message) return null;
  return (
    <div role="alert" className="rounded border-2 border-replace bg-surface p-3 text-base">
      <p className="font-semibold">{failure.conflict ? 'Not saved: a conflict' : 'Not saved'}</p>
      <p className="mt-1 text-ink-muted">{failure.message}</p>
    </div>
  );
}
