import type { ReactNode } from 'react';
import { classNames } from '../../lib/class-names';

/** 48 px tall on a phone and 16 px text (no zoom on focus), 40 px on a desk. */
export const controlClass =
  'min-h-touch w-full min-w-0 rounded border bg-surface px-3 text-base text-ink placeholder:text-ink-muted desk:min-h-control';

export function controlBorder(invalid: boolean): string {
  return invalid ? 'border-2 border-replace' : 'border-line-strong';
}

/** A field's message from validation or the server: an outlined "!" and the words, never colour alone. */
export function FieldError({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-base font-medium text-replace desk:text-sm">
      <svg aria-hidden="true" focusable="false" viewBox="0 0 16 16" className="mt-1 size-4 shrink-0 fill-none stroke-current stroke-2 desk:mt-0.5">
        <circle cx="8" cy="8" r="6.5" />
        <path d="M8 4.5v4.2M8 11.2v.3" strokeLinecap="round" />
      </svg>
      <span>{children}</span>
    </p>
  );
}

export function FieldHint({ id, children, className }: { id: string; children: ReactNode; className?: string }) {
  return (
    <p id={id} className={classNames('text-base text-ink-muted desk:text-sm', className)}>
      {children}
    </p>
  );
}

/** The ids a control is described by: its hint and its error, when present. */
export function describedBy(id: string, hint: unknown, error: unknown): string | undefined {
  const ids = [hint ? `${id}-hint` : undefined, error ? `${id}-error` : undefined].filter(Boolean);
  return ids.length > 0 ? ids.join(' ') : undefined;
}
