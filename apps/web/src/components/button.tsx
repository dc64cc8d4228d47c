import type { ComponentPropsWithRef } from 'react';
import { classNames } from '../lib/class-names';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-copper text-on-copper hover:brightness-110',
  secondary: 'border border-line-strong bg-surface text-ink hover:bg-sunken',
  quiet: 'text-copper underline-offset-4 hover:underline',
};

type ButtonProps = ComponentPropsWithRef<'button'> & { variant?: ButtonVariant };

/** A button's look, also for a link that acts as a command ("Invite someone"). */
export function buttonClassName(variant: ButtonVariant = 'secondary', className?: string): string {
  return classNames(
    'inline-flex min-h-touch items-center justify-center gap-2 rounded px-4 text-base font-medium no-underline desk:min-h-control desk:text-sm',
    'disabled:cursor-not-allowed disabled:opacity-60',
    variants[variant],
    className,
  );
}

/** 48 px tall on a phone (gloved hands), 40 px on a desk. */
export function Button({ variant = 'secondary', type = 'button', className, ...props }: ButtonProps) {
  return <button type={type} className={buttonClassName(variant, className)} {...props} />;
}
