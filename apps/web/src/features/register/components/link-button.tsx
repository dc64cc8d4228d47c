import { Link, type LinkProps } from 'react-router-dom';
import { classNames } from '../../../lib/class-names';
import type { ButtonVariant } from '../../../components/button';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-copper text-on-copper no-underline hover:brightness-110',
  secondary: 'border border-line-strong bg-surface text-ink no-underline hover:bg-sunken',
  quiet: 'text-copper underline-offset-4 hover:underline',
};

/** A link that looks like the shared Button: for commands that open a page ("New site"). */
export function LinkButton({ variant = 'secondary', className, ...props }: LinkProps & { variant?: ButtonVariant }) {
  return (
    <Link
      className={classNames(
        'inline-flex min-h-touch items-center justify-center gap-2 rounded px-4 text-base font-medium desk:min-h-control desk:text-sm',
        variants[variant],
        className,
      )}
      {...props}
    />
  );
}
