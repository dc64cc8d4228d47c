import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { classNames } from '../../lib/class-names';
import { controlBorder, controlClass, describedBy, FieldError, FieldHint } from './field-parts';

export type TextFieldProps = Omit<ComponentPropsWithRef<'input'>, 'className' | 'children'> & {
  label: string;
  hint?: ReactNode;
  error?: string | undefined;
  /** Beside the input, e.g. a show-password button. */
  adornment?: ReactNode;
};

/** A labelled input with its hint and error, both tied to it for screen readers. */
export function TextField({ label, hint, error, adornment, id, ...input }: TextFieldProps) {
  const generated = useId();
  const inputId = id ?? generated;
  return (
    <div className="grid gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {hint && <FieldHint id={`${inputId}-hint`}>{hint}</FieldHint>}
      <div className="flex gap-2">
        <input
          id={inputId}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(inputId, hint, error)}
          className={classNames(controlClass, controlBorder(Boolean(error)))}
          {...input}
        />
        {adornment}
      </div>
      {error && <FieldError id={`${inputId}-error`}>{error}</FieldError>}
    </div>
  );
}
