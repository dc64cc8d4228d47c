import { Link } from 'react-router-dom';
import { classNames } from '../../../lib/class-names';
import type { NextStep, Urgency } from '../lib/next-steps';

const urgencyWords: Record<Urgency, string> = { act: 'Act now', plan: 'Plan', note: 'Note' };
const urgencyLooks: Record<Urgency, string> = {
  act: 'border-replace text-replace font-semibold',
  plan: 'border-watch text-watch font-semibold',
  note: 'border-line-strong text-ink-muted',
};

/** "What to do next": one sentence per finding, the most urgent first, each with the page where it is done. */
export function NextStepsList({ steps }: { steps: readonly NextStep[] }) {
  return (
    <ol className="grid gap-2" aria-label="What to do next">
      {steps.map((step) => (
        <li key={step.id} data-urgency={step.urgency} className="grid gap-x-3 gap-y-1 rounded border border-line bg-paper p-3 desk:grid-cols-[6.5rem_1fr] print:bg-surface">
          <span
            className={classNames(
              'inline-flex h-fit w-fit items-center rounded border px-2 py-0.5 text-base whitespace-nowrap desk:text-sm',
              urgencyLooks[step.urgency],
            )}
          >
            {urgencyWords[step.urgency]}
          </span>
          <p className="min-w-0">
            {step.text}
            {step.link && (
              <>
                {' — '}
                <Link to={step.link.href} className="font-medium">
                  {step.link.label}
                </Link>
              </>
            )}
          </p>
        </li>
      ))}
    </ol>
  );
}
