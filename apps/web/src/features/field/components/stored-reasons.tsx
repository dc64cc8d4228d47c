import type { Reading } from '@varden/schemas';

/** What the server made of a component's last reading: its stored reasons, as words. */
export function StoredReasons({ reading }: { reading: Reading | undefined }) {
  if (!reading) return null;
  const reasons = Array.isArray(reading.evaluation.reasons) ? reading.evaluation.reasons.filter((r): r is string => typeof r === 'string') : [];
  const flags = reading.flags.filter((flag) => !flag.alreadyOpen);
  return (
    <div className="grid gap-1 rounded border border-line-strong p-3" data-testid="server-result">
      <p className="font-semibold">Server’s result</p>
      {reasons.length === 0 ? (
        <p className="text-ink-muted">Nothing to report.</p>
      ) : (
        <ul className="grid list-disc gap-1 pl-5">
          {reasons.map((reason) => (
            <li key={reason}>{reason}</li>
          ))}
        </ul>
      )}
      {flags.length > 0 && (
        <p className="text-ink-muted">
          Flag raised for the planner: {flags.map((flag) => flag.message).join(' ')}
        </p>
      )}
    </div>
  );
}
