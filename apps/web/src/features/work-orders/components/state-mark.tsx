import type { WorkOrderState } from '@varden/schemas';
import { classNames } from '../../../lib/class-names';
import { stateLabels } from '../lib/work-order-words';

/**
 * How far along its way an order is, as the stage meter draws it: five rising bars, one lit
 * per stage reached (queued 1 … sealed 5). Sent back lights three with a return hook; withdrawn
 * lights none and is struck through. Ink only: the condition bands keep their colours and shapes.
 */
const reached: Readonly<Record<WorkOrderState, number>> = {
  queued: 1,
  dispatched: 2,
  'on-site': 3,
  'awaiting-review': 4,
  'sent-back': 3,
  sealed: 5,
  withdrawn: 0,
};

function StageMeter({ state }: { state: WorkOrderState }) {
  const lit = reached[state];
  return (
    <svg aria-hidden="true" focusable="false" viewBox="0 0 22 14" className="h-[0.9em] w-[1.45em] shrink-0">
      {[0, 1, 2, 3, 4].map((i) => {
        const height = 4 + i * 2.5;
        return (
          <rect
            key={i}
            x={1 + i * 4.2}
            y={13 - height}
            width="3"
            height={height}
            rx="0.6"
            className={i < lit ? 'fill-ink' : 'fill-none stroke-ink-muted'}
            strokeWidth="0.9"
          />
        );
      })}
      {state === 'sent-back' && <path d="M20.5 2.5h-5.5m0 0 2-2m-2 2 2 2" className="fill-none stroke-ink" strokeWidth="1.3" strokeLinecap="round" strokeLinejoin="round" />}
      {state === 'withdrawn' && <path d="M.5 8.5 21.5 5" className="stroke-ink" strokeWidth="1.4" strokeLinecap="round" />}
    </svg>
  );
}

/** A work order's state: the stage meter and the state's name, never the mark alone. */
export function StateMark({ state, className }: { state: WorkOrderState; className?: string }) {
  return (
    <span data-state={state} className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap', className)}>
      <StageMeter state={state} />
      <span>{stateLabels[state]}</span>
    </span>
  );
}

/** "Overdue" in words beside a due date, with an outlined clock so it reads at a glance. */
export function OverdueMark() {
  return (
    <span className="inline-flex items-center gap-1 font-semibold whitespace-nowrap text-ink">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="size-[1em] shrink-0 fill-none stroke-current stroke-[1.6]">
        <circle cx="8" cy="8" r="6.3" />
        <path d="M8 4.2V8l2.6 1.8" strokeLinecap="round" />
      </svg>
      Overdue
    </span>
  );
}
