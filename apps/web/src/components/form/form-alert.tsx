import type { ReactNode } from 'react';
import { classNames } from '../../lib/class-names';

type FormAlertProps = { children: ReactNode; className?: string };

/** What the server said about the whole form (wrong password, try again later, a conflict). */
export function FormAlert({ children, className }: FormAlertProps) {
  return (
    <div role="alert" className={classNames('flex gap-3 rounded border-2 border-replace bg-surface p-3 text-ink', className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-replace stroke-2">
        <circle cx="8" cy="8" r="6.5" />
        <path d="M8 4.5v4.2M8 11.2v.3" strokeLinecap="round" />
      </svg>
      <div className="min-w-0">{children}</div>
    </div>
  );
}

/** A confirmation after something worked (a link sent, a password set). */
export function FormSuccess({ children, className }: FormAlertProps) {
  return (
    <div role="status" className={classNames('flex gap-3 rounded border-2 border-healthy bg-surface p-3 text-ink', className)}>
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-healthy stroke-[2.5]">
        <path d="M2.5 8.5 6.5 12.5 13.5 3.5" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
      <div className="min-w-0">{children}</div>
    </div>
  );
}
