import type { UserStatus } from '@varden/schemas';
import { classNames } from '../../../lib/class-names';

export const accountStatusLabels: Readonly<Record<UserStatus, string>> = {
  invited: 'Invited',
  active: 'Active',
  deactivated: 'Deactivated',
};

// Outline strokes in ink, so an account's state never reads as a condition band.
const glyphs: Record<UserStatus, string> = {
  invited: 'M2 4h12v8H2ZM2 4l6 5 6-5',
  active: 'M2.5 8.5 6.5 12.5 13.5 3.5',
  deactivated: 'M8 1.8a6.2 6.2 0 1 0 0 12.4A6.2 6.2 0 0 0 8 1.8ZM3.6 12.4l8.8-8.8',
};

/** Whether a person may sign in, as glyph and word. */
export function AccountStatus({ status, className }: { status: UserStatus; className?: string }) {
  return (
    <span data-status={status} className={classNames('inline-flex items-center gap-1.5 whitespace-nowrap', className)}>
      <svg
        aria-hidden="true"
        focusable="false"
        viewBox="0 0 16 16"
        className="size-4 shrink-0 fill-none stroke-current stroke-[1.75]"
        strokeLinecap="round"
        strokeLinejoin="round"
      >
        <path d={glyphs[status]} />
      </svg>
      <span>{accountStatusLabels[status]}</span>
    </span>
  );
}
